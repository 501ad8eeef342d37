/**
 * Where the base map's tiles come from. Set at build time:
 * - VITE_TILE_URL (+ VITE_TILE_ATTRIBUTION): the standard map; default OpenStreetMap's standard tiles;
 * - VITE_SATELLITE_TILE_URL (+ VITE_SATELLITE_TILE_ATTRIBUTION): an optional satellite layer,
 *   offered only when set.
 * URLs use Leaflet's template, e.g. https://tile.openstreetmap.org/{z}/{x}/{y}.png.
 */

export interface TileSource {
  id: 'standard' | 'satellite';
  label: string;
  url: string;
  /** HTML shown in the map's attribution control. */
  attribution: string;
  maxZoom: number;
}

export const OSM_TILE_URL = 'https://tile.openstreetmap.org/{z}/{x}/{y}.png';
export const OSM_ATTRIBUTION = '&copy; <a href="https://www.openstreetmap.org/copyright">OpenStreetMap</a> contributors';
/** Credit for the offline land layer (world-atlas is built from Natural Earth, public domain). */
export const OFFLINE_LAND_ATTRIBUTION = 'Offline coastline: <a href="https://www.naturalearthdata.com/">Natural Earth</a>';

function text(value: unknown): string | undefined {
  return typeof value === 'string' && value.trim() !== '' ? value.trim() : undefined;
}

const env = import.meta.env;

/** The tile sources this build offers: the standard map first, then satellite when configured. */
export const tileSources: readonly TileSource[] = (() => {
  const sources: TileSource[] = [{
    id: 'standard',
    label: 'Map',
    url: text(env.VITE_TILE_URL) ?? OSM_TILE_URL,
    attribution: text(env.VITE_TILE_ATTRIBUTION) ?? (text(env.VITE_TILE_URL) ? '' : OSM_ATTRIBUTION),
    maxZoom: 19,
  }];
  const satellite = text(env.VITE_SATELLITE_TILE_URL);
  if (satellite) {
    sources.push({ id: 'satellite', label: 'Satellite', url: satellite, attribution: text(env.VITE_SATELLITE_TILE_ATTRIBUTION) ?? '', maxZoom: 19 });
  }
  return Object.freeze(sources);
})();
