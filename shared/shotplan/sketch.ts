/**
 * Layouts for the shot plan's drawings, shared by the client's SVG and the shot card's HTML and
 * PDF: the night's timeline as a horizontal bar (events as ticks, blocks as boxes, late blocks
 * flagged) and the azimuth/altitude box a sky sketch shows. Pure arithmetic on numbers.
 */
import { assertFiniteInRange } from '../guards';
import { unwrapAzimuthDeg } from './outline';

/** An event to place on the bar. */
export interface BarEventInput {
  kind: string;
  label: string;
  atMs: number;
}

/** A block to place on the bar. */
export interface BarBlockInput {
  kind: string;
  label: string;
  startMs: number;
  endMs: number;
  /** True when the block runs past one of its deadlines. */
  late: boolean;
}

/** The bar's geometry; x in the drawing's units from 0 to `width`. */
export interface TimelineBarLayout {
  startMs: number;
  endMs: number;
  width: number;
  /**
   * Each event's x, and its label's lane (0 .. lanes - 1) and left edge: labels centred on their
   * ticks (kept inside 0..width) go to the first lane where they do not overlap a label already
   * placed, left to right; lane 0 when no widths were given; -1 for a label left out (dropOverflow).
   */
  events: Array<BarEventInput & { x: number; lane: number; labelX: number }>;
  blocks: Array<BarBlockInput & { x: number; w: number }>;
}

/** Time shown before the first and after the last item, as a fraction of the span (5 %). */
const BAR_PAD_FRACTION = 0.05;
/** Narrowest drawn block, in drawing units, so a short block stays visible. */
const MIN_BLOCK_WIDTH = 2;

/** Options of {@link timelineBarLayout}. */
export interface BarLabelOptions {
  /** Width of each event's label in drawing units, same order as the events (finite, >= 0). */
  labelWidths?: readonly number[];
  /** Lanes labels may use, 1..8 (default 4). */
  lanes?: number;
  /** Space kept between labels in one lane, drawing units (default 4). */
  labelGap?: number;
  /**
   * What to do with a label that finds no free lane: put it in the lane that frees up first
   * (false, the default; it may overlap) or leave it out (true: its lane is -1).
   */
  dropOverflow?: boolean;
}

/**
 * Places the night's events and shooting blocks on a horizontal bar: the span runs from the
 * earliest to the latest instant of them all, padded by 5 % each side, mapped linearly onto
 * 0..width; event labels are spread over lanes so they do not overlap.
 * @param events - events (finite Unix ms), at most 1000
 * @param blocks - blocks (finite Unix ms, end not before start), at most 1000
 * @param width - drawing width, above 0 and at most 100 000
 * @param options - label widths, number of lanes (1..8), the gap between labels, and whether a
 *   label with no free lane is left out
 * @returns the span, each item's x (and width for blocks, at least 2 units), each label's lane
 * @throws RangeError on invalid input or when there is nothing to place
 */
export function timelineBarLayout(events: readonly BarEventInput[], blocks: readonly BarBlockInput[], width: number, options: BarLabelOptions = {}): TimelineBarLayout {
  if (!Array.isArray(events) || !Array.isArray(blocks)) throw new RangeError('events and blocks must be arrays');
  if (events.length > 1000 || blocks.length > 1000) throw new RangeError('at most 1000 events and 1000 blocks');
  const w = assertFiniteInRange(width, 'width', 0, 100_000);
  if (!(w > 0)) throw new RangeError(`width must be above 0 (got ${w})`);
  const instants: number[] = [];
  events.forEach((e, i) => instants.push(assertFiniteInRange(e?.atMs, `events[${i}].atMs`)));
  blocks.forEach((b, i) => {
    const s = assertFiniteInRange(b?.startMs, `blocks[${i}].startMs`);
    const e = assertFiniteInRange(b.endMs, `blocks[${i}].endMs`);
    if (e < s) throw new RangeError(`blocks[${i}] ends before it starts`);
    instants.push(s, e);
  });
  if (instants.length === 0) throw new RangeError('nothing to place on the bar');
  const first = Math.min(...instants);
  const last = Math.max(...instants);
  const span = Math.max(last - first, 60_000);
  const startMs = first - span * BAR_PAD_FRACTION;
  const endMs = first + span * (1 + BAR_PAD_FRACTION);
  const x = (ms: number) => ((ms - startMs) / (endMs - startMs)) * w;
  const lanes = options.lanes ?? 4;
  if (!Number.isInteger(lanes) || lanes < 1 || lanes > 8) throw new RangeError(`options.lanes must be an integer between 1 and 8 (got ${String(lanes)})`);
  const gap = assertFiniteInRange(options.labelGap ?? 4, 'options.labelGap', 0, w);
  const widths = options.labelWidths;
  if (widths !== undefined && (!Array.isArray(widths) || widths.length !== events.length)) throw new RangeError('options.labelWidths must give one width per event');
  const placed = events.map((e, i) => {
    const lw = widths ? assertFiniteInRange(widths[i], `options.labelWidths[${i}]`, 0, w) : 0;
    const ex = x(e.atMs);
    return { ...e, x: ex, lane: 0, labelX: Math.min(Math.max(0, ex - lw / 2), w - lw), labelW: lw };
  });
  if (widths) {
    // Greedy interval colouring, left to right: the first lane whose last label ends before this one.
    const laneEnds: number[] = Array.from({ length: lanes }, () => -Infinity);
    const order = placed.map((_, i) => i).sort((a, b) => (placed[a]!.labelX - placed[b]!.labelX) || a - b);
    for (const i of order) {
      const p = placed[i]!;
      let lane = laneEnds.findIndex((end) => end + gap <= p.labelX);
      if (lane < 0 && options.dropOverflow) { p.lane = -1; continue; }
      if (lane < 0) lane = laneEnds.indexOf(Math.min(...laneEnds));
      p.lane = lane;
      laneEnds[lane] = p.labelX + p.labelW;
    }
  }
  return {
    startMs,
    endMs,
    width: w,
    events: placed.map(({ labelW: _labelW, ...rest }) => rest),
    blocks: blocks.map((b) => {
      const x0 = x(b.startMs);
      const w0 = Math.max(MIN_BLOCK_WIDTH, x(b.endMs) - x0);
      return { ...b, x: Math.min(x0, w - w0), w: w0 };
    }),
  };
}

/** The box of sky a sketch shows; azimuths continuous (they may run below 0 or past 360). */
export interface AzAltBox {
  /** Left and right edges, degrees, `fromAzDeg < toAzDeg`. */
  fromAzDeg: number;
  toAzDeg: number;
  bottomAltDeg: number;
  topAltDeg: number;
  /** The azimuth every direction was unwrapped around, degrees [0, 360). */
  centreAzDeg: number;
}

/**
 * The azimuth/altitude box holding a set of directions with a margin: azimuths are unwrapped
 * around `centreAzDeg` (so a set across north stays in one piece), and the box is widened to
 * at least `minSpanDeg` each way about its middle.
 * @param directions - 1..100 000 directions (azimuth and altitude in degrees, finite)
 * @param centreAzDeg - the azimuth to unwrap around, degrees 0..360 (e.g. the landmark's bearing)
 * @param marginDeg - margin each side, degrees 0..90 (default 5)
 * @param minSpanDeg - smallest width and height, degrees 1..360 (default 20)
 * @returns the box; altitudes clamped to -90..90
 * @throws RangeError on invalid input
 */
export function azAltBox(directions: ReadonlyArray<{ azimuthDeg: number; altitudeDeg: number }>, centreAzDeg: number, marginDeg = 5, minSpanDeg = 20): AzAltBox {
  if (!Array.isArray(directions) || directions.length === 0) throw new RangeError('directions must be a non-empty array');
  if (directions.length > 100_000) throw new RangeError('directions may hold at most 100000 entries');
  const c = assertFiniteInRange(centreAzDeg, 'centreAzDeg', 0, 360);
  const m = assertFiniteInRange(marginDeg, 'marginDeg', 0, 90);
  const minSpan = assertFiniteInRange(minSpanDeg, 'minSpanDeg', 1, 360);
  let lo = Infinity; let hi = -Infinity; let bottom = Infinity; let top = -Infinity;
  directions.forEach((d, i) => {
    const a = unwrapAzimuthDeg(assertFiniteInRange(d?.azimuthDeg, `directions[${i}].azimuthDeg`), c);
    const alt = assertFiniteInRange(d.altitudeDeg, `directions[${i}].altitudeDeg`, -90, 90);
    lo = Math.min(lo, a); hi = Math.max(hi, a);
    bottom = Math.min(bottom, alt); top = Math.max(top, alt);
  });
  lo -= m; hi += m; bottom -= m; top += m;
  if (hi - lo < minSpan) { const mid = (lo + hi) / 2; lo = mid - minSpan / 2; hi = mid + minSpan / 2; }
  if (top - bottom < minSpan) { const mid = (bottom + top) / 2; bottom = mid - minSpan / 2; top = mid + minSpan / 2; }
  return { fromAzDeg: lo, toAzDeg: hi, bottomAltDeg: Math.max(-90, bottom), topAltDeg: Math.min(90, top), centreAzDeg: c % 360 };
}
