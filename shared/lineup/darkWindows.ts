/**
 * Dark windows: when the Sun's centre is below the chosen altitude and the Moon is down (or up but
 * at most a chosen illuminated fraction). Computed once per site and range, independent of the
 * target, so a server can cache them per site and year and pass them back into the search.
 * Definitions of the Sun and Moon quantities: see siteSky.ts.
 */
import type { ObserverSite } from '../schemas/geometry';
import { checkMoonCondition, resolveSunMaxAltDeg, type MoonCondition } from './conditions';
import { diurnalIntervalsBelowZero, intervalsFromNodes } from './diurnalEvents';
import { intersectIntervals, unionIntervals, type FlatIntervals } from './intervals';
import { refineExtremum } from './roots';
import { SiteSky } from './siteSky';
import { checkedRange, unixMsToUtDays, utDaysToUnixMs } from './time';
import { RAD_PER_DEG } from '../units';

/** Nominal rate of the Sun's hour angle, rad/day. */
const SUN_HOUR_ANGLE_RATE = 2 * Math.PI;
/** Nominal rate of the Moon's hour angle, rad/day (one lunar day is about 24 h 50 min). */
const MOON_HOUR_ANGLE_RATE = 2 * Math.PI * 0.9661;

/** One dark window; Unix milliseconds (JSON-safe). */
export interface DarkWindow {
  startMs: number;
  endMs: number;
}

/**
 * The dark windows of one site over one range, with what they were computed for. Plain data:
 * it survives JSON (a server can store it per site and year and pass it back to the search).
 */
export interface DarkWindowSet {
  /** Site the windows were computed for (deg, deg, m). */
  site: ObserverSite;
  /** Range covered, Unix ms. */
  fromMs: number;
  toMs: number;
  /** Sun limit used, deg. */
  sunMaxAltDeg: number;
  /** Moon rule used. */
  moon: MoonCondition;
  /** Sorted, disjoint windows clipped to the range. */
  windows: DarkWindow[];
}

/**
 * Intervals (UT days) when the Sun's geometric centre altitude is below `sunMaxAltDeg`.
 * @param sky - The site.
 * @param sunMaxAltDeg - Limit, deg, -90..90.
 * @param from - Start, UT days; @param to - End, UT days (> from).
 */
export function sunBelowIntervals(sky: SiteSky, sunMaxAltDeg: number, from: number, to: number): FlatIntervals {
  const sinLimit = Math.sin(sunMaxAltDeg * RAD_PER_DEG);
  return diurnalIntervalsBelowZero(
    { value: (t) => sky.sunSinAltitude(t) - sinLimit, hourAngle: (t) => sky.sunHourAngleRad(t), rateRadPerDay: SUN_HOUR_ANGLE_RATE },
    sky.latDeg,
    from,
    to,
  );
}

/** Intervals (UT days) when the Moon is down (refracted upper limb below the horizon). */
export function moonDownIntervals(sky: SiteSky, from: number, to: number): FlatIntervals {
  return diurnalIntervalsBelowZero(
    { value: (t) => sky.moonLimbSin(t), hourAngle: (t) => sky.moonHourAngleRad(t), rateRadPerDay: MOON_HOUR_ANGLE_RATE },
    sky.latDeg,
    from,
    to,
  );
}

/** Sampling step for the illuminated fraction, days: its extrema (new and full Moon) are 14.8 days apart. */
const ILLUMINATION_STEP_DAYS = 1;

/**
 * Intervals (UT days) when the Moon's illuminated fraction is below `maxIllumination`.
 * The fraction is monotonic between new and full Moon; those extrema are bracketed by daily samples
 * and refined, then each crossing is solved.
 */
export function illuminationBelowIntervals(sky: SiteSky, maxIllumination: number, from: number, to: number): FlatIntervals {
  const f = (t: number): number => sky.moonIlluminatedFraction(t) - maxIllumination;
  const n = Math.max(2, Math.ceil((to - from) / ILLUMINATION_STEP_DAYS));
  const step = (to - from) / n;
  const nodeT: number[] = [from];
  const nodeV: number[] = [f(from)];
  let tPrev = from - step;
  let vPrev = f(tPrev);
  let tCur = from;
  let vCur = nodeV[0]!;
  for (let i = 1; i <= n + 1; i++) {
    const tNext = from + i * step;
    const vNext = f(tNext);
    if ((vCur - vPrev) * (vNext - vCur) < 0) {
      const ext = refineExtremum(f, tPrev, tNext, vCur > vPrev ? 1 : -1, tCur);
      if (ext.t > from && ext.t < to && ext.t > nodeT[nodeT.length - 1]!) {
        nodeT.push(ext.t);
        nodeV.push(ext.value);
      }
    }
    tPrev = tCur;
    vPrev = vCur;
    tCur = tNext;
    vCur = vNext;
  }
  nodeT.push(to);
  nodeV.push(f(to));
  return intervalsFromNodes(f, nodeT, nodeV);
}

/**
 * Dark intervals in UT days for a site (internal form used by the search).
 * @param sky - The site.
 * @param sunMaxAltDeg - Sun limit, deg.
 * @param moon - Moon rule.
 * @param from - Start, UT days; @param to - End, UT days.
 */
export function darkIntervals(sky: SiteSky, sunMaxAltDeg: number, moon: MoonCondition, from: number, to: number): FlatIntervals {
  const sun = sunBelowIntervals(sky, sunMaxAltDeg, from, to);
  if (sun.length === 0) return sun;
  if (moon !== 'down' && moon.maxIllumination >= 1) return sun;
  let moonOk = moonDownIntervals(sky, from, to);
  if (moon !== 'down' && moon.maxIllumination > 0) {
    moonOk = unionIntervals(moonOk, illuminationBelowIntervals(sky, moon.maxIllumination, from, to));
  }
  return intersectIntervals(sun, moonOk);
}

/**
 * Dark windows for a site and a UTC range.
 * @param site - Latitude -90..90 deg, longitude -180..180 deg, elevation -500..9000 m.
 * @param fromUtc - Range start (1900..2200).
 * @param toUtc - Range end, after `fromUtc`, at most ten years later.
 * @param conditions - `sunMaxAltDeg` (deg, -30..0, default -18) and `moon` (default 'down').
 * @returns The windows, sorted and clipped to the range, with what they were computed for.
 * @throws RangeError on invalid input.
 */
export function computeDarkWindows(
  site: ObserverSite,
  fromUtc: Date,
  toUtc: Date,
  conditions: { sunMaxAltDeg?: number; moon?: MoonCondition } = {},
): DarkWindowSet {
  const { fromMs, toMs } = checkedRange(fromUtc, toUtc);
  const sunMaxAltDeg = resolveSunMaxAltDeg(conditions.sunMaxAltDeg);
  const moon = checkMoonCondition(conditions.moon ?? 'down');
  const sky = new SiteSky(site);
  const flat = darkIntervals(sky, sunMaxAltDeg, moon, unixMsToUtDays(fromMs), unixMsToUtDays(toMs));
  const windows: DarkWindow[] = [];
  for (let i = 0; i < flat.length; i += 2) {
    windows.push({ startMs: Math.max(fromMs, utDaysToUnixMs(flat[i]!)), endMs: Math.min(toMs, utDaysToUnixMs(flat[i + 1]!)) });
  }
  return { site: { lat: site.lat, lon: site.lon, elevationM: site.elevationM }, fromMs, toMs, sunMaxAltDeg, moon, windows };
}
