/**
 * Framing for a shot plan: the field of view of a body + lens, whether a set of sky directions
 * (the landmark's top and base, the target's path during the lineup) fits in one frame in
 * landscape or in portrait, and the longest focal length at which it still does.
 *
 * Lens model: rectilinear (pinhole, gnomonic), the camera model of shared/projection
 * (Hartley & Zisserman, "Multiple View Geometry in Computer Vision", 2nd ed., ch. 6): a side of
 * length d on the sensor sees an angle of 2 atan(d / 2f). The camera is held level (no roll) and
 * pointed where it lets the longest focal length keep every point inside the image; directions
 * are projected with shared/projection's camera basis, so extents are right near the zenith and
 * across azimuth 0/360 (no azimuth differences are taken).
 *
 * The pointing search is our own: a small minimax problem (two unknowns, the pointing) that no
 * maintained package solves in this form. A coarse grid of pointings around the points' mean
 * direction picks the best few; each is refined by a Nelder-Mead simplex search on a smoothed
 * objective (a power-norm of the points' image-plane extents, the power raised step by step
 * toward the exact maximum), then on the exact objective.
 */
import { assertFiniteInRange, assertPositiveUpTo } from '../guards';
import {
  assertSkyDirection,
  cameraBasis,
  type CameraPose,
  horizontalFovDeg,
  MAX_HORIZONTAL_FOV_DEG,
  pixelToSky,
  type SkyDirection,
} from '../projection/camera';
import { MAX_FOCAL_LENGTH_MM, MAX_SENSOR_SIDE_MM, MIN_FOCAL_LENGTH_MM } from '../schemas/gear';
import { DEG_PER_RAD, normalizeDegrees360, RAD_PER_DEG } from '../units';

/** Most sky directions accepted by the framing functions (the search costs about 0.5 s per thousand points). */
export const MAX_FRAMING_POINTS = 2000;

/** How a frame is held: landscape (sensor width horizontal) or portrait (turned 90 deg). */
export type Orientation = 'landscape' | 'portrait';
/** Both orientations, landscape first. */
export const ORIENTATIONS: readonly Orientation[] = ['landscape', 'portrait'];

/** Angles of view of a rectilinear lens on a sensor, degrees. */
export interface FieldOfView {
  /** Across the sensor's width. */
  horizontalDeg: number;
  /** Across the sensor's height. */
  verticalDeg: number;
  /** Across the sensor's diagonal. */
  diagonalDeg: number;
}

/** A sensor's size, mm (width the long side). */
export interface SensorSize {
  widthMm: number;
  heightMm: number;
}

function assertSensor(sensor: unknown): SensorSize {
  const s = (sensor ?? {}) as Partial<SensorSize>;
  return {
    widthMm: assertPositiveUpTo(s.widthMm, 'sensor.widthMm', MAX_SENSOR_SIDE_MM),
    heightMm: assertPositiveUpTo(s.heightMm, 'sensor.heightMm', MAX_SENSOR_SIDE_MM),
  };
}

function assertFocal(value: unknown, name: string): number {
  return assertFiniteInRange(value, name, MIN_FOCAL_LENGTH_MM, MAX_FOCAL_LENGTH_MM);
}

/**
 * Horizontal, vertical and diagonal angles of view of a rectilinear lens, each 2 atan(d / 2f)
 * with d the sensor's width, height or diagonal (pinhole model; Hartley & Zisserman ch. 6),
 * through shared/projection's horizontalFovDeg.
 * @param focalLengthMm - focal length, mm 1..5000
 * @param sensor - sensor width and height, mm, each above 0 and at most 100
 * @returns the three angles, degrees (0..180)
 * @throws RangeError on invalid input
 */
export function fieldOfView(focalLengthMm: number, sensor: SensorSize): FieldOfView {
  const f = assertFocal(focalLengthMm, 'focalLengthMm');
  const s = assertSensor(sensor);
  return {
    horizontalDeg: horizontalFovDeg(f, s.widthMm),
    verticalDeg: horizontalFovDeg(f, s.heightMm),
    diagonalDeg: horizontalFovDeg(f, Math.hypot(s.widthMm, s.heightMm)),
  };
}

/**
 * The angles across the image as held: portrait swaps the horizontal and vertical angles.
 * @param fov - a field of view from {@link fieldOfView}
 * @param orientation - 'landscape' or 'portrait'
 * @returns horizontal (across the held image) and vertical angles, degrees
 * @throws RangeError on an unknown orientation or angles outside (0, 180)
 */
export function heldFieldOfView(fov: FieldOfView, orientation: Orientation): { horizontalDeg: number; verticalDeg: number } {
  const h = assertFiniteInRange(fov?.horizontalDeg, 'fov.horizontalDeg', 0, 180);
  const v = assertFiniteInRange(fov?.verticalDeg, 'fov.verticalDeg', 0, 180);
  if (orientation === 'landscape') return { horizontalDeg: h, verticalDeg: v };
  if (orientation === 'portrait') return { horizontalDeg: v, verticalDeg: h };
  throw new RangeError(`orientation must be 'landscape' or 'portrait' (got ${String(orientation)})`);
}

/**
 * The focal length at which a sensor side sees a given angle: f = d / (2 tan(fov / 2)), the
 * pinhole relation solved for f.
 * @param fovDeg - angle of view, degrees, above 0 and below 180
 * @param sideMm - sensor side (or diagonal), mm, above 0 and at most 1000
 * @returns the focal length, mm
 * @throws RangeError on invalid input
 */
export function focalLengthForFovMm(fovDeg: number, sideMm: number): number {
  assertFiniteInRange(fovDeg, 'fovDeg', 0, 180);
  if (!(fovDeg > 0 && fovDeg < 180)) throw new RangeError(`fovDeg must be above 0 and below 180 (got ${fovDeg})`);
  assertPositiveUpTo(sideMm, 'sideMm', 1000);
  return sideMm / (2 * Math.tan((fovDeg / 2) * RAD_PER_DEG));
}

/** The best level pointing for one orientation, see {@link fitInFrame}. */
export interface OrientationFit {
  orientation: Orientation;
  /**
   * Where to point the optical axis (level camera): the direction that allows the longest focal
   * length; null when no direction has every point in front of the camera (more than 180 deg apart).
   */
  centre: SkyDirection | null;
  /** Angle the points need across the held image's width at that pointing, degrees (null: cannot fit). */
  requiredHorizontalFovDeg: number | null;
  /** Angle the points need across the held image's height at that pointing, degrees (null: cannot fit). */
  requiredVerticalFovDeg: number | null;
  /**
   * Longest focal length that keeps every point inside the image, mm, capped at 5000 mm
   * (null when nothing fits in a rectilinear frame, whose angle stays below 179 deg).
   */
  longestFocalLengthMm: number | null;
  /** Whether everything fits at the focal length asked for. */
  fits: boolean;
}

/** Result of {@link fitInFrame}. */
export interface FrameFit {
  /** Field of view of the lens at the focal length asked for. */
  fov: FieldOfView;
  landscape: OrientationFit;
  portrait: OrientationFit;
  /** The orientations in which everything fits, landscape first; empty when neither does (a panorama is needed). */
  fitsIn: Orientation[];
}

type Vec3 = [number, number, number];

interface Evaluation {
  /** True when every point is in front of the camera. */
  feasible: boolean;
  /**
   * Feasible: the objective, max over points of max(|u| / A, |v| / B) in 1/mm (or, while
   * smoothing, its p-norm over the same terms). Infeasible: the largest angle to a point, radians.
   */
  value: number;
  maxAbsU: number;
  maxAbsV: number;
}

function unit(azDeg: number, altDeg: number): Vec3 {
  const az = azDeg * RAD_PER_DEG;
  const alt = altDeg * RAD_PER_DEG;
  return [Math.cos(alt) * Math.sin(az), Math.cos(alt) * Math.cos(az), Math.sin(alt)];
}

function directionOf(v: Vec3): SkyDirection {
  const horizontal = Math.hypot(v[0], v[1]);
  return {
    azimuthDeg: horizontal < 1e-15 ? 0 : normalizeDegrees360(Math.atan2(v[0], v[1]) * DEG_PER_RAD),
    altitudeDeg: Math.atan2(v[2], horizontal) * DEG_PER_RAD,
  };
}

/** A level camera with a focal length of 1 px and its centre at (1, 1): pixels give image-plane coordinates. */
function unitPose(d: SkyDirection): CameraPose {
  return { azimuthDeg: d.azimuthDeg, altitudeDeg: Math.max(-90, Math.min(90, d.altitudeDeg)), rollDeg: 0, horizontalFovDeg: 90, widthPx: 2, heightPx: 2 };
}

function better(a: Evaluation, b: Evaluation): boolean {
  if (a.feasible !== b.feasible) return a.feasible;
  return a.value < b.value - 1e-15 * Math.max(1, Math.abs(b.value));
}

/** Smoothing exponents for the search, then the exact objective (Infinity). */
const SMOOTHING_POWERS = [16, 128, 1024, 8192, 65536, Infinity];

class PointingSearch {
  private readonly terms: Float64Array;

  constructor(
    private readonly points: readonly SkyDirection[],
    private readonly vectors: readonly Vec3[],
    /** Half the held image's width and height, mm. */
    private readonly halfWidthMm: number,
    private readonly halfHeightMm: number,
  ) {
    this.terms = new Float64Array(2 * points.length);
  }

  /**
   * The objective at a pointing: the largest of |u| / A and |v| / B over the points (u, v their
   * image-plane coordinates), or with a finite `power` the power-norm of those terms, a smooth
   * stand-in whose minimum tends to the minimax one as the power grows.
   */
  evaluate(d: SkyDirection, power = Infinity): Evaluation {
    const basis = cameraBasis(unitPose(d));
    let maxAbsU = 0;
    let maxAbsV = 0;
    let feasible = true;
    let worstAngle = 0;
    for (let i = 0; i < this.points.length; i++) {
      const w = this.vectors[i] as Vec3;
      const z = w[0] * basis.forward[0] + w[1] * basis.forward[1] + w[2] * basis.forward[2];
      worstAngle = Math.max(worstAngle, Math.acos(Math.max(-1, Math.min(1, z))));
      if (!(z > 1e-12)) { feasible = false; continue; }
      // Image-plane coordinates X/Z, Y/Z on the camera basis (as projectWithBasis, without re-deriving the vector).
      const u = Math.abs((w[0] * basis.right[0] + w[1] * basis.right[1] + w[2] * basis.right[2]) / z);
      const v = Math.abs((w[0] * basis.up[0] + w[1] * basis.up[1] + w[2] * basis.up[2]) / z);
      this.terms[2 * i] = u / this.halfWidthMm;
      this.terms[2 * i + 1] = v / this.halfHeightMm;
      maxAbsU = Math.max(maxAbsU, u);
      maxAbsV = Math.max(maxAbsV, v);
    }
    if (!feasible) return { feasible, value: worstAngle, maxAbsU, maxAbsV };
    const max = Math.max(maxAbsU / this.halfWidthMm, maxAbsV / this.halfHeightMm);
    if (power === Infinity || max === 0) return { feasible, value: max, maxAbsU, maxAbsV };
    let sum = 0;
    for (const t of this.terms) sum += (t / max) ** power;
    return { feasible, value: max * sum ** (1 / power), maxAbsU, maxAbsV };
  }

  /** The direction seen at image-plane offset (du, dv) from the axis of a level camera pointed at d. */
  static offset(d: SkyDirection, du: number, dv: number): SkyDirection {
    return pixelToSky(unitPose(d), { x: 1 + du, y: 1 - dv });
  }

  /** The objective at an image-plane offset from a reference pointing; infeasible pointings rank last. */
  private offsetValue(ref: SkyDirection, du: number, dv: number, power: number): number {
    const e = this.evaluate(PointingSearch.offset(ref, du, dv), power);
    return e.feasible ? e.value : INFEASIBLE + e.value;
  }

  /**
   * Nelder-Mead simplex search (reflection 1, expansion 2, contraction 1/2, shrink 1/2) over
   * image-plane offsets from `ref`, starting with a simplex of size `size`.
   */
  private nelderMead(ref: SkyDirection, power: number, size: number): SkyDirection {
    const f = (p: readonly [number, number]) => this.offsetValue(ref, p[0], p[1], power);
    let simplex: Array<{ p: [number, number]; v: number }> = [[0, 0], [size, 0], [0, size]].map((p) => ({ p: p as [number, number], v: f(p as [number, number]) }));
    for (let iteration = 0; iteration < 400; iteration++) {
      simplex.sort((a, b) => a.v - b.v);
      const [best, mid, worst] = simplex as [typeof simplex[0], typeof simplex[0], typeof simplex[0]];
      const extent = Math.max(Math.hypot(mid.p[0] - best.p[0], mid.p[1] - best.p[1]), Math.hypot(worst.p[0] - best.p[0], worst.p[1] - best.p[1]));
      if (extent < 1e-11) break;
      const c: [number, number] = [(best.p[0] + mid.p[0]) / 2, (best.p[1] + mid.p[1]) / 2];
      const along = (t: number): [number, number] => [c[0] + t * (worst.p[0] - c[0]), c[1] + t * (worst.p[1] - c[1])];
      const r = along(-1);
      const rv = f(r);
      if (rv < best.v) {
        const e = along(-2);
        const ev = f(e);
        simplex = [best, mid, ev < rv ? { p: e, v: ev } : { p: r, v: rv }];
      } else if (rv < mid.v) {
        simplex = [best, mid, { p: r, v: rv }];
      } else {
        const k = rv < worst.v ? along(-0.5) : along(0.5);
        const kv = f(k);
        if (kv < Math.min(rv, worst.v)) simplex = [best, mid, { p: k, v: kv }];
        else {
          simplex = [best, mid, worst].map((q, i) => {
            if (i === 0) return q;
            const p: [number, number] = [(q.p[0] + best.p[0]) / 2, (q.p[1] + best.p[1]) / 2];
            return { p, v: f(p) };
          });
        }
      }
    }
    simplex.sort((a, b) => a.v - b.v);
    const b = (simplex[0] as { p: [number, number] }).p;
    return PointingSearch.offset(ref, b[0], b[1]);
  }

  /** Simplex searches on the smoothed objective of growing power, then on the exact one. */
  refine(start: SkyDirection, size: number): { centre: SkyDirection; evaluation: Evaluation } {
    let d = start;
    let s = size;
    for (const power of SMOOTHING_POWERS) {
      d = this.nelderMead(d, power, s);
      s = Math.max(size / 50, 1e-4);
    }
    return { centre: d, evaluation: this.evaluate(d) };
  }
}

/** Added to the objective of pointings that leave a point behind the camera. */
const INFEASIBLE = 1e6;
/** Half the number of coarse-grid steps across each image-plane axis. */
const COARSE_STEPS = 10;
/** Coarse-grid pointings refined. */
const COARSE_KEPT = 3;

function meanDirection(vectors: readonly Vec3[]): SkyDirection {
  const m: Vec3 = [0, 0, 0];
  for (const v of vectors) { m[0] += v[0]; m[1] += v[1]; m[2] += v[2]; }
  if (Math.hypot(m[0], m[1], m[2]) < 1e-9 * vectors.length) return directionOf(vectors[0] as Vec3);
  return directionOf(m);
}

function checkPoints(points: readonly SkyDirection[]): SkyDirection[] {
  if (!Array.isArray(points) || points.length === 0) throw new RangeError('points must be a non-empty array of sky directions');
  if (points.length > MAX_FRAMING_POINTS) throw new RangeError(`points may hold at most ${MAX_FRAMING_POINTS} directions (got ${points.length})`);
  return points.map((p, i) => assertSkyDirection(p, `points[${i}]`));
}

/**
 * The level pointing that minimises the objective: a coarse grid over image-plane offsets from
 * the points' mean direction (wide enough to reach every point; with the zenith at several
 * azimuths when the points are high), then simplex refinement of the best few, because a level
 * frame near the zenith turns with its azimuth and the objective can have several minima there.
 */
function bestPointing(points: readonly SkyDirection[], halfWidthMm: number, halfHeightMm: number): { centre: SkyDirection; evaluation: Evaluation } {
  const vectors = points.map((p) => unit(p.azimuthDeg, p.altitudeDeg));
  const search = new PointingSearch(points, vectors, halfWidthMm, halfHeightMm);
  const mean = meanDirection(vectors);
  const m = unit(mean.azimuthDeg, mean.altitudeDeg);
  let reach = 0;
  for (const v of vectors) reach = Math.max(reach, Math.acos(Math.max(-1, Math.min(1, v[0] * m[0] + v[1] * m[1] + v[2] * m[2]))));
  const span = Math.tan(Math.min(reach, 85 * RAD_PER_DEG));
  const candidates: Array<{ d: SkyDirection; e: Evaluation }> = [];
  for (let i = -COARSE_STEPS; i <= COARSE_STEPS; i++) {
    for (let j = -COARSE_STEPS; j <= COARSE_STEPS; j++) {
      const d = PointingSearch.offset(mean, (span * i) / COARSE_STEPS, (span * j) / COARSE_STEPS);
      candidates.push({ d, e: search.evaluate(d) });
    }
  }
  if (Math.abs(mean.altitudeDeg) > 45) {
    const pole = mean.altitudeDeg > 0 ? 90 : -90;
    for (let az = 0; az < 180; az += 15) {
      const d = { azimuthDeg: az, altitudeDeg: pole };
      candidates.push({ d, e: search.evaluate(d) });
    }
  }
  candidates.sort((a, b) => (better(a.e, b.e) ? -1 : better(b.e, a.e) ? 1 : 0));
  const size = Math.max(span / COARSE_STEPS, 1e-3);
  let best: { centre: SkyDirection; evaluation: Evaluation } | undefined;
  for (const c of candidates.slice(0, COARSE_KEPT)) {
    const result = search.refine(c.d, size);
    const kept = better(c.e, result.evaluation) ? { centre: c.d, evaluation: c.e } : result;
    if (!best || better(kept.evaluation, best.evaluation)) best = kept;
  }
  return best as { centre: SkyDirection; evaluation: Evaluation };
}

function orientationFit(points: readonly SkyDirection[], sensor: SensorSize, orientation: Orientation, focalLengthMm: number | null): OrientationFit {
  const halfW = (orientation === 'landscape' ? sensor.widthMm : sensor.heightMm) / 2;
  const halfH = (orientation === 'landscape' ? sensor.heightMm : sensor.widthMm) / 2;
  const { centre, evaluation } = bestPointing(points, halfW, halfH);
  if (!evaluation.feasible) {
    return { orientation, centre: null, requiredHorizontalFovDeg: null, requiredVerticalFovDeg: null, longestFocalLengthMm: null, fits: false };
  }
  const requiredH = 2 * Math.atan(evaluation.maxAbsU) * DEG_PER_RAD;
  const requiredV = 2 * Math.atan(evaluation.maxAbsV) * DEG_PER_RAD;
  const unlimited = evaluation.value > 0 ? 1 / evaluation.value : Infinity;
  // A rectilinear frame's angle stays below MAX_HORIZONTAL_FOV_DEG on both sides.
  const withinLens = Math.max(requiredH, requiredV) <= MAX_HORIZONTAL_FOV_DEG;
  const longest = withinLens ? Math.min(unlimited, MAX_FOCAL_LENGTH_MM) : null;
  return {
    orientation,
    centre: { azimuthDeg: normalizeDegrees360(centre.azimuthDeg), altitudeDeg: centre.altitudeDeg },
    requiredHorizontalFovDeg: requiredH,
    requiredVerticalFovDeg: requiredV,
    longestFocalLengthMm: longest,
    fits: longest !== null && focalLengthMm !== null && focalLengthMm <= longest * (1 + 1e-9),
  };
}

/**
 * Whether a set of sky directions fits in one frame of a body + lens, in landscape and in portrait.
 * For each orientation the level camera is pointed where the longest focal length still holds
 * every point inside the image (a minimax over the points' image-plane coordinates), and the angles
 * the points need at that pointing are returned. Give the landmark's top and base (and its sides
 * if wide) and the target's path as samples close enough that the path between them stays inside
 * too (a few degrees apart): only the given directions are checked.
 * @param points - 1..2000 sky directions (true azimuth 0..360 deg, apparent altitude -90..90 deg)
 * @param sensor - sensor width and height, mm, each above 0 and at most 100
 * @param focalLengthMm - the focal length to check, mm 1..5000
 * @returns the lens's field of view, each orientation's best pointing and fit, and the orientations that fit
 * @throws RangeError on invalid input
 */
export function fitInFrame(points: readonly SkyDirection[], sensor: SensorSize, focalLengthMm: number): FrameFit {
  const ps = checkPoints(points);
  const s = assertSensor(sensor);
  const f = assertFocal(focalLengthMm, 'focalLengthMm');
  const landscape = orientationFit(ps, s, 'landscape', f);
  const portrait = orientationFit(ps, s, 'portrait', f);
  return {
    fov: fieldOfView(f, s),
    landscape,
    portrait,
    fitsIn: [landscape, portrait].filter((o) => o.fits).map((o) => o.orientation),
  };
}

/** Result of {@link longestFittingFocalLength}. */
export interface LensFit {
  /**
   * The longest focal length within the lens's range at which everything fits in one frame, mm;
   * null when it does not fit even at the shortest (a panorama is needed).
   */
  focalLengthMm: number | null;
  /** The orientation that allows it (landscape on a tie); null with no fit. */
  orientation: Orientation | null;
  /** Where to point at that focal length (null with no fit). */
  centre: SkyDirection | null;
  /** Each orientation's longest fitting focal length and pointing, not limited to the lens. */
  landscape: OrientationFit;
  portrait: OrientationFit;
}

/**
 * The longest focal length of a prime or zoom at which the landmark and the target's path still
 * fit in one frame. Every shorter focal length fits too (its field is wider), so this is the
 * tightest framing that holds everything: what the lineup's "widest focal length that fits" asks
 * for, read as the limit the focal length must not exceed.
 * @param points - 1..2000 sky directions (see {@link fitInFrame})
 * @param sensor - sensor width and height, mm, each above 0 and at most 100
 * @param lens - focal range, mm 1..5000, `minMm <= maxMm` (equal for a prime; see lensFocalRange)
 * @returns the focal length and orientation, or nulls when even the shortest focal length is too long
 * @throws RangeError on invalid input
 */
export function longestFittingFocalLength(points: readonly SkyDirection[], sensor: SensorSize, lens: { minMm: number; maxMm: number }): LensFit {
  const ps = checkPoints(points);
  const s = assertSensor(sensor);
  const minMm = assertFocal(lens?.minMm, 'lens.minMm');
  const maxMm = assertFocal(lens?.maxMm, 'lens.maxMm');
  if (maxMm < minMm) throw new RangeError(`lens.maxMm must be at least lens.minMm (got ${maxMm} < ${minMm})`);
  const landscape = orientationFit(ps, s, 'landscape', minMm);
  const portrait = orientationFit(ps, s, 'portrait', minMm);
  const best = (portrait.longestFocalLengthMm ?? -1) > (landscape.longestFocalLengthMm ?? -1) ? portrait : landscape;
  if (best.longestFocalLengthMm === null || best.longestFocalLengthMm < minMm * (1 - 1e-9)) {
    return { focalLengthMm: null, orientation: null, centre: null, landscape, portrait };
  }
  return {
    focalLengthMm: Math.max(minMm, Math.min(maxMm, best.longestFocalLengthMm)),
    orientation: best.orientation,
    centre: best.centre,
    landscape,
    portrait,
  };
}
