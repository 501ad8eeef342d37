/**
 * Lines the scouting map draws, computed with shared/geo: rays from the vantage along an
 * azimuth, the sightline itself, and the coordinate grid of the offline base map.
 */
import { destinationPoint, distanceM, geodesicInverse, type GeoPoint } from '../../../shared/geo';

/** Leaflet's [lat, lng] pair. */
export type LatLngTuple = [number, number];

/** The part of the map in view, degrees. */
export interface ViewBounds {
  south: number;
  west: number;
  north: number;
  east: number;
}

/** Points along a geodesic from `start` heading `azimuthDeg` for `lengthM`, for a polyline. */
export function rayPoints(start: GeoPoint, azimuthDeg: number, lengthM: number, segments = 8): LatLngTuple[] {
  const points: LatLngTuple[] = [[start.lat, start.lon]];
  for (let i = 1; i <= segments; i += 1) {
    const p = destinationPoint(start, azimuthDeg, (lengthM * i) / segments);
    points.push([p.lat, p.lon]);
  }
  return points;
}

/**
 * Ray length that reaches past the edge of the view from `start`: the distance to the farthest
 * corner, at least 1 km, at most 2000 km (beyond that the map is a globe and rays lose meaning).
 */
export function rayLengthForView(start: GeoPoint, view: ViewBounds | null): number {
  if (!view) return 20_000;
  const clampLat = (lat: number) => Math.max(-89.9, Math.min(89.9, lat));
  const clampLon = (lon: number) => Math.max(-180, Math.min(180, lon));
  const corners: GeoPoint[] = [
    { lat: clampLat(view.north), lon: clampLon(view.west) },
    { lat: clampLat(view.north), lon: clampLon(view.east) },
    { lat: clampLat(view.south), lon: clampLon(view.west) },
    { lat: clampLat(view.south), lon: clampLon(view.east) },
  ];
  const farthest = Math.max(...corners.map((c) => distanceM(start, c)));
  return Math.min(2_000_000, Math.max(1_000, farthest));
}

/** The sightline as a polyline along the geodesic from vantage to landmark. */
export function sightlinePoints(vantage: GeoPoint, landmark: GeoPoint): LatLngTuple[] {
  const line = geodesicInverse(vantage, landmark);
  // Short lines are straight on the map; long ones follow the geodesic.
  if (line.distanceM < 50_000) return [[vantage.lat, vantage.lon], [landmark.lat, landmark.lon]];
  return rayPoints(vantage, line.initialBearingDeg, line.distanceM, 32);
}

/** Grid spacings offered, degrees: about 4 to 10 lines across the view. */
const GRID_STEPS_DEG = [30, 10, 5, 2, 1, 0.5, 0.2, 0.1, 0.05, 0.02, 0.01, 0.005, 0.002, 0.001];

/** A grid line with its label. */
export interface GridLine {
  kind: 'parallel' | 'meridian';
  valueDeg: number;
  label: string;
  points: LatLngTuple[];
}

function gridLabel(value: number, kind: GridLine['kind'], step: number): string {
  const decimals = Math.max(0, Math.ceil(-Math.log10(step) - 1e-9));
  const hemisphere = value === 0 ? '' : kind === 'parallel' ? (value > 0 ? 'N' : 'S') : (value > 0 ? 'E' : 'W');
  return `${Math.abs(value).toFixed(decimals)}°${hemisphere}`;
}

/**
 * The coordinate grid for the view: parallels and meridians at a round spacing, each with its
 * label; `stepDeg` is the spacing chosen.
 */
export function graticule(view: ViewBounds): { stepDeg: number; lines: GridLine[] } {
  const south = Math.max(-85, view.south);
  const north = Math.min(85, view.north);
  const west = Math.max(-180, view.west);
  const east = Math.min(180, view.east);
  const span = Math.max(north - south, east - west, 1e-6);
  const stepDeg = GRID_STEPS_DEG.find((s) => span / s >= 4) ?? GRID_STEPS_DEG[GRID_STEPS_DEG.length - 1]!;
  const lines: GridLine[] = [];
  const round = (x: number) => Math.round(x / stepDeg) * stepDeg;
  for (let lat = Math.ceil(south / stepDeg) * stepDeg; lat <= north + 1e-12 && lines.length < 200; lat += stepDeg) {
    const v = Number(round(lat).toFixed(6));
    lines.push({ kind: 'parallel', valueDeg: v, label: gridLabel(v, 'parallel', stepDeg), points: [[v, west], [v, east]] });
  }
  for (let lon = Math.ceil(west / stepDeg) * stepDeg; lon <= east + 1e-12 && lines.length < 400; lon += stepDeg) {
    const v = Number(round(lon).toFixed(6));
    lines.push({ kind: 'meridian', valueDeg: v, label: gridLabel(v, 'meridian', stepDeg), points: [[south, v], [north, v]] });
  }
  return { stepDeg, lines };
}

function inside(p: GeoPoint, view: ViewBounds, marginFraction: number): boolean {
  const dLat = (view.north - view.south) * marginFraction;
  const dLon = (view.east - view.west) * marginFraction;
  return p.lat > view.south + dLat && p.lat < view.north - dLat && p.lon > view.west + dLon && p.lon < view.east - dLon;
}

/**
 * Where along a ray to put its label so that it shows: part-way to where the ray leaves the view
 * (found by bisection), or part-way along the ray when the start is not in view.
 */
export function rayLabelPoint(start: GeoPoint, azimuthDeg: number, lengthM: number, view: ViewBounds | null): LatLngTuple {
  const MARGIN = 0.06;
  let along = lengthM * 0.42;
  if (view && inside(start, view, MARGIN)) {
    let lo = 0;
    let hi = lengthM;
    for (let i = 0; i < 30; i += 1) {
      const mid = (lo + hi) / 2;
      if (inside(destinationPoint(start, azimuthDeg, mid), view, MARGIN)) lo = mid;
      else hi = mid;
    }
    along = lo * 0.62;
  }
  const p = destinationPoint(start, azimuthDeg, Math.max(along, 1));
  return [p.lat, p.lon];
}
