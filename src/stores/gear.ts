import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type {
  CameraBodyInputBody,
  CameraBodyPatch,
  CameraBodyRecord,
  GearSettings,
  LensInputBody,
  LensPatch,
  LensRecord,
} from '../../shared/schemas/shot-plan';
import * as gearApi from '@/api/gear';

function byName<T extends { name: string }>(a: T, b: T): number {
  return a.name.localeCompare(b.name, undefined, { sensitivity: 'base' });
}

function byFocal(a: LensRecord, b: LensRecord): number {
  return a.range.minMm - b.range.minMm || a.range.maxMm - b.range.maxMm || byName(a, b);
}

/** The signed-in user's gear: camera bodies, lenses and whether a star tracker is at hand. */
export const useGearStore = defineStore('gear', () => {
  const bodies = ref<CameraBodyRecord[]>([]);
  const lenses = ref<LensRecord[]>([]);
  const settings = ref<GearSettings>({ starTrackerAvailable: false });
  const loading = ref(false);
  const loadError = ref('');
  const loaded = ref(false);
  const savingSettings = ref(false);

  const empty = computed(() => loaded.value && bodies.value.length === 0 && lenses.value.length === 0);

  /** Loads the gear (again when `force`). */
  async function load(force = false): Promise<void> {
    if (loaded.value && !force) return;
    loading.value = true;
    loadError.value = '';
    try {
      const gear = await gearApi.getGear();
      bodies.value = gear.bodies;
      lenses.value = gear.lenses;
      settings.value = gear.settings;
      loaded.value = true;
    } catch (error) {
      loadError.value = (error as Error).message;
    } finally {
      loading.value = false;
    }
  }

  function putBody(body: CameraBodyRecord): void {
    bodies.value = [...bodies.value.filter((b) => b.id !== body.id), body].sort(byName);
  }

  function putLens(lens: LensRecord): void {
    lenses.value = [...lenses.value.filter((l) => l.id !== lens.id), lens].sort(byFocal);
  }

  async function createBody(input: CameraBodyInputBody): Promise<CameraBodyRecord> {
    const body = await gearApi.createBody(input);
    putBody(body);
    return body;
  }

  async function updateBody(id: string, change: CameraBodyPatch): Promise<CameraBodyRecord> {
    const body = await gearApi.updateBody(id, change);
    putBody(body);
    return body;
  }

  async function removeBody(id: string): Promise<void> {
    await gearApi.deleteBody(id);
    bodies.value = bodies.value.filter((b) => b.id !== id);
  }

  async function createLens(input: LensInputBody): Promise<LensRecord> {
    const lens = await gearApi.createLens(input);
    putLens(lens);
    return lens;
  }

  async function updateLens(id: string, change: LensPatch): Promise<LensRecord> {
    const lens = await gearApi.updateLens(id, change);
    putLens(lens);
    return lens;
  }

  async function removeLens(id: string): Promise<void> {
    await gearApi.deleteLens(id);
    lenses.value = lenses.value.filter((l) => l.id !== id);
  }

  /** Saves whether a star tracker is available; the switch shows the saved value. */
  async function setStarTracker(available: boolean): Promise<void> {
    savingSettings.value = true;
    try {
      settings.value = await gearApi.saveGearSettings({ starTrackerAvailable: available });
    } finally {
      savingSettings.value = false;
    }
  }

  /** Forgets everything (on sign-out). */
  function reset(): void {
    bodies.value = [];
    lenses.value = [];
    settings.value = { starTrackerAvailable: false };
    loaded.value = false;
    loadError.value = '';
  }

  return {
    bodies, lenses, settings, loading, loadError, loaded, savingSettings, empty,
    load, createBody, updateBody, removeBody, createLens, updateLens, removeLens, setStarTracker, reset,
  };
});
