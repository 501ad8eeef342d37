/**
 * Sky conditions of a lineup search: how dark the sky must be and what Moon is acceptable.
 */
import { assertFiniteInRange } from '../guards';
import { MINUTES_PER_DAY } from '../units';

/**
 * The Moon rule: `'down'` (upper limb below the horizon, standard refraction) or the Moon allowed
 * above the horizon while its illuminated fraction is at most `maxIllumination` (0..1).
 */
export type MoonCondition = 'down' | { maxIllumination: number };

/** Conditions of a search; every field has a default. */
export interface LineupConditions {
  /** Highest geometric altitude of the Sun's centre, deg, -30..0 (default -18: astronomical twilight). */
  sunMaxAltDeg?: number;
  /** Moon rule (default 'down'). */
  moon?: MoonCondition;
  /** Shortest lineup kept, minutes, 0..1440 (default 5). */
  minDurationMin?: number;
}

/** Conditions with the defaults filled in. */
export interface ResolvedConditions {
  sunMaxAltDeg: number;
  moon: MoonCondition;
  minDurationMin: number;
}

/** Default Sun limit, deg (astronomical twilight, USNO Almanac for Computers). */
export const DEFAULT_SUN_MAX_ALT_DEG = -18;
/** Default shortest lineup, minutes. */
export const DEFAULT_MIN_DURATION_MIN = 5;
/** Lowest Sun limit accepted, deg. */
const MIN_SUN_MAX_ALT_DEG = -30;
/** Highest Sun limit accepted, deg (the horizon). */
const MAX_SUN_MAX_ALT_DEG = 0;

/**
 * The Sun limit of a search or a dark-window computation: the given one or the default, checked.
 * @param sunMaxAltDeg - Highest geometric altitude of the Sun's centre, deg, -30..0; undefined for
 *   {@link DEFAULT_SUN_MAX_ALT_DEG}.
 * @returns The limit, deg.
 * @throws RangeError on NaN or a value outside -30..0.
 */
export function resolveSunMaxAltDeg(sunMaxAltDeg: number | undefined): number {
  return assertFiniteInRange(sunMaxAltDeg ?? DEFAULT_SUN_MAX_ALT_DEG, 'conditions.sunMaxAltDeg', MIN_SUN_MAX_ALT_DEG, MAX_SUN_MAX_ALT_DEG);
}

/**
 * Checks a Moon rule.
 * @throws RangeError when it is neither 'down' nor {maxIllumination in 0..1}.
 */
export function checkMoonCondition(moon: unknown): MoonCondition {
  if (moon === 'down') return 'down';
  if (moon !== null && typeof moon === 'object' && 'maxIllumination' in moon) {
    const k = (moon as { maxIllumination: unknown }).maxIllumination;
    if (typeof k === 'number' && Number.isFinite(k) && k >= 0 && k <= 1) return { maxIllumination: k };
  }
  throw new RangeError("conditions.moon must be 'down' or { maxIllumination: 0..1 }");
}

/**
 * Fills defaults and checks ranges.
 * @throws RangeError on NaN or out-of-range values.
 */
export function resolveConditions(conditions: LineupConditions = {}): ResolvedConditions {
  const sunMaxAltDeg = resolveSunMaxAltDeg(conditions.sunMaxAltDeg);
  const moon = checkMoonCondition(conditions.moon ?? 'down');
  const minDurationMin = assertFiniteInRange(conditions.minDurationMin ?? DEFAULT_MIN_DURATION_MIN, 'conditions.minDurationMin', 0, MINUTES_PER_DAY);
  return { sunMaxAltDeg, moon, minDurationMin };
}

/** True when two Moon rules are the same. */
export function sameMoonCondition(a: MoonCondition, b: MoonCondition): boolean {
  if (a === 'down' || b === 'down') return a === b;
  return a.maxIllumination === b.maxIllumination;
}
