/**
 * Atmospheric refraction for targets: astronomy-engine's `Refraction('normal', h)` (Saemundsson's
 * formula with geometric altitude in, clamped at -1 deg and tapered to zero at the nadir), taken
 * from the sky module's {@link unclampedRefractionDeg}. It changes altitude only. The frame's
 * altitude band is given in apparent altitude; since h -> h + R(h) is strictly increasing, the
 * band maps to a geometric band through the inverse below, and "inside the band" means the same
 * thing in both.
 *
 * Why not sky/refraction's apparentFromTrueAltitudeDeg / trueFromApparentAltitudeDeg:
 * - speed: {@link apparentAltitudeDeg} runs inside the peak search, thousands of times a search,
 *   on an altitude that is already a clamped asin, so it skips the guard;
 * - the zenith: the sky module clamps the lift at 0 where the formula turns slightly negative
 *   (true altitude above about 89.89 deg, at most 0.116 arcsec); the engine keeps the unclamped
 *   lift that astronomy-engine's `Horizon(..., 'normal')` applies, the definition the brute-force
 *   oracle in tests/unit/lineup checks it against. Below 89.89 deg the two are the same number;
 *   tests/unit/lineup/framePassage.test.ts checks them against each other.
 */
import { assertFiniteInRange } from '../guards';
import { unclampedRefractionDeg } from '../sky/refraction';

/**
 * Apparent altitude seen for a geometric altitude (no guard: hot path).
 * @param geometricDeg - Geometric (airless) altitude, deg, -90..90.
 * @returns Apparent altitude, deg.
 */
export function apparentAltitudeDeg(geometricDeg: number): number {
  return geometricDeg + unclampedRefractionDeg(geometricDeg);
}

/**
 * Geometric altitude whose apparent altitude is `apparentDeg` (inverse of
 * {@link apparentAltitudeDeg}, by bisection to 1e-12 deg).
 * @param apparentDeg - Apparent altitude, deg, -90..90.
 * @returns Geometric altitude, deg, -90..90 (90 when `apparentDeg` is above the apparent altitude
 *   of the zenith, which the unclamped lift puts 0.00003 deg below 90).
 * @throws RangeError when the input is not a number in -90..90.
 */
export function geometricAltitudeDeg(apparentDeg: number): number {
  assertFiniteInRange(apparentDeg, 'apparentDeg', -90, 90);
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
