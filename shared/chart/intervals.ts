/**
 * Where a sampled quantity lies within limits, as time intervals: the quantity is taken as a
 * straight line between consecutive samples.
 */

/** A time interval, Unix milliseconds, start <= end. */
export interface MsInterval {
  startMs: number;
  endMs: number;
}

/**
 * Checks that sample times are finite and strictly increasing, and that `values` has one finite
 * value per time.
 * @throws RangeError otherwise
 */
export function assertSampled(timesMs: readonly number[], values: readonly number[], name = 'values'): void {
  if (!Array.isArray(timesMs) || !Array.isArray(values)) throw new RangeError('timesMs and values must be arrays');
  if (timesMs.length !== values.length) throw new RangeError(`${name} must have one value per time (${values.length} values, ${timesMs.length} times)`);
  for (let i = 0; i < timesMs.length; i++) {
    const t = timesMs[i]!;
    if (!Number.isFinite(t)) throw new RangeError(`timesMs[${i}] must be finite (got ${t})`);
    if (i > 0 && !(t > timesMs[i - 1]!)) throw new RangeError(`timesMs must be strictly increasing (index ${i})`);
    if (!Number.isFinite(values[i]!)) throw new RangeError(`${name}[${i}] must be finite (got ${values[i]})`);
  }
}

/**
 * When a sampled quantity lies strictly between two limits, taking it as a straight line between
 * consecutive samples. A quantity that passes right through the band between two samples (both
 * samples outside, on either side) still gives the interval where the line is inside it, so a
 * narrow band is not missed by a coarse step.
 * @param timesMs - sample times, Unix ms, finite, strictly increasing
 * @param values - one finite value per time (any unit)
 * @param low - lower limit, finite (same unit)
 * @param high - upper limit, finite, above `low`
 * @returns sorted, disjoint intervals (neighbours that touch are merged); empty when never inside
 * @throws RangeError on invalid input
 */
export function bandRuns(timesMs: readonly number[], values: readonly number[], low: number, high: number): MsInterval[] {
  assertSampled(timesMs, values);
  if (!Number.isFinite(low) || !Number.isFinite(high) || !(high > low)) {
    throw new RangeError(`low and high must be finite with high above low (got ${low}, ${high})`);
  }
  const out: MsInterval[] = [];
  const add = (a: number, b: number): void => {
    const last = out[out.length - 1];
    if (last && a <= last.endMs) last.endMs = Math.max(last.endMs, b);
    else out.push({ startMs: a, endMs: b });
  };
  if (timesMs.length === 1) {
    const v = values[0]!;
    if (v > low && v < high) add(timesMs[0]!, timesMs[0]!);
    return out;
  }
  for (let i = 1; i < timesMs.length; i++) {
    const t0 = timesMs[i - 1]!;
    const t1 = timesMs[i]!;
    const v0 = values[i - 1]!;
    const v1 = values[i]!;
    if (v0 === v1) {
      if (v0 > low && v0 < high) add(t0, t1);
      continue;
    }
    // Fractions of the step where the line meets each limit, ordered along the step.
    const fLow = (low - v0) / (v1 - v0);
    const fHigh = (high - v0) / (v1 - v0);
    const f0 = Math.max(0, Math.min(fLow, fHigh));
    const f1 = Math.min(1, Math.max(fLow, fHigh));
    if (f1 > f0) add(t0 + (t1 - t0) * f0, t0 + (t1 - t0) * f1);
  }
  return out;
}

/**
 * The intersection of two sorted lists of disjoint intervals.
 * @param a - sorted, disjoint intervals
 * @param b - sorted, disjoint intervals
 * @returns sorted, disjoint intervals of positive length in both
 */
export function intersectRuns(a: readonly MsInterval[], b: readonly MsInterval[]): MsInterval[] {
  const out: MsInterval[] = [];
  let i = 0;
  let j = 0;
  while (i < a.length && j < b.length) {
    const x = a[i]!;
    const y = b[j]!;
    const start = Math.max(x.startMs, y.startMs);
    const end = Math.min(x.endMs, y.endMs);
    if (end > start) out.push({ startMs: start, endMs: end });
    if (x.endMs < y.endMs) i++;
    else j++;
  }
  return out;
}
