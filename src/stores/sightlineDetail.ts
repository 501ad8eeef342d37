import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import { frameFromSightline, sightlineGeometry, type SightlineGeometry } from '../../shared/geo';
import type { Frame, ObserverSite } from '../../shared/schemas/geometry';
import type { Sightline } from '../../shared/schemas/sightline';
import type { TideEvent, TideRule } from '../../shared/tide';
import { getSightline, updateSightline } from '@/api/sightlines';
import { roleAllows } from '../../shared/policy/sightline-policy';
import * as tidesApi from '@/api/tides';

/** Warnings the server kept about a saved paste (they did not stop it). */
export type TidePasteWarning = { line: number; text: string; message: string };

/**
 * The sightline a sightline page shows: the sightline with its geometry, its tide rule and its
 * stored tide times. `planRevision` goes up whenever the vantage, the tide rule or tide times change, so lineup
 * results (whose tide status depends on them) know to refresh.
 */
export const useSightlineDetailStore = defineStore('sightlineDetail', () => {
  const sightline = ref<Sightline | null>(null);
  const loading = ref(false);
  const loadError = ref('');
  const tideEvents = ref<TideEvent[]>([]);
  const planRevision = ref(0);
  let loadToken = 0;

  const id = computed(() => sightline.value?.id ?? null);
  /** True when the signed-in person may change the plan (the owner or an editor in the crew). */
  const canEdit = computed(() => sightline.value !== null && roleAllows(sightline.value.myRole, 'edit'));
  const timeZone = computed(() => sightline.value?.timezone ?? 'UTC');

  /** The camera for sky positions: ground elevation plus camera height, m. */
  const site = computed<ObserverSite | null>(() => {
    const s = sightline.value;
    return s ? { lat: s.vantage.lat, lon: s.vantage.lon, elevationM: s.vantage.elevationM + s.vantage.cameraHeightM } : null;
  });

  /** The saved frame (saved band height); null when the geometry cannot be computed. */
  const frame = computed<Frame | null>(() => {
    const s = sightline.value;
    if (!s) return null;
    try {
      return frameFromSightline(s.vantage, s.landmark, { bandHeightDeg: s.bandHeightDeg });
    } catch {
      return null;
    }
  });

  const geometry = computed<SightlineGeometry | null>(() => {
    const s = sightline.value;
    if (!s) return null;
    try {
      return sightlineGeometry(s.vantage, s.landmark);
    } catch {
      return null;
    }
  });

  /** Loads a sightline and its tide times (again when `force`). */
  async function open(sightlineId: string, force = false): Promise<void> {
    if (!force && sightline.value?.id === sightlineId && !loadError.value) return;
    const token = ++loadToken;
    loading.value = true;
    loadError.value = '';
    if (sightline.value?.id !== sightlineId) {
      sightline.value = null;
      tideEvents.value = [];
    }
    try {
      const [s, tides] = await Promise.all([getSightline(sightlineId), tidesApi.getTideTimes(sightlineId)]);
      if (token !== loadToken) return;
      sightline.value = s;
      tideEvents.value = tides.events;
    } catch (error) {
      if (token === loadToken) loadError.value = (error as Error).message;
    } finally {
      if (token === loadToken) loading.value = false;
    }
  }

  function requireId(): string {
    if (!id.value) throw new Error('No sightline is open');
    return id.value;
  }

  /** Moves the vantage to a new position, keeping its elevation and camera height. */
  async function moveVantage(lat: number, lon: number): Promise<void> {
    const current = sightline.value;
    if (!current) throw new Error('No sightline is open');
    sightline.value = await updateSightline(current.id, { vantage: { ...current.vantage, lat, lon } });
    planRevision.value += 1;
  }

  async function saveTideRule(rule: TideRule | null): Promise<void> {
    sightline.value = await tidesApi.putTideRule(requireId(), rule);
    planRevision.value += 1;
  }

  /** Saves pasted tide times (all or nothing); returns the server's warnings. */
  async function pasteTideTimes(text: string): Promise<TidePasteWarning[]> {
    const result = await tidesApi.pasteTideTimes(requireId(), text);
    tideEvents.value = result.events;
    planRevision.value += 1;
    return result.warnings;
  }

  async function clearTideTimes(): Promise<void> {
    await tidesApi.clearTideTimes(requireId());
    tideEvents.value = [];
    planRevision.value += 1;
  }

  return { sightline, loading, loadError, tideEvents, planRevision, id, canEdit, timeZone, site, frame, geometry, open, moveVantage, saveTideRule, pasteTideTimes, clearTideTimes };
});
