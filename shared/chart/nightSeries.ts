/**
 * The series of a night chart: the Sun's, the Moon's and the target's altitude (and the target's
 * azimuth) sampled over one night at a site, the twilight shading, the stretches when the target
 * is inside the frame, and the local hour ticks. Pure: everything comes from shared/sky.
 */
import type { EquatorialJ2000, Frame, ObserverSite } from '../schemas/geometry';
import { frameSchema } from '../schemas/geometry';
import { SUNRISE_ALTITUDE_DEG } from '../sky/constants';
import { assertEquatorialJ2000, assertFiniteInRange, assertSite } from '../sky/guards';
import { moonHorizontal, moonIllumination, sunHorizontal, targetHorizontal } from '../sky/positions';
import { assertLocalDate, assertTimeZone, localMidnightAfter, nightSpanUtc } from '../sky/timezone';
import { angleDifferenceDeg } from '../geo/guards';
import { bandRuns, intersectRuns, type MsInterval } from './intervals';
import { localHourTicks, type HourTick } from './localTime';
import { sunLimitCrossings, twilightSegments, type SunLimitCrossing, type TwilightSegment } from './twilight';

/** Default sampling step of a night chart, minutes. */
export const DEFAULT_NIGHT_CHART_STEP_MIN = 5;
/** Default time shown before sunset and after sunrise, minutes. */
export const DEFAULT_NIGHT_CHART_MARGIN_MIN = 60;
/** Half the span shown around the Sun's lowest point when it does not set (midnight sun), hours. */
export const MIDNIGHT_SUN_HALF_SPAN_H = 6;

const MS_PER_MINUTE = 60_000;
const MS_PER_HOUR = 3_600_000;
/** Step of the first, Sun-only pass that finds sunset and sunrise, minutes. */
const SPAN_SEARCH_STEP_MIN = 10;

/** What a night chart is drawn for. */
export interface NightChartInput {
  /** The camera: lat -90..90, lon -180..180 (deg, east positive), eye height above sea level -500..9000 m. */
  site: ObserverSite;
  /** IANA zone of the site: the local date and the hour ticks are read in it. */
  timeZone: string;
  /** Local date 'YYYY-MM-DD' of the evening that starts the night. */
  date: string;
  /** The target, J2000. */
  target: EquatorialJ2000;
  /** The frame behind the landmark (true azimuth, apparent altitudes, degrees). */
  frame: Frame;
  /** Sampling step, minutes, 1..30 (default 5). */
  stepMin?: number;
  /** Time shown before sunset and after sunrise, minutes, 0..240 (default 60). */
  marginMin?: number;
}

/** The sampled night. Arrays are parallel to `timesMs`. */
export interface NightChartSeries {
  date: string;
  timeZone: string;
  /** Sampling step, ms. */
  stepMs: number;
  /** The whole night: local noon of `date` to local noon of the next date. */
  window: MsInterval;
  /** The stretch shown: sunset - margin to sunrise + margin, within the window, on the step grid. */
  span: MsInterval;
  /** Sample times, Unix ms, strictly increasing by `stepMs`, from span.startMs to span.endMs. */
  timesMs: number[];
  /** True (airless) altitude of the Sun's centre, degrees: the quantity of the twilight limits. */
  sunAltDeg: number[];
  /** Apparent (refracted) topocentric altitude of the Moon's centre, degrees. */
  moonAltDeg: number[];
  /** Apparent altitude of the target, degrees (the frame's altitudes are apparent too). */
  targetAltDeg: number[];
  /** True azimuth of the target, degrees 0..360. */
  targetAzDeg: number[];
  /** Day, twilights and darkness over the span. */
  twilight: TwilightSegment[];
  /** Crossings of -0.833, -6, -12 and -18 deg by the Sun within the span. */
  sunCrossings: SunLimitCrossing[];
  /** When the target's azimuth is within the frame's (any altitude). */
  frameAzimuthRuns: MsInterval[];
  /** When the target is inside the frame: within its azimuth and between its bottom and top. */
  frameRuns: MsInterval[];
  /** Full local hours within the span. */
  hourTicks: HourTick[];
  /** Moon's illuminated fraction at local midnight, 0..1. */
  moonIllumination: number;
}

/**
 * The shown span of a night: from `marginMin` before the first moment the Sun is below the
 * sunset altitude to `marginMin` after the last, clipped to the window; around the Sun's lowest
 * point (± {@link MIDNIGHT_SUN_HALF_SPAN_H} h) when it never sets.
 */
function spanOfNight(site: ObserverSite, window: MsInterval, marginMs: number): MsInterval {
  const step = SPAN_SEARCH_STEP_MIN * MS_PER_MINUTE;
  let firstBelow: number | null = null;
  let lastBelow: number | null = null;
  let lowestMs = window.startMs;
  let lowest = Infinity;
  for (let t = window.startMs; t <= window.endMs; t += step) {
    const alt = sunHorizontal(site, new Date(t), { refraction: false }).altitudeDeg;
    if (alt < lowest) {
      lowest = alt;
      lowestMs = t;
    }
    if (alt < SUNRISE_ALTITUDE_DEG) {
      firstBelow ??= t;
      lastBelow = t;
    }
  }
  if (firstBelow === null || lastBelow === null) {
    const half = MIDNIGHT_SUN_HALF_SPAN_H * MS_PER_HOUR;
    return { startMs: Math.max(window.startMs, lowestMs - half), endMs: Math.min(window.endMs, lowestMs + half) };
  }
  // The crossing lies within one coarse step before the first sample below (and after the last).
  return {
    startMs: Math.max(window.startMs, firstBelow - step - marginMs),
    endMs: Math.min(window.endMs, lastBelow + step + marginMs),
  };
}

/**
 * Samples one night for its chart.
 *
 * The night is the one that starts on the evening of `input.date` in the site's zone (local noon
 * to local noon, as shared/sky's nightReport). The shown span runs from about `marginMin` before
 * sunset to `marginMin` after sunrise; samples lie on a grid of `stepMin` minutes from the start
 * of the span (so on full hours for zones with whole-hour or half-hour offsets and a step that
 * divides 30 min). Each sample costs three astronomy-engine positions: about 300 samples, a few
 * tens of milliseconds, for the default 5 min step.
 * @param input - site, zone, date, target, frame; optional step (1..30 min) and margin (0..240 min)
 * @returns parallel sample arrays, twilight segments and crossings, frame runs and hour ticks
 * @throws RangeError on invalid input
 */
export function nightChartSeries(input: NightChartInput): NightChartSeries {
  if (input === null || typeof input !== 'object') throw new RangeError('input must be an object');
  const site = assertSite(input.site, 'site');
  const timeZone = assertTimeZone(input.timeZone);
  const date = assertLocalDate(input.date);
  const target = assertEquatorialJ2000(input.target, 'target');
  const parsedFrame = frameSchema.safeParse(input.frame);
  if (!parsedFrame.success) throw new RangeError(`frame is invalid: ${parsedFrame.error.issues[0]?.message ?? 'bad value'}`);
  const frame = parsedFrame.data;
  const stepMin = assertFiniteInRange(input.stepMin ?? DEFAULT_NIGHT_CHART_STEP_MIN, 'stepMin', 1, 30);
  const marginMin = assertFiniteInRange(input.marginMin ?? DEFAULT_NIGHT_CHART_MARGIN_MIN, 'marginMin', 0, 240);
  const stepMs = Math.round(stepMin * MS_PER_MINUTE);

  const utcSpan = nightSpanUtc(date, timeZone);
  const window: MsInterval = { startMs: utcSpan.start.getTime(), endMs: utcSpan.end.getTime() };
  const rough = spanOfNight(site, window, marginMin * MS_PER_MINUTE);
  const startMs = Math.max(window.startMs, Math.floor(rough.startMs / stepMs) * stepMs);
  const endMs = Math.min(window.endMs, Math.ceil(rough.endMs / stepMs) * stepMs);

  const timesMs: number[] = [];
  const sunAltDeg: number[] = [];
  const moonAltDeg: number[] = [];
  const targetAltDeg: number[] = [];
  const targetAzDeg: number[] = [];
  const frameOffsetDeg: number[] = [];
  for (let t = startMs; t <= endMs; t += stepMs) {
    const at = new Date(t);
    const tgt = targetHorizontal(target, site, at);
    timesMs.push(t);
    sunAltDeg.push(sunHorizontal(site, at, { refraction: false }).altitudeDeg);
    moonAltDeg.push(moonHorizontal(site, at).altitudeDeg);
    targetAltDeg.push(tgt.altitudeDeg);
    targetAzDeg.push(tgt.azimuthDeg);
    frameOffsetDeg.push(angleDifferenceDeg(tgt.azimuthDeg, frame.azimuthDeg));
  }
  // A span that is not a whole number of steps still ends on its last sample.
  const lastMs = timesMs[timesMs.length - 1]!;
  // The offset from the frame's centre is continuous except behind the observer (±180 deg), far
  // from any frame narrower than a half turn, so a linear band test on it is sound.
  const frameAzimuthRuns = bandRuns(timesMs, frameOffsetDeg, -frame.halfWidthDeg, frame.halfWidthDeg);
  const frameRuns = intersectRuns(frameAzimuthRuns, bandRuns(timesMs, targetAltDeg, frame.bottomAltDeg, frame.topAltDeg));

  return {
    date,
    timeZone,
    stepMs,
    window,
    span: { startMs, endMs: lastMs },
    timesMs,
    sunAltDeg,
    moonAltDeg,
    targetAltDeg,
    targetAzDeg,
    twilight: twilightSegments(timesMs, sunAltDeg),
    sunCrossings: sunLimitCrossings(timesMs, sunAltDeg),
    frameAzimuthRuns,
    frameRuns,
    hourTicks: localHourTicks(startMs, lastMs, timeZone),
    moonIllumination: moonIllumination(localMidnightAfter(date, timeZone)).illuminatedFraction,
  };
}
