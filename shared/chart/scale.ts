/**
 * Linear scales and tick values for the charts: data units (milliseconds, degrees, a score) to
 * drawing units (SVG user units) and back.
 */
import { assertFiniteInRange } from '../sky/guards';

/** A (piecewise) linear map from a data interval (domain) to a drawing interval (range). */
export interface LinearScale {
  /** Data interval [d0, d1], d0 != d1 (either order). */
  readonly domain: readonly [number, number];
  /** Drawing interval [r0, r1] (either order: an SVG y axis runs downwards, so r0 > r1 is usual). */
  readonly range: readonly [number, number];
  /** The drawing position of a data value (values outside the domain extrapolate). */
  map(value: number): number;
  /** The data value at a drawing position. */
  invert(position: number): number;
}

/**
 * A linear scale from `domain` to `range`.
 * @param domain - data interval [d0, d1], finite, d0 != d1 (any unit)
 * @param range - drawing interval [r0, r1], finite (any unit; may be reversed)
 * @returns the scale; `map(d0) = r0` and `map(d1) = r1`
 * @throws RangeError on non-finite ends or an empty domain
 */
export function linearScale(domain: readonly [number, number], range: readonly [number, number]): LinearScale {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  assertFiniteInRange(d0, 'domain[0]');
  assertFiniteInRange(d1, 'domain[1]');
  assertFiniteInRange(r0, 'range[0]');
  assertFiniteInRange(r1, 'range[1]');
  if (d0 === d1) throw new RangeError(`domain must not be empty (got [${d0}, ${d1}])`);
  const k = (r1 - r0) / (d1 - d0);
  return {
    domain: [d0, d1],
    range: [r0, r1],
    map: (value) => r0 + (value - d0) * k,
    invert: (position) => (k === 0 ? d0 : d0 + (position - r0) / k),
  };
}

/**
 * A piecewise linear scale through matching stops: each stretch between two domain stops maps
 * linearly onto the stretch between the matching range stops (e.g. -20..0 deg onto a quarter of
 * a chart's height and 0..90 deg onto the rest). Values beyond the ends extrapolate the end pieces.
 * @param domainStops - at least two finite data values, strictly increasing
 * @param rangeStops - as many finite drawing positions, strictly monotonic (either direction)
 * @returns the scale; `domain` and `range` are the end stops
 * @throws RangeError on non-finite, non-monotonic or mismatched stops
 */
export function piecewiseLinearScale(domainStops: readonly number[], rangeStops: readonly number[]): LinearScale {
  if (!Array.isArray(domainStops) || !Array.isArray(rangeStops) || domainStops.length < 2 || domainStops.length !== rangeStops.length) {
    throw new RangeError('domainStops and rangeStops must be arrays of the same length, at least 2');
  }
  domainStops.forEach((d, i) => assertFiniteInRange(d, `domainStops[${i}]`));
  rangeStops.forEach((r, i) => assertFiniteInRange(r, `rangeStops[${i}]`));
  const rising = rangeStops[1]! > rangeStops[0]!;
  for (let i = 1; i < domainStops.length; i++) {
    if (!(domainStops[i]! > domainStops[i - 1]!)) throw new RangeError('domainStops must be strictly increasing');
    if (rising ? !(rangeStops[i]! > rangeStops[i - 1]!) : !(rangeStops[i]! < rangeStops[i - 1]!)) throw new RangeError('rangeStops must be strictly monotonic');
  }
  const pieces = domainStops.slice(1).map((_, i) => linearScale([domainStops[i]!, domainStops[i + 1]!], [rangeStops[i]!, rangeStops[i + 1]!]));
  const last = pieces.length - 1;
  const pieceOfValue = (v: number) => {
    let i = 0;
    while (i < last && v > domainStops[i + 1]!) i++;
    return pieces[i]!;
  };
  const pieceOfPosition = (p: number) => {
    let i = 0;
    while (i < last && (rising ? p > rangeStops[i + 1]! : p < rangeStops[i + 1]!)) i++;
    return pieces[i]!;
  };
  return {
    domain: [domainStops[0]!, domainStops[domainStops.length - 1]!],
    range: [rangeStops[0]!, rangeStops[rangeStops.length - 1]!],
    map: (value) => pieceOfValue(value).map(value),
    invert: (position) => pieceOfPosition(position).invert(position),
  };
}

/**
 * A round step (1, 2 or 5 times a power of ten) that cuts [min, max] into at most `maxTicks`
 * intervals.
 * @param min - lower end, finite
 * @param max - upper end, finite, above `min`
 * @param maxTicks - largest number of intervals, integer 1..1000
 * @throws RangeError on invalid input
 */
export function niceStep(min: number, max: number, maxTicks: number): number {
  assertFiniteInRange(min, 'min');
  assertFiniteInRange(max, 'max');
  if (!(max > min)) throw new RangeError(`max must be above min (got ${min}, ${max})`);
  if (!Number.isInteger(maxTicks) || maxTicks < 1 || maxTicks > 1000) throw new RangeError(`maxTicks must be an integer 1..1000 (got ${maxTicks})`);
  const raw = (max - min) / maxTicks;
  const power = 10 ** Math.floor(Math.log10(raw));
  for (const m of [1, 2, 5, 10]) if (m * power >= raw - 1e-12 * power) return m * power;
  return 10 * power;
}

/**
 * Tick values: the multiples of {@link niceStep} within [min, max], ascending.
 * @param min - lower end, finite
 * @param max - upper end, finite, above `min`
 * @param maxTicks - largest number of intervals, integer 1..1000
 * @throws RangeError on invalid input
 */
export function linearTicks(min: number, max: number, maxTicks: number): number[] {
  const step = niceStep(min, max, maxTicks);
  const ticks: number[] = [];
  // Round to the step's precision so that 0.1 + 0.2 style drift does not leak into labels.
  const decimals = Math.max(0, -Math.floor(Math.log10(step)));
  for (let i = Math.ceil(min / step - 1e-9); i * step <= max + step * 1e-9; i++) ticks.push(Number((i * step).toFixed(decimals)));
  return ticks;
}
