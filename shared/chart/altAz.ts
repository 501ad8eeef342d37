/**
 * The altitude-against-azimuth panel of a night chart: the target's track across the azimuths
 * around the frame, with its positions at full local hours, and a schematic landmark silhouette.
 */
import type { Frame } from '../schemas/geometry';
import { angleDifferenceDeg } from '../geo/guards';
import { assertFiniteInRange } from '../sky/guards';
import type { NightChartSeries } from './nightSeries';

/** Default half of the azimuth span shown around the frame's centre, degrees. */
export const DEFAULT_ALT_AZ_HALF_SPAN_DEG = 25;

/** A point of the track: azimuth as an offset from the frame's centre. */
export interface AltAzPoint {
  /** Azimuth minus the frame's centre azimuth, degrees (-180, 180]; east of the centre is positive. */
  offsetDeg: number;
  /** Apparent altitude, degrees. */
  altDeg: number;
  /** Instant, Unix ms. */
  atMs: number;
}

/** What the panel draws. */
export interface AltAzView {
  /** Frame's centre azimuth (true, degrees 0..360): offset 0. */
  centreAzDeg: number;
  /** Azimuths shown: centre ± this, degrees. */
  halfSpanDeg: number;
  /** Altitude axis, degrees [bottom, top]. */
  altDomainDeg: [number, number];
  /** Pieces of the target's track within the azimuths shown (one sample past each edge, for clipping). */
  track: AltAzPoint[][];
  /** The target at each full local hour while within the azimuths shown, with the hour's label. */
  hourMarks: Array<AltAzPoint & { label: string }>;
}

/**
 * Azimuth relative to a centre, folded to (-180, 180] degrees.
 * @param azDeg - azimuth, degrees, finite
 * @param centreDeg - centre azimuth, degrees, finite
 * @throws RangeError on NaN
 */
export function azimuthOffsetDeg(azDeg: number, centreDeg: number): number {
  assertFiniteInRange(azDeg, 'azDeg');
  assertFiniteInRange(centreDeg, 'centreDeg');
  return angleDifferenceDeg(azDeg, centreDeg);
}

/** Linear interpolation of a sampled series (times strictly increasing), held at its ends. */
function interpolate(timesMs: readonly number[], values: readonly number[], atMs: number): number {
  const n = timesMs.length;
  if (n === 0) return NaN;
  if (atMs <= timesMs[0]!) return values[0]!;
  if (atMs >= timesMs[n - 1]!) return values[n - 1]!;
  const hi = timesMs.findIndex((t) => t >= atMs);
  const t0 = timesMs[hi - 1]!;
  const t1 = timesMs[hi]!;
  return values[hi - 1]! + ((values[hi]! - values[hi - 1]!) * (atMs - t0)) / (t1 - t0);
}

/**
 * The alt-az panel for a sampled night.
 * @param series - from {@link nightChartSeries}
 * @param frame - the frame (true azimuth, apparent altitudes, degrees)
 * @param options - `halfSpanDeg`: azimuths shown each side of the frame's centre, degrees, above the
 *   frame's half-width and at most 180 (default the larger of 25 deg and 3 frame half-widths);
 *   `landmarkBaseDeg`: elevation angle of the landmark's base, degrees -90..90, so the axis reaches it
 * @throws RangeError on invalid input
 */
export function altAzView(series: NightChartSeries, frame: Frame, options: { halfSpanDeg?: number; landmarkBaseDeg?: number } = {}): AltAzView {
  assertFiniteInRange(frame?.azimuthDeg, 'frame.azimuthDeg', 0, 360);
  assertFiniteInRange(frame.halfWidthDeg, 'frame.halfWidthDeg', 0, 180);
  const halfSpanDeg = assertFiniteInRange(
    options.halfSpanDeg ?? Math.max(DEFAULT_ALT_AZ_HALF_SPAN_DEG, 3 * frame.halfWidthDeg),
    'halfSpanDeg',
    Math.min(frame.halfWidthDeg, 180),
    180,
  );
  const baseDeg = assertFiniteInRange(options.landmarkBaseDeg ?? frame.bottomAltDeg, 'landmarkBaseDeg', -90, 90);
  const { timesMs, targetAzDeg, targetAltDeg } = series;
  const offsets = targetAzDeg.map((az) => angleDifferenceDeg(az, frame.azimuthDeg));
  const inside = offsets.map((o) => Math.abs(o) <= halfSpanDeg);

  const track: AltAzPoint[][] = [];
  let piece: AltAzPoint[] | null = null;
  let maxAltInView = -Infinity;
  for (let i = 0; i < timesMs.length; i++) {
    const near = inside[i] || inside[i - 1] === true || inside[i + 1] === true;
    // A jump of more than half a turn between samples is the track passing behind the observer.
    const wraps = piece !== null && i > 0 && Math.abs(offsets[i]! - offsets[i - 1]!) > 180;
    if (!near || wraps) {
      if (piece && piece.length > 1) track.push(piece);
      piece = null;
      if (!near) continue;
    }
    piece ??= [];
    piece.push({ offsetDeg: offsets[i]!, altDeg: targetAltDeg[i]!, atMs: timesMs[i]! });
    if (inside[i]) maxAltInView = Math.max(maxAltInView, targetAltDeg[i]!);
  }
  if (piece && piece.length > 1) track.push(piece);

  const hourMarks: AltAzView['hourMarks'] = [];
  for (const tick of series.hourTicks) {
    const alt = interpolate(timesMs, targetAltDeg, tick.atMs);
    // Interpolating offsets (continuous near the centre) rather than azimuths (which wrap at 360).
    const offset = interpolate(timesMs, offsets, tick.atMs);
    if (Math.abs(offset) <= halfSpanDeg) hourMarks.push({ offsetDeg: offset, altDeg: alt, atMs: tick.atMs, label: tick.label });
  }

  const bottom = Math.max(-90, Math.floor(Math.min(baseDeg, frame.bottomAltDeg, 0) - 2));
  const highest = Math.max(frame.topAltDeg + 5, Number.isFinite(maxAltInView) ? maxAltInView + 3 : -Infinity);
  const top = Math.min(90, Math.ceil(highest));
  return { centreAzDeg: frame.azimuthDeg, halfSpanDeg, altDomainDeg: [bottom, Math.max(top, bottom + 1)], track, hourMarks };
}

/**
 * A schematic outline of the landmark for drawing: its width, base and top are known, not its
 * shape, so it is drawn as a stack with sloping shoulders. Points are [offsetDeg, altDeg] (azimuth
 * offset from the landmark's centre, elevation angle), base first, clockwise in drawing.
 * @param angularWidthDeg - landmark's angular width, degrees 0..180 (a minimum of 0.2 deg is drawn)
 * @param baseDeg - elevation angle of its base, degrees -90..90
 * @param topDeg - elevation angle of its top, degrees -90..90, at least baseDeg
 * @throws RangeError on invalid input
 */
export function landmarkSilhouette(angularWidthDeg: number, baseDeg: number, topDeg: number): Array<[number, number]> {
  assertFiniteInRange(angularWidthDeg, 'angularWidthDeg', 0, 180);
  assertFiniteInRange(baseDeg, 'baseDeg', -90, 90);
  assertFiniteInRange(topDeg, 'topDeg', baseDeg, 90);
  const w = Math.max(angularWidthDeg, 0.2) / 2;
  const h = topDeg - baseDeg;
  return [
    [-w, baseDeg],
    [-w * 0.9, baseDeg + h * 0.7],
    [-w * 0.55, baseDeg + h * 0.93],
    [-w * 0.15, topDeg],
    [w * 0.35, baseDeg + h * 0.97],
    [w * 0.75, baseDeg + h * 0.8],
    [w, baseDeg],
  ];
}
