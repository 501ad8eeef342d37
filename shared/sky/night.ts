/**
 * The night at a site: sunset, twilights, sunrise, moonrise/moonset and the Moon's light, for the
 * night that starts on the evening of a local calendar date in the site's own time zone.
 *
 * Definitions (USNO, Almanac for Computers 1990):
 * - sunset/sunrise: the Sun's centre at -0.833 deg true altitude (34' refraction + 16' semidiameter),
 *   sea-level horizon;
 * - civil, nautical, astronomical twilight: the Sun's centre at -6, -12, -18 deg true altitude;
 * - moonrise/moonset: the Moon's upper limb on the horizon with standard refraction, i.e. its
 *   topocentric centre at -(34' + semidiameter) true altitude, the semidiameter from the radius
 *   astronomy-engine's SearchRiseSet uses ({@link MOON_RISE_SET_RADIUS_KM}, 1738.1 km).
 * Events are solved with {@link findThresholdCrossings} (sampling, extremum refinement, bisection
 * to 10 ms, and a check on exact altitudes 1 s either side), not with astronomy-engine's
 * SearchAltitude, which can return a false crossing on short dark nights.
 *
 * Nights without astronomical darkness (high-latitude summer), midnight sun and polar night are
 * states of the report, not errors.
 */
import { Body, Equator, Horizon, MakeTime, type Observer } from 'astronomy-engine';
import type { ObserverSite } from '../schemas/geometry';
import {
  ASTRONOMICAL_TWILIGHT_ALTITUDE_DEG,
  AU_KM,
  CIVIL_TWILIGHT_ALTITUDE_DEG,
  HORIZON_REFRACTION_DEG,
  MOON_RISE_SET_RADIUS_KM,
  NAUTICAL_TWILIGHT_ALTITUDE_DEG,
  SUNRISE_ALTITUDE_DEG,
} from './constants';
import { DEG_PER_RAD, MS_PER_MINUTE } from '../units';
import { crossingsFromSamples, findThresholdCrossings, sampleWithExtrema, type ThresholdCrossing } from './crossings';
import { assertSite } from './guards';
import { moonIllumination, observerForSite, type MoonPhaseName } from './positions';
import { assertLocalDate, assertTimeZone, localMidnightAfter, nightSpanUtc, timeZoneForSite, toLocalInstant, type LocalInstant } from './timezone';

/**
 * What kind of night it is:
 * - 'dark': the Sun goes below -18 deg (there is astronomical darkness);
 * - 'no-astronomical-darkness': the Sun sets but stays above -18 deg all night;
 * - 'midnight-sun': the Sun stays above the sunset altitude (-0.833 deg) all night;
 * - 'polar-night': the Sun stays below the sunrise altitude all day (it may still be dark or not).
 */
export type NightState = 'dark' | 'no-astronomical-darkness' | 'midnight-sun' | 'polar-night';

/** A time interval with both ends in the site's zone. */
export interface LocalInterval {
  start: LocalInstant;
  end: LocalInstant;
}

/** A moonrise or moonset. */
export interface MoonEvent {
  kind: 'rise' | 'set';
  at: LocalInstant;
}

/** The Moon at local midnight. */
export interface MoonAtMidnight {
  /** Local midnight (00:00 of the day after the report's date). */
  at: LocalInstant;
  /** Illuminated fraction 0..1 (geocentric). */
  illuminatedFraction: number;
  /** Phase angle, degrees. */
  phaseAngleDeg: number;
  phaseName: MoonPhaseName;
  /** Topocentric altitude of the Moon's centre with refraction, degrees. */
  altitudeDeg: number;
}

/** Everything about one night at a site. */
export interface NightReport {
  site: ObserverSite;
  /** The local date whose evening starts the night, 'YYYY-MM-DD'. */
  date: string;
  /** IANA zone used for all local times. */
  timeZone: string;
  /** The searched span: local noon of `date` to local noon of the next date. */
  window: LocalInterval;
  state: NightState;
  sunset: LocalInstant | null;
  civilDusk: LocalInstant | null;
  nauticalDusk: LocalInstant | null;
  astronomicalDusk: LocalInstant | null;
  astronomicalDawn: LocalInstant | null;
  nauticalDawn: LocalInstant | null;
  civilDawn: LocalInstant | null;
  sunrise: LocalInstant | null;
  /** Lowest true altitude of the Sun's centre in the window, degrees, and when it happens (solar midnight). */
  sunLowest: { at: LocalInstant; altitudeDeg: number };
  /** Intervals of the window with the Sun's centre below -18 deg (astronomical darkness), in order. */
  darkIntervals: LocalInterval[];
  /** First moonrise in the night (between sunset, or the window start, and sunrise, or the window end), or null. */
  moonrise: LocalInstant | null;
  /** First moonset in the night, or null. */
  moonset: LocalInstant | null;
  /** All moonrises and moonsets in the night, in order. */
  moonEvents: MoonEvent[];
  /** Whether the Moon's upper limb is above the horizon at the start of the night. */
  moonUpAtNightStart: boolean;
  moonAtMidnight: MoonAtMidnight;
}

/** Options of {@link nightReport}. */
export interface NightReportOptions {
  /** IANA zone to use instead of the zone looked up from the site's coordinates. */
  timeZone?: string;
  /** Skip the Moon (faster when only the Sun's events are needed). Default false. */
  skipMoon?: boolean;
}

const STEP_MS = 20 * MS_PER_MINUTE;

/** True (airless) topocentric altitude of a body's centre, degrees. */
function trueAltitudeDeg(body: Body, observer: Observer, ms: number): number {
  const time = MakeTime(new Date(ms));
  const eq = Equator(body, time, observer, true, true);
  return Horizon(time, observer, eq.ra, eq.dec).altitude;
}

/** Altitude of the Moon's upper limb relative to the refracted horizon, degrees (0 at moonrise/moonset). */
function moonLimbAboveHorizonDeg(observer: Observer, ms: number): number {
  const time = MakeTime(new Date(ms));
  const eq = Equator(Body.Moon, time, observer, true, true);
  const alt = Horizon(time, observer, eq.ra, eq.dec).altitude;
  const semidiameterDeg = Math.asin(MOON_RISE_SET_RADIUS_KM / (eq.dist * AU_KM)) * DEG_PER_RAD;
  return alt + semidiameterDeg + HORIZON_REFRACTION_DEG;
}

function lastBefore(crossings: ThresholdCrossing[], direction: ThresholdCrossing['direction'], ms: number): ThresholdCrossing | undefined {
  let found: ThresholdCrossing | undefined;
  for (const c of crossings) if (c.direction === direction && c.timeMs <= ms) found = c;
  return found;
}

function firstAfter(crossings: ThresholdCrossing[], direction: ThresholdCrossing['direction'], ms: number): ThresholdCrossing | undefined {
  return crossings.find((c) => c.direction === direction && c.timeMs >= ms);
}

/**
 * Intervals of [startMs, endMs] where f stays below `threshold`, from its crossings and the value at
 * the start.
 */
function intervalsBelow(crossings: ThresholdCrossing[], startMs: number, endMs: number, belowAtStart: boolean): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  let openedAt: number | null = belowAtStart ? startMs : null;
  for (const c of crossings) {
    if (c.direction === 'setting' && openedAt === null) openedAt = c.timeMs;
    else if (c.direction === 'rising' && openedAt !== null) {
      out.push([openedAt, c.timeMs]);
      openedAt = null;
    }
  }
  if (openedAt !== null) out.push([openedAt, endMs]);
  return out;
}

/**
 * Sun and Moon events of the night that starts on the evening of a local date at a site.
 *
 * The night's window is local noon of `date` to local noon of the next day in the site's zone
 * (tz-lookup from the coordinates unless `options.timeZone` is given). Dusks are the last
 * descending crossings before the Sun's lowest point in the window, dawns the first ascending ones
 * after it; an event that does not happen is null. All times are UTC Dates with their local reading.
 * @param site observer: lat -90..90, lon -180..180 (east positive), elevation -500..9000 m (used
 *   for parallax; the horizon is taken at sea level, with no dip)
 * @param date local date 'YYYY-MM-DD' (the evening that starts the night)
 * @param options time zone override; skipMoon
 * @throws RangeError on invalid input
 */
export function nightReport(site: ObserverSite, date: string, options: NightReportOptions = {}): NightReport {
  const s = assertSite(site);
  assertLocalDate(date);
  const timeZone = options.timeZone === undefined ? timeZoneForSite(s.lat, s.lon) : assertTimeZone(options.timeZone);
  const observer = observerForSite(s);
  const span = nightSpanUtc(date, timeZone);
  const startMs = span.start.getTime();
  const endMs = span.end.getTime();
  const local = (ms: number): LocalInstant => toLocalInstant(new Date(Math.round(ms)), timeZone);

  const sunAlt = (ms: number): number => trueAltitudeDeg(Body.Sun, observer, ms);
  const sunSamples = sampleWithExtrema(sunAlt, startMs, endMs, STEP_MS);
  let lowestMs = startMs;
  let lowestAlt = Infinity;
  let highestAlt = -Infinity;
  sunSamples.values.forEach((v, i) => {
    if (v < lowestAlt) {
      lowestAlt = v;
      lowestMs = sunSamples.timesMs[i] as number;
    }
    if (v > highestAlt) highestAlt = v;
  });

  const crossingsAt = (altitudeDeg: number): ThresholdCrossing[] => crossingsFromSamples(sunAlt, sunSamples, altitudeDeg);
  const sunriseCrossings = crossingsAt(SUNRISE_ALTITUDE_DEG);
  const civil = crossingsAt(CIVIL_TWILIGHT_ALTITUDE_DEG);
  const nautical = crossingsAt(NAUTICAL_TWILIGHT_ALTITUDE_DEG);
  const astronomical = crossingsAt(ASTRONOMICAL_TWILIGHT_ALTITUDE_DEG);
  const dusk = (list: ThresholdCrossing[]): LocalInstant | null => {
    const c = lastBefore(list, 'setting', lowestMs);
    return c ? local(c.timeMs) : null;
  };
  const dawn = (list: ThresholdCrossing[]): LocalInstant | null => {
    const c = firstAfter(list, 'rising', lowestMs);
    return c ? local(c.timeMs) : null;
  };

  let state: NightState;
  if (highestAlt < SUNRISE_ALTITUDE_DEG) state = 'polar-night';
  else if (lowestAlt >= SUNRISE_ALTITUDE_DEG) state = 'midnight-sun';
  else if (lowestAlt >= ASTRONOMICAL_TWILIGHT_ALTITUDE_DEG) state = 'no-astronomical-darkness';
  else state = 'dark';

  const darkIntervals = intervalsBelow(astronomical, startMs, endMs, (sunSamples.values[0] as number) < ASTRONOMICAL_TWILIGHT_ALTITUDE_DEG).map(
    ([a, b]) => ({ start: local(a), end: local(b) }),
  );

  const sunset = dusk(sunriseCrossings);
  const sunrise = dawn(sunriseCrossings);

  const midnight = localMidnightAfter(date, timeZone);
  const illumination = moonIllumination(midnight);
  const moonAltitudeAtMidnight = (() => {
    const time = MakeTime(midnight);
    const eq = Equator(Body.Moon, time, observer, true, true);
    return Horizon(time, observer, eq.ra, eq.dec, 'normal').altitude;
  })();

  let moonEvents: MoonEvent[] = [];
  let moonUpAtNightStart = false;
  if (!options.skipMoon) {
    const nightStartMs = sunset ? sunset.utc.getTime() : startMs;
    const nightEndMs = sunrise ? sunrise.utc.getTime() : endMs;
    const moonF = (ms: number): number => moonLimbAboveHorizonDeg(observer, ms);
    moonUpAtNightStart = moonF(nightStartMs) >= 0;
    if (nightEndMs > nightStartMs) {
      moonEvents = findThresholdCrossings(moonF, nightStartMs, nightEndMs, 0, { stepMs: STEP_MS }).map((c) => ({
        kind: c.direction === 'rising' ? 'rise' : 'set',
        at: local(c.timeMs),
      }));
    }
  }

  return {
    site: s,
    date,
    timeZone,
    window: { start: local(startMs), end: local(endMs) },
    state,
    sunset,
    civilDusk: dusk(civil),
    nauticalDusk: dusk(nautical),
    astronomicalDusk: dusk(astronomical),
    astronomicalDawn: dawn(astronomical),
    nauticalDawn: dawn(nautical),
    civilDawn: dawn(civil),
    sunrise,
    sunLowest: { at: local(lowestMs), altitudeDeg: lowestAlt },
    darkIntervals,
    moonrise: moonEvents.find((e) => e.kind === 'rise')?.at ?? null,
    moonset: moonEvents.find((e) => e.kind === 'set')?.at ?? null,
    moonEvents,
    moonUpAtNightStart,
    moonAtMidnight: {
      at: toLocalInstant(midnight, timeZone),
      illuminatedFraction: illumination.illuminatedFraction,
      phaseAngleDeg: illumination.phaseAngleDeg,
      phaseName: illumination.phaseName,
      altitudeDeg: moonAltitudeAtMidnight,
    },
  };
}
