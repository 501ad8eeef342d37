import { computed, type Ref } from 'vue';
import { distanceM, MAX_SIGHTLINE_DISTANCE_M, sightlineGeometry, type SightlineGeometry } from '../../shared/geo';
import { usePlannerStore } from '@/stores/planner';
import { useUnits } from './useUnits';

/** One line of the readout. */
export interface ReadoutRow {
  key: 'distance' | 'true-bearing' | 'magnetic-bearing' | 'declination' | 'top-angle' | 'base-angle' | 'angular-width';
  label: string;
  value: string;
  hint?: string;
}

const deg = (x: number, decimals = 1) => `${x.toFixed(decimals)}°`;
const signedDeg = (x: number, decimals = 2) => `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(decimals)}°`;

/**
 * The live readout of the sightline between the pins, computed in the browser with shared/geo
 * on every move: distance, true and magnetic bearing, declination for the shoot date, the
 * landmark's top and base elevation angles and its angular width.
 *
 * @param when - the shoot's instant (UTC ms) for the declination; null: now
 */
export function useSightlineReadout(when: Readonly<Ref<number | null>>) {
  const store = usePlannerStore();
  const u = useUnits();

  const result = computed<{ geometry: SightlineGeometry | null; message: string }>(() => {
    if (!store.vantagePoint || !store.landmarkPoint) {
      return { geometry: null, message: store.vantagePoint ? 'Place the landmark to see the sightline.' : 'Place the vantage, then the landmark.' };
    }
    if (!store.vantage || !store.landmark) return { geometry: null, message: 'Fix the heights marked below to see the sightline.' };
    const apart = distanceM(store.vantagePoint, store.landmarkPoint);
    if (apart > MAX_SIGHTLINE_DISTANCE_M) {
      return { geometry: null, message: `The pins are ${u.distance(apart)} apart; a sightline can be at most ${u.distance(MAX_SIGHTLINE_DISTANCE_M)}. Move one of them.` };
    }
    try {
      return { geometry: sightlineGeometry(store.vantage, store.landmark, new Date(when.value ?? Date.now())), message: '' };
    } catch (error) {
      return { geometry: null, message: (error as Error).message };
    }
  });

  const rows = computed<ReadoutRow[]>(() => {
    const g = result.value.geometry;
    if (!g) return [];
    return [
      { key: 'distance', label: 'Distance', value: u.distance(g.distanceM) },
      { key: 'true-bearing', label: 'True bearing', value: deg(g.trueBearingDeg) },
      { key: 'magnetic-bearing', label: 'Magnetic bearing', value: deg(g.magneticBearingDeg), hint: 'What a compass reads on the shoot date' },
      { key: 'declination', label: 'Declination', value: `${Math.abs(g.declinationDeg).toFixed(2)}° ${g.declinationDeg >= 0 ? 'E' : 'W'}`, hint: 'WMM2025 at the vantage on the shoot date' },
      { key: 'top-angle', label: 'Landmark top', value: signedDeg(g.topElevationDeg), hint: 'Elevation angle, with curvature and refraction' },
      { key: 'base-angle', label: 'Landmark base', value: signedDeg(g.baseElevationDeg), hint: 'Elevation angle, with curvature and refraction' },
      { key: 'angular-width', label: 'Angular width', value: deg(g.angularWidthDeg, 2) },
    ];
  });

  return {
    geometry: computed(() => result.value.geometry),
    message: computed(() => result.value.message),
    warnings: computed(() => result.value.geometry?.declinationWarnings ?? []),
    rows,
  };
}
