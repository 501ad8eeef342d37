import { roleAllows } from '../../shared/policy/sightline-policy';
import { defineStore } from 'pinia';
import { computed, reactive, ref } from 'vue';
import type { GeoPoint } from '../../shared/geo';
import { landmarkSchema, vantageSchema, type Landmark, type Vantage } from '../../shared/schemas/geometry';
import type { Sightline, SightlineInputBody } from '../../shared/schemas/sightline';

/** The two pins of a sightline. */
export type PinKind = 'vantage' | 'landmark';

/** The heights the user gives (metres; null while a field is empty). */
export interface PinHeights {
  vantageElevationM: number | null;
  cameraHeightM: number | null;
  landmarkBaseElevationM: number | null;
  landmarkHeightM: number | null;
  landmarkWidthM: number | null;
}
export type HeightKey = keyof PinHeights;

/** Where the map looks: centre (deg) and zoom level. */
export interface MapView extends GeoPoint {
  zoom: number;
}

export const DEFAULT_TARGET_ID = 'galactic-centre';
export const DEFAULT_BAND_HEIGHT_DEG = 20;

function defaultHeights(): PinHeights {
  return { vantageElevationM: 0, cameraHeightM: 1.5, landmarkBaseElevationM: 0, landmarkHeightM: 20, landmarkWidthM: 10 };
}

/**
 * The plan on the planner page: the pins and their heights, the target, the chosen night and
 * instant, and which saved sightline (if any) it came from. Kept while the user moves between
 * pages; values are metric whatever the display units.
 */
export const usePlannerStore = defineStore('planner', () => {
  const vantagePoint = ref<GeoPoint | null>(null);
  const landmarkPoint = ref<GeoPoint | null>(null);
  const heights = reactive<PinHeights>(defaultHeights());
  const bandHeightDeg = ref(DEFAULT_BAND_HEIGHT_DEG);
  const targetId = ref(DEFAULT_TARGET_ID);
  /** Which pin a click on the map places. */
  const placing = ref<PinKind>('vantage');
  /** The local date (site's zone) whose evening starts the chosen night; null: tonight. */
  const nightDate = ref<string | null>(null);
  /** The chosen instant (UTC ms) within the night; null: the default instant of the night. */
  const timeMs = ref<number | null>(null);
  /** The saved sightline the plan was opened from or saved as. */
  const opened = ref<{ id: string; name: string; canEdit: boolean } | null>(null);
  const mapView = ref<MapView | null>(null);
  /** Whether the map shows where to stand. */
  const showWhereToStand = ref(false);

  /** The vantage as the shared schema reads it, or null while it is missing or a height is invalid. */
  const vantage = computed<Vantage | null>(() => {
    if (!vantagePoint.value) return null;
    const parsed = vantageSchema.safeParse({
      ...vantagePoint.value,
      elevationM: heights.vantageElevationM,
      cameraHeightM: heights.cameraHeightM,
    });
    return parsed.success ? parsed.data : null;
  });

  /** The landmark as the shared schema reads it, or null while it is missing or a height is invalid. */
  const landmark = computed<Landmark | null>(() => {
    if (!landmarkPoint.value) return null;
    const parsed = landmarkSchema.safeParse({
      ...landmarkPoint.value,
      baseElevationM: heights.landmarkBaseElevationM,
      heightM: heights.landmarkHeightM,
      widthM: heights.landmarkWidthM,
    });
    return parsed.success ? parsed.data : null;
  });

  function point(kind: PinKind): GeoPoint | null {
    return kind === 'vantage' ? vantagePoint.value : landmarkPoint.value;
  }

  /** Moves (or first places) a pin. Placing the first vantage switches the map to the landmark. */
  function setPin(kind: PinKind, p: GeoPoint): void {
    const clean = { lat: p.lat, lon: p.lon };
    if (kind === 'vantage') {
      const first = vantagePoint.value === null;
      vantagePoint.value = clean;
      if (first && landmarkPoint.value === null) placing.value = 'landmark';
    } else {
      landmarkPoint.value = clean;
    }
  }

  function setHeight(key: HeightKey, metres: number | null): void {
    heights[key] = metres;
  }

  /** Loads a saved sightline into the planner. */
  function loadSightline(s: Sightline): void {
    vantagePoint.value = { lat: s.vantage.lat, lon: s.vantage.lon };
    landmarkPoint.value = { lat: s.landmark.lat, lon: s.landmark.lon };
    Object.assign(heights, {
      vantageElevationM: s.vantage.elevationM,
      cameraHeightM: s.vantage.cameraHeightM,
      landmarkBaseElevationM: s.landmark.baseElevationM,
      landmarkHeightM: s.landmark.heightM,
      landmarkWidthM: s.landmark.widthM,
    } satisfies PinHeights);
    bandHeightDeg.value = s.bandHeightDeg;
    targetId.value = s.targetId;
    opened.value = { id: s.id, name: s.name, canEdit: roleAllows(s.myRole, 'edit') };
    placing.value = 'landmark';
    mapView.value = null;
    // Another site, maybe another zone: start from the default instant of its night.
    timeMs.value = null;
  }

  /** Marks the plan as saved under this sightline. */
  function markSaved(s: Sightline): void {
    opened.value = { id: s.id, name: s.name, canEdit: roleAllows(s.myRole, 'edit') };
  }

  /** Starts an empty plan (the night, target and units stay). */
  function clear(): void {
    vantagePoint.value = null;
    landmarkPoint.value = null;
    Object.assign(heights, defaultHeights());
    bandHeightDeg.value = DEFAULT_BAND_HEIGHT_DEG;
    opened.value = null;
    placing.value = 'vantage';
  }

  /** What to send to save the plan, or null while a pin is missing or a height invalid. */
  function sightlineInput(name: string): SightlineInputBody | null {
    if (!vantage.value || !landmark.value) return null;
    return { name, vantage: vantage.value, landmark: landmark.value, bandHeightDeg: bandHeightDeg.value, targetId: targetId.value };
  }

  return {
    vantagePoint, landmarkPoint, heights, bandHeightDeg, targetId, placing, nightDate, timeMs, opened, mapView, showWhereToStand,
    vantage, landmark, point, setPin, setHeight, loadSightline, markSaved, clear, sightlineInput,
  };
});
