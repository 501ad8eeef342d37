import { describe, expect, it } from 'vitest';
import { mergeIntervals, overlapMs, subtractIntervals, type MsInterval } from '../../../shared/tide/intervals';

const L = (...pairs: [number, number][]): MsInterval[] => pairs.map(([startMs, endMs]) => ({ startMs, endMs }));

describe('mergeIntervals', () => {
  it.each([
    ['empty', L(), L()],
    ['apart, out of order', L([5, 6], [1, 2]), L([1, 2], [5, 6])],
    ['overlapping', L([1, 4], [3, 6]), L([1, 6])],
    ['touching', L([1, 3], [3, 5]), L([1, 5])],
    ['one inside another', L([1, 10], [2, 3]), L([1, 10])],
  ])('%s', (_label, input, expected) => {
    expect(mergeIntervals(input)).toEqual(expected);
  });
});

describe('subtractIntervals', () => {
  it.each([
    ['nothing removed', L([0, 10]), L(), L([0, 10])],
    ['a hole in the middle', L([0, 10]), L([3, 5]), L([0, 3], [5, 10])],
    ['the start and end cut', L([0, 10]), L([-5, 2], [8, 12]), L([2, 8])],
    ['all removed', L([0, 10]), L([-1, 11]), L()],
    ['one removal across two pieces', L([0, 4], [6, 10]), L([3, 7]), L([0, 3], [7, 10])],
    ['removals only touching', L([0, 10]), L([-3, 0], [10, 12]), L([0, 10])],
    ['several holes', L([0, 20]), L([2, 3], [5, 6], [9, 15]), L([0, 2], [3, 5], [6, 9], [15, 20])],
  ])('%s', (_label, from, remove, expected) => {
    expect(subtractIntervals(from, remove)).toEqual(expected);
  });
});

describe('overlapMs', () => {
  it.each([
    [L([0, 10])[0]!, L([5, 15])[0]!, 5],
    [L([0, 10])[0]!, L([10, 15])[0]!, 0],
    [L([0, 10])[0]!, L([12, 15])[0]!, 0],
    [L([0, 10])[0]!, L([2, 3])[0]!, 1],
  ])('overlap of %j and %j is %s ms', (a, b, expected) => {
    expect(overlapMs(a, b)).toBe(expected);
  });
});
