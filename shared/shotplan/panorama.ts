/**
 * Panorama grids for a shot plan: rows of level frames that together cover an azimuth span (up
 * to a full ring) and an altitude span (up to the zenith), with a chosen overlap between
 * neighbouring frames.
 *
 * Model (our own; each frame is the rectilinear, level camera of shared/projection):
 * - Rows. With an altitude span of height H and a frame of vertical angle v, the rows split the
 *   span into n equal bands, each frame pointed at the middle of its band. n = 1 when the span
 *   fits in one frame; otherwise n >= ceil(H / (v (1 - overlap))), so the rows are stepped in
 *   altitude by at most v x (1 - overlap) and neighbouring rows overlap by at least
 *   `overlap` x v along the frames' centre lines. The outer rows reach past the span by
 *   (v - H / n) / 2, which keeps the top and bottom edges, which bow toward the horizon
 *   (keystone), outside the span.
 * - Columns. A level frame pointed at altitude a covers, at altitude alt, the azimuths within
 *   +-W(alt) of its own ({@link frameAzimuthHalfWidthDeg}, solved exactly from the frame's four
 *   edges). W grows with altitude: for a small frame 2W = h / cos(alt) (the 1/cos(alt) widening),
 *   and it reaches 180 deg (a full circle) where the frame holds the zenith. Each row's columns
 *   are stepped in azimuth by 2W (1 - overlap), with W the smallest over the row's band (at one of
 *   its edges, because W first grows then shrinks with altitude), spread evenly over the span; a
 *   full ring has n columns 360/n apart (no frame repeated at the wrap).
 * - Of the row counts that meet these rules (the smallest few), the one with the fewest frames is
 *   chosen (fewer rows on a tie), because columns widen with altitude.
 * So every direction of the span lies inside at least one frame, which the unit tests check with
 * shared/projection's camera model.
 */
import { assertFiniteInRange } from '../guards';
import { MAX_HORIZONTAL_FOV_DEG, MIN_HORIZONTAL_FOV_DEG, type SkyDirection } from '../projection/camera';
import { DEG_PER_RAD, normalizeDegrees360, RAD_PER_DEG } from '../units';

/** Overlap between neighbouring frames used when none is given: 30 % (common practice for stitching). */
export const DEFAULT_PANORAMA_OVERLAP = 0.3;
/** Largest overlap accepted (as a fraction of a frame). */
export const MAX_PANORAMA_OVERLAP = 0.9;
/** Most frames a grid may hold. */
export const MAX_PANORAMA_FRAMES = 5000;

/** The part of the sky a panorama covers. */
export interface PanoramaSpan {
  /**
   * Azimuth span, true degrees 0..360, clockwise from `fromAzDeg` to `toAzDeg` (crossing north
   * when `toAzDeg < fromAzDeg`; equal values: a single azimuth, a vertical panorama).
   * With `fullCircle`, `fromAzDeg` is the first column's azimuth and `toAzDeg` is ignored.
   */
  fromAzDeg: number;
  toAzDeg: number;
  /** A full 360 deg ring. */
  fullCircle?: boolean;
  /** Altitude span, degrees -90..90, bottom <= top. */
  bottomAltDeg: number;
  topAltDeg: number;
}

/** A frame's angles as held (portrait: swap them), degrees 1..179. */
export interface PanoramaFrameFov {
  horizontalDeg: number;
  verticalDeg: number;
}

/** One frame of the grid: where to point the level camera. */
export interface PanoramaFrame {
  /** Row index, 0 at the bottom. */
  row: number;
  /** Column index within the row, 0 at the span's start, clockwise. */
  column: number;
  /** True azimuth of the optical axis, degrees [0, 360). */
  azimuthDeg: number;
  /** Altitude of the optical axis, degrees. */
  altitudeDeg: number;
}

/** One row of the grid. */
export interface PanoramaRow {
  index: number;
  /** Altitude the row's frames point at, degrees. */
  altitudeDeg: number;
  /** The altitude band this row covers on its own, degrees. */
  bandBottomDeg: number;
  bandTopDeg: number;
  columns: number;
  /** Azimuth between neighbouring columns, degrees (0 with one column). */
  azimuthStepDeg: number;
  /** Azimuth width one frame covers over the whole band, 2W, degrees (360 for a frame holding the zenith's cap). */
  frameAzimuthWidthDeg: number;
}

/** A panorama grid; see {@link panoramaGrid}. */
export interface PanoramaGrid {
  rows: PanoramaRow[];
  /** Number of rows. */
  rowCount: number;
  /** Most columns in a row (rows higher up may need fewer). */
  maxColumns: number;
  frameCount: number;
  overlap: number;
  /** Every frame, row by row from the bottom, clockwise within a row. */
  frames: PanoramaFrame[];
  /** The field the grid covers. */
  field: {
    /** Azimuth width covered at every altitude of the span, degrees (360 for a ring). */
    azimuthDeg: number;
    fullCircle: boolean;
    /** Lowest and highest altitude the frames reach along their centre lines, degrees. */
    bottomAltDeg: number;
    topAltDeg: number;
  };
}

const EPS = 1e-12;

/**
 * Half the azimuth range a level rectilinear frame covers along one altitude: the smallest
 * azimuth offset, either side of the frame's own, at which the circle of that altitude leaves
 * the frame through one of its four edges (derived from the pinhole projection x = f X/Z,
 * y = f Y/Z; Hartley & Zisserman ch. 6).
 * @param frameAltitudeDeg - altitude of the optical axis, degrees -90..90
 * @param horizontalFovDeg - the frame's horizontal angle as held, degrees 1..179
 * @param verticalFovDeg - the frame's vertical angle as held, degrees 1..179
 * @param altitudeDeg - the altitude looked at, degrees -90..90
 * @returns W, degrees 0..180: 0 when the frame does not reach that altitude on its centre line,
 *   180 when the whole circle of that altitude lies inside the frame
 * @throws RangeError on invalid input
 */
export function frameAzimuthHalfWidthDeg(frameAltitudeDeg: number, horizontalFovDeg: number, verticalFovDeg: number, altitudeDeg: number): number {
  const a = assertFiniteInRange(frameAltitudeDeg, 'frameAltitudeDeg', -90, 90) * RAD_PER_DEG;
  const t = Math.tan((assertFiniteInRange(horizontalFovDeg, 'horizontalFovDeg', MIN_HORIZONTAL_FOV_DEG, MAX_HORIZONTAL_FOV_DEG) / 2) * RAD_PER_DEG);
  const tv = Math.tan((assertFiniteInRange(verticalFovDeg, 'verticalFovDeg', MIN_HORIZONTAL_FOV_DEG, MAX_HORIZONTAL_FOV_DEG) / 2) * RAD_PER_DEG);
  const alpha = assertFiniteInRange(altitudeDeg, 'altitudeDeg', -90, 90) * RAD_PER_DEG;
  const sa = Math.sin(a); const ca = Math.cos(a);
  const sAl = Math.sin(alpha); const cAl = Math.cos(alpha);
  // Camera coordinates of the direction (azimuth offset phi, altitude alpha) for a level camera:
  // X = cAl sin phi, Y = -cAl cos phi sa + sAl ca, Z = cAl cos phi ca + sAl sa.
  const z0 = cAl * ca + sAl * sa;
  const y0 = -cAl * sa + sAl * ca;
  if (!(z0 > EPS) || Math.abs(y0) > tv * z0 * (1 + 1e-12)) return 0;
  if (cAl < EPS) return 180; // the zenith or nadir itself, inside the frame
  let w = Math.PI;
  // Side edge X = t Z: cAl (sin phi - t ca cos phi) = t sAl sa, i.e. R sin(phi - delta) = k R.
  const r = Math.hypot(1, t * ca);
  const delta = Math.atan2(t * ca, 1);
  const k = (t * sAl * sa) / (cAl * r);
  if (k <= 1) w = Math.min(w, delta + Math.asin(Math.max(-1, k)));
  // Top edge Y = tv Z: C - K cos phi = 0, leaving when cos phi falls to C / K (K > 0).
  const kTop = cAl * (sa + tv * ca);
  const cTop = sAl * (ca - tv * sa);
  if (kTop > EPS && cTop / kTop > -1) w = Math.min(w, Math.acos(Math.min(1, cTop / kTop)));
  // Bottom edge Y = -tv Z: K' cos phi + C' = 0, leaving when cos phi falls to -C' / K' (K' > 0).
  const kBottom = cAl * (tv * ca - sa);
  const cBottom = sAl * (ca + tv * sa);
  if (kBottom > EPS && -cBottom / kBottom > -1) w = Math.min(w, Math.acos(Math.min(1, -cBottom / kBottom)));
  return Math.max(0, w) * DEG_PER_RAD;
}

interface Layout {
  rows: PanoramaRow[];
  frameCount: number;
}

function columnsFor(spanDeg: number, fullCircle: boolean, halfWidthDeg: number, overlap: number): { columns: number; stepDeg: number } | null {
  if (halfWidthDeg >= 180 - 1e-9) return { columns: 1, stepDeg: 0 };
  const width = 2 * halfWidthDeg;
  const maxStep = width * (1 - overlap);
  if (!(maxStep > 1e-6)) return null;
  if (fullCircle) {
    const columns = Math.max(1, Math.ceil(360 / maxStep - 1e-9));
    return columns === 1 ? { columns: 1, stepDeg: 0 } : { columns, stepDeg: 360 / columns };
  }
  if (spanDeg <= width + 1e-9) return { columns: 1, stepDeg: 0 };
  const columns = Math.ceil((spanDeg - width) / maxStep - 1e-9) + 1;
  return { columns, stepDeg: (spanDeg - width) / (columns - 1) };
}

function layout(n: number, span: Required<PanoramaSpan>, azSpanDeg: number, fov: PanoramaFrameFov, overlap: number): Layout | null {
  const height = span.topAltDeg - span.bottomAltDeg;
  const band = height / n;
  const rows: PanoramaRow[] = [];
  let frameCount = 0;
  for (let i = 0; i < n; i++) {
    const bandBottom = span.bottomAltDeg + i * band;
    const bandTop = i === n - 1 ? span.topAltDeg : bandBottom + band;
    const altitude = (bandBottom + bandTop) / 2;
    // Just inside the poles, where a circle of altitude still has a width.
    const lo = Math.max(-90 + 1e-7, Math.min(90 - 1e-7, bandBottom));
    const hi = Math.max(-90 + 1e-7, Math.min(90 - 1e-7, bandTop));
    const w = Math.min(
      frameAzimuthHalfWidthDeg(altitude, fov.horizontalDeg, fov.verticalDeg, lo),
      frameAzimuthHalfWidthDeg(altitude, fov.horizontalDeg, fov.verticalDeg, hi),
    );
    const cols = columnsFor(azSpanDeg, span.fullCircle, w, overlap);
    if (!cols) return null;
    frameCount += cols.columns;
    if (frameCount > 10 * MAX_PANORAMA_FRAMES) return null;
    rows.push({
      index: i,
      altitudeDeg: altitude,
      bandBottomDeg: bandBottom,
      bandTopDeg: bandTop,
      columns: cols.columns,
      azimuthStepDeg: cols.stepDeg,
      frameAzimuthWidthDeg: Math.min(360, 2 * w),
    });
  }
  return { rows, frameCount };
}

/**
 * The clockwise azimuth width of a span, degrees 0..360.
 * @param span - see {@link PanoramaSpan}
 * @returns 360 for a full ring, else (to - from) folded into [0, 360)
 */
function azimuthSpanDeg(span: Required<PanoramaSpan>): number {
  return span.fullCircle ? 360 : normalizeDegrees360(span.toAzDeg - span.fromAzDeg);
}

/**
 * Rows x columns of level frames covering a sky span with a given overlap (model in this module's
 * header): the frames' pointing, each row's columns and step, and the field covered.
 * @param span - azimuth span (clockwise, may cross 0, or a full ring) and altitude span (-90..90 deg, bottom <= top)
 * @param fov - the frame's horizontal and vertical angles as held, degrees 1..179 (see heldFieldOfView)
 * @param overlap - overlap between neighbouring frames, fraction 0..0.9 (default 0.3)
 * @returns the grid; a span that fits in one frame gives one row of one column
 * @throws RangeError on invalid input, or when the grid would need more than 5000 frames
 */
export function panoramaGrid(span: PanoramaSpan, fov: PanoramaFrameFov, overlap = DEFAULT_PANORAMA_OVERLAP): PanoramaGrid {
  const s = (span ?? {}) as Partial<PanoramaSpan>;
  const full = s.fullCircle ?? false;
  if (typeof full !== 'boolean') throw new RangeError('span.fullCircle must be true or false');
  const checked: Required<PanoramaSpan> = {
    fromAzDeg: assertFiniteInRange(s.fromAzDeg, 'span.fromAzDeg', 0, 360),
    toAzDeg: full && s.toAzDeg === undefined ? 0 : assertFiniteInRange(s.toAzDeg, 'span.toAzDeg', 0, 360),
    fullCircle: full,
    bottomAltDeg: assertFiniteInRange(s.bottomAltDeg, 'span.bottomAltDeg', -90, 90),
    topAltDeg: assertFiniteInRange(s.topAltDeg, 'span.topAltDeg', -90, 90),
  };
  if (checked.topAltDeg < checked.bottomAltDeg) {
    throw new RangeError(`span.topAltDeg must be at least span.bottomAltDeg (got ${checked.topAltDeg} < ${checked.bottomAltDeg})`);
  }
  const f: PanoramaFrameFov = {
    horizontalDeg: assertFiniteInRange(fov?.horizontalDeg, 'fov.horizontalDeg', MIN_HORIZONTAL_FOV_DEG, MAX_HORIZONTAL_FOV_DEG),
    verticalDeg: assertFiniteInRange(fov?.verticalDeg, 'fov.verticalDeg', MIN_HORIZONTAL_FOV_DEG, MAX_HORIZONTAL_FOV_DEG),
  };
  const o = assertFiniteInRange(overlap, 'overlap', 0, MAX_PANORAMA_OVERLAP);
  const height = checked.topAltDeg - checked.bottomAltDeg;
  const azSpan = azimuthSpanDeg(checked);

  const candidates: number[] = [];
  if (height < f.verticalDeg) candidates.push(1);
  const stepped = Math.max(2, Math.ceil(height / (f.verticalDeg * (1 - o)) - 1e-9));
  for (let n = stepped; n < stepped + 4; n++) candidates.push(n);
  let best: Layout | null = null;
  for (const n of candidates) {
    const l = layout(n, checked, azSpan, f, o);
    if (l && (!best || l.frameCount < best.frameCount)) best = l;
  }
  if (!best) {
    throw new RangeError(`the grid would need more than ${MAX_PANORAMA_FRAMES} frames: use a wider lens, less overlap or a smaller span`);
  }
  if (best.frameCount > MAX_PANORAMA_FRAMES) {
    throw new RangeError(`the grid would need ${best.frameCount} frames (at most ${MAX_PANORAMA_FRAMES}): use a wider lens, less overlap or a smaller span`);
  }

  const frames: PanoramaFrame[] = [];
  let coveredAz = 360;
  for (const row of best.rows) {
    const halfWidth = row.frameAzimuthWidthDeg / 2;
    let firstAz: number;
    if (checked.fullCircle) firstAz = checked.fromAzDeg;
    else if (row.columns === 1) firstAz = checked.fromAzDeg + azSpan / 2;
    else firstAz = checked.fromAzDeg + halfWidth;
    for (let c = 0; c < row.columns; c++) {
      frames.push({ row: row.index, column: c, azimuthDeg: normalizeDegrees360(firstAz + c * row.azimuthStepDeg), altitudeDeg: row.altitudeDeg });
    }
    const rowCover = checked.fullCircle || row.frameAzimuthWidthDeg >= 360 ? 360 : Math.min(360, (row.columns - 1) * row.azimuthStepDeg + row.frameAzimuthWidthDeg);
    coveredAz = Math.min(coveredAz, rowCover);
  }
  const first = best.rows[0] as PanoramaRow;
  const last = best.rows[best.rows.length - 1] as PanoramaRow;
  return {
    rows: best.rows,
    rowCount: best.rows.length,
    maxColumns: Math.max(...best.rows.map((r) => r.columns)),
    frameCount: best.frameCount,
    overlap: o,
    frames,
    field: {
      azimuthDeg: coveredAz,
      fullCircle: checked.fullCircle || coveredAz >= 360,
      bottomAltDeg: Math.max(-90, first.altitudeDeg - f.verticalDeg / 2),
      topAltDeg: Math.min(90, last.altitudeDeg + f.verticalDeg / 2),
    },
  };
}

/** The smallest span holding a set of directions; see {@link skySpanOf}. */
export interface SkySpan {
  /** Clockwise from this azimuth ... */
  fromAzDeg: number;
  /** ... to this one, degrees [0, 360). */
  toAzDeg: number;
  /** Clockwise width, degrees 0..360. */
  azimuthWidthDeg: number;
  bottomAltDeg: number;
  topAltDeg: number;
}

/**
 * The smallest azimuth arc (clockwise, may cross north) and the altitude range holding a set of
 * directions, e.g. the landmark's edges plus the galactic plane's points up to some altitude, to
 * pass to {@link panoramaGrid}. The arc leaves out the largest gap between neighbouring azimuths.
 * @param directions - 1..10 000 sky directions (azimuth 0..360 deg, altitude -90..90 deg)
 * @returns the span (azimuth width 0 for a single azimuth)
 * @throws RangeError on invalid input
 */
export function skySpanOf(directions: readonly SkyDirection[]): SkySpan {
  if (!Array.isArray(directions) || directions.length === 0) throw new RangeError('directions must be a non-empty array of sky directions');
  if (directions.length > 10_000) throw new RangeError(`directions may hold at most 10000 entries (got ${directions.length})`);
  const az = directions.map((d, i) => normalizeDegrees360(assertFiniteInRange(d?.azimuthDeg, `directions[${i}].azimuthDeg`, 0, 360)));
  const alt = directions.map((d, i) => assertFiniteInRange(d?.altitudeDeg, `directions[${i}].altitudeDeg`, -90, 90));
  const sorted = [...az].sort((x, y) => x - y);
  // The largest gap between neighbours (the wrap from the last to the first included) is left out.
  let gap = sorted[0] as number + 360 - (sorted[sorted.length - 1] as number);
  let from = sorted[0] as number;
  let to = sorted[sorted.length - 1] as number;
  for (let i = 1; i < sorted.length; i++) {
    const g = (sorted[i] as number) - (sorted[i - 1] as number);
    if (g > gap) { gap = g; from = sorted[i] as number; to = sorted[i - 1] as number; }
  }
  return {
    fromAzDeg: from,
    toAzDeg: to,
    azimuthWidthDeg: 360 - gap,
    bottomAltDeg: Math.min(...alt),
    topAltDeg: Math.max(...alt),
  };
}
