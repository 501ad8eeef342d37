import { ref, watch, type Ref } from 'vue';
import { useRoute, useRouter } from 'vue-router';
import type { GeoPoint } from '../../shared/geo';
import { ApiError } from '@/api/client';
import { usePlannerStore, type MapView, type PinKind } from '@/stores/planner';
import { useSightlinesStore } from '@/stores/sightlines';
import { useGeolocation } from './useGeolocation';

/** What the planner page needs from its map. */
export interface PlannerMapHandle {
  focusOn(points: GeoPoint[]): void;
}

/**
 * The planner page's wiring between the map, the fields and the saved sightlines: clicks and
 * drags move the pins, "use my location" places the vantage, and `?sightline=<id>` opens a saved
 * sightline.
 */
export function usePlannerPage(map: Ref<PlannerMapHandle | null>) {
  const planner = usePlannerStore();
  const sightlines = useSightlinesStore();
  const route = useRoute();
  const router = useRouter();
  const geolocation = useGeolocation();
  const loadError = ref('');
  const loading = ref(false);

  function focus(points: Array<GeoPoint | null>): void {
    map.value?.focusOn(points.filter((p): p is GeoPoint => p !== null));
  }

  function onPlace(kind: PinKind, point: GeoPoint): void {
    planner.setPin(kind, point);
  }

  function onMove(kind: PinKind, point: GeoPoint): void {
    planner.setPin(kind, point);
  }

  function onPickSpot(point: GeoPoint): void {
    planner.setPin('vantage', point);
  }

  function onView(view: MapView): void {
    planner.mapView = view;
  }

  /** A pin typed into its field: show it (and the other pin when there is one). */
  function onCoordinatesApplied(kind: PinKind, point: GeoPoint): void {
    const other = planner.point(kind === 'vantage' ? 'landmark' : 'vantage');
    focus([point, other]);
  }

  async function useMyLocation(): Promise<void> {
    const found = await geolocation.locate();
    if (!found) return;
    planner.setPin('vantage', found);
    focus([found]);
  }

  async function openSightline(id: string): Promise<void> {
    if (planner.opened?.id === id) return;
    loading.value = true;
    loadError.value = '';
    try {
      const s = await sightlines.get(id);
      planner.loadSightline(s);
      focus([planner.vantagePoint, planner.landmarkPoint]);
    } catch (error) {
      loadError.value = error instanceof ApiError && error.status === 404
        ? 'That sightline does not exist, or it is not yours.'
        : (error as Error).message;
    } finally {
      loading.value = false;
    }
  }

  watch(() => route.query.sightline, (id) => {
    if (typeof id === 'string' && id) void openSightline(id);
  }, { immediate: true });

  async function newPlan(): Promise<void> {
    planner.clear();
    await router.replace({ query: {} });
  }

  return {
    geolocation, loadError, loading,
    onPlace, onMove, onPickSpot, onView, onCoordinatesApplied, useMyLocation, newPlan,
  };
}
