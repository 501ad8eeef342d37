/**
 * Brute-force reference for the lineup engine: samples every minute with exact astronomy-engine
 * positions (no tables, no interpolation, no hour-angle algebra) and the same definitions as the
 * engine, then bisects each change of state between two samples to 0.2 s. Slow by design (a few
 * seconds per target-year); the unit tests run it on a month or two per case and the benchmark
 * times it over a year. It imports nothing from shared/lineup.
 *
 * Definitions:
 * - Sun: geometric (no refraction) topocentric altitude of its centre, from
 *   `Equator(Sun, t, observer, ofdate=true, aberration=true)` and `Horizon(..., no refraction)`.
 * - Moon down: the same altitude of the Moon's centre + asin(1738.1 km / topocentric distance)
 *   + 34 arcmin below zero (astronomy-engine's rise/set definition at sea level).
 * - Moon illuminated fraction: `Illumination(Moon, t).phase_fraction`.
 * - Target: defined as a star 1e9 light-years away (no parallax) with `DefineStar`;
 *   `Equator(star, t, observer, true, true)` (precession, nutation, annual aberration) and
 *   `Horizon(..., 'normal')` (refraction included) give its apparent azimuth and altitude.
 * - Inside the frame: azimuth within azimuthDeg +- halfWidthDeg across north; apparent altitude
 *   within [bottomAltDeg, topAltDeg].
 */
import { Body, DefineStar, Equator, Horizon, Illumination, KM_PER_AU, MakeTime, Observer, type AstroTime } from 'astronomy-engine';

export interface OracleFrame {
  azimuthDeg: number;
  halfWidthDeg: number;
  bottomAltDeg: number;
  topAltDeg: number;
}
export interface OracleSite {
  lat: number;
  lon: number;
  elevationM: number;
}
export interface OracleTarget {
  raHours: number;
  decDeg: number;
}
export interface OracleConditions {
  sunMaxAltDeg: number;
  moon: 'down' | { maxIllumination: number };
}
/** An interval in Unix ms. */
export interface MsInterval {
  startMs: number;
  endMs: number;
}

const MOON_RADIUS_AU = 1738.1 / KM_PER_AU;
const ORACLE_STAR = Body.Star8;
const J2000_MS = Date.UTC(2000, 0, 1, 12);
const BISECT_MS = 200;

function time(ms: number): AstroTime {
  return MakeTime((ms - J2000_MS) / 86_400_000);
}

/** Exact Sun centre geometric altitude, deg. */
export function oracleSunAltitudeDeg(site: OracleSite, ms: number): number {
  const obs = new Observer(site.lat, site.lon, site.elevationM);
  const t = time(ms);
  const eq = Equator(Body.Sun, t, obs, true, true);
  return Horizon(t, obs, eq.ra, eq.dec).altitude;
}

/** Exact Moon centre geometric altitude (deg) and refracted upper-limb altitude (deg). */
export function oracleMoon(site: OracleSite, ms: number): { altitudeDeg: number; limbDeg: number } {
  const obs = new Observer(site.lat, site.lon, site.elevationM);
  const t = time(ms);
  const eq = Equator(Body.Moon, t, obs, true, true);
  const alt = Horizon(t, obs, eq.ra, eq.dec).altitude;
  return { altitudeDeg: alt, limbDeg: alt + (Math.asin(MOON_RADIUS_AU / eq.dist) * 180) / Math.PI + 34 / 60 };
}

/** Exact Moon illuminated fraction. */
export function oracleMoonIllumination(ms: number): number {
  return Illumination(Body.Moon, time(ms)).phase_fraction;
}

/** Exact apparent azimuth/altitude of a J2000 target (deg). */
export function oracleTargetHorizontal(site: OracleSite, target: OracleTarget, ms: number): { azimuthDeg: number; altitudeDeg: number } {
  DefineStar(ORACLE_STAR, target.raHours, target.decDeg, 1e9);
  const obs = new Observer(site.lat, site.lon, site.elevationM);
  const t = time(ms);
  const eq = Equator(ORACLE_STAR, t, obs, true, true);
  const hor = Horizon(t, obs, eq.ra, eq.dec, 'normal');
  return { azimuthDeg: hor.azimuth, altitudeDeg: hor.altitude };
}

/** Whether the Sun/Moon conditions hold at an instant. */
export function oracleIsDark(site: OracleSite, c: OracleConditions, ms: number): boolean {
  if (!(oracleSunAltitudeDeg(site, ms) < c.sunMaxAltDeg)) return false;
  if (c.moon !== 'down' && c.moon.maxIllumination >= 1) return true;
  if (oracleMoon(site, ms).limbDeg < 0) return true;
  return c.moon !== 'down' && oracleMoonIllumination(ms) <= c.moon.maxIllumination;
}

/** Whether the target is inside the frame at an instant. */
export function oracleInFrame(site: OracleSite, frame: OracleFrame, target: OracleTarget, ms: number): boolean {
  const { azimuthDeg, altitudeDeg } = oracleTargetHorizontal(site, target, ms);
  if (altitudeDeg < frame.bottomAltDeg || altitudeDeg > frame.topAltDeg) return false;
  const d = Math.abs((((azimuthDeg - frame.azimuthDeg) % 360) + 540) % 360 - 180);
  return d <= frame.halfWidthDeg;
}

/**
 * Intervals where a predicate holds: samples every `stepMs`, bisects each change to 0.2 s.
 * @param holds - The predicate at a Unix ms instant.
 */
export function scanIntervals(holds: (ms: number) => boolean, fromMs: number, toMs: number, stepMs = 60_000, bisectMs = BISECT_MS): MsInterval[] {
  const out: MsInterval[] = [];
  let prevMs = fromMs;
  let prev = holds(fromMs);
  let start = prev ? fromMs : Number.NaN;
  for (let ms = fromMs + stepMs; ; ms += stepMs) {
    const t = Math.min(ms, toMs);
    const now = holds(t);
    if (now !== prev) {
      let lo = prevMs;
      let hi = t;
      while (hi - lo > bisectMs) {
        const mid = (lo + hi) / 2;
        if (holds(mid) === prev) lo = mid;
        else hi = mid;
      }
      const edge = (lo + hi) / 2;
      if (now) start = edge;
      else out.push({ startMs: start, endMs: edge });
    }
    prev = now;
    prevMs = t;
    if (t >= toMs) break;
  }
  if (prev) out.push({ startMs: start, endMs: toMs });
  return out;
}

/** Dark windows by brute force. */
export function oracleDarkWindows(site: OracleSite, c: OracleConditions, fromMs: number, toMs: number, stepMs = 60_000, bisectMs = BISECT_MS): MsInterval[] {
  return scanIntervals((ms) => oracleIsDark(site, c, ms), fromMs, toMs, stepMs, bisectMs);
}

/**
 * Lineups by brute force (no minimum duration): the target in the frame and the sky dark. The
 * frame test runs first because it fails most often, so most minutes cost one position.
 */
export function oracleLineups(site: OracleSite, frame: OracleFrame, target: OracleTarget, c: OracleConditions, fromMs: number, toMs: number, stepMs = 60_000): MsInterval[] {
  return scanIntervals((ms) => oracleInFrame(site, frame, target, ms) && oracleIsDark(site, c, ms), fromMs, toMs, stepMs);
}
