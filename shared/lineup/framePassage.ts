/**
 * Passage of a fixed J2000 target through a frame, solved analytically in hour angle.
 *
 * For a fixed declination the target's altitude and azimuth are functions of its hour angle H
 * alone, so the set of hour angles inside the frame is found once per sidereal day by solving the
 * boundary equations in closed form:
 * - altitude band edge h: cos H = (sin h - sin(lat) sin(dec)) / (cos(lat) cos(dec));
 * - azimuth edge A (the vertical plane through A): P sin H + Q cos H = S with
 *   P = -cos(dec) cos A, Q = sin(lat) cos(dec) sin A, S = cos(lat) sin(dec) sin A;
 * then each arc between successive roots is classified by testing its midpoint. Tangencies (a path
 * grazing a frame edge) give a zero-width arc and are classified the same way. The hour-angle arcs
 * are mapped to UTC with the hour angle H(t) = local apparent sidereal angle - RA(t), linear to
 * 1e-9 rad within a day. The declination is refreshed every day from apparent places interpolated
 * between exact nodes (apparentPlace.ts), so a search over ten years stays within a fraction of a
 * second of the exact boundaries.
 *
 * Definitions (same as the brute-force oracle in tests/unit/lineup): the target's apparent altitude
 * is its geometric altitude plus astronomy-engine's `Refraction('normal')`; its azimuth is true,
 * from north through east, unaffected by refraction; it is inside the frame when its azimuth is
 * within `azimuthDeg +- halfWidthDeg` (wrapping across north) and its apparent altitude within
 * [bottomAltDeg, topAltDeg].
 */
import type { Frame } from '../schemas/geometry';
import { directionAt, type PlaceNodes } from './apparentPlace';
import { earthRotationUnwrappedRad, siderealOffsetDeg } from './ephemeris';
import { appendMerging, type FlatIntervals } from './intervals';
import { geometricAltitudeDeg } from './refraction';

const DEG = Math.PI / 180;
const TWO_PI = 2 * Math.PI;

/** Length of a sidereal day in solar days (the cycle of the hour-angle solution). */
export const SIDEREAL_DAY_DAYS = 0.9972695663;

/**
 * Checks a frame: azimuth 0..360, half-width in (0, 180], altitudes -90..90 with top > bottom.
 * @throws RangeError otherwise.
 */
export function checkFrame(frame: Frame): void {
  if (frame === null || typeof frame !== 'object') throw new RangeError('frame must be an object');
  const { azimuthDeg, halfWidthDeg, bottomAltDeg, topAltDeg } = frame;
  if (!Number.isFinite(azimuthDeg) || azimuthDeg < 0 || azimuthDeg > 360) throw new RangeError('frame.azimuthDeg must be a finite number in 0..360');
  if (!Number.isFinite(halfWidthDeg) || halfWidthDeg <= 0 || halfWidthDeg > 180) throw new RangeError('frame.halfWidthDeg must be a finite number in (0, 180]');
  if (!Number.isFinite(bottomAltDeg) || bottomAltDeg < -90 || bottomAltDeg > 90) throw new RangeError('frame.bottomAltDeg must be a finite number in -90..90');
  if (!Number.isFinite(topAltDeg) || topAltDeg < -90 || topAltDeg > 90) throw new RangeError('frame.topAltDeg must be a finite number in -90..90');
  if (!(topAltDeg > bottomAltDeg)) throw new RangeError('frame.topAltDeg must be above frame.bottomAltDeg');
}

/** Frame and site quantities reused for every hour-angle solution. */
export interface FrameGeometry {
  sinLat: number;
  cosLat: number;
  lonRad: number;
  /** Frame centre azimuth, rad. */
  azimuthRad: number;
  cosAzimuth: number;
  sinAzimuth: number;
  /** Half-width, rad; >= pi means the whole horizon. */
  halfWidthRad: number;
  cosHalfWidth: number;
  /** Azimuth edges (rad) and their sines/cosines, empty for a whole-horizon frame. */
  edges: { cos: number; sin: number }[];
  /** Sines of the geometric altitudes of the band's bottom and top. */
  sinBottom: number;
  sinTop: number;
  /** The band in apparent altitude, deg (for centring). */
  bottomAltDeg: number;
  topAltDeg: number;
}

/**
 * Precomputes the frame geometry for a site latitude/longitude (deg).
 * @param frame - A checked frame.
 * @param latDeg - Site latitude, -90..90; @param lonDeg - Site longitude, -180..180.
 */
export function frameGeometry(frame: Frame, latDeg: number, lonDeg: number): FrameGeometry {
  const azimuthRad = frame.azimuthDeg * DEG;
  const halfWidthRad = frame.halfWidthDeg * DEG;
  const whole = frame.halfWidthDeg >= 180;
  const edges = whole
    ? []
    : [azimuthRad - halfWidthRad, azimuthRad + halfWidthRad].map((a) => ({ cos: Math.cos(a), sin: Math.sin(a) }));
  return {
    sinLat: Math.sin(latDeg * DEG),
    cosLat: Math.cos(latDeg * DEG),
    lonRad: lonDeg * DEG,
    azimuthRad,
    cosAzimuth: Math.cos(azimuthRad),
    sinAzimuth: Math.sin(azimuthRad),
    halfWidthRad: whole ? Math.PI : halfWidthRad,
    cosHalfWidth: whole ? -1 : Math.cos(halfWidthRad),
    edges,
    sinBottom: Math.sin(geometricAltitudeDeg(frame.bottomAltDeg) * DEG),
    sinTop: Math.sin(geometricAltitudeDeg(frame.topAltDeg) * DEG),
    bottomAltDeg: frame.bottomAltDeg,
    topAltDeg: frame.topAltDeg,
  };
}

/**
 * Whether a direction at hour angle H (declination given by its sine and cosine) is inside the
 * frame (geometric altitude band, azimuth sector).
 */
export function insideAtHourAngle(g: FrameGeometry, sinDec: number, cosDec: number, hourAngle: number): boolean {
  const c = Math.cos(hourAngle);
  const up = g.sinLat * sinDec + g.cosLat * cosDec * c;
  if (up < g.sinBottom || up > g.sinTop) return false;
  if (g.edges.length === 0) return true;
  const east = -cosDec * Math.sin(hourAngle);
  const north = g.cosLat * sinDec - g.sinLat * cosDec * c;
  // Angle between (north, east) and the frame centre at most the half-width.
  return north * g.cosAzimuth + east * g.sinAzimuth >= g.cosHalfWidth * Math.hypot(north, east);
}

const candidates: number[] = [];

/**
 * Hour-angle arcs inside the frame for a fixed declination.
 * @param g - Frame geometry; @param sinDec - sin(dec); @param cosDec - cos(dec), >= 0.
 * @returns Flat arcs [start, end, ...], starts in [0, 2 pi), ends > starts (an arc crossing
 *   2 pi ends beyond it); [0, 2 pi] for the whole circle; [] when never inside.
 */
export function hourAngleArcs(g: FrameGeometry, sinDec: number, cosDec: number): number[] {
  candidates.length = 0;
  const k = g.cosLat * cosDec;
  if (k > 1e-12) {
    for (const s of [g.sinBottom, g.sinTop]) {
      if (s <= -1 || s >= 1) continue;
      const c = (s - g.sinLat * sinDec) / k;
      if (c > -1 && c < 1) {
        const h = Math.acos(c);
        candidates.push(h, TWO_PI - h);
      }
    }
  }
  for (const e of g.edges) {
    const p = -cosDec * e.cos;
    const q = g.sinLat * cosDec * e.sin;
    const s = g.cosLat * sinDec * e.sin;
    const r = Math.hypot(p, q);
    if (r > 1e-12 && Math.abs(s) < r) {
      const theta = Math.atan2(p, q);
      const d = Math.acos(s / r);
      for (const h of [theta + d, theta - d]) candidates.push(((h % TWO_PI) + TWO_PI) % TWO_PI);
    }
  }
  if (candidates.length === 0) return insideAtHourAngle(g, sinDec, cosDec, 0) ? [0, TWO_PI] : [];
  candidates.sort((a, b) => a - b);
  const arcs: number[] = [];
  const n = candidates.length;
  // Classify each arc [c_i, c_i+1] (the last one wraps to c_0 + 2 pi); join neighbours.
  for (let i = 0; i < n; i++) {
    const a = candidates[i]!;
    const b = i + 1 < n ? candidates[i + 1]! : candidates[0]! + TWO_PI;
    if (!(b > a) || !insideAtHourAngle(g, sinDec, cosDec, (a + b) / 2)) continue;
    const m = arcs.length;
    if (m > 0 && arcs[m - 1] === a) arcs[m - 1] = b;
    else arcs.push(a, b);
  }
  const m = arcs.length;
  const c0 = candidates[0]!;
  if (m === 2 && arcs[0] === c0 && arcs[1] === c0 + TWO_PI) return [0, TWO_PI];
  // An arc ending at c_0 + 2 pi continues into the first arc when that one starts at c_0.
  if (m >= 4 && arcs[0] === c0 && arcs[m - 1] === c0 + TWO_PI) {
    const end = arcs[1]! + TWO_PI;
    arcs.splice(0, 2);
    arcs[arcs.length - 1] = end;
  }
  return arcs;
}

/** Interpolated apparent RA/Dec of a target and its hour angle. */
export class TargetTrack {
  private readonly dir = new Float64Array(3);
  /** sin and cos of the declination after the last {@link TargetTrack.at} call. */
  sinDec = 0;
  cosDec = 1;
  /** Right ascension of date after the last call, rad in (-pi, pi]. */
  ra = 0;

  /**
   * @param nodes - Shared apparent-place nodes; @param directions - This target's node directions.
   * @param lonRad - Site longitude, rad.
   */
  constructor(
    private readonly nodes: PlaceNodes,
    private readonly directions: Float64Array,
    private readonly lonRad: number,
  ) {}

  /** Updates declination and RA for time t (UT days). */
  at(t: number): void {
    directionAt(this.nodes, this.directions, t, this.dir);
    const x = this.dir[0]!;
    const y = this.dir[1]!;
    this.sinDec = this.dir[2]!;
    this.cosDec = Math.hypot(x, y);
    this.ra = Math.atan2(y, x);
  }

  /** Unwrapped local apparent sidereal angle at t, rad. */
  localSidereal(t: number): number {
    return earthRotationUnwrappedRad(t) + siderealOffsetDeg(t) * DEG + this.lonRad;
  }

  /** Hour angle at t, rad, on an arbitrary branch (updates sinDec/cosDec/ra). */
  hourAngle(t: number): number {
    this.at(t);
    return this.localSidereal(t) - this.ra;
  }
}

/**
 * Intervals (UT days) when the target is inside the frame, over [from, to].
 * @param g - Frame geometry; @param track - The target's track.
 * @param from - Start, UT days; @param to - End, UT days (> from).
 * @param only - Optional sorted interval list: sidereal days that do not meet it are skipped
 *   (the search passes the dark windows), so results are complete only inside it.
 */
export function framePassageIntervals(g: FrameGeometry, track: TargetTrack, from: number, to: number, only?: FlatIntervals): FlatIntervals {
  const out: FlatIntervals = [];
  let ptr = 0;
  for (let tA = from; tA < to; ) {
    const tB = Math.min(tA + SIDEREAL_DAY_DAYS, to);
    if (only) {
      while (ptr < only.length && only[ptr + 1]! <= tA) ptr += 2;
      if (ptr >= only.length) break;
      if (only[ptr]! >= tB) {
        tA = tB;
        continue;
      }
    }
    const hA = track.hourAngle(tA);
    const raA = track.ra;
    const thetaB = track.localSidereal(tB);
    track.at(tB);
    let dRa = track.ra - raA;
    if (dRa > Math.PI) dRa -= TWO_PI;
    else if (dRa < -Math.PI) dRa += TWO_PI;
    const hB = thetaB - (raA + dRa);
    track.at((tA + tB) / 2);
    const arcs = hourAngleArcs(g, track.sinDec, track.cosDec);
    const scale = (tB - tA) / (hB - hA);
    const mFirst = Math.floor(hA / TWO_PI) - 1;
    const mLast = Math.floor(hB / TWO_PI);
    for (let m = mFirst; m <= mLast; m++) {
      const shift = m * TWO_PI;
      for (let i = 0; i < arcs.length; i += 2) {
        const lo = Math.max(hA, arcs[i]! + shift);
        const hi = Math.min(hB, arcs[i + 1]! + shift);
        if (hi > lo) appendMerging(out, tA + (lo - hA) * scale, tA + (hi - hA) * scale, 1e-9);
      }
    }
    tA = tB;
  }
  return out;
}
