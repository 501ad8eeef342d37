/**
 * Parsing tide times pasted from an official tide table for the nearest port: one high or low
 * water per line, local times in the site's zone, converted to UTC tide events. Errors and warnings
 * are reported per line; whether a parse with errors is used at all is the caller's choice (see
 * {@link isCleanTideParse}).
 */
import { DateTime } from 'luxon';
import { MAX_TIDE_HEIGHT_M, MIN_TIDE_HEIGHT_M, type TideEvent, type TideKind } from './schemas';
import { assertTimeZone, isCalendarDate } from '../sky/timezone';
import { resolveLocalTime } from './localTime';
import { checkTideSequence, type LinedTideEvent } from './sequence';

/** Most lines a pasted text may have (about three years of semidiurnal tides). */
export const MAX_TIDE_TEXT_LINES = 5000;
/** Most characters a pasted text may have. */
export const MAX_TIDE_TEXT_CHARS = 500_000;

/** A problem on one line of the pasted text. */
export interface TideLineIssue {
  /** Line number in the pasted text, 1-based. */
  line: number;
  /** The line as pasted (without its line break). */
  text: string;
  /** What is wrong, in words for the user. */
  message: string;
}

/** What {@link parseTideTimes} found. */
export interface TideParseResult {
  /** The events read from lines without errors, sorted by time. */
  events: TideEvent[];
  /** Lines that could not be read, or that repeat another line's time; in line order. */
  errors: TideLineIssue[];
  /** Lines read with a doubt (ambiguous local time, odd sequence); in line order. */
  warnings: TideLineIssue[];
}

const ISO_DATE_RE = /^(\d{4})([-/])(\d{1,2})\2(\d{1,2})$/;
const DAY_FIRST_DATE_RE = /^\d{1,2}[./-]\d{1,2}[./-]\d{2,4}$/;
const TIME_RE = /^(\d{1,2}):(\d{2})(?::(\d{2}))?$/;
const TIME_WITH_ZONE_RE = /^\d{1,2}:\d{2}(?::\d{2})?(?:Z|[+-]\d{2}:?\d{2})$/i;
const ZONE_WORD_RE = /^(?:Z|UTC|UT|GMT|[+-]\d{2}:?\d{2})$/i;
const HIGH_RE = /^(?:H|HW|HIGH)$/i;
const LOW_RE = /^(?:L|LW|LOW)$/i;
const WATER_RE = /^WATER$/i;
const HEIGHT_DOT_RE = /^([+-]?(?:\d+(?:\.\d+)?|\.\d+))(m)?$/i;
const HEIGHT_DOT_OR_COMMA_RE = /^([+-]?(?:\d+(?:[.,]\d+)?|[.,]\d+))(m)?$/i;
const METRE_RE = /^m$/i;
const FEET_RE = /^(?:[+-]?[\d.,]+)?(?:ft|feet|')$/i;
const HEADER_WORD_RE = /\b(?:date|time)\b/i;

type LineOutcome =
  | { kind: 'event'; wall: { year: number; month: number; day: number; hour: number; minute: number; second: number }; tide: TideKind; heightM?: number }
  | { kind: 'error'; message: string };

/** Splits a content line into tokens: by `;`, tab or `,` when the line has one, then by spaces. */
function tokenize(content: string): { tokens: string[]; decimalComma: boolean } | { error: string } {
  const delimiter = content.includes(';') ? ';' : content.includes('\t') ? '\t' : content.includes(',') ? ',' : null;
  const fields = delimiter === null ? [content] : content.split(delimiter);
  if (fields.every((f) => f.trim() === '')) return { error: 'The line has separators but no values' };
  while (fields.length > 1 && fields[fields.length - 1]!.trim() === '') fields.pop();
  const tokens: string[] = [];
  for (let i = 0; i < fields.length; i++) {
    const field = fields[i]!.trim().replace(/^"(.*)"$/, '$1').trim();
    if (field === '') return { error: `Field ${i + 1} is empty` };
    for (const word of field.split(/\s+/)) {
      // '2027-05-04T03:12' is a date and a time.
      const t = /^(\d{4}-\d{1,2}-\d{1,2})T(.+)$/.exec(word);
      if (t) tokens.push(t[1]!, t[2]!);
      else tokens.push(word);
    }
  }
  return { tokens, decimalComma: delimiter === ';' || delimiter === '\t' };
}

function parseContentLine(content: string): LineOutcome {
  const split = tokenize(content);
  if ('error' in split) return { kind: 'error', message: split.error };
  const { tokens, decimalComma } = split;

  const dateToken = tokens[0] ?? '';
  const date = ISO_DATE_RE.exec(dateToken);
  if (!date) {
    if (DAY_FIRST_DATE_RE.test(dateToken)) {
      return { kind: 'error', message: `Write the date year first, as YYYY-MM-DD (found '${dateToken}'): day/month order is ambiguous` };
    }
    return { kind: 'error', message: `Expected a date as YYYY-MM-DD at the start of the line (found '${dateToken}')` };
  }
  const year = Number(date[1]);
  const month = Number(date[3]);
  const day = Number(date[4]);
  if (!isCalendarDate(year, month, day)) {
    return { kind: 'error', message: `${dateToken} is not a calendar date` };
  }

  const timeToken = tokens[1];
  if (timeToken === undefined) return { kind: 'error', message: 'Expected a time as HH:MM after the date' };
  if (TIME_WITH_ZONE_RE.test(timeToken)) {
    return { kind: 'error', message: `Time '${timeToken}' names a zone or offset: give the local time of the site, without a zone` };
  }
  const time = TIME_RE.exec(timeToken);
  if (!time) return { kind: 'error', message: `Expected a time as HH:MM or HH:MM:SS after the date (found '${timeToken}')` };
  const hour = Number(time[1]);
  const minute = Number(time[2]);
  const second = time[3] === undefined ? 0 : Number(time[3]);
  if (hour > 23 || minute > 59 || second > 59) {
    return { kind: 'error', message: `${timeToken} is not a time of day (00:00 to 23:59:59)` };
  }

  let tide: TideKind | undefined;
  let heightM: number | undefined;
  const heightRe = decimalComma ? HEIGHT_DOT_OR_COMMA_RE : HEIGHT_DOT_RE;
  for (let i = 2; i < tokens.length; i++) {
    const token = tokens[i]!;
    const isHigh = HIGH_RE.test(token);
    if (isHigh || LOW_RE.test(token)) {
      if (tide !== undefined) return { kind: 'error', message: `Two tide kinds on one line ('${token}' after another H/L)` };
      tide = isHigh ? 'high' : 'low';
      if (tokens[i + 1] !== undefined && WATER_RE.test(tokens[i + 1]!)) i++;
      continue;
    }
    if (ZONE_WORD_RE.test(token)) {
      return { kind: 'error', message: `'${token}' names a zone or offset: give the local time of the site, without a zone` };
    }
    if (FEET_RE.test(token)) {
      return { kind: 'error', message: 'Heights in feet are not read: give heights in metres' };
    }
    const height = heightRe.exec(token);
    if (height) {
      if (heightM !== undefined) {
        const hint = decimalComma ? '' : '; with comma or space separators, write decimals with a point (4.1)';
        return { kind: 'error', message: `Two heights on one line ('${token}' after another height)${hint}` };
      }
      heightM = Number(height[1]!.replace(',', '.'));
      if (height[2] === undefined && tokens[i + 1] !== undefined && METRE_RE.test(tokens[i + 1]!)) i++;
      if (tokens[i + 1] !== undefined && FEET_RE.test(tokens[i + 1]!)) {
        return { kind: 'error', message: 'Heights in feet are not read: give heights in metres' };
      }
      if (heightM < MIN_TIDE_HEIGHT_M || heightM > MAX_TIDE_HEIGHT_M) {
        return { kind: 'error', message: `Height ${heightM} m is outside ${MIN_TIDE_HEIGHT_M} to ${MAX_TIDE_HEIGHT_M} m` };
      }
      continue;
    }
    return { kind: 'error', message: `Unexpected '${token}': a line is date, time, H or L, and an optional height in metres` };
  }
  if (tide === undefined) return { kind: 'error', message: 'Expected H or L (also HW/LW or High/Low) after the time' };
  return { kind: 'event', wall: { year, month, day, hour, minute, second }, tide, ...(heightM === undefined ? {} : { heightM }) };
}

function pad2(n: number): string {
  return String(n).padStart(2, '0');
}

/**
 * Reads tide times pasted from a tide table.
 *
 * Each line is one high or low water: a date `YYYY-MM-DD` (or `YYYY/MM/DD`), a local time `HH:MM`
 * or `HH:MM:SS`, the kind (`H`/`L`, `HW`/`LW`, `High`/`Low`, optionally followed by `water`; any
 * case) and an optional height in metres (`0.4`, `0.4m`, `0.4 m`). The kind and the height may
 * come in either order. Fields are separated by spaces, or by `;`, tab or `,` (CSV, fields may be
 * in double quotes); with `;` or tab a decimal comma is read too (`0,4`). An ISO `2027-05-04T03:12`
 * is read as date and time. The first line may be a CSV header (a line with no digits naming a
 * date or time column); blank lines, and text after `#`, are ignored. Times naming a zone (`Z`,
 * `UTC`, `GMT`, `+01:00`) and heights in feet are errors: every time is the site's local time.
 *
 * Local times are converted to UTC in `timeZone`. A time that does not exist there (clocks go
 * forward over it) is an error; a time that happens twice (clocks go back) is read as the earlier
 * instant, with a warning. Then the events, sorted by time, are checked as a sequence: a repeated
 * instant is an error (the later line is dropped); two highs or two lows in a row, events less than
 * 2 h apart, gaps over 14 h and a high lower than a neighbouring low are warnings.
 *
 * @param text the pasted text, at most {@link MAX_TIDE_TEXT_LINES} lines and
 *   {@link MAX_TIDE_TEXT_CHARS} characters; `\n`, `\r\n` or `\r` line breaks
 * @param timeZone the site's IANA zone, e.g. 'Europe/London'
 * @returns events sorted by time (UTC ISO strings), errors and warnings with 1-based line numbers
 * @throws RangeError when `text` is not a string or too long, or `timeZone` is not a known IANA zone
 */
export function parseTideTimes(text: string, timeZone: string): TideParseResult {
  if (typeof text !== 'string') throw new RangeError('Tide times text must be a string');
  if (text.length > MAX_TIDE_TEXT_CHARS) {
    throw new RangeError(`Tide times text must be at most ${MAX_TIDE_TEXT_CHARS} characters (got ${text.length})`);
  }
  assertTimeZone(timeZone);
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
  if (lines.length > MAX_TIDE_TEXT_LINES) {
    throw new RangeError(`Tide times text must have at most ${MAX_TIDE_TEXT_LINES} lines (got ${lines.length})`);
  }

  const errors: TideLineIssue[] = [];
  const warnings: TideLineIssue[] = [];
  const read: LinedTideEvent[] = [];
  let seenContent = false;

  lines.forEach((lineText, index) => {
    const line = index + 1;
    const hash = lineText.indexOf('#');
    const content = (hash >= 0 ? lineText.slice(0, hash) : lineText).trim();
    if (content === '') return;
    const first = !seenContent;
    seenContent = true;
    if (!/\d/.test(content) && HEADER_WORD_RE.test(content)) {
      if (!first) errors.push({ line, text: lineText, message: 'A header row is read only as the first line' });
      return;
    }

    const outcome = parseContentLine(content);
    if (outcome.kind === 'error') {
      errors.push({ line, text: lineText, message: outcome.message });
      return;
    }
    const { wall } = outcome;
    const localLabel = `${wall.year}-${pad2(wall.month)}-${pad2(wall.day)} ${pad2(wall.hour)}:${pad2(wall.minute)}`;
    const resolved = resolveLocalTime(wall, timeZone);
    let utcMs: number;
    if (resolved.kind === 'nonexistent') {
      errors.push({ line, text: lineText, message: `${localLabel} does not exist in ${timeZone}: the clocks go forward over it; check the table's time` });
      return;
    } else if (resolved.kind === 'ambiguous') {
      utcMs = resolved.earlierUtcMs;
      const offset = DateTime.fromMillis(utcMs, { zone: timeZone }).toFormat('ZZ');
      const utcLabel = DateTime.fromMillis(utcMs, { zone: 'UTC' }).toFormat('HH:mm');
      warnings.push({ line, text: lineText, message: `${localLabel} happens twice in ${timeZone} (the clocks go back): read as the earlier one, UTC${offset} (${utcLabel} UTC)` });
    } else {
      utcMs = resolved.utcMs;
    }
    read.push({
      line,
      text: lineText,
      utcMs,
      event: {
        at: new Date(utcMs).toISOString(),
        kind: outcome.tide,
        ...(outcome.heightM === undefined ? {} : { heightM: outcome.heightM }),
      },
    });
  });

  const sequence = checkTideSequence(read);
  errors.push(...sequence.errors);
  warnings.push(...sequence.warnings);
  errors.sort((a, b) => a.line - b.line);
  warnings.sort((a, b) => a.line - b.line);
  return { events: sequence.kept.map((e) => e.event), errors, warnings };
}

/**
 * Whether a parse found no errors, so the events are everything the text held (warnings allowed).
 * A text with no tide lines at all is clean with no events: check `events.length` too.
 */
export function isCleanTideParse(result: TideParseResult): boolean {
  return result.errors.length === 0;
}
