/**
 * Intervals where a diurnal quantity (an altitude-like function of a Sun or Moon position) is
 * below zero, solved event by event.
 *
 * Method: find every extremum of the function (its culminations, close to the meridian and
 * antimeridian passages), then solve one crossing in each monotonic piece between successive
 * extrema where the sign changes. The extremum's own value decides whether the threshold is
 * reached at all, so grazes (an extremum just above or below the threshold) and nights with no
 * darkness need no special case, and polar day and night simply produce no crossing.
 *
 * - Up to 80 deg of latitude the body moves much faster in hour angle than in declination, so the
 *   derivative has a known sign 6 h either side of a passage: each extremum is bracketed by
 *   [passage - 6 h, passage + 6 h] and found by safeguarded Newton steps; the next passage is
 *   predicted half a (solar or lunar) day later. Maxima and minima alternate.
 * - Beyond 80 deg the declination drift can rival the diurnal motion: the time axis is cut at the
 *   body's hour angles of +-90 deg, the derivative's sign is computed at each cut, and an extremum is
 *   solved only in pieces where it changes sign (pieces without one are monotonic; a pair of extrema
 *   merging inside one piece changes the function by a negligible amount).
 */
import { appendMerging, type FlatIntervals } from './intervals';
import { centralDerivative, refineExtremum, solveBracketed } from './roots';

const HALF_PI = Math.PI / 2;
const TWO_PI = 2 * Math.PI;

/** Latitude (deg) up to which the derivative's sign 6 h from a passage is taken as known. */
export const REGULAR_LATITUDE_LIMIT_DEG = 80;

/** Extrema closer than this to zero (function units) are solved to full precision. */
const EXTREMUM_MARGIN = 1e-4;

/** A diurnal quantity: the function and the body's hour angle. */
export interface DiurnalQuantity {
  /** Smooth function of UT days, negative where the condition holds; extrema near the passages. */
  value: (t: number) => number;
  /** The body's geocentric hour angle, rad, any branch. */
  hourAngle: (t: number) => number;
  /** Nominal hour-angle rate, rad/day (Sun 2 pi, Moon about 0.966 x 2 pi). */
  rateRadPerDay: number;
}

/**
 * Times where the hour angle is 90 deg or 270 deg, covering [from, to] with one point at or before
 * `from` and one at or after `to`.
 */
export function quarterPoints(q: DiurnalQuantity, from: number, to: number): number[] {
  const rate = q.rateRadPerDay;
  const residual = (t: number): number => {
    let r = (q.hourAngle(t) - HALF_PI) % Math.PI;
    if (r < 0) r += Math.PI;
    return r >= HALF_PI ? r - Math.PI : r;
  };
  const halfCycle = Math.PI / rate;
  let t = from;
  t -= residual(t) / rate;
  t -= residual(t) / rate;
  if (t > from) {
    t -= halfCycle;
    t -= residual(t) / rate;
  }
  const points = [t];
  while (t < to) {
    t += halfCycle;
    t -= residual(t) / rate;
    points.push(t);
  }
  return points;
}

/** Extrema in (from, to), regular latitudes: chained from passage to passage. */
function regularExtrema(q: DiurnalQuantity, from: number, to: number, nodeT: number[], nodeV: number[]): void {
  const halfCycle = Math.PI / q.rateRadPerDay;
  let h = q.hourAngle(from) % TWO_PI;
  if (h < 0) h += TWO_PI;
  // The last passage at or before `from`: upper (a maximum) if 0 <= h < pi, else lower.
  let isMax = h < Math.PI;
  let guess = from - (isMax ? h : h - Math.PI) / q.rateRadPerDay;
  for (;;) {
    const ext = refineExtremum(q.value, guess - halfCycle / 2, guess + halfCycle / 2, isMax ? 1 : -1, guess, EXTREMUM_MARGIN);
    if (ext.t >= to) return;
    if (ext.t > from && ext.t > nodeT[nodeT.length - 1]!) {
      nodeT.push(ext.t);
      nodeV.push(ext.value);
    }
    guess = ext.t + halfCycle;
    isMax = !isMax;
  }
}

/** Extrema in (from, to), polar latitudes: derivative signs at the +-90 deg hour-angle cuts. */
function polarExtrema(q: DiurnalQuantity, from: number, to: number, nodeT: number[], nodeV: number[]): void {
  const points = quarterPoints(q, from, to);
  let prevSlope = centralDerivative(q.value, points[0]!);
  for (let k = 0; k + 1 < points.length; k++) {
    const lo = points[k]!;
    const hi = points[k + 1]!;
    const slope = centralDerivative(q.value, hi);
    if ((prevSlope >= 0) !== (slope >= 0)) {
      const ext = refineExtremum(q.value, lo, hi, prevSlope >= 0 ? 1 : -1, (lo + hi) / 2);
      if (ext.t > from && ext.t < to && ext.t > nodeT[nodeT.length - 1]!) {
        nodeT.push(ext.t);
        nodeV.push(ext.value);
      }
    }
    prevSlope = slope;
  }
}

/**
 * Sorted intervals within [from, to] where the quantity is negative.
 * @param q - The quantity.
 * @param latDeg - Site latitude, deg (-90..90): selects the regular or the polar method.
 * @param from - Start, UT days.
 * @param to - End, UT days, > from.
 * @returns Flat list [start, end, ...] in UT days, clipped to [from, to].
 */
export function diurnalIntervalsBelowZero(q: DiurnalQuantity, latDeg: number, from: number, to: number): FlatIntervals {
  const nodeT: number[] = [from];
  const nodeV: number[] = [q.value(from)];
  if (Math.abs(latDeg) <= REGULAR_LATITUDE_LIMIT_DEG) regularExtrema(q, from, to, nodeT, nodeV);
  else polarExtrema(q, from, to, nodeT, nodeV);
  nodeT.push(to);
  nodeV.push(q.value(to));
  return intervalsFromNodes(q.value, nodeT, nodeV);
}

/**
 * Builds the intervals where `value` < 0 from nodes between which it is monotonic. The first root
 * guess in each piece comes from a half-cosine through the two nodes (the shape of an altitude
 * between culminations), which puts it within about a minute of the crossing.
 * @param value - The function, UT days -> number.
 * @param nodeT - Increasing node times, first = range start, last = range end.
 * @param nodeV - value at each node.
 */
export function intervalsFromNodes(value: (t: number) => number, nodeT: number[], nodeV: number[]): FlatIntervals {
  const out: FlatIntervals = [];
  let inside = nodeV[0]! < 0;
  let start = nodeT[0]!;
  for (let i = 0; i + 1 < nodeT.length; i++) {
    const v0 = nodeV[i]!;
    const v1 = nodeV[i + 1]!;
    if ((v0 < 0) !== (v1 < 0)) {
      const t0 = nodeT[i]!;
      const t1 = nodeT[i + 1]!;
      // v(t) ~ m + a cos(pi s), s = (t - t0) / (t1 - t0), through both nodes.
      const m = (v0 + v1) / 2;
      const a = (v0 - v1) / 2;
      const s = Math.acos(Math.min(1, Math.max(-1, -m / a))) / Math.PI;
      const guess = t0 + s * (t1 - t0);
      const slope = (-a * Math.PI * Math.sin(Math.PI * s)) / (t1 - t0);
      const root = solveBracketed(value, t0, v0, t1, v1, guess, slope);
      if (inside) appendMerging(out, start, root, 0);
      else start = root;
      inside = !inside;
    }
  }
  if (inside) appendMerging(out, start, nodeT[nodeT.length - 1]!, 0);
  return out;
}
