import { onBeforeUnmount, watch, type Ref } from 'vue';
import { layerGroup, marker, polyline, type LayerGroup, type Map as LeafletMap } from 'leaflet';
import { graticule, type ViewBounds } from '@/components/map/mapGeometry';
import { labelIcon } from '@/components/map/pinIcons';

/**
 * The coordinate grid of the offline base map, drawn straight with Leaflet into one layer group
 * and rebuilt after each move: its lines change on every zoom, and mounting and unmounting
 * dozens of @vue-leaflet components that fast races their asynchronous set-up.
 *
 * @param map - the map, once ready
 * @param pane - the pane to draw into (under the tiles)
 * @param shown - whether the grid is wanted (tiles unavailable)
 * @param view - the part of the map in view
 */
export function useOfflineGrid(map: Ref<LeafletMap | null>, pane: string, shown: Ref<boolean>, view: Ref<ViewBounds | null>) {
  let group: LayerGroup | null = null;

  watch([map, shown, view], ([m, on, v]) => {
    if (!m) return;
    group ??= layerGroup([], { pane }).addTo(m);
    group.clearLayers();
    if (!on || !v) return;
    const grid = graticule(v);
    const latSpan = v.north - v.south;
    const lonSpan = v.east - v.west;
    for (const line of grid.lines) {
      polyline(line.points, { pane, className: 'gn-grid', weight: 1, interactive: false }).addTo(group);
      const at: [number, number] = line.kind === 'parallel' ? [line.valueDeg, v.west + lonSpan * 0.01] : [v.south + latSpan * 0.02, line.valueDeg];
      marker(at, { pane, icon: labelIcon(`gn-grid-label gn-grid-label-${line.kind}`, line.label), interactive: false, keyboard: false }).addTo(group);
    }
  }, { immediate: true });

  onBeforeUnmount(() => {
    group?.remove();
    group = null;
  });
}
