/**
 * SVG path data for chart lines and areas, from points in drawing units.
 */
import type { LinearScale } from './scale';

/** A point in drawing units [x, y]. */
export type ChartPoint = readonly [number, number];

function round1(v: number): string {
  return (Math.round(v * 10) / 10).toString();
}

function checkPoint(p: ChartPoint, i: number): void {
  if (!Array.isArray(p) || p.length !== 2 || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
    throw new RangeError(`points[${i}] must be a pair of finite numbers`);
  }
}

/**
 * Path data of a polyline through the points ('M x y L x y ...', to 0.1 unit); '' for no points.
 * @param points - points in drawing units, finite
 * @param closed - close the path (an area) with 'Z' (default false)
 * @throws RangeError on a non-finite point
 */
export function polylinePath(points: readonly ChartPoint[], closed = false): string {
  if (points.length === 0) return '';
  const parts = points.map((p, i) => {
    checkPoint(p, i);
    return `${i === 0 ? 'M' : 'L'}${round1(p[0])} ${round1(p[1])}`;
  });
  return parts.join('') + (closed ? 'Z' : '');
}

/**
 * Path data of a sampled series as a line broken where `defined` is false (one 'M' per piece).
 * @param xs - x values in data units (e.g. Unix ms), finite
 * @param ys - y values in data units, same length, finite
 * @param xScale - data to drawing units for x
 * @param yScale - data to drawing units for y
 * @param defined - which samples to draw (default all)
 * @throws RangeError on arrays of different lengths or non-finite values
 */
export function seriesPath(
  xs: readonly number[],
  ys: readonly number[],
  xScale: LinearScale,
  yScale: LinearScale,
  defined: (index: number) => boolean = () => true,
): string {
  if (xs.length !== ys.length) throw new RangeError(`xs and ys must have the same length (${xs.length}, ${ys.length})`);
  let out = '';
  let pen = false;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i]!;
    const y = ys[i]!;
    if (!Number.isFinite(x) || !Number.isFinite(y)) throw new RangeError(`sample ${i} must be finite`);
    if (!defined(i)) {
      pen = false;
      continue;
    }
    out += `${pen ? 'L' : 'M'}${round1(xScale.map(x))} ${round1(yScale.map(y))}`;
    pen = true;
  }
  return out;
}
