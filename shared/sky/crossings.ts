/**
 * Finding when a smooth function of time (an altitude) crosses a threshold, robustly.
 *
 * Own code rather than astronomy-engine's SearchAltitude: on short dark nights SearchAltitude,
 * started just after a crossing, can return a false crossing about a second later (seen at
 * 52.1 N, 7.0 W on 2027-05-20 UT). Here the interval is sampled at a fixed step, every local
 * extremum between samples is refined with a golden-section search (so a graze that dips past the
 * threshold between two samples is not missed), each sign change is bisected, and every crossing
 * is checked again on exact values a moment before and after before it is returned.
 *
 * Not merged with the lineup engine's solvers (lineup/roots.ts), which do another job: they solve
 * one bracketed root or extremum at a time, in UT days, seeded with a guess and a slope from a
 * model of the engine's tabled functions, and stop early once a sign is certain. This module
 * knows nothing of the function: it scans it by sampling, for the night report and the charts,
 * and its results (10 ms bisection, 0.5 s extrema) are part of what those report.
 */
import { assertFiniteInRange } from '../guards';
import { MS_PER_MINUTE } from '../units';

/** One threshold crossing. */
export interface ThresholdCrossing {
  /** Instant of the crossing, milliseconds since 1970 (UTC). */
  timeMs: number;
  /** 'rising' when the function goes from below to above the threshold, else 'setting'. */
  direction: 'rising' | 'setting';
}

/** One local extremum of a sampled function. */
export interface Extremum {
  timeMs: number;
  value: number;
  kind: 'min' | 'max';
}

/** Options of {@link findThresholdCrossings}. */
export interface CrossingSearchOptions {
  /** Sampling step, ms (default 20 minutes). Must be short enough that the function has at most one extremum per two steps. */
  stepMs?: number;
  /** Bisection tolerance, ms (default 10 ms). */
  toleranceMs?: number;
  /** Offset of the validation samples before and after a crossing, ms (default 1000 ms). */
  validationMs?: number;
}

const GOLDEN = (Math.sqrt(5) - 1) / 2;

/**
 * Golden-section search for the extremum of a unimodal function on [a, b].
 * @returns the time (ms) and value at the extremum, to about `toleranceMs`
 */
function goldenExtremum(f: (ms: number) => number, a: number, b: number, kind: 'min' | 'max', toleranceMs: number): { timeMs: number; value: number } {
  const sign = kind === 'min' ? 1 : -1;
  let lo = a;
  let hi = b;
  let x1 = hi - GOLDEN * (hi - lo);
  let x2 = lo + GOLDEN * (hi - lo);
  let f1 = sign * f(x1);
  let f2 = sign * f(x2);
  while (hi - lo > toleranceMs) {
    if (f1 < f2) {
      hi = x2;
      x2 = x1;
      f2 = f1;
      x1 = hi - GOLDEN * (hi - lo);
      f1 = sign * f(x1);
    } else {
      lo = x1;
      x1 = x2;
      f1 = f2;
      x2 = lo + GOLDEN * (hi - lo);
      f2 = sign * f(x2);
    }
  }
  const t = (lo + hi) / 2;
  return { timeMs: t, value: f(t) };
}

/** Samples of a function, with every interior local extremum refined and inserted. */
export interface RefinedSamples {
  timesMs: number[];
  values: number[];
  extrema: Extremum[];
}

/**
 * Samples `f` on [startMs, endMs] every `stepMs` (end included) and refines each interior local
 * extremum with a golden-section search, inserting it among the samples.
 * @param f function of time (ms since 1970) to sample; must be finite
 * @param startMs start of the interval, ms
 * @param endMs end of the interval, ms (> startMs)
 * @param stepMs sampling step, ms (> 0)
 * @param refineToleranceMs golden-section tolerance, ms (default 500 ms)
 * @throws RangeError on invalid bounds or step, or when `f` returns a non-finite value
 */
export function sampleWithExtrema(f: (ms: number) => number, startMs: number, endMs: number, stepMs: number, refineToleranceMs = 500): RefinedSamples {
  assertFiniteInRange(startMs, 'startMs');
  assertFiniteInRange(endMs, 'endMs');
  assertFiniteInRange(stepMs, 'stepMs', 1);
  if (!(endMs > startMs)) throw new RangeError('endMs must be after startMs');
  const times: number[] = [];
  for (let t = startMs; t < endMs; t += stepMs) times.push(t);
  times.push(endMs);
  const values = times.map((t) => {
    const v = f(t);
    if (!Number.isFinite(v)) throw new RangeError(`function value at ${new Date(t).toISOString()} is not finite`);
    return v;
  });
  const extrema: Extremum[] = [];
  const outTimes: number[] = [times[0] as number];
  const outValues: number[] = [values[0] as number];
  for (let i = 1; i < times.length; i++) {
    const prev = values[i - 1] as number;
    const cur = values[i] as number;
    const next = values[i + 1];
    if (next !== undefined && ((cur <= prev && cur <= next) || (cur >= prev && cur >= next)) && !(cur === prev && cur === next)) {
      const kind = cur <= prev && cur <= next ? 'min' : 'max';
      const ext = goldenExtremum(f, times[i - 1] as number, times[i + 1] as number, kind, refineToleranceMs);
      extrema.push({ ...ext, kind });
      // Insert the refined extremum in time order next to sample i.
      if (ext.timeMs < (times[i] as number)) {
        outTimes.push(ext.timeMs, times[i] as number);
        outValues.push(ext.value, cur);
      } else if (ext.timeMs > (times[i] as number)) {
        outTimes.push(times[i] as number, ext.timeMs);
        outValues.push(cur, ext.value);
      } else {
        outTimes.push(times[i] as number);
        outValues.push(cur);
      }
    } else {
      outTimes.push(times[i] as number);
      outValues.push(cur);
    }
  }
  return { timesMs: outTimes, values: outValues, extrema };
}

/**
 * All crossings of `threshold` by `f` on [startMs, endMs], in time order.
 *
 * A value exactly equal to the threshold counts as above it. Each returned crossing has been
 * validated: f is below the threshold `validationMs` before a rising crossing and above it
 * `validationMs` after (and the reverse for setting); crossings that fail (a graze shorter than the
 * validation offset) are left out.
 * @param f function of time (ms since 1970); must be finite and continuous
 * @param startMs start of the interval, ms
 * @param endMs end of the interval, ms (> startMs)
 * @param threshold value to cross (same unit as f)
 * @param options sampling step, bisection tolerance and validation offset
 * @throws RangeError on invalid input
 */
export function findThresholdCrossings(
  f: (ms: number) => number,
  startMs: number,
  endMs: number,
  threshold: number,
  options: CrossingSearchOptions = {},
): ThresholdCrossing[] {
  const stepMs = assertFiniteInRange(options.stepMs ?? 20 * MS_PER_MINUTE, 'options.stepMs', 1);
  return crossingsFromSamples(f, sampleWithExtrema(f, startMs, endMs, stepMs), threshold, options);
}

/**
 * The crossings of `threshold` by `f`, located from samples already taken with
 * {@link sampleWithExtrema} (so one sampling serves several thresholds), bisected and validated as
 * in {@link findThresholdCrossings}.
 * @param f the sampled function of time (ms since 1970)
 * @param samples samples of `f` from {@link sampleWithExtrema}
 * @param threshold value to cross (same unit as f)
 * @param options bisection tolerance and validation offset (stepMs is not used)
 * @throws RangeError on invalid input
 */
export function crossingsFromSamples(
  f: (ms: number) => number,
  samples: RefinedSamples,
  threshold: number,
  options: CrossingSearchOptions = {},
): ThresholdCrossing[] {
  assertFiniteInRange(threshold, 'threshold');
  const toleranceMs = assertFiniteInRange(options.toleranceMs ?? 10, 'options.toleranceMs', 0.001);
  const validationMs = assertFiniteInRange(options.validationMs ?? 1000, 'options.validationMs', 0);
  if (samples.timesMs.length !== samples.values.length || samples.timesMs.length < 2) {
    throw new RangeError('samples must hold at least two times and as many values');
  }
  const g = (t: number): number => f(t) - threshold;
  const crossings: ThresholdCrossing[] = [];
  for (let i = 1; i < samples.timesMs.length; i++) {
    let a = samples.timesMs[i - 1] as number;
    let b = samples.timesMs[i] as number;
    const aboveA = (samples.values[i - 1] as number) - threshold >= 0;
    const aboveB = (samples.values[i] as number) - threshold >= 0;
    if (aboveA === aboveB) continue;
    while (b - a > toleranceMs) {
      const m = (a + b) / 2;
      if (g(m) >= 0 === aboveA) a = m;
      else b = m;
    }
    const t = (a + b) / 2;
    const direction = aboveB ? 'rising' : 'setting';
    const before = g(t - validationMs - toleranceMs);
    const after = g(t + validationMs + toleranceMs);
    const valid = direction === 'rising' ? before < 0 && after >= 0 : before >= 0 && after < 0;
    if (valid || validationMs === 0) crossings.push({ timeMs: t, direction });
  }
  return crossings;
}
