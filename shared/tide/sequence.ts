/**
 * Plausibility checks on a sequence of high and low waters read from a tide table: repeated
 * times, two highs or two lows in a row, events too close together or too far apart, a high lower
 * than its neighbouring low.
 */
import { MS_PER_MINUTE } from '../units';
import type { TideEvent } from './schemas';

/**
 * Typical time from a high water to the next low water (or low to high) where the tide is
 * semidiurnal: 6 h 12 min, half a lunar semidiurnal period of about 12 h 25 min ('common practice').
 * Used only in messages.
 */
export const SEMIDIURNAL_HALF_PERIOD_MIN = 372;

/**
 * Consecutive events closer than this are flagged, minutes ('common practice': far below the
 * usual 6 h 12 min; short intervals occur, e.g. double high waters, so it is only a warning).
 */
export const MIN_TIDE_EVENT_SPACING_MIN = 120;

/**
 * Consecutive events further apart than this are flagged as a possible missing line, minutes
 * ('common practice': above the about 12 h 25 min from high to low of a diurnal tide).
 */
export const MAX_TIDE_EVENT_GAP_MIN = 14 * 60;

/** A tide event with the line it was read from and its instant in ms since the Unix epoch (UTC). */
export interface LinedTideEvent {
  line: number;
  text: string;
  utcMs: number;
  event: TideEvent;
}

/** A message on a line, as in the parser's result. */
export interface SequenceIssue {
  line: number;
  text: string;
  message: string;
}

/** What {@link checkTideSequence} found. */
export interface TideSequenceCheck {
  /** The events kept (repeats dropped), sorted by time, then by line. */
  kept: LinedTideEvent[];
  /** Repeated instants, on the later line. */
  errors: SequenceIssue[];
  /** Doubtful neighbours, on the later event's line. */
  warnings: SequenceIssue[];
}

/** Formats a duration in minutes as e.g. '6 h 12 min' or '45 min'. */
export function formatDurationMin(minutes: number): string {
  const total = Math.round(minutes);
  const h = Math.floor(total / 60);
  const m = total % 60;
  return h === 0 ? `${m} min` : `${h} h ${String(m).padStart(2, '0')} min`;
}

/**
 * Sorts the events by time and checks them as a sequence.
 *
 * - Two events at the same instant (whatever their kind): error on the later line, which is
 *   dropped from `kept`.
 * - Two highs or two lows in a row: warning (tides alternate).
 * - Neighbours less than {@link MIN_TIDE_EVENT_SPACING_MIN} apart, or more than
 *   {@link MAX_TIDE_EVENT_GAP_MIN} apart: warning.
 * - A high water not above the low water next to it (both heights given): warning.
 *
 * @param events the events read, any order; `utcMs` finite
 * @throws RangeError when an event's `utcMs` is not a finite number
 */
export function checkTideSequence(events: readonly LinedTideEvent[]): TideSequenceCheck {
  for (const e of events) {
    if (!Number.isFinite(e.utcMs)) throw new RangeError(`Event on line ${e.line} has no finite time`);
  }
  const sorted = [...events].sort((a, b) => a.utcMs - b.utcMs || a.line - b.line);
  const errors: SequenceIssue[] = [];
  const warnings: SequenceIssue[] = [];
  const kept: LinedTideEvent[] = [];

  for (const current of sorted) {
    const previous = kept[kept.length - 1];
    if (previous === undefined) {
      kept.push(current);
      continue;
    }
    const { line, text } = current;
    if (current.utcMs === previous.utcMs) {
      errors.push({ line, text, message: `Same time as line ${previous.line}: a repeated tide time` });
      continue;
    }
    kept.push(current);

    const gapMin = (current.utcMs - previous.utcMs) / MS_PER_MINUTE;
    const pair = `lines ${Math.min(previous.line, line)} and ${Math.max(previous.line, line)}`;
    if (current.event.kind === previous.event.kind) {
      const kinds = current.event.kind === 'high' ? 'high waters' : 'low waters';
      warnings.push({ line, text, message: `Two ${kinds} in a row (${pair}): tides alternate high and low; check for a missing or mislabelled line` });
    }
    if (gapMin < MIN_TIDE_EVENT_SPACING_MIN) {
      warnings.push({ line, text, message: `Only ${formatDurationMin(gapMin)} between ${pair}: high and low waters are usually about ${formatDurationMin(SEMIDIURNAL_HALF_PERIOD_MIN)} apart` });
    } else if (gapMin > MAX_TIDE_EVENT_GAP_MIN) {
      warnings.push({ line, text, message: `${formatDurationMin(gapMin)} between ${pair}: a high or low water may be missing` });
    }
    if (current.event.kind !== previous.event.kind) {
      const [high, low] = current.event.kind === 'high' ? [current.event, previous.event] : [previous.event, current.event];
      if (high.heightM !== undefined && low.heightM !== undefined && high.heightM <= low.heightM) {
        warnings.push({ line, text, message: `High water ${high.heightM} m is not above the low water ${low.heightM} m next to it (${pair}): check H and L` });
      }
    }
  }
  return { kept, errors, warnings };
}
