import { computed, reactive, watch, type Ref } from 'vue';
import { fieldErrorsFromZod } from '../../shared/errors';
import type { Lineup } from '../../shared/schemas/lineup';
import {
  DEFAULT_TRACKED_INTEGRATION_S,
  DEFAULT_UNTRACKED_INTEGRATION_S,
  shotPlanRequestSchema,
  type CameraBodyRecord,
  type LensRecord,
  type PanoramaCover,
  type ShotPlanRequestBody,
} from '../../shared/schemas/shot-plan';
import type { TargetRef } from '../../shared/schemas/lineup';
import { clockOf, durationText, zoneOf } from './useLineupTime';

/** The fields of the shot plan form that can carry a message. */
export type ShotPlanFormField =
  | 'lineup' | 'bodyId' | 'lensId' | 'focalLengthMm' | 'fNumber' | 'tracked'
  | 'subExposureS' | 'totalIntegrationS' | 'foregroundFrames' | 'foregroundExposureS'
  | 'overlap' | 'skyTopAltDeg' | 'target';

/** Maps a request field path (client or server) to the form field that shows it. */
export function shotPlanFieldOfPath(path: string): ShotPlanFormField | null {
  const [head, tail] = path.split('.');
  switch (head) {
    case 'lineup': return 'lineup';
    case 'bodyId': case 'lensId': case 'focalLengthMm': case 'fNumber': case 'tracked': case 'target': return head;
    case 'sky': return tail === 'subExposureS' ? 'subExposureS' : tail === 'totalIntegrationS' ? 'totalIntegrationS' : null;
    case 'foreground': return tail === 'frames' ? 'foregroundFrames' : tail === 'exposureS' ? 'foregroundExposureS' : null;
    case 'panorama': return tail === 'overlap' ? 'overlap' : tail === 'skyTopAltDeg' ? 'skyTopAltDeg' : null;
    default: return null;
  }
}

export interface ShotPlanFormSources {
  lineups: Ref<Lineup[]>;
  bodies: Ref<CameraBodyRecord[]>;
  lenses: Ref<LensRecord[]>;
  starTrackerAvailable: Ref<boolean>;
  timeZone: Ref<string>;
  /** The lineup search's target: a catalogue id or a custom position. */
  target: Ref<TargetRef | null>;
}

const orNone = (n: number | null) => (n === null ? undefined : n);

/**
 * The shot plan form: which lineup (from the page's lineup search), body and lens (from the
 * user's gear), focal length, f-number, tracked or not, the sky stack, foreground frames and the
 * panorama settings. Defaults follow the choices (the lens's shortest focal length and widest
 * aperture, tracked when a star tracker is at hand); the request is checked with the shared schema.
 */
export function useShotPlanForm(sources: ShotPlanFormSources) {
  const form = reactive({
    lineupStart: null as string | null,
    bodyId: null as string | null,
    lensId: null as string | null,
    focalLengthMm: null as number | null,
    fNumber: null as number | null,
    tracked: false,
    subExposureS: null as number | null,
    totalIntegrationMin: null as number | null,
    foregroundFrames: 3 as number | null,
    foregroundExposureS: 120 as number | null,
    foregroundFirst: false,
    panoramaMode: 'auto' as 'auto' | 'always' | 'off',
    overlapPercent: 30 as number | null,
    orientation: 'portrait' as 'landscape' | 'portrait',
    cover: 'target-path' as PanoramaCover,
    skyTopAltDeg: 60 as number | null,
  });

  const lineup = computed(() => sources.lineups.value.find((l) => l.start === form.lineupStart) ?? null);
  const body = computed(() => sources.bodies.value.find((b) => b.id === form.bodyId) ?? null);
  const lens = computed(() => sources.lenses.value.find((l) => l.id === form.lensId) ?? null);

  const lineupOptions = computed(() => sources.lineups.value.map((l) => {
    const tz = sources.timeZone.value;
    const day = new Date(l.start).toLocaleDateString('en-GB', { timeZone: tz, weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' });
    return { value: l.start, label: `${day} · ${clockOf(l.start, tz)}–${clockOf(l.end, tz)} ${zoneOf(l.start, tz)} · ${durationText(l.durationMin)} · score ${Math.round(l.score * 100)}` };
  }));
  const bodyOptions = computed(() => sources.bodies.value.map((b) => ({ value: b.id, label: `${b.name} (${b.sensorWidthMm} × ${b.sensorHeightMm} mm)` })));
  const lensOptions = computed(() => sources.lenses.value.map((l) => ({
    value: l.id,
    label: `${l.name} (${l.range.isZoom ? `${l.range.minMm}–${l.range.maxMm}` : l.range.minMm} mm, f/${l.widestApertureF})`,
  })));

  // Keep the choices valid as lists load and change: the first lineup, body and lens by default.
  watch(sources.lineups, (list) => {
    if (!list.some((l) => l.start === form.lineupStart)) form.lineupStart = list[0]?.start ?? null;
  }, { immediate: true });
  watch(sources.bodies, (list) => {
    if (!list.some((b) => b.id === form.bodyId)) form.bodyId = list[0]?.id ?? null;
  }, { immediate: true });
  watch(sources.lenses, (list) => {
    if (!list.some((l) => l.id === form.lensId)) form.lensId = list[0]?.id ?? null;
  }, { immediate: true });
  watch(sources.starTrackerAvailable, (available) => { form.tracked = available; }, { immediate: true });
  // A new lens: its shortest focal length and widest aperture.
  watch(lens, (l, previous) => {
    if (!l || l.id === previous?.id) return;
    form.focalLengthMm = l.range.minMm;
    form.fNumber = l.widestApertureF;
  }, { immediate: true });

  const focalRange = computed(() => (lens.value ? { min: lens.value.range.minMm, max: lens.value.range.maxMm, isZoom: lens.value.range.isZoom } : null));
  const defaultIntegrationMin = computed(() => (form.tracked ? DEFAULT_TRACKED_INTEGRATION_S : DEFAULT_UNTRACKED_INTEGRATION_S) / 60);

  /** What is missing before a plan can be asked for ('' when nothing). */
  const missing = computed(() => {
    if (sources.lineups.value.length === 0) return 'Search for lineups first (Lineups tab): a shot plan is made for one of them.';
    if (sources.bodies.value.length === 0 || sources.lenses.value.length === 0) return 'Add a camera body and a lens to your gear first.';
    return '';
  });

  /** The request, checked with the shared schema: the body to send, or the messages by form field. */
  const checked = computed<{ body: ShotPlanRequestBody | null; fields: Partial<Record<ShotPlanFormField, string>> }>(() => {
    const l = lineup.value;
    if (!l || !form.bodyId || !form.lensId) return { body: null, fields: {} };
    const body: ShotPlanRequestBody = {
      lineup: { start: l.start, peak: l.peak, end: l.end },
      ...(sources.target.value ? { target: sources.target.value } : {}),
      bodyId: form.bodyId,
      lensId: form.lensId,
      ...(form.focalLengthMm !== null ? { focalLengthMm: form.focalLengthMm } : {}),
      ...(form.fNumber !== null ? { fNumber: form.fNumber } : {}),
      tracked: form.tracked,
      sky: {
        ...(form.subExposureS !== null ? { subExposureS: form.subExposureS } : {}),
        ...(form.totalIntegrationMin !== null ? { totalIntegrationS: form.totalIntegrationMin * 60 } : {}),
      },
      foreground: { frames: orNone(form.foregroundFrames) ?? 0, exposureS: orNone(form.foregroundExposureS), first: form.foregroundFirst },
      panorama: {
        mode: form.panoramaMode,
        overlap: form.overlapPercent === null ? undefined : form.overlapPercent / 100,
        orientation: form.orientation,
        cover: form.cover,
        skyTopAltDeg: orNone(form.skyTopAltDeg),
      },
    };
    const parsed = shotPlanRequestSchema.safeParse(body);
    if (parsed.success) return { body, fields: {} };
    const fields: Partial<Record<ShotPlanFormField, string>> = {};
    for (const [path, message] of Object.entries(fieldErrorsFromZod(parsed.error))) {
      const key = shotPlanFieldOfPath(path);
      if (key && !fields[key]) fields[key] = key === 'overlap' ? 'Overlap is 0 to 90 %' : message;
    }
    return { body: null, fields };
  });

  return { form, lineup, body, lens, lineupOptions, bodyOptions, lensOptions, focalRange, defaultIntegrationMin, missing, checked };
}
export type ShotPlanForm = ReturnType<typeof useShotPlanForm>;
