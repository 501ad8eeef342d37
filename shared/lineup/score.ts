/**
 * The lineup score: one number, 0..1, that reads as "how good is this lineup".
 *
 *   score = 0.4 C + 0.2 D + 0.2 K + 0.2 M
 *
 * - C, centring at the peak: (1 - u^2)(1 - v^2), where u is the azimuth offset from the frame
 *   centre over the half-width and v the apparent-altitude offset from the band's middle over half
 *   the band's height. 1 at the centre, 0 on any edge. The peak is the time that maximises C.
 * - D, duration: 1 - exp(-minutes / 30): 0.15 at 5 min, 0.63 at 30 min, 0.86 at 60 min.
 * - K, darkness at the peak: (-12 deg - Sun altitude) / 6 deg, clamped to 0..1: 1 once the Sun's
 *   centre is 18 deg or more below the horizon (astronomical night), 0 at -12 deg (nautical
 *   twilight). With the default Sun limit (-18 deg) K is always 1; it ranks lineups only when the
 *   search allows a brighter sky.
 * - M, moonlight at the peak: 1 when the Moon is down; else 1 - k sin(h), with k the illuminated
 *   fraction and h the Moon's altitude (a thin or low Moon costs little, a high bright one a lot).
 *
 * The weights favour what a photographer cannot fix afterwards (where the target sits in the
 * frame) over what the search conditions already bound (darkness, Moon). They are a design choice
 * of the project, not a published standard.
 */

import { assertFiniteInRange } from '../guards';

/** Inputs of the score, all at the lineup's peak. */
export interface ScoreInputs {
  /** Centring C, 0..1. */
  centring: number;
  /** Lineup duration, minutes, >= 0. */
  durationMin: number;
  /** Sun centre geometric altitude, deg. */
  sunAltitudeDeg: number;
  /** Whether the Moon is down (refracted upper limb below the horizon). */
  moonDown: boolean;
  /** Moon centre altitude, deg. */
  moonAltitudeDeg: number;
  /** Moon illuminated fraction, 0..1. */
  moonIllumination: number;
}

/** Duration time constant of D, minutes. */
export const SCORE_DURATION_SCALE_MIN = 30;

/**
 * Centring C from normalised offsets.
 * @param u - Azimuth offset / half-width (-1..1 inside the frame).
 * @param v - Altitude offset from the band middle / half the band (-1..1 inside).
 * @returns 0..1 (clamped).
 */
export function centringFromOffsets(u: number, v: number): number {
  const c = (1 - u * u) * (1 - v * v);
  return c < 0 ? 0 : c > 1 ? 1 : c;
}

/**
 * The lineup score (formula above).
 * @returns 0..1.
 * @throws RangeError on NaN input.
 */
export function lineupScore(s: ScoreInputs): number {
  assertFiniteInRange(s.centring, 'centring');
  assertFiniteInRange(s.durationMin, 'durationMin');
  assertFiniteInRange(s.sunAltitudeDeg, 'sunAltitudeDeg');
  assertFiniteInRange(s.moonAltitudeDeg, 'moonAltitudeDeg');
  assertFiniteInRange(s.moonIllumination, 'moonIllumination');
  const c = Math.min(1, Math.max(0, s.centring));
  const d = 1 - Math.exp(-Math.max(0, s.durationMin) / SCORE_DURATION_SCALE_MIN);
  const k = Math.min(1, Math.max(0, (-12 - s.sunAltitudeDeg) / 6));
  const moonLight = s.moonDown ? 0 : Math.min(1, Math.max(0, s.moonIllumination)) * Math.max(0, Math.sin((s.moonAltitudeDeg * Math.PI) / 180));
  const m = 1 - moonLight;
  return 0.4 * c + 0.2 * d + 0.2 * k + 0.2 * m;
}
