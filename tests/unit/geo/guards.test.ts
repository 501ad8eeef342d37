/**
 * The guards (shared/guards.ts) and the angle folding (shared/units.ts) that the geometry, sky,
 * lineup and tide modules share. The expected values follow from the definitions of the ranges.
 */
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { assertFiniteInRange, assertIntegerInRange, assertPositiveUpTo, assertValidDate, parseOrThrow } from '../../../shared/guards';
import { angleDifferenceDeg, normalizeDegrees180, normalizeDegrees360 } from '../../../shared/units';

describe('assertFiniteInRange', () => {
  it.each([0, 10, 3.5])('returns %s when it lies in [0, 10] (ends included)', (v) => {
    expect(assertFiniteInRange(v, 'widthM', 0, 10)).toBe(v);
  });

  it('takes any finite number when no range is given', () => {
    expect(assertFiniteInRange(-Number.MAX_VALUE, 'bearingDeg')).toBe(-Number.MAX_VALUE);
  });

  it.each([
    ['NaN', Number.NaN, 'NaN'],
    ['Infinity', Infinity, 'Infinity'],
    ['a string', '3', '3'],
    ['undefined', undefined, 'undefined'],
  ])('refuses %s, naming the argument and the value', (_label, v, shown) => {
    expect(() => assertFiniteInRange(v, 'widthM', 0, 10)).toThrow(RangeError);
    expect(() => assertFiniteInRange(v, 'widthM', 0, 10)).toThrow(`widthM must be a finite number (got ${shown})`);
  });

  it.each([-0.001, 10.001])('refuses %s outside [0, 10], giving the range', (v) => {
    expect(() => assertFiniteInRange(v, 'widthM', 0, 10)).toThrow(RangeError);
    expect(() => assertFiniteInRange(v, 'widthM', 0, 10)).toThrow(`widthM must be between 0 and 10 (got ${v})`);
  });
});

describe('assertPositiveUpTo', () => {
  it.each([1e-9, 5])('returns %s in (0, 5]', (v) => {
    expect(assertPositiveUpTo(v, 'stepDeg', 5)).toBe(v);
  });

  it.each([0, -1, 5.001])('refuses %s outside (0, 5]', (v) => {
    expect(() => assertPositiveUpTo(v, 'stepDeg', 5)).toThrow(RangeError);
    expect(() => assertPositiveUpTo(v, 'stepDeg', 5)).toThrow(`stepDeg must be above 0 and at most 5 (got ${v})`);
  });

  it('refuses NaN as not a finite number', () => {
    expect(() => assertPositiveUpTo(Number.NaN, 'stepDeg', 5)).toThrow('stepDeg must be a finite number (got NaN)');
  });
});

describe('assertIntegerInRange', () => {
  it.each([1, 12])('returns %s in 1..12', (v) => {
    expect(assertIntegerInRange(v, 'month', 1, 12)).toBe(v);
  });

  it.each([0, 13, 1.5, Number.NaN])('refuses %s', (v) => {
    expect(() => assertIntegerInRange(v, 'month', 1, 12)).toThrow(RangeError);
    expect(() => assertIntegerInRange(v, 'month', 1, 12)).toThrow(`month must be an integer between 1 and 12 (got ${v})`);
  });
});

describe('assertValidDate', () => {
  it('returns the same Date when it holds an instant', () => {
    const d = new Date('2027-05-20T00:00:00Z');
    expect(assertValidDate(d, 'date')).toBe(d);
  });

  it.each([
    ['an Invalid Date', new Date(Number.NaN)],
    ['an ISO string', '2027-05-20T00:00:00Z'],
    ['a number of ms', 0],
  ])('refuses %s', (_label, v) => {
    expect(() => assertValidDate(v, 'date')).toThrow(RangeError);
    expect(() => assertValidDate(v, 'date')).toThrow('date must be a valid Date');
  });
});

describe('parseOrThrow', () => {
  const schema = z.object({ a: z.number().max(1, 'a is too big'), b: z.string().default('x') });

  it('returns the parsed value with the defaults applied', () => {
    expect(parseOrThrow('thing', schema, { a: 1 })).toEqual({ a: 1, b: 'x' });
  });

  it('lists every problem with its path', () => {
    expect(() => parseOrThrow('thing', schema, { a: 2, b: 3 })).toThrow(RangeError);
    expect(() => parseOrThrow('thing', schema, { a: 2, b: 3 })).toThrow(/^Invalid thing: a: a is too big; b: /);
  });
});

describe('angle folding', () => {
  it.each([
    [-30, 330],
    [720, 0],
    [359.5, 359.5],
    [-1e-15, 0],
    [-360, 0],
  ])('normalizeDegrees360(%s) is %s', (a, expected) => {
    // + 0 reads -0 (what -360 % 360 gives) as 0: the two are the same angle.
    expect(normalizeDegrees360(a) + 0).toBe(expected);
  });

  it.each([
    [0, 0],
    [180, -180],
    [-180, -180],
    [190, -170],
    [-190, 170],
    [539, 179],
  ])('normalizeDegrees180(%s) is %s', (a, expected) => {
    expect(normalizeDegrees180(a)).toBe(expected);
  });

  it.each([
    [10, 350, 20],
    [350, 10, -20],
    [0, 180, 180],
    [180, 0, 180],
    [-180, 0, 180],
    [725, 0, 5],
  ])('angleDifferenceDeg(%s, %s) is %s', (a, b, expected) => {
    expect(angleDifferenceDeg(a, b)).toBe(expected);
  });
});
