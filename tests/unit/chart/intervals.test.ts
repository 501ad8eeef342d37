import { describe, expect, it } from 'vitest';
import { bandRuns, intersectRuns } from '../../../shared/chart';

describe('bandRuns', () => {
  it('places the ends where the straight line between samples meets the limits', () => {
    // v = t / 10 over t = 0..100: inside (2, 5) for t in (20, 50) (computed).
    const times = [0, 25, 50, 75, 100];
    const values = times.map((t) => t / 10);
    expect(bandRuns(times, values, 2, 5)).toEqual([{ startMs: 20, endMs: 50 }]);
  });

  it('finds a band the quantity jumps right across between two samples (a narrow frame, a coarse step)', () => {
    // From -3 to +3 in one step of 60: inside (-0.5, 0.5) for t in (25, 35) (computed).
    expect(bandRuns([0, 60], [-3, 3], -0.5, 0.5)).toEqual([{ startMs: 25, endMs: 35 }]);
  });

  it('merges the pieces of consecutive steps and separates distinct visits', () => {
    const times = [0, 10, 20, 30, 40, 50, 60];
    const values = [0, 2, 2, 0, -2, 0, 2];
    const runs = bandRuns(times, values, 1, 3);
    expect(runs).toHaveLength(2);
    expect(runs[0]).toEqual({ startMs: 5, endMs: 25 });
    expect(runs[1]).toEqual({ startMs: 55, endMs: 60 });
  });

  it('gives nothing for a quantity that stays outside', () => {
    expect(bandRuns([0, 1, 2], [5, 6, 7], 0, 1)).toEqual([]);
  });

  it.each([
    [[0, 0], [1, 1]],
    [[1, 0], [1, 1]],
    [[0, 1], [1, Number.NaN]],
    [[0, 1], [1]],
  ])('rejects times %j with values %j', (times, values) => {
    expect(() => bandRuns(times, values, 0, 2)).toThrow(RangeError);
  });

  it('rejects an empty band', () => {
    expect(() => bandRuns([0, 1], [0, 1], 1, 1)).toThrow(RangeError);
  });
});

describe('intersectRuns', () => {
  it('keeps only the overlaps of positive length', () => {
    const a = [{ startMs: 0, endMs: 10 }, { startMs: 20, endMs: 30 }];
    const b = [{ startMs: 5, endMs: 22 }, { startMs: 30, endMs: 40 }];
    expect(intersectRuns(a, b)).toEqual([{ startMs: 5, endMs: 10 }, { startMs: 20, endMs: 22 }]);
  });
});
