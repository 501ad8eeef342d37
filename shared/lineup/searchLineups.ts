/**
 * The lineup search: when a target stands inside a frame during a dark window.
 *
 * Event-based, no time stepping: the dark windows are solved once per site and range
 * (darkWindows.ts) and shared by every target; each target's passages through the frame are solved
 * in hour angle per sidereal day (framePassage.ts), only on days that meet a dark window; the two
 * interval lists are intersected, short pieces dropped, and each lineup gets its peak (best
 * centring), the sky at the peak and a score (score.ts).
 */
import type { EquatorialJ2000, Frame, ObserverSite } from '../schemas/geometry';
import { placeNodes, targetNodeDirections } from './apparentPlace';
import { resolveConditions, sameMoonCondition, type LineupConditions, type ResolvedConditions } from './conditions';
import { darkIntervals, type DarkWindowSet } from './darkWindows';
import { checkFrame, frameGeometry, framePassageIntervals, hourAngleArcs, TargetTrack, type FrameGeometry } from './framePassage';
import { appendMerging, intersectIntervals, type FlatIntervals } from './intervals';
import { apparentAltitudeDeg } from './refraction';
import { minimizeBrent } from './roots';
import { centringFromOffsets, lineupScore } from './score';
import { SiteSky } from './siteSky';
import { checkedRange, unixMsToUtDays, utDaysToUnixMs } from './time';
import { assertEquatorialJ2000 } from '../sky/guards';
import { angleDifferenceDeg, MINUTES_PER_DAY, RAD_PER_DEG } from '../units';

const TWO_PI = 2 * Math.PI;

/** Most targets in one search. */
export const MAX_TARGETS = 100;

/** Largest distance (deg, in latitude and in longitude) between a cached dark-window set's site and the search site. */
export const DARK_WINDOW_SITE_TOLERANCE_DEG = 0.05;

/** One lineup: the target inside the frame during a dark window. */
export interface Lineup {
  /** Index of the target in the `targets` argument (0 for a single target). */
  targetIndex: number;
  /** Start and end of the lineup (UTC). */
  start: Date;
  end: Date;
  /** Time of best centring (UTC), within [start, end]. */
  peak: Date;
  /** end - start, minutes. */
  durationMin: number;
  /** Target's true azimuth at the peak, deg 0..360. */
  peakAzimuthDeg: number;
  /** Target's apparent altitude (refraction included) at the peak, deg. */
  peakAltitudeDeg: number;
  /** Centring at the peak, 0..1 (see score.ts). */
  centring: number;
  /** Sun centre geometric altitude at the peak, deg. */
  sunAltitudeDeg: number;
  /** Moon centre geometric topocentric altitude at the peak, deg. */
  moonAltitudeDeg: number;
  /** Moon illuminated fraction at the peak, 0..1. */
  moonIllumination: number;
  /** Score 0..1 (formula in score.ts). */
  score: number;
}

/** Options of a search. */
export interface SearchOptions {
  /**
   * Precomputed dark windows (for example cached per site and year): one set or several whose
   * union covers the search range, computed with the same Sun limit and Moon rule for a site within
   * {@link DARK_WINDOW_SITE_TOLERANCE_DEG}.
   */
  darkWindows?: DarkWindowSet | readonly DarkWindowSet[];
}

/** Dark intervals (UT days) over [from, to] from cached sets, after checking they fit the search. */
function darkFromSets(sets: readonly DarkWindowSet[], site: ObserverSite, c: ResolvedConditions, fromMs: number, toMs: number): FlatIntervals {
  const sorted = [...sets].sort((a, b) => a.fromMs - b.fromMs);
  let covered = fromMs;
  const out: FlatIntervals = [];
  for (const set of sorted) {
    if (set.sunMaxAltDeg !== c.sunMaxAltDeg || !sameMoonCondition(set.moon, c.moon)) {
      throw new RangeError('options.darkWindows were computed for other conditions');
    }
    const dLon = Math.abs(angleDifferenceDeg(set.site.lon, site.lon));
    if (Math.abs(set.site.lat - site.lat) > DARK_WINDOW_SITE_TOLERANCE_DEG || !(dLon <= DARK_WINDOW_SITE_TOLERANCE_DEG)) {
      throw new RangeError('options.darkWindows were computed for another site');
    }
    if (set.fromMs <= covered) covered = Math.max(covered, set.toMs);
    for (const w of set.windows) {
      const s = Math.max(w.startMs, fromMs);
      const e = Math.min(w.endMs, toMs);
      if (e > s) appendMerging(out, unixMsToUtDays(s), unixMsToUtDays(e), 1e-9);
    }
  }
  if (covered < toMs) throw new RangeError('options.darkWindows do not cover the search range');
  return out;
}

/** Evaluates the target's place and centring at an hour angle for a fixed declination. */
class Centring {
  private readonly mid: number;
  private readonly halfBand: number;
  azimuthDeg = 0;
  altitudeDeg = 0;

  constructor(private readonly g: FrameGeometry) {
    this.mid = (g.bottomAltDeg + g.topAltDeg) / 2;
    this.halfBand = (g.topAltDeg - g.bottomAltDeg) / 2;
  }

  /** Centring 0..1 at hour angle h (rad); also sets azimuthDeg and altitudeDeg (apparent). */
  at(sinDec: number, cosDec: number, h: number): number {
    const g = this.g;
    const c = Math.cos(h);
    const up = g.sinLat * sinDec + g.cosLat * cosDec * c;
    const east = -cosDec * Math.sin(h);
    const north = g.cosLat * sinDec - g.sinLat * cosDec * c;
    const geo = Math.asin(Math.max(-1, Math.min(1, up))) / RAD_PER_DEG;
    const alt = apparentAltitudeDeg(geo);
    let az = Math.atan2(east, north);
    if (az < 0) az += TWO_PI;
    this.azimuthDeg = az / RAD_PER_DEG;
    this.altitudeDeg = alt;
    let dAz = az - g.azimuthRad;
    dAz -= TWO_PI * Math.round(dAz / TWO_PI);
    return centringFromOffsets(dAz / g.halfWidthRad, (alt - this.mid) / this.halfBand);
  }
}

/**
 * Searches the lineups of one or several targets in a frame, over a UTC range.
 * @param frame - Azimuth 0..360 deg (true), half-width (0, 180] deg, apparent altitude band
 *   bottomAltDeg < topAltDeg in -90..90 deg.
 * @param site - Camera position: latitude -90..90 deg, longitude -180..180 deg, elevation m.
 * @param targets - One J2000 position (RA 0..24 h, Dec -90..90 deg) or up to {@link MAX_TARGETS}.
 * @param fromUtc - Range start (1900..2200).
 * @param toUtc - Range end, after `fromUtc`, at most ten years later.
 * @param conditions - Sun limit (deg, default -18), Moon rule (default 'down'), shortest lineup
 *   (minutes, default 5).
 * @param options - Precomputed dark windows.
 * @returns Lineups sorted by start (then target index).
 * @throws RangeError on invalid input.
 */
export function searchLineups(
  frame: Frame,
  site: ObserverSite,
  targets: EquatorialJ2000 | readonly EquatorialJ2000[],
  fromUtc: Date,
  toUtc: Date,
  conditions: LineupConditions = {},
  options: SearchOptions = {},
): Lineup[] {
  checkFrame(frame);
  const list: readonly EquatorialJ2000[] = Array.isArray(targets) ? targets : [targets as EquatorialJ2000];
  if (list.length === 0 || list.length > MAX_TARGETS) throw new RangeError(`targets must hold 1..${MAX_TARGETS} positions`);
  list.forEach((t, i) => assertEquatorialJ2000(t, `targets[${i}]`));
  const { fromMs, toMs } = checkedRange(fromUtc, toUtc);
  const c = resolveConditions(conditions);
  const sky = new SiteSky(site);
  const from = unixMsToUtDays(fromMs);
  const to = unixMsToUtDays(toMs);

  const sets = options.darkWindows === undefined ? undefined : Array.isArray(options.darkWindows) ? options.darkWindows : [options.darkWindows as DarkWindowSet];
  const dark = sets ? darkFromSets(sets, site, c, fromMs, toMs) : darkIntervals(sky, c.sunMaxAltDeg, c.moon, from, to);
  if (dark.length === 0) return [];

  const g = frameGeometry(frame, site.lat, site.lon);
  const nodes = placeNodes(from, to);
  const centring = new Centring(g);
  const minDays = c.minDurationMin / MINUTES_PER_DAY;
  const lineups: Lineup[] = [];
  for (let ti = 0; ti < list.length; ti++) {
    const track = new TargetTrack(nodes, targetNodeDirections(nodes, list[ti]!), sky.lonRad);
    const passages = framePassageIntervals(g, track, from, to, dark);
    const pieces = intersectIntervals(passages, dark);
    const peaks = new PeakFinder(g, centring);
    for (let i = 0; i < pieces.length; i += 2) {
      const s = pieces[i]!;
      const e = pieces[i + 1]!;
      if (e - s < minDays) continue;
      lineups.push(describeLineup(ti, s, e, track, centring, peaks, sky));
    }
  }
  lineups.sort((a, b) => a.start.getTime() - b.start.getTime() || a.targetIndex - b.targetIndex);
  return lineups;
}

/** Samples of the coarse scan that guards the peak search against a second local maximum. */
const PEAK_SCAN_SAMPLES = 16;
/** The same for a lineup cut short by a dark-window edge (a shorter span). */
const PEAK_SCAN_SAMPLES_CLIPPED = 8;
/** Hour-angle tolerance of the peak, rad (about 3 s of time). */
const PEAK_TOLERANCE_RAD = 2e-4;
/**
 * Declination change (as a change of its sine, about 6 arcsec) within which a frame passage's peak
 * is reused: the peak moves with the declination at a rate of order one (rad per rad), so by well
 * under a second of time; the declination drifts by at most 0.4 arcsec a day.
 */
const PEAK_REUSE_SIN_DEC = 3e-5;

/**
 * Finds the hour angle of best centring within a lineup. A lineup that covers the peak of its whole
 * frame passage takes that peak; the passage's peak is searched once (coarse scan, then Brent) and
 * reused on later days while the declination has moved by less than about 6 arcsec, which moves the
 * peak by a fraction of a second. A lineup cut short by a dark-window edge before reaching that peak
 * is searched on its own span.
 */
class PeakFinder {
  private cachedSinDec = Number.NaN;
  private arcStart = 0;
  private arcEnd = 0;
  private arcPeak = 0;

  constructor(
    private readonly g: FrameGeometry,
    private readonly centring: Centring,
  ) {}

  private best(sinDec: number, cosDec: number, lo: number, hi: number, samples = PEAK_SCAN_SAMPLES): number {
    const f = (h: number): number => -this.centring.at(sinDec, cosDec, h);
    if (!(hi > lo)) return lo;
    const step = (hi - lo) / (samples - 1);
    let bestI = 0;
    let bestV = Infinity;
    for (let i = 0; i < samples; i++) {
      const v = f(lo + i * step);
      if (v < bestV) {
        bestV = v;
        bestI = i;
      }
    }
    const a = lo + Math.max(0, bestI - 1) * step;
    const b = lo + Math.min(samples - 1, bestI + 1) * step;
    const h = minimizeBrent(f, a, b, PEAK_TOLERANCE_RAD);
    return f(h) <= bestV ? h : lo + bestI * step;
  }

  /** Best hour angle in [hS, hE] (same branch as hS). */
  find(sinDec: number, cosDec: number, hS: number, hE: number): number {
    const base = TWO_PI * Math.floor(hS / TWO_PI);
    const s = hS - base;
    const e = hE - base;
    if (!(Math.abs(sinDec - this.cachedSinDec) < PEAK_REUSE_SIN_DEC && this.locate(s, e) !== null)) {
      // Solve the passage's arc at this declination and search its peak.
      const arcs = hourAngleArcs(this.g, sinDec, cosDec);
      let found = false;
      for (let i = 0; i < arcs.length && !found; i += 2) {
        this.arcStart = arcs[i]!;
        this.arcEnd = arcs[i + 1]!;
        found = this.locate(s, e) !== null;
      }
      if (!found) {
        this.cachedSinDec = Number.NaN;
        return this.best(sinDec, cosDec, hS, hE);
      }
      this.cachedSinDec = sinDec;
      this.arcPeak = this.best(sinDec, cosDec, this.arcStart, this.arcEnd);
    }
    const k = this.locate(s, e)!;
    const peak = this.arcPeak - k * TWO_PI + base;
    return peak >= hS && peak <= hE ? peak : this.best(sinDec, cosDec, hS, hE, PEAK_SCAN_SAMPLES_CLIPPED);
  }

  /** Turns (0 or 1) to add to [s, e] to fall inside the cached arc, or null. */
  private locate(s: number, e: number): number | null {
    const slack = 1e-4;
    for (let k = 0; k <= 1; k++) {
      if (s + k * TWO_PI >= this.arcStart - slack && e + k * TWO_PI <= this.arcEnd + slack) return k;
    }
    return null;
  }
}

/** Peak (best centring) and the sky there for the lineup [s, e] (UT days). */
function describeLineup(targetIndex: number, s: number, e: number, track: TargetTrack, centring: Centring, peaks: PeakFinder, sky: SiteSky): Lineup {
  const hS = track.hourAngle(s);
  const raS = track.ra;
  const thetaE = track.localSidereal(e);
  track.at(e);
  let dRa = track.ra - raS;
  dRa -= TWO_PI * Math.round(dRa / TWO_PI);
  const hE = thetaE - (raS + dRa);
  track.declinationAt((s + e) / 2);
  const hBest = peaks.find(track.sinDec, track.cosDec, hS, hE);
  const tPeak = hE > hS ? s + ((hBest - hS) / (hE - hS)) * (e - s) : s;
  // Place and centring at the peak with the declination of that instant.
  const hPeak = track.hourAngle(tPeak);
  const centringAtPeak = centring.at(track.sinDec, track.cosDec, hPeak);
  const sunAltitudeDeg = sky.sunAltitudeDeg(tPeak);
  const moon = sky.moonAt(tPeak);
  const durationMin = (e - s) * MINUTES_PER_DAY;
  return {
    targetIndex,
    // Rounded to the millisecond (a Date would truncate), so range-clipped ends equal the range.
    start: new Date(Math.round(utDaysToUnixMs(s))),
    end: new Date(Math.round(utDaysToUnixMs(e))),
    peak: new Date(Math.round(utDaysToUnixMs(tPeak))),
    durationMin,
    peakAzimuthDeg: centring.azimuthDeg,
    peakAltitudeDeg: centring.altitudeDeg,
    centring: centringAtPeak,
    sunAltitudeDeg,
    moonAltitudeDeg: moon.altitudeDeg,
    moonIllumination: moon.illumination,
    score: lineupScore({ centring: centringAtPeak, durationMin, sunAltitudeDeg, moonDown: moon.down, moonAltitudeDeg: moon.altitudeDeg, moonIllumination: moon.illumination }),
  };
}
