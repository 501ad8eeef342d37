/**
 * Drawing helpers for the sky overlay: project polylines of sky directions (a target's track,
 * the galactic plane, the frame box) into a calibrated photo, split into runs that an SVG path
 * can draw without cutting across the frame.
 */
import type { Frame, ObserverSite } from '../schemas/geometry';
import { assertFiniteInRange, assertIntegerInRange } from '../guards';
import { normalizeDegrees360 } from '../units';
import { galacticPlanePoints, targetHorizontal } from '../sky';
import type { HorizontalOptions } from '../sky';
import { assertSkyDirection, type CameraPose, cameraBasis, type PixelPoint, projectWithBasis, type SkyDirection } from './camera';

/** Default margin around the image inside which projected points are kept, in image sizes. */
export const DEFAULT_OVERLAY_MARGIN = 1;
/** Rounding slack at the margin's edge, as a fraction of the image size. */
const EDGE_SLACK_FRACTION = 1e-9;

/** Options for {@link projectPolyline}. */
export interface PolylineOptions {
  /**
   * How far outside the image a point may lie and still be drawn, as a fraction of the image
   * width (horizontally) and height (vertically), 0..10 (default 1: one image size each side).
   * Points farther out, or behind the camera, break the line.
   */
  margin?: number;
  /** Treat the points as a closed loop (the last joins the first), default false. */
  closed?: boolean;
}

/**
 * Projects a polyline of sky directions into the image and splits it into drawable runs.
 * A run breaks at every point behind the camera or farther outside the image than the margin,
 * so no segment joins points on opposite sides of the camera. Runs of a single point are
 * dropped (nothing to draw). Straight segments between projected points approximate the curve:
 * sample the sky densely (about 1 deg) for smooth lines; the runs end at the last kept point,
 * beyond the image edge when the margin is above 0, so SVG clipping draws them to the edge.
 * @param pose - camera pose and image size (see cameraPoseSchema)
 * @param points - sky directions in drawing order (azimuth 0..360 deg, altitude -90..90 deg)
 * @param options - margin and closing, see {@link PolylineOptions}
 * @returns runs of pixel points (x right, y down), each with at least two points
 * @throws RangeError on invalid input
 */
export function projectPolyline(pose: CameraPose, points: readonly SkyDirection[], options: PolylineOptions = {}): PixelPoint[][] {
  const basis = cameraBasis(pose);
  const margin = assertFiniteInRange(options.margin ?? DEFAULT_OVERLAY_MARGIN, 'margin', 0, 10);
  if (!Array.isArray(points)) throw new RangeError('points must be an array');
  // A hair of slack (1e-9 of the image size) keeps points exactly on the edge despite rounding.
  const slackX = EDGE_SLACK_FRACTION * pose.widthPx;
  const slackY = EDGE_SLACK_FRACTION * pose.heightPx;
  const minX = -margin * pose.widthPx - slackX;
  const maxX = (1 + margin) * pose.widthPx + slackX;
  const minY = -margin * pose.heightPx - slackY;
  const maxY = (1 + margin) * pose.heightPx + slackY;
  const projected: (PixelPoint | null)[] = points.map((point, i) => {
    const d = assertSkyDirection(point, `points[${i}]`);
    const p = projectWithBasis(basis, d.azimuthDeg, d.altitudeDeg);
    return p.inFront && p.x >= minX && p.x <= maxX && p.y >= minY && p.y <= maxY ? { x: p.x, y: p.y } : null;
  });

  let ordered = projected;
  if (options.closed === true && projected.length > 1) {
    const firstBreak = projected.findIndex((p) => p === null);
    // All kept: close the loop by repeating the first point. Otherwise start just after a
    // break so that the run crossing the list's end is not cut in two.
    ordered = firstBreak < 0 ? [...projected, projected[0] ?? null] : [...projected.slice(firstBreak + 1), ...projected.slice(0, firstBreak + 1)];
  }

  const runs: PixelPoint[][] = [];
  let run: PixelPoint[] = [];
  for (const p of ordered) {
    if (p === null) {
      if (run.length > 1) runs.push(run);
      run = [];
    } else {
      run.push(p);
    }
  }
  if (run.length > 1) runs.push(run);
  return runs;
}

/**
 * The frame box (azimuth +- half-width, bottom..top altitude) as a projected closed outline.
 * Edges of constant altitude are not straight in a rectilinear image, so each edge is sampled.
 * @param pose - camera pose and image size (see cameraPoseSchema)
 * @param frame - the frame (shared/schemas/geometry Frame: azimuth 0..360, half-width 0..180,
 *   altitudes -90..90 with top above bottom)
 * @param samplesPerEdge - segments per edge, integer 1..1000 (default 16)
 * @param options - margin (see {@link PolylineOptions}); the outline is always closed
 * @returns runs of pixel points; one closed run (first point repeated at the end) when the whole
 *   box is in view
 * @throws RangeError on invalid input
 */
export function frameOutline(pose: CameraPose, frame: Frame, samplesPerEdge = 16, options: Pick<PolylineOptions, 'margin'> = {}): PixelPoint[][] {
  assertIntegerInRange(samplesPerEdge, 'samplesPerEdge', 1, 1000);
  const azimuthDeg = assertFiniteInRange(frame?.azimuthDeg, 'frame.azimuthDeg', 0, 360);
  const halfWidthDeg = assertFiniteInRange(frame.halfWidthDeg, 'frame.halfWidthDeg', 0, 180);
  const bottomAltDeg = assertFiniteInRange(frame.bottomAltDeg, 'frame.bottomAltDeg', -90, 90);
  const topAltDeg = assertFiniteInRange(frame.topAltDeg, 'frame.topAltDeg', -90, 90);
  if (!(topAltDeg > bottomAltDeg)) throw new RangeError(`frame.topAltDeg must be above frame.bottomAltDeg (got ${topAltDeg} <= ${bottomAltDeg})`);
  const left = azimuthDeg - halfWidthDeg;
  const right = azimuthDeg + halfWidthDeg;
  const corners: [number, number][] = [
    [left, bottomAltDeg],
    [right, bottomAltDeg],
    [right, topAltDeg],
    [left, topAltDeg],
  ];
  const points: SkyDirection[] = [];
  for (let edge = 0; edge < 4; edge++) {
    const [az0, alt0] = corners[edge] as [number, number];
    const [az1, alt1] = corners[(edge + 1) % 4] as [number, number];
    for (let i = 0; i < samplesPerEdge; i++) {
      const k = i / samplesPerEdge;
      points.push({ azimuthDeg: normalizeDegrees360(az0 + (az1 - az0) * k), altitudeDeg: alt0 + (alt1 - alt0) * k });
    }
  }
  return projectPolyline(pose, points, { margin: options.margin, closed: true });
}

/** A galactic-plane point in horizontal coordinates. */
export interface HorizontalGalacticPlanePoint extends SkyDirection {
  /** Galactic longitude, degrees 0..360 (0: the galactic centre). */
  lDeg: number;
}

/**
 * The galactic plane (galactic latitude 0) in horizontal coordinates for a site and instant,
 * ready for {@link projectPolyline} with `closed: true`.
 * @param site - observer (lat -90..90, lon -180..180 east positive, elevation -500..9000 m)
 * @param date - the instant (UTC)
 * @param stepDeg - spacing in galactic longitude, degrees 0.1..90 (default 1)
 * @param options - refraction (default: apparent altitude, as targetHorizontal)
 * @returns points in galactic-longitude order from l = 0 (the galactic centre)
 * @throws RangeError on invalid input
 */
export function galacticPlaneHorizontal(site: ObserverSite, date: Date, stepDeg = 1, options: HorizontalOptions = {}): HorizontalGalacticPlanePoint[] {
  return galacticPlanePoints(stepDeg).map((p) => {
    const h = targetHorizontal(p, site, date, options);
    return { lDeg: p.lDeg, azimuthDeg: h.azimuthDeg, altitudeDeg: h.altitudeDeg };
  });
}

/**
 * SVG path data for projected runs: `M x y L x y ...` per run.
 * @param runs - runs of pixel points (e.g. from {@link projectPolyline}); runs shorter than two
 *   points are skipped
 * @param decimals - digits after the decimal point, integer 0..6 (default 1)
 * @returns the `d` attribute of an SVG path (empty string when there is nothing to draw)
 * @throws RangeError on invalid input
 */
export function svgPathData(runs: readonly (readonly PixelPoint[])[], decimals = 1): string {
  assertIntegerInRange(decimals, 'decimals', 0, 6);
  const f = (n: number): string => String(Number(n.toFixed(decimals)));
  return runs
    .filter((run) => run.length > 1)
    .map((run) => run.map((p, i) => `${i === 0 ? 'M' : 'L'}${f(assertFiniteInRange(p.x, 'x'))} ${f(assertFiniteInRange(p.y, 'y'))}`).join(' '))
    .join(' ');
}

/**
 * Splits a closed loop of sky points (e.g. the galactic plane) into the open runs that stay at or
 * above an altitude, so the part under the ground or sea is not drawn.
 * @param loop - sky directions in loop order (the last joins the first)
 * @param minAltitudeDeg - lowest altitude kept, degrees -90..90
 * @returns the runs in loop order (runs of one point dropped); `closed` is true only when no point
 *   was below, and then the single run is the whole loop, to be drawn closed
 * @throws RangeError on invalid input
 */
export function runsAboveAltitude<T extends SkyDirection>(loop: readonly T[], minAltitudeDeg: number): { runs: T[][]; closed: boolean } {
  if (!Array.isArray(loop)) throw new RangeError('loop must be an array');
  assertFiniteInRange(minAltitudeDeg, 'minAltitudeDeg', -90, 90);
  loop.forEach((p, i) => assertSkyDirection(p, `loop[${i}]`));
  const firstBelow = loop.findIndex((p) => p.altitudeDeg < minAltitudeDeg);
  if (firstBelow < 0) return { runs: loop.length > 1 ? [loop.slice()] : [], closed: true };
  // Start at a point below, so a run that wraps past the loop's end stays in one piece.
  const rotated = [...loop.slice(firstBelow), ...loop.slice(0, firstBelow)];
  const runs: T[][] = [];
  let current: T[] = [];
  for (const p of rotated) {
    if (p.altitudeDeg >= minAltitudeDeg) current.push(p);
    else if (current.length) {
      runs.push(current);
      current = [];
    }
  }
  if (current.length) runs.push(current);
  return { runs: runs.filter((r) => r.length > 1), closed: false };
}
