import { shallowRef, ref, watch, type Ref } from 'vue';
import type { FeatureCollection } from 'geojson';
import type { GeometryCollection, Topology } from 'topojson-specification';
import { landForFlatMap } from '@/components/map/antimeridian';

let cached: Promise<FeatureCollection> | undefined;

/**
 * The world's land (Natural Earth 1:50m via world-atlas, shipped with the app) as GeoJSON. Loaded
 * with a dynamic import the first time it is needed, so it stays out of the main bundle.
 */
export function loadOfflineLand(): Promise<FeatureCollection> {
  cached ??= Promise.all([import('world-atlas/land-50m.json'), import('topojson-client')])
    .then(([atlas, topojson]) => {
      const topology = atlas.default as unknown as Topology<{ land: GeometryCollection }>;
      return landForFlatMap(topojson.feature(topology, topology.objects.land) as FeatureCollection);
    })
    .catch((error: unknown) => {
      cached = undefined;
      throw error;
    });
  return cached;
}

/** The offline land layer, loaded once `wanted` turns true. */
export function useOfflineLand(wanted: Readonly<Ref<boolean>>) {
  const land = shallowRef<FeatureCollection | null>(null);
  const failed = ref(false);
  watch(wanted, (value) => {
    if (!value || land.value) return;
    loadOfflineLand()
      .then((fc) => { land.value = fc; failed.value = false; })
      .catch(() => { failed.value = true; });
  }, { immediate: true });
  return { land, failed };
}
