/**
 * Chebyshev series: fitting a smooth vector function on an interval at the Chebyshev nodes and
 * evaluating it with Clenshaw's recurrence. Own code: it is twenty lines, and no maintained npm
 * package offers fitted ephemeris tables over astronomy-engine.
 */
import { assertFiniteInRange, assertIntegerInRange } from '../guards';

/**
 * Fits `componentCount` functions on [a, b] with `coefficientCount` Chebyshev terms each.
 * @param sample - Writes the function values at time t into `out` (length >= componentCount).
 * @param a - Interval start (any unit, finite).
 * @param b - Interval end, > a.
 * @param coefficientCount - Terms per component, 2..64.
 * @param componentCount - Number of components, 1..8.
 * @returns Coefficients laid out component after component (`componentCount * coefficientCount`).
 * @throws RangeError on a bad interval or counts.
 */
export function fitChebyshev(
  sample: (t: number, out: Float64Array) => void,
  a: number,
  b: number,
  coefficientCount: number,
  componentCount: number,
): Float64Array {
  assertFiniteInRange(a, 'a');
  assertFiniteInRange(b, 'b');
  if (!(b > a)) throw new RangeError('Chebyshev interval must have b > a');
  assertIntegerInRange(coefficientCount, 'coefficientCount', 2, 64);
  assertIntegerInRange(componentCount, 'componentCount', 1, 8);
  const n = coefficientCount;
  const values = new Float64Array(n * componentCount);
  const scratch = new Float64Array(componentCount);
  const half = (b - a) / 2;
  const mid = (a + b) / 2;
  for (let j = 0; j < n; j++) {
    const x = Math.cos((Math.PI * (j + 0.5)) / n);
    sample(mid + half * x, scratch);
    for (let c = 0; c < componentCount; c++) values[c * n + j] = scratch[c]!;
  }
  const coefficients = new Float64Array(n * componentCount);
  for (let k = 0; k < n; k++) {
    for (let c = 0; c < componentCount; c++) {
      let sum = 0;
      for (let j = 0; j < n; j++) sum += values[c * n + j]! * Math.cos((Math.PI * k * (j + 0.5)) / n);
      coefficients[c * n + k] = ((k === 0 ? 1 : 2) * sum) / n;
    }
  }
  return coefficients;
}

/**
 * Evaluates one component of a Chebyshev series at x in [-1, 1] (Clenshaw's recurrence).
 * @param coefficients - Series laid out as by {@link fitChebyshev}.
 * @param offset - Index of the component's first coefficient.
 * @param count - Number of terms.
 * @param x - Normalised argument, -1..1 (slightly outside extrapolates).
 */
export function evalChebyshev(coefficients: Float64Array, offset: number, count: number, x: number): number {
  const x2 = 2 * x;
  let b1 = 0;
  let b2 = 0;
  for (let k = offset + count - 1; k > offset; k--) {
    const t = x2 * b1 - b2 + coefficients[k]!;
    b2 = b1;
    b1 = t;
  }
  return x * b1 - b2 + coefficients[offset]!;
}

/**
 * Evaluates three consecutive components of a Chebyshev series at once (interleaved Clenshaw
 * recurrences, about twice as fast as three separate calls).
 * @param coefficients - Series laid out as by {@link fitChebyshev}; components at `offset`,
 *   `offset + count`, `offset + 2 * count`.
 * @param offset - Index of the first component's first coefficient.
 * @param count - Terms per component.
 * @param x - Normalised argument, -1..1.
 * @param out - Receives the three values at indices 0..2.
 */
export function evalChebyshev3(coefficients: Float64Array, offset: number, count: number, x: number, out: Float64Array): void {
  const x2 = 2 * x;
  let a1 = 0;
  let a2 = 0;
  let b1 = 0;
  let b2 = 0;
  let c1 = 0;
  let c2 = 0;
  const ob = offset + count;
  const oc = offset + 2 * count;
  for (let k = count - 1; k > 0; k--) {
    const ta = x2 * a1 - a2 + coefficients[offset + k]!;
    const tb = x2 * b1 - b2 + coefficients[ob + k]!;
    const tc = x2 * c1 - c2 + coefficients[oc + k]!;
    a2 = a1;
    a1 = ta;
    b2 = b1;
    b1 = tb;
    c2 = c1;
    c1 = tc;
  }
  out[0] = x * a1 - a2 + coefficients[offset]!;
  out[1] = x * b1 - b2 + coefficients[ob]!;
  out[2] = x * c1 - c2 + coefficients[oc]!;
}
