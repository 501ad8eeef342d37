/**
 * The night's timeline for a shot plan: the night's events (end of astronomical twilight, the
 * lineup's start, peak and end, moonrise, the tide cut-off, the start of dawn twilight) in time
 * order, the shooting blocks laid out one after another from a start time, and a warning for
 * every block that runs past a deadline it must meet. A computed timeline is a plan, not a
 * promise: the tide caution goes with any timeline that has a tide cut-off.
 */
import { assertFiniteInRange, assertIntegerInRange, assertValidDate } from '../guards';
import type { NightReport } from '../sky/night';
import { TIDE_CAUTION } from '../tide/caution';
import { formatDurationMin } from '../tide/sequence';
import { MS_PER_SECOND } from '../units';
import type { PanoramaGrid } from './panorama';

/** The night's events, in the order used for events at the same instant. */
export const NIGHT_EVENT_KINDS = [
  'astronomical-dusk',
  'lineup-start',
  'lineup-peak',
  'lineup-end',
  'moonrise',
  'tide-cut-off',
  'astronomical-dawn',
] as const;
export type NightEventKind = (typeof NIGHT_EVENT_KINDS)[number];

/** Plain names of the events, for lists and warnings. */
export const NIGHT_EVENT_LABELS: Readonly<Record<NightEventKind, string>> = {
  'astronomical-dusk': 'End of astronomical twilight',
  'lineup-start': 'Lineup starts',
  'lineup-peak': 'Lineup peak',
  'lineup-end': 'Lineup ends',
  moonrise: 'Moonrise',
  'tide-cut-off': 'Tide cut-off',
  'astronomical-dawn': 'Start of dawn twilight',
};

/** The night's instants; any may be missing (null or left out). */
export interface NightEvents {
  astronomicalDusk?: Date | null;
  lineupStart?: Date | null;
  lineupPeak?: Date | null;
  lineupEnd?: Date | null;
  /** The moonrise that ends the dark time (leave it out when the Moon stays down). */
  moonrise?: Date | null;
  /** When the tide cuts the spot off. */
  tideCutOff?: Date | null;
  astronomicalDawn?: Date | null;
}

const EVENT_FIELDS: Readonly<Record<NightEventKind, keyof NightEvents>> = {
  'astronomical-dusk': 'astronomicalDusk',
  'lineup-start': 'lineupStart',
  'lineup-peak': 'lineupPeak',
  'lineup-end': 'lineupEnd',
  moonrise: 'moonrise',
  'tide-cut-off': 'tideCutOff',
  'astronomical-dawn': 'astronomicalDawn',
};

/** One event on the timeline. */
export interface TimelineEvent {
  kind: NightEventKind;
  label: string;
  at: Date;
}

/**
 * The night's events that are given, in time order (events at the same instant in the order of
 * {@link NIGHT_EVENT_KINDS}).
 * @param events - the instants, each a valid Date, or null / left out when missing
 * @returns the events, sorted
 * @throws RangeError when a given instant is not a valid Date, or the lineup's start, peak and end are out of order
 */
export function nightTimelineEvents(events: NightEvents): TimelineEvent[] {
  const e = events ?? {};
  const out: TimelineEvent[] = [];
  for (const kind of NIGHT_EVENT_KINDS) {
    const field = EVENT_FIELDS[kind];
    const value = e[field];
    if (value === undefined || value === null) continue;
    out.push({ kind, label: NIGHT_EVENT_LABELS[kind], at: assertValidDate(value, `events.${field}`) });
  }
  const ms = (d: Date | null | undefined) => (d instanceof Date ? d.getTime() : null);
  const s = ms(e.lineupStart); const p = ms(e.lineupPeak); const en = ms(e.lineupEnd);
  if ((s !== null && p !== null && p < s) || (p !== null && en !== null && en < p) || (s !== null && en !== null && en < s)) {
    throw new RangeError('events.lineupStart, lineupPeak and lineupEnd must be in time order');
  }
  const order = (k: NightEventKind) => NIGHT_EVENT_KINDS.indexOf(k);
  return out.sort((a, b) => a.at.getTime() - b.at.getTime() || order(a.kind) - order(b.kind));
}

/**
 * The events of a night report with a lineup and the tide cut-off. The moonrise taken is the
 * first one at or after the end of astronomical twilight (or the report's first moonrise when the
 * night has no astronomical darkness).
 * @param report - the night at the site (shared/sky nightReport)
 * @param lineup - the lineup's start, peak and end, if one is planned
 * @param tideCutOffAt - when the tide cuts the spot off (lineupTideStatus's cutOffAt), if it does
 * @returns the instants for {@link nightTimelineEvents} and {@link planNight}
 * @throws RangeError when the report is missing or a given instant is not a valid Date
 */
export function nightEventsFromReport(
  report: NightReport,
  lineup?: { start: Date; peak: Date; end: Date } | null,
  tideCutOffAt?: Date | null,
): NightEvents {
  if (typeof report !== 'object' || report === null) throw new RangeError('report must be a night report');
  const dusk = report.astronomicalDusk?.utc ?? null;
  let moonrise = report.moonrise?.utc ?? null;
  if (dusk !== null) {
    const rise = (report.moonEvents ?? []).find((m) => m.kind === 'rise' && m.at.utc.getTime() >= dusk.getTime());
    moonrise = rise ? rise.at.utc : null;
  }
  return {
    astronomicalDusk: dusk,
    lineupStart: lineup ? assertValidDate(lineup.start, 'lineup.start') : null,
    lineupPeak: lineup ? assertValidDate(lineup.peak, 'lineup.peak') : null,
    lineupEnd: lineup ? assertValidDate(lineup.end, 'lineup.end') : null,
    moonrise,
    tideCutOff: tideCutOffAt === undefined || tideCutOffAt === null ? null : assertValidDate(tideCutOffAt, 'tideCutOffAt'),
    astronomicalDawn: report.astronomicalDawn?.utc ?? null,
  };
}

/** What is shot in a block. */
export const SHOOTING_BLOCK_KINDS = ['sky-stack', 'panorama-row', 'foreground'] as const;
export type ShootingBlockKind = (typeof SHOOTING_BLOCK_KINDS)[number];

/** Events a block must end by. */
export type DeadlineKind = 'lineup-end' | 'moonrise' | 'tide-cut-off' | 'astronomical-dawn';

/** How warnings name each deadline ("... ends 5 min after moonrise"). */
export const DEADLINE_PHRASES: Readonly<Record<DeadlineKind, string>> = {
  'lineup-end': 'the end of the lineup',
  moonrise: 'moonrise',
  'tide-cut-off': 'the tide cut-off',
  'astronomical-dawn': 'the start of dawn twilight',
};

/**
 * The deadlines each kind of block must meet: sky frames need the lineup, no Moon and no dawn;
 * every block, the foreground included, must end before the tide cuts the spot off.
 */
export const BLOCK_DEADLINES: Readonly<Record<ShootingBlockKind, readonly DeadlineKind[]>> = {
  'sky-stack': ['lineup-end', 'moonrise', 'tide-cut-off', 'astronomical-dawn'],
  'panorama-row': ['lineup-end', 'moonrise', 'tide-cut-off', 'astronomical-dawn'],
  foreground: ['tide-cut-off'],
};

/** Most blocks on one timeline. */
export const MAX_BLOCKS = 500;
/** Longest block or gap, seconds (12 h). */
export const MAX_BLOCK_S = 43_200;
/** Gap between blocks when none is given, seconds (a minute to recompose: our default). */
export const DEFAULT_BLOCK_GAP_S = 60;

/** A block of shooting. */
export interface ShootingBlock {
  kind: ShootingBlockKind;
  label: string;
  /** How long it takes, seconds, above 0 and at most 43 200. */
  durationS: number;
  /** Pause before it, seconds 0..43 200 (default: the timeline's gap; none before the first block). */
  gapBeforeS?: number;
}

/** A block placed on the timeline. */
export interface PlacedBlock {
  index: number;
  kind: ShootingBlockKind;
  label: string;
  durationS: number;
  start: Date;
  end: Date;
}

/** A block that runs past a deadline. */
export interface DeadlineWarning {
  blockIndex: number;
  blockLabel: string;
  deadline: DeadlineKind;
  deadlineLabel: string;
  deadlineAt: Date;
  /** How far the block's end lies past the deadline, seconds (above 0). */
  overrunS: number;
  /** Whether the block even starts at or after the deadline. */
  startsAfter: boolean;
  /** One sentence naming the block and the deadline, e.g. "Sky stack ends 12 min after moonrise." or "... starts after the tide cut-off." */
  message: string;
}

/** A night's timeline; see {@link planNight}. */
export interface NightTimeline {
  events: TimelineEvent[];
  blocks: PlacedBlock[];
  warnings: DeadlineWarning[];
  /** When the last block ends (the start with no blocks). */
  endsAt: Date;
  /** Cautions to show with the timeline (the tide caution when there is a tide cut-off). */
  cautions: string[];
}

function checkBlock(block: unknown, i: number): ShootingBlock {
  if (typeof block !== 'object' || block === null) throw new RangeError(`blocks[${i}] must be an object`);
  const b = block as Partial<ShootingBlock>;
  if (!SHOOTING_BLOCK_KINDS.includes(b.kind as ShootingBlockKind)) {
    throw new RangeError(`blocks[${i}].kind must be one of ${SHOOTING_BLOCK_KINDS.join(', ')} (got ${String(b.kind)})`);
  }
  if (typeof b.label !== 'string' || b.label.trim() === '') throw new RangeError(`blocks[${i}].label must be a non-empty string`);
  const durationS = assertFiniteInRange(b.durationS, `blocks[${i}].durationS`, 0, MAX_BLOCK_S);
  if (!(durationS > 0)) throw new RangeError(`blocks[${i}].durationS must be above 0 (got ${durationS})`);
  const out: ShootingBlock = { kind: b.kind as ShootingBlockKind, label: b.label.trim(), durationS };
  if (b.gapBeforeS !== undefined) out.gapBeforeS = assertFiniteInRange(b.gapBeforeS, `blocks[${i}].gapBeforeS`, 0, MAX_BLOCK_S);
  return out;
}

function warningMessage(label: string, deadline: DeadlineKind, overrunS: number, startsAfter: boolean): string {
  const what = DEADLINE_PHRASES[deadline];
  if (startsAfter) return `${label} starts after ${what}.`;
  return `${label} ends ${formatDurationMin(Math.ceil(overrunS / 60))} after ${what}.`;
}

/**
 * Lays the shooting blocks out in order from a start time, with a gap before each block after the
 * first, puts them beside the night's events, and warns for each block that ends after one of its
 * deadlines ({@link BLOCK_DEADLINES}): lineup end, moonrise, tide cut-off, astronomical dawn.
 * @param events - the night's instants (any may be missing: no warning for a missing deadline)
 * @param blocks - 0..500 blocks in shooting order (kind, non-empty label, duration above 0 and
 *   at most 43 200 s, optional gap before it 0..43 200 s)
 * @param start - when the first block starts
 * @param options - `gapS`: gap before each block that gives none, seconds 0..43 200 (default 60)
 * @returns the sorted events, the placed blocks, the warnings (block order, then deadline
 *   order) and cautions
 * @throws RangeError on invalid input
 */
export function planNight(events: NightEvents, blocks: readonly ShootingBlock[], start: Date, options: { gapS?: number } = {}): NightTimeline {
  const timelineEvents = nightTimelineEvents(events);
  if (!Array.isArray(blocks)) throw new RangeError('blocks must be an array');
  if (blocks.length > MAX_BLOCKS) throw new RangeError(`blocks may hold at most ${MAX_BLOCKS} entries (got ${blocks.length})`);
  const checked = blocks.map((b, i) => checkBlock(b, i));
  const startMs = assertValidDate(start, 'start').getTime();
  const gapS = assertFiniteInRange(options?.gapS ?? DEFAULT_BLOCK_GAP_S, 'options.gapS', 0, MAX_BLOCK_S);
  const deadlineAt = new Map<DeadlineKind, Date>();
  for (const e of timelineEvents) {
    if (e.kind === 'lineup-end' || e.kind === 'moonrise' || e.kind === 'tide-cut-off' || e.kind === 'astronomical-dawn') deadlineAt.set(e.kind, e.at);
  }

  const placed: PlacedBlock[] = [];
  const warnings: DeadlineWarning[] = [];
  let cursor = startMs;
  checked.forEach((b, index) => {
    const gap = b.gapBeforeS ?? (index === 0 ? 0 : gapS);
    const s = cursor + gap * MS_PER_SECOND;
    const e = s + b.durationS * MS_PER_SECOND;
    cursor = e;
    placed.push({ index, kind: b.kind, label: b.label, durationS: b.durationS, start: new Date(s), end: new Date(e) });
    for (const deadline of BLOCK_DEADLINES[b.kind]) {
      const at = deadlineAt.get(deadline);
      if (!at || e <= at.getTime()) continue;
      const overrunS = (e - at.getTime()) / MS_PER_SECOND;
      const startsAfter = s >= at.getTime();
      const deadlineLabel = NIGHT_EVENT_LABELS[deadline];
      warnings.push({
        blockIndex: index,
        blockLabel: b.label,
        deadline,
        deadlineLabel,
        deadlineAt: at,
        overrunS,
        startsAfter,
        message: warningMessage(b.label, deadline, overrunS, startsAfter),
      });
    }
  });
  return {
    events: timelineEvents,
    blocks: placed,
    warnings,
    endsAt: new Date(cursor),
    cautions: deadlineAt.has('tide-cut-off') ? [TIDE_CAUTION] : [],
  };
}

/**
 * A block of equal frames: frames x exposure + (frames - 1) x gap between frames.
 * @param kind - 'sky-stack', 'panorama-row' or 'foreground'
 * @param label - a non-empty label, e.g. 'Sky stack (tracked)'
 * @param frames - number of frames, integer 1..100 000
 * @param exposureS - one frame's exposure, seconds, above 0 and at most 43 200
 * @param frameGapS - time between frames (read-out, moving the head), seconds 0..3600 (default 0)
 * @returns the block (its duration at most 43 200 s)
 * @throws RangeError on invalid input or a block longer than 12 h
 */
export function framesBlock(kind: ShootingBlockKind, label: string, frames: number, exposureS: number, frameGapS = 0): ShootingBlock {
  assertIntegerInRange(frames, 'frames', 1, 100_000);
  const exposure = assertFiniteInRange(exposureS, 'exposureS', 0, MAX_BLOCK_S);
  if (!(exposure > 0)) throw new RangeError(`exposureS must be above 0 (got ${exposure})`);
  const gap = assertFiniteInRange(frameGapS, 'frameGapS', 0, 3600);
  return checkBlock({ kind, label, durationS: frames * exposure + (frames - 1) * gap }, 0);
}

/**
 * One 'panorama-row' block per row of a panorama grid, bottom row first.
 * @param grid - from panoramaGrid
 * @param exposureS - one frame's exposure, seconds, above 0 and at most 43 200
 * @param frameGapS - time between frames (turning the head), seconds 0..3600 (default 0)
 * @param labelPrefix - label before the row number (default 'Panorama row')
 * @returns the blocks, labelled e.g. 'Panorama row 1 (5 frames)'
 * @throws RangeError on invalid input
 */
export function panoramaRowBlocks(grid: PanoramaGrid, exposureS: number, frameGapS = 0, labelPrefix = 'Panorama row'): ShootingBlock[] {
  if (typeof grid !== 'object' || grid === null || !Array.isArray(grid.rows)) throw new RangeError('grid must be a panorama grid');
  return grid.rows.map((row, i) => {
    const frames = assertIntegerInRange(row.columns, `grid.rows[${i}].columns`, 1, 100_000);
    return framesBlock('panorama-row', `${labelPrefix} ${i + 1} (${frames} frame${frames === 1 ? '' : 's'})`, frames, exposureS, frameGapS);
  });
}
