/**
 * Makes world-atlas land polygons drawable on Leaflet's flat map. The atlas is made for spherical
 * renderers (d3-geo): a few rings cross the antimeridian (Chukotka, Wrangel Island, Fiji) and
 * Antarctica's ring goes round the South Pole. Drawn as they are, their 180 -> -180 jumps become
 * bands across the whole map. Here each ring's longitudes are made continuous (so a ring may run
 * past 180), a ring round a pole is closed through the pole, and a ring that runs past +-180 gets
 * a copy shifted by 360 so that both ends of the map show it.
 *
 * Written here because the job is a few lines specific to this data; the general-purpose
 * antimeridian packages cut polygons for other purposes and add a dependency for little.
 */
import type { FeatureCollection, MultiPolygon, Polygon, Position } from 'geojson';

type Ring = Position[];

/** The ring with continuous longitudes, and how far its end drifted from its start (0 or +-360). */
function unwrapRing(ring: Ring): { ring: Ring; driftDeg: number } {
  const out: Ring = [];
  let offset = 0;
  let previous: number | null = null;
  for (const position of ring) {
    const lon = (position[0] as number) + offset;
    let x = lon;
    if (previous !== null) {
      if (x - previous > 180) { offset -= 360; x -= 360; } else if (x - previous < -180) { offset += 360; x += 360; }
    }
    out.push([x, position[1] as number]);
    previous = x;
  }
  const first = out[0];
  const last = out[out.length - 1];
  return { ring: out, driftDeg: first && last ? (last[0] as number) - (first[0] as number) : 0 };
}

function shift(rings: Ring[], byDeg: number): Ring[] {
  return rings.map((ring) => ring.map((p) => [(p[0] as number) + byDeg, p[1] as number]));
}

function fixPolygon(rings: Ring[]): Ring[][] {
  const fixed = rings.map((r, index) => {
    const { ring, driftDeg } = unwrapRing(r);
    if (index === 0 && Math.abs(driftDeg) > 180) {
      // Round a pole: close the ring along the pole's latitude.
      const meanLat = ring.reduce((sum, p) => sum + (p[1] as number), 0) / ring.length;
      const pole = meanLat < 0 ? -90 : 90;
      const first = ring[0] as Position;
      const last = ring[ring.length - 1] as Position;
      ring.push([last[0] as number, pole], [first[0] as number, pole], [first[0] as number, first[1] as number]);
    }
    return ring;
  });
  const outer = fixed[0] ?? [];
  const lons = outer.map((p) => p[0] as number);
  const polygons = [fixed];
  if (Math.max(...lons) > 180) polygons.push(shift(fixed, -360));
  if (Math.min(...lons) < -180) polygons.push(shift(fixed, 360));
  return polygons;
}

/** The land as one MultiPolygon feature per input feature, fit for Leaflet. */
export function landForFlatMap(land: FeatureCollection): FeatureCollection<MultiPolygon> {
  return {
    type: 'FeatureCollection',
    features: land.features.flatMap((f) => {
      const g = f.geometry as Polygon | MultiPolygon | null;
      if (!g || (g.type !== 'Polygon' && g.type !== 'MultiPolygon')) return [];
      const polygons = g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
      return [{ type: 'Feature' as const, properties: f.properties, geometry: { type: 'MultiPolygon' as const, coordinates: polygons.flatMap(fixPolygon) } }];
    }),
  };
}
