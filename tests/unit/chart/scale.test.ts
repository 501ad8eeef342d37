import { describe, expect, it } from 'vitest';
import { linearScale, linearTicks, niceStep, piecewiseLinearScale } from '../../../shared/chart';

describe('linearScale', () => {
  it('maps the domain ends onto the range ends and back, also with a reversed (SVG y) range', () => {
    const y = linearScale([-20, 90], [300, 20]);
    expect(y.map(-20)).toBe(300);
    expect(y.map(90)).toBe(20);
    // 0 deg is 20/110 of the way up from -20: 300 - 280 * 20 / 110 (computed).
    expect(y.map(0)).toBeCloseTo(300 - (280 * 20) / 110, 12);
    expect(y.invert(y.map(37.5))).toBeCloseTo(37.5, 12);
  });

  it('extrapolates linearly outside the domain', () => {
    const x = linearScale([0, 10], [0, 100]);
    expect(x.map(-1)).toBe(-10);
    expect(x.map(11)).toBe(110);
  });

  it.each([
    [[0, 0], [0, 1]],
    [[0, Number.NaN], [0, 1]],
    [[0, 1], [0, Number.POSITIVE_INFINITY]],
  ] as const)('rejects domain %j with range %j', (domain, range) => {
    expect(() => linearScale(domain, range)).toThrow(RangeError);
  });
});

describe('niceStep and linearTicks', () => {
  it.each([
    // [min, max, maxTicks, step, ticks]: 1-2-5 steps (common practice for chart axes).
    [-20, 90, 11, 10, [-20, -10, 0, 10, 20, 30, 40, 50, 60, 70, 80, 90]],
    [-20, 90, 6, 20, [-20, 0, 20, 40, 60, 80]],
    [0, 1, 4, 0.5, [0, 0.5, 1]],
    [0.1, 0.7, 6, 0.1, [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7]],
    [3, 97, 4, 50, [50]],
  ])('[%s, %s] in at most %s intervals: step %s, ticks %j', (min, max, n, step, ticks) => {
    expect(niceStep(min, max, n)).toBeCloseTo(step, 12);
    expect(linearTicks(min, max, n)).toEqual(ticks);
  });

  it.each([
    [1, 1, 5],
    [0, 1, 0],
    [0, 1, 2.5],
    [Number.NaN, 1, 5],
  ])('rejects min %s, max %s, maxTicks %s', (min, max, n) => {
    expect(() => niceStep(min, max, n)).toThrow(RangeError);
  });
});

describe('piecewiseLinearScale', () => {
  // -20..0 deg onto the bottom quarter of a 400 px plot (400..300), 0..90 deg onto the rest (300..0).
  const y = piecewiseLinearScale([-20, 0, 90], [400, 300, 0]);

  it.each([
    [-20, 400],
    [-10, 350],
    [0, 300],
    [45, 150],
    [90, 0],
    [-30, 450], // extrapolates the first piece
  ])('maps %s deg to %s px and back', (deg, px) => {
    expect(y.map(deg)).toBeCloseTo(px, 9);
    expect(y.invert(px)).toBeCloseTo(deg, 9);
  });

  it('is monotonic across the stops', () => {
    let previous = Infinity;
    for (let deg = -20; deg <= 90; deg += 0.5) {
      const px = y.map(deg);
      expect(px).toBeLessThan(previous);
      previous = px;
    }
  });

  it.each([
    [[0], [0]],
    [[0, 1], [0]],
    [[0, 0], [0, 1]],
    [[0, 1, 2], [0, 2, 1]],
    [[0, Number.NaN], [0, 1]],
  ])('rejects domain stops %j with range stops %j', (d, r) => {
    expect(() => piecewiseLinearScale(d, r)).toThrow(RangeError);
  });
});
