/**
 * Twilight shading of a night chart from the Sun's sampled altitude: day, civil, nautical and
 * astronomical twilight and astronomical darkness, with the USNO limits shared/sky uses
 * (sunrise/sunset -0.833 deg, civil -6, nautical -12, astronomical -18 deg, Sun's centre, true
 * altitude).
 */
import {
  ASTRONOMICAL_TWILIGHT_ALTITUDE_DEG,
  CIVIL_TWILIGHT_ALTITUDE_DEG,
  NAUTICAL_TWILIGHT_ALTITUDE_DEG,
  SUNRISE_ALTITUDE_DEG,
} from '../sky/constants';
import { assertSampled, type MsInterval } from './intervals';

/** How dark the sky is, by the Sun's true altitude. */
export type SkyBrightness = 'day' | 'civil-twilight' | 'nautical-twilight' | 'astronomical-twilight' | 'dark';

/** The Sun altitudes (deg) that separate the kinds, from the horizon down. */
export const TWILIGHT_LIMITS_DEG = [
  SUNRISE_ALTITUDE_DEG,
  CIVIL_TWILIGHT_ALTITUDE_DEG,
  NAUTICAL_TWILIGHT_ALTITUDE_DEG,
  ASTRONOMICAL_TWILIGHT_ALTITUDE_DEG,
] as const;

const KINDS: readonly SkyBrightness[] = ['day', 'civil-twilight', 'nautical-twilight', 'astronomical-twilight', 'dark'];

/**
 * The kind of sky for a Sun altitude: 'day' at or above -0.833 deg, then each twilight down to
 * (not including) its lower limit, 'dark' below -18 deg.
 * @param sunAltDeg - true altitude of the Sun's centre, degrees, -90..90
 * @throws RangeError on NaN or out-of-range input
 */
export function skyBrightness(sunAltDeg: number): SkyBrightness {
  if (typeof sunAltDeg !== 'number' || !Number.isFinite(sunAltDeg) || sunAltDeg < -90 || sunAltDeg > 90) {
    throw new RangeError(`sunAltDeg must be a finite number in -90..90 (got ${String(sunAltDeg)})`);
  }
  let i = 0;
  while (i < TWILIGHT_LIMITS_DEG.length && sunAltDeg < TWILIGHT_LIMITS_DEG[i]!) i++;
  return KINDS[i]!;
}

/** Where the Sun crosses one of {@link TWILIGHT_LIMITS_DEG}. */
export interface SunLimitCrossing {
  /** The limit crossed, degrees (one of TWILIGHT_LIMITS_DEG). */
  limitDeg: number;
  /** 'setting' going down through the limit (dusk), 'rising' going up (dawn). */
  direction: 'setting' | 'rising';
  /** Instant, Unix ms, linearly interpolated between the two samples around it. */
  atMs: number;
}

/**
 * Every crossing of the twilight limits by a sampled Sun altitude, in time order. Between two
 * samples the altitude is taken as a straight line, so with a 5 min step a crossing is placed to
 * well under a minute (the altitude curves by a few hundredths of a degree in 5 min).
 * @param timesMs - sample times, Unix ms, finite, strictly increasing
 * @param sunAltDeg - true altitude of the Sun's centre at each time, degrees
 * @throws RangeError on invalid input
 */
export function sunLimitCrossings(timesMs: readonly number[], sunAltDeg: readonly number[]): SunLimitCrossing[] {
  assertSampled(timesMs, sunAltDeg, 'sunAltDeg');
  const out: SunLimitCrossing[] = [];
  for (let i = 1; i < timesMs.length; i++) {
    const a0 = sunAltDeg[i - 1]!;
    const a1 = sunAltDeg[i]!;
    const t0 = timesMs[i - 1]!;
    const t1 = timesMs[i]!;
    const found: SunLimitCrossing[] = [];
    for (const limit of TWILIGHT_LIMITS_DEG) {
      // Half-open tests so that a sample exactly on a limit counts once.
      const setting = a0 >= limit && a1 < limit;
      const rising = a0 < limit && a1 >= limit;
      if (!setting && !rising) continue;
      found.push({ limitDeg: limit, direction: setting ? 'setting' : 'rising', atMs: t0 + ((t1 - t0) * (a0 - limit)) / (a0 - a1) });
    }
    found.sort((x, y) => x.atMs - y.atMs);
    out.push(...found);
  }
  return out;
}

/** A stretch of the chart with one kind of sky. */
export interface TwilightSegment extends MsInterval {
  kind: SkyBrightness;
}

/**
 * The chart's time axis cut into stretches of one sky kind, from the first to the last sample,
 * with the boundaries at the interpolated crossings of {@link sunLimitCrossings}.
 * @param timesMs - sample times, Unix ms, finite, strictly increasing, at least two
 * @param sunAltDeg - true altitude of the Sun's centre at each time, degrees, -90..90
 * @returns contiguous segments covering [timesMs[0], last time]; neighbours differ in kind
 * @throws RangeError on invalid input
 */
export function twilightSegments(timesMs: readonly number[], sunAltDeg: readonly number[]): TwilightSegment[] {
  if (timesMs.length < 2) throw new RangeError('twilightSegments needs at least two samples');
  const crossings = sunLimitCrossings(timesMs, sunAltDeg);
  const segments: TwilightSegment[] = [];
  const push = (segment: TwilightSegment): void => {
    const last = segments[segments.length - 1];
    if (last && last.kind === segment.kind) last.endMs = segment.endMs;
    else segments.push(segment);
  };
  let kind = skyBrightness(sunAltDeg[0]!);
  let startMs = timesMs[0]!;
  for (const c of crossings) {
    const index = TWILIGHT_LIMITS_DEG.indexOf(c.limitDeg as (typeof TWILIGHT_LIMITS_DEG)[number]);
    // Setting through limit i enters kind i + 1; rising through it enters kind i.
    const next = KINDS[c.direction === 'setting' ? index + 1 : index]!;
    if (next === kind) continue;
    if (c.atMs > startMs) push({ kind, startMs, endMs: c.atMs });
    kind = next;
    startMs = c.atMs;
  }
  push({ kind, startMs, endMs: timesMs[timesMs.length - 1]! });
  return segments;
}
