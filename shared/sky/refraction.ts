/**
 * Atmospheric refraction near sea level.
 *
 * The forward formula is astronomy-engine's Refraction('normal'): Saemundsson's formula (Meeus
 * eq. 16.4, R = 1.02 / tan(h + 10.3/(h + 5.11)) arcmin, h the true altitude, clamped at
 * h = -1 deg and tapered to 0 at the nadir), which is built to invert Bennett's formula (Meeus
 * eq. 16.3, h the apparent altitude). The two agree within about 0.07 arcmin from the horizon up;
 * the tests compare against Bennett's values within 0.1 arcmin.
 *
 * Two guards on top of astronomy-engine 2.1.19:
 * - Saemundsson's formula goes slightly negative near the zenith (-0.002 arcmin at 90 deg); the
 *   result is clamped at 0 (an error below 0.2 arcsec).
 * - astronomy-engine's InverseRefraction loops forever at an apparent altitude of exactly 90 deg
 *   (its 1e-14 stopping test never passes there), so the inverse is solved here by the same
 *   fixed-point iteration with a bounded number of steps.
 */
import { Refraction } from 'astronomy-engine';
import { assertFiniteInRange } from '../guards';

/**
 * Refraction lift, in degrees, for an object at the given true (airless) altitude: add it to the
 * true altitude to get the apparent altitude. Standard atmosphere near sea level.
 * @param trueAltitudeDeg true altitude in degrees, -90..90
 * @returns refraction in degrees (>= 0; about 0.48 deg at a true altitude of 0)
 * @throws RangeError on NaN or out-of-range input
 */
export function refractionForTrueAltitudeDeg(trueAltitudeDeg: number): number {
  assertFiniteInRange(trueAltitudeDeg, 'trueAltitudeDeg', -90, 90);
  return forwardDeg(trueAltitudeDeg);
}

/**
 * astronomy-engine's refraction lift `Refraction('normal', h)` as it is, with no guard and no
 * clamp: exactly what its `Horizon(..., 'normal')` adds to a true altitude, slightly negative
 * above a true altitude of about 89.89 deg (-0.116 arcsec at the zenith). Only for hot paths that
 * have checked their input and must match Horizon to the bit (the lineup engine); everything else
 * uses {@link refractionForTrueAltitudeDeg}, which clamps at 0.
 * @param trueAltitudeDeg true altitude in degrees, -90..90 (not checked; 0 outside)
 * @returns refraction in degrees (about 0.48 deg at a true altitude of 0)
 */
export function unclampedRefractionDeg(trueAltitudeDeg: number): number {
  return Refraction('normal', trueAltitudeDeg);
}

function forwardDeg(trueAltitudeDeg: number): number {
  return Math.max(0, unclampedRefractionDeg(trueAltitudeDeg));
}

/** Stopping tolerance of the inversion, degrees (3.6e-9 arcsec). */
const INVERSE_TOLERANCE_DEG = 1e-12;
/** Iteration bound of the inversion; it converges in under 10 steps (|dR/dh| < 0.25). */
const INVERSE_MAX_ITERATIONS = 60;

function inverseDeg(apparentAltitudeDeg: number): number {
  let altitude = apparentAltitudeDeg - forwardDeg(apparentAltitudeDeg);
  for (let i = 0; i < INVERSE_MAX_ITERATIONS; i++) {
    const diff = altitude + forwardDeg(altitude) - apparentAltitudeDeg;
    if (Math.abs(diff) < INVERSE_TOLERANCE_DEG) break;
    altitude -= diff;
  }
  return apparentAltitudeDeg - altitude;
}

/**
 * Refraction, in degrees, contained in an observed (apparent) altitude: subtract it from the
 * apparent altitude to get the true altitude.
 * @param apparentAltitudeDeg apparent altitude in degrees, -90..90
 * @returns refraction in degrees (>= 0; about 0.574 deg at an apparent altitude of 0)
 * @throws RangeError on NaN or out-of-range input
 */
export function refractionForApparentAltitudeDeg(apparentAltitudeDeg: number): number {
  assertFiniteInRange(apparentAltitudeDeg, 'apparentAltitudeDeg', -90, 90);
  return inverseDeg(apparentAltitudeDeg);
}

/**
 * Apparent altitude of an object at a given true altitude.
 * @param trueAltitudeDeg true altitude in degrees, -90..90
 * @returns apparent altitude in degrees
 * @throws RangeError on NaN or out-of-range input
 */
export function apparentFromTrueAltitudeDeg(trueAltitudeDeg: number): number {
  return trueAltitudeDeg + refractionForTrueAltitudeDeg(trueAltitudeDeg);
}

/**
 * True altitude of an object seen at a given apparent altitude (e.g. read from an inclinometer).
 * @param apparentAltitudeDeg apparent altitude in degrees, -90..90
 * @returns true altitude in degrees
 * @throws RangeError on NaN or out-of-range input
 */
export function trueFromApparentAltitudeDeg(apparentAltitudeDeg: number): number {
  return apparentAltitudeDeg - refractionForApparentAltitudeDeg(apparentAltitudeDeg);
}
