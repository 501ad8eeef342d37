import { describe, expect, it } from 'vitest';
import { linearScale, polylinePath, seriesPath } from '../../../shared/chart';

describe('polylinePath', () => {
  it('writes M then L commands to 0.1 unit, closed with Z for an area', () => {
    expect(polylinePath([[0, 0], [10.04, 5.06], [20, 0]])).toBe('M0 0L10 5.1L20 0');
    expect(polylinePath([[0, 0], [1, 1]], true)).toBe('M0 0L1 1Z');
    expect(polylinePath([])).toBe('');
  });

  it('rejects a non-finite point', () => {
    expect(() => polylinePath([[0, Number.NaN]])).toThrow(RangeError);
  });
});

describe('seriesPath', () => {
  const x = linearScale([0, 4], [0, 40]);
  const y = linearScale([0, 10], [100, 0]);

  it('maps samples through the scales', () => {
    expect(seriesPath([0, 2, 4], [0, 5, 10], x, y)).toBe('M0 100L20 50L40 0');
  });

  it('starts a new piece after samples that are not drawn', () => {
    expect(seriesPath([0, 1, 2, 3, 4], [0, 1, 2, 3, 4], x, y, (i) => i !== 2)).toBe('M0 100L10 90M30 70L40 60');
  });

  it('rejects arrays of different lengths', () => {
    expect(() => seriesPath([0, 1], [0], x, y)).toThrow(RangeError);
  });
});
