/**
 * Passage of a fixed J2000 target through a frame, solved analytically in hour angle.
 *
 * For a fixed declination the target's altitude and azimuth are functions of its hour angle H
 * alone, so the set of hour angles inside the frame is found once per sidereal day by solving the
 * boundary equations in closed form:
 * - altitude band edge h: cos H = (sin h - sin(lat) sin(dec)) / (cos(lat) cos(dec));
 * - azimuth edge A (the vertical plane through A): P sin H + Q cos H = S with
 *   P = -cos(dec) cos A, Q = sin(lat) cos(dec) sin A, S = cos(lat) sin(dec) sin A;
 * then each arc between successive roots is classified by testing its midpoint (a target's
 * classification is reused from one day to the next while the order of its roots is unchanged:
 * arcs can only change class when roots appear, vanish or cross). Tangencies (a path grazing a
 * frame edge) give a zero-width arc and are classified the same way. The hour-angle arcs are
 * mapped to UTC with the hour angle H(t) = local apparent sidereal angle - RA(t), linear within a
 * day to about 1e-7 rad (a millisecond). The declination is refreshed every day from apparent
 * places interpolated between exact nodes (apparentPlace.ts), so a search over ten years stays
 * within a tenth of a second of the exact boundaries (tests compare with a brute-force oracle).
 *
 * Definitions (same as the brute-force oracle in tests/unit/lineup): the target's apparent altitude
 * is its geometric altitude plus astronomy-engine's `Refraction('normal')`; its azimuth is true,
 * from north through east, unaffected by refraction; it is inside the frame when its azimuth is
 * within `azimuthDeg +- halfWidthDeg` (wrapping across north) and its apparent altitude within
 * [bottomAltDeg, topAltDeg].
 */
import type { Frame } from '../schemas/geometry';
import { directionAt, type PlaceNodes } from './apparentPlace';
import { apparentSiderealUnwrappedRad } from './ephemeris';
import { appendMerging, type FlatIntervals } from './intervals';
import { geometricAltitudeDeg } from './refraction';
import { assertFiniteInRange, assertPositiveUpTo } from '../guards';
import { RAD_PER_DEG } from '../units';

const TWO_PI = 2 * Math.PI;

/** Length of a sidereal day in solar days (the cycle of the hour-angle solution). */
export const SIDEREAL_DAY_DAYS = 0.9972695663;

/**
 * Checks a frame: azimuth 0..360, half-width in (0, 180], altitudes -90..90 with top > bottom.
 * @throws RangeError otherwise.
 */
export function checkFrame(frame: Frame): void {
  if (frame === null || typeof frame !== 'object') throw new RangeError('frame must be an object');
  assertFiniteInRange(frame.azimuthDeg, 'frame.azimuthDeg', 0, 360);
  assertPositiveUpTo(frame.halfWidthDeg, 'frame.halfWidthDeg', 180);
  const bottomAltDeg = assertFiniteInRange(frame.bottomAltDeg, 'frame.bottomAltDeg', -90, 90);
  const topAltDeg = assertFiniteInRange(frame.topAltDeg, 'frame.topAltDeg', -90, 90);
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
  /**
   * Azimuth edges, empty for a whole-horizon frame. For an edge at azimuth A the boundary equation
   * P sin H + Q cos H = S has P = -cos(dec) cos A, Q = sin(lat) cos(dec) sin A,
   * S = cos(lat) sin(dec) sin A; cos(dec) > 0 factors out, so theta = atan2(P, Q) and
   * |(P, Q)| / cos(dec) are fixed per edge and the roots are theta +- acos(k tan(dec)).
   */
  edges: { cos: number; sin: number; theta: number; norm: number; k: number }[];
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
  const azimuthRad = frame.azimuthDeg * RAD_PER_DEG;
  const halfWidthRad = frame.halfWidthDeg * RAD_PER_DEG;
  const whole = frame.halfWidthDeg >= 180;
  const sinLat = Math.sin(latDeg * RAD_PER_DEG);
  const cosLat = Math.cos(latDeg * RAD_PER_DEG);
  const edges = whole
    ? []
    : [azimuthRad - halfWidthRad, azimuthRad + halfWidthRad].map((a) => {
      const cos = Math.cos(a);
      const sin = Math.sin(a);
      const norm = Math.hypot(cos, sinLat * sin);
      return { cos, sin, theta: Math.atan2(-cos, sinLat * sin), norm, k: norm > 0 ? (cosLat * sin) / norm : 0 };
    });
  return {
    sinLat,
    cosLat,
    lonRad: lonDeg * RAD_PER_DEG,
    azimuthRad,
    cosAzimuth: Math.cos(azimuthRad),
    sinAzimuth: Math.sin(azimuthRad),
    halfWidthRad: whole ? Math.PI : halfWidthRad,
    cosHalfWidth: whole ? -1 : Math.cos(halfWidthRad),
    edges,
    sinBottom: Math.sin(geometricAltitudeDeg(frame.bottomAltDeg) * RAD_PER_DEG),
    sinTop: Math.sin(geometricAltitudeDeg(frame.topAltDeg) * RAD_PER_DEG),
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

/** Boundary candidates of one solution (at most 2 altitude edges x 2 + 2 azimuth edges x 2). */
const candidates = new Float64Array(8);
/** Which equation and root each candidate comes from (0..7), sorted along with `candidates`. */
const candidateIds = new Int8Array(8);
/** Arcs of the last solution, flat [start, end, ...]; reused to keep the hot path allocation-free. */
const arcBuffer = new Float64Array(16);

/**
 * What one target's previous solution looked like: the order of its boundary candidates and which
 * arcs between them were inside. While the order is unchanged (no tangency, no candidate crossing
 * another or 0 h), every arc keeps its classification, so the midpoint tests can be skipped.
 */
export interface ArcMemo {
  signature: number;
  insideMask: number;
}

/** A fresh memo (no previous solution). */
export function newArcMemo(): ArcMemo {
  return { signature: -1, insideMask: 0 };
}

function pushAltitudeCandidates(g: FrameGeometry, sinDec: number, k: number, s: number, n: number, id: number): number {
  if (s <= -1 || s >= 1) return n;
  const c = (s - g.sinLat * sinDec) / k;
  if (c > -1 && c < 1) {
    const h = Math.acos(c);
    candidates[n] = h;
    candidateIds[n++] = id;
    candidates[n] = TWO_PI - h;
    candidateIds[n++] = id + 1;
  }
  return n;
}

function pushAzimuthCandidates(cosDec: number, tanDec: number, edge: FrameGeometry['edges'][number], n: number, id: number): number {
  if (!(cosDec * edge.norm > 1e-12)) return n;
  const x = edge.k * tanDec;
  if (x > -1 && x < 1) {
    const d = Math.acos(x);
    let h = edge.theta + d;
    h -= TWO_PI * Math.floor(h / TWO_PI);
    candidates[n] = h;
    candidateIds[n++] = id;
    h = edge.theta - d;
    h -= TWO_PI * Math.floor(h / TWO_PI);
    candidates[n] = h;
    candidateIds[n++] = id + 1;
  }
  return n;
}

/**
 * Hour-angle arcs inside the frame for a fixed declination, into a shared buffer.
 * @param g - Frame geometry; @param sinDec - sin(dec); @param cosDec - cos(dec), >= 0.
 * @param memo - Optional memo of the same target's previous solution (updated).
 * @returns The number of values written to `arcBuffer` (pairs start, end; starts in
 *   [0, 2 pi), ends > starts, an arc crossing 2 pi ends beyond it; [0, 2 pi] for the whole circle).
 */
function solveArcs(g: FrameGeometry, sinDec: number, cosDec: number, memo?: ArcMemo): number {
  // Altitude range over a day: culminations at 90 - |lat - dec| and |lat + dec| - 90 (as sines).
  const upMax = g.sinLat * sinDec + g.cosLat * cosDec;
  const upMin = g.sinLat * sinDec - g.cosLat * cosDec;
  if (upMax < g.sinBottom || upMin > g.sinTop) return 0;
  let n = 0;
  const k = g.cosLat * cosDec;
  if (k > 1e-12) {
    n = pushAltitudeCandidates(g, sinDec, k, g.sinBottom, n, 0);
    n = pushAltitudeCandidates(g, sinDec, k, g.sinTop, n, 2);
  }
  const tanDec = sinDec / cosDec;
  for (let e = 0; e < g.edges.length; e++) n = pushAzimuthCandidates(cosDec, tanDec, g.edges[e]!, n, 4 + 2 * e);
  if (n === 0) {
    if (!insideAtHourAngle(g, sinDec, cosDec, 0)) return 0;
    arcBuffer[0] = 0;
    arcBuffer[1] = TWO_PI;
    return 2;
  }
  // Insertion sort (n <= 8), carrying the ids; the signature is the sorted id sequence.
  for (let i = 1; i < n; i++) {
    const v = candidates[i]!;
    const id = candidateIds[i]!;
    let j = i - 1;
    while (j >= 0 && candidates[j]! > v) {
      candidates[j + 1] = candidates[j]!;
      candidateIds[j + 1] = candidateIds[j]!;
      j--;
    }
    candidates[j + 1] = v;
    candidateIds[j + 1] = id;
  }
  let signature = n;
  for (let i = 0; i < n; i++) signature = signature * 8 + candidateIds[i]!;
  const reuse = memo !== undefined && memo.signature === signature;
  let mask = reuse ? memo.insideMask : 0;
  // Classify each arc [c_i, c_i+1] (the last one wraps to c_0 + 2 pi); join neighbours.
  let m = 0;
  const c0 = candidates[0]!;
  for (let i = 0; i < n; i++) {
    const a = candidates[i]!;
    const b = i + 1 < n ? candidates[i + 1]! : c0 + TWO_PI;
    let inside: boolean;
    if (reuse) inside = (mask & (1 << i)) !== 0;
    else {
      inside = b > a && insideAtHourAngle(g, sinDec, cosDec, (a + b) / 2);
      if (inside) mask |= 1 << i;
    }
    if (!inside || !(b > a)) continue;
    if (m > 0 && arcBuffer[m - 1] === a) arcBuffer[m - 1] = b;
    else {
      arcBuffer[m++] = a;
      arcBuffer[m++] = b;
    }
  }
  if (memo) {
    memo.signature = signature;
    memo.insideMask = mask;
  }
  if (m === 2 && arcBuffer[0] === c0 && arcBuffer[1] === c0 + TWO_PI) {
    arcBuffer[0] = 0;
    arcBuffer[1] = TWO_PI;
    return 2;
  }
  // An arc ending at c_0 + 2 pi continues into the first arc when that one starts at c_0.
  if (m >= 4 && arcBuffer[0] === c0 && arcBuffer[m - 1] === c0 + TWO_PI) {
    const end = arcBuffer[1]! + TWO_PI;
    for (let i = 2; i < m; i++) arcBuffer[i - 2] = arcBuffer[i]!;
    m -= 2;
    arcBuffer[m - 1] = end;
  }
  return m;
}

/**
 * Hour-angle arcs inside the frame for a fixed declination.
 * @param g - Frame geometry; @param sinDec - sin(dec); @param cosDec - cos(dec), >= 0.
 * @returns Flat arcs [start, end, ...], starts in [0, 2 pi), ends > starts (an arc crossing
 *   2 pi ends beyond it); [0, 2 pi] for the whole circle; [] when never inside.
 */
export function hourAngleArcs(g: FrameGeometry, sinDec: number, cosDec: number, memo?: ArcMemo): number[] {
  return Array.from(arcBuffer.subarray(0, solveArcs(g, sinDec, cosDec, memo)));
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

  /** Updates only the declination (sinDec, cosDec) for time t (UT days). */
  declinationAt(t: number): void {
    directionAt(this.nodes, this.directions, t, this.dir);
    this.sinDec = this.dir[2]!;
    this.cosDec = Math.hypot(this.dir[0]!, this.dir[1]!);
  }

  /** Unwrapped local apparent sidereal angle at t, rad. */
  localSidereal(t: number): number {
    return apparentSiderealUnwrappedRad(t) + this.lonRad;
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
  const memo = newArcMemo();
  let ptr = 0;
  // Hour angle and RA at the end of the previous solved day, reused when days follow each other.
  let lastT = Number.NaN;
  let lastH = 0;
  let lastRa = 0;
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
    let hA: number;
    let raA: number;
    if (tA === lastT) {
      hA = lastH;
      raA = lastRa;
    } else {
      hA = track.hourAngle(tA);
      raA = track.ra;
    }
    const thetaB = track.localSidereal(tB);
    track.at(tB);
    let dRa = track.ra - raA;
    if (dRa > Math.PI) dRa -= TWO_PI;
    else if (dRa < -Math.PI) dRa += TWO_PI;
    const hB = thetaB - (raA + dRa);
    lastT = tB;
    lastH = hB;
    lastRa = raA + dRa;
    track.declinationAt((tA + tB) / 2);
    const count = solveArcs(g, track.sinDec, track.cosDec, memo);
    if (count > 0) {
      const scale = (tB - tA) / (hB - hA);
      const mFirst = Math.floor(hA / TWO_PI) - 1;
      const mLast = Math.floor(hB / TWO_PI);
      for (let m = mFirst; m <= mLast; m++) {
        const shift = m * TWO_PI;
        for (let i = 0; i < count; i += 2) {
          const lo = Math.max(hA, arcBuffer[i]! + shift);
          const hi = Math.min(hB, arcBuffer[i + 1]! + shift);
          if (hi > lo) appendMerging(out, tA + (lo - hA) * scale, tA + (hi - hA) * scale, 1e-9);
        }
      }
    }
    tA = tB;
  }
  return out;
}
