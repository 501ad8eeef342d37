/**
 * Atmospheric refraction for targets: astronomy-engine's `Refraction('normal', h)` (Saemundsson's
 * formula with geometric altitude in, clamped at -1 deg and tapered to zero at the nadir). It
 * changes altitude only. The frame's altitude band is given in apparent altitude; since
 * h -> h + R(h) is strictly increasing, the band maps to a geometric band through the inverse
 * below, and "inside the band" means the same thing in both.
 */
import { Refraction } from 'astronomy-engine';

/**
 * Apparent altitude seen for a geometric altitude.
 * @param geometricDeg - Geometric (airless) altitude, deg, -90..90.
 * @returns Apparent altitude, deg.
 */
export function apparentAltitudeDeg(geometricDeg: number): number {
  return geometricDeg + Refraction('normal', geometricDeg);
}

/**
 * Geometric altitude whose apparent altitude is `apparentDeg` (inverse of
 * {@link apparentAltitudeDeg}, by bisection to 1e-12 deg).
 * @param apparentDeg - Apparent altitude, deg, -90..90.
 * @returns Geometric altitude, deg, -90..90 (90 when `apparentDeg` is above the apparent altitude
 *   of the zenith, which refraction puts 0.0001 deg below 90).
 * @throws RangeError when the input is not a number in -90..90.
 */
export function geometricAltitudeDeg(apparentDeg: number): number {
  if (!Number.isFinite(apparentDeg) || apparentDeg < -90 || apparentDeg > 90) throw new RangeError('altitude must be a finite number in -90..90');
  if (apparentDeg >= apparentAltitudeDeg(90)) return 90;
  let lo = -90;
  let hi = 90;
  for (let i = 0; i < 60 && hi - lo > 1e-12; i++) {
    const mid = (lo + hi) / 2;
    if (apparentAltitudeDeg(mid) < apparentDeg) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
