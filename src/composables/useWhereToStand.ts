import { computed, type Ref } from 'vue';
import { whereToStand, whereToStandLine, type StandingSpot } from '../../shared/geo';
import { targetHorizontal, type Target } from '../../shared/sky';
import { usePlannerStore } from '@/stores/planner';

/** Landmark-top angles the line runs through, degrees: from 0.5 to 20 in steps of 0.5. */
export const WHERE_TO_STAND_RANGE = { fromDeg: 0.5, toDeg: 20, stepDeg: 0.5 } as const;
/** The angles labelled on the map, degrees. */
export const LABELLED_ANGLES_DEG: readonly number[] = [0.5, 1, 2, 3, 5, 10];

/** A spot to offer on the map. */
export interface OfferedSpot extends StandingSpot {
  label: string;
  /** The spot where the target stands exactly on the landmark top at the chosen instant. */
  exact: boolean;
}

/**
 * "Where to stand": for the chosen target and instant, the line of spots from which the target
 * stands behind the landmark (same azimuth), each giving its own elevation angle of the landmark
 * top; and the one spot where that angle equals the target's altitude, so it sits on the top.
 * The ground at each spot is assumed at the vantage's ground elevation (there is no terrain model).
 */
export function useWhereToStand(target: Readonly<Ref<Target>>, instantMs: Readonly<Ref<number | null>>) {
  const store = usePlannerStore();
  const enabled = computed({ get: () => store.showWhereToStand, set: (on: boolean) => { store.showWhereToStand = on; } });

  const result = computed<{ line: StandingSpot[]; offered: OfferedSpot[]; targetAltitudeDeg: number | null; message: string }>(() => {
    const empty = { line: [], offered: [], targetAltitudeDeg: null };
    if (!enabled.value) return { ...empty, message: '' };
    const landmark = store.landmark;
    if (!store.landmarkPoint) return { ...empty, message: 'Place the landmark first.' };
    if (!landmark) return { ...empty, message: 'Fix the landmark heights first.' };
    if (instantMs.value === null) return { ...empty, message: 'Place the vantage to choose a night and time.' };
    const eye = {
      groundElevationM: store.heights.vantageElevationM ?? 0,
      cameraHeightM: store.heights.cameraHeightM ?? 1.5,
    };
    try {
      const sky = targetHorizontal(target.value, { lat: landmark.lat, lon: landmark.lon, elevationM: landmark.baseElevationM }, new Date(instantMs.value));
      const line = whereToStandLine(landmark, sky.azimuthDeg, eye, WHERE_TO_STAND_RANGE);
      const offered: OfferedSpot[] = line
        .filter((s) => LABELLED_ANGLES_DEG.some((a) => Math.abs(a - s.elevationAngleDeg) < 1e-9))
        .map((s) => ({ ...s, label: `${s.elevationAngleDeg}°`, exact: false }));
      let message = '';
      const exact = sky.altitudeDeg > 0 && sky.altitudeDeg < 89.99 ? whereToStand(landmark, sky.azimuthDeg, eye, sky.altitudeDeg) : null;
      if (exact) {
        offered.push({ ...exact, label: `${target.value.name} on top: ${sky.altitudeDeg.toFixed(1)}°`, exact: true });
      } else if (sky.altitudeDeg <= 0) {
        message = `${target.value.name} is below the horizon at this time: move the time slider.`;
      } else {
        message = `No spot within reach puts ${target.value.name} (${sky.altitudeDeg.toFixed(1)}°) on the landmark top.`;
      }
      if (line.length === 0) message = 'No spot gives these angles: is the vantage ground above the landmark top?';
      return { line, offered, targetAltitudeDeg: sky.altitudeDeg, message };
    } catch (error) {
      return { ...empty, message: (error as Error).message };
    }
  });

  return {
    enabled,
    line: computed(() => result.value.line),
    offered: computed(() => result.value.offered),
    targetAltitudeDeg: computed(() => result.value.targetAltitudeDeg),
    message: computed(() => result.value.message),
  };
}
