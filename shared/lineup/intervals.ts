/**
 * Interval lists as flat arrays [start0, end0, start1, end1, ...], sorted and disjoint, in days.
 */

/** A sorted list of disjoint intervals, flat: [start0, end0, start1, end1, ...]. */
export type FlatIntervals = number[];

/**
 * Intersection of two sorted disjoint interval lists.
 * @returns A new sorted disjoint list (empty pieces dropped).
 */
export function intersectIntervals(a: FlatIntervals, b: FlatIntervals): FlatIntervals {
  const out: FlatIntervals = [];
  let i = 0;
  let j = 0;
  while (i < a.length && j < b.length) {
    const s = Math.max(a[i]!, b[j]!);
    const e = Math.min(a[i + 1]!, b[j + 1]!);
    if (e > s) out.push(s, e);
    if (a[i + 1]! < b[j + 1]!) i += 2;
    else j += 2;
  }
  return out;
}

/**
 * Union of two sorted disjoint interval lists; touching pieces are merged.
 * @returns A new sorted disjoint list.
 */
export function unionIntervals(a: FlatIntervals, b: FlatIntervals): FlatIntervals {
  const out: FlatIntervals = [];
  let i = 0;
  let j = 0;
  while (i < a.length || j < b.length) {
    let s: number;
    let e: number;
    if (j >= b.length || (i < a.length && a[i]! <= b[j]!)) {
      s = a[i]!;
      e = a[i + 1]!;
      i += 2;
    } else {
      s = b[j]!;
      e = b[j + 1]!;
      j += 2;
    }
    const n = out.length;
    if (n > 0 && s <= out[n - 1]!) out[n - 1] = Math.max(out[n - 1]!, e);
    else out.push(s, e);
  }
  return out;
}

/**
 * Appends [s, e] to a sorted list, merging with the last piece when the gap is at most `gap`.
 * @param list - Sorted disjoint list, modified in place.
 * @param s - Start, >= the list's last start.
 * @param e - End, >= s.
 * @param gap - Largest gap (days) bridged, >= 0.
 */
export function appendMerging(list: FlatIntervals, s: number, e: number, gap: number): void {
  const n = list.length;
  if (n > 0 && s - list[n - 1]! <= gap) {
    if (e > list[n - 1]!) list[n - 1] = e;
  } else {
    list.push(s, e);
  }
}
