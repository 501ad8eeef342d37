/**
 * Closed time intervals in ms since the Unix epoch (UTC), for the tide windows: merging a list
 * into sorted disjoint pieces and subtracting one list from another.
 *
 * Own code: the handful of lines needed here does not justify a dependency, and the lineup
 * module's interval helpers work in days on flat arrays and have no difference operation.
 */

/** A closed interval [startMs, endMs], ms since the Unix epoch, startMs <= endMs. */
export interface MsInterval {
  startMs: number;
  endMs: number;
}

/**
 * Sorts intervals and merges overlapping or touching ones.
 * @param intervals any order; each with finite startMs <= endMs
 * @returns sorted disjoint intervals (a new array)
 */
export function mergeIntervals(intervals: readonly MsInterval[]): MsInterval[] {
  const sorted = [...intervals].sort((a, b) => a.startMs - b.startMs);
  const out: MsInterval[] = [];
  for (const iv of sorted) {
    const last = out[out.length - 1];
    if (last !== undefined && iv.startMs <= last.endMs) last.endMs = Math.max(last.endMs, iv.endMs);
    else out.push({ startMs: iv.startMs, endMs: iv.endMs });
  }
  return out;
}

/**
 * The parts of `from` not covered by `remove`. Pieces of no length are dropped; the boundary
 * instants shared with `remove` are kept on the pieces (closed intervals, a difference up to
 * instants).
 * @param from sorted disjoint intervals
 * @param remove sorted disjoint intervals
 * @returns sorted disjoint intervals (a new array)
 */
export function subtractIntervals(from: readonly MsInterval[], remove: readonly MsInterval[]): MsInterval[] {
  const out: MsInterval[] = [];
  let j = 0;
  for (const iv of from) {
    let cursor = iv.startMs;
    while (j < remove.length && remove[j]!.endMs <= cursor) j++;
    let k = j;
    while (k < remove.length && remove[k]!.startMs < iv.endMs) {
      const r = remove[k]!;
      if (r.startMs > cursor) out.push({ startMs: cursor, endMs: r.startMs });
      cursor = Math.max(cursor, r.endMs);
      k++;
    }
    if (cursor < iv.endMs) out.push({ startMs: cursor, endMs: iv.endMs });
  }
  return out;
}

/** Intersection length in ms of two closed intervals (0 when they only touch or are apart). */
export function overlapMs(a: MsInterval, b: MsInterval): number {
  return Math.max(0, Math.min(a.endMs, b.endMs) - Math.max(a.startMs, b.startMs));
}
