import { describe, expect, it } from 'vitest';
import { skyBrightness, sunLimitCrossings, twilightSegments } from '../../../shared/chart';

describe('skyBrightness', () => {
  // Limits of the USNO, Almanac for Computers 1990 (REFERENCES.md "Altitudes of events"):
  // sunset -0.833 deg, civil -6, nautical -12, astronomical -18 deg (Sun's centre).
  it.each([
    [10, 'day'],
    [-0.833, 'day'],
    [-0.84, 'civil-twilight'],
    [-6, 'civil-twilight'],
    [-6.01, 'nautical-twilight'],
    [-12, 'nautical-twilight'],
    [-12.01, 'astronomical-twilight'],
    [-18, 'astronomical-twilight'],
    [-18.01, 'dark'],
    [-60, 'dark'],
  ] as const)('the Sun at %s deg gives %s', (alt, kind) => {
    expect(skyBrightness(alt)).toBe(kind);
  });

  it.each([Number.NaN, 91, -91])('rejects %s', (alt) => {
    expect(() => skyBrightness(alt)).toThrow(RangeError);
  });
});

describe('sunLimitCrossings and twilightSegments on a straight-line Sun', () => {
  // The Sun going down 1 deg a minute from +2 deg: it crosses -0.833 deg at 2.833 min, -6 at 8,
  // -12 at 14 and -18 at 20 min (computed), then comes back up symmetrically.
  const MIN = 60_000;
  const times = Array.from({ length: 61 }, (_, i) => i * MIN);
  const alt = times.map((t) => {
    const m = t / MIN;
    return m <= 30 ? 2 - m : 2 - (60 - m);
  });

  it('places each crossing where the line meets the limit', () => {
    const c = sunLimitCrossings(times, alt);
    expect(c.map((x) => [x.limitDeg, x.direction])).toEqual([
      [-50 / 60, 'setting'], [-6, 'setting'], [-12, 'setting'], [-18, 'setting'],
      [-18, 'rising'], [-12, 'rising'], [-6, 'rising'], [-50 / 60, 'rising'],
    ]);
    expect(c[0]!.atMs / MIN).toBeCloseTo(2 + 50 / 60, 9);
    expect(c[3]!.atMs / MIN).toBeCloseTo(20, 9);
    expect(c[4]!.atMs / MIN).toBeCloseTo(40, 9);
  });

  it('cuts the axis into contiguous segments from day to dark and back', () => {
    const s = twilightSegments(times, alt);
    expect(s.map((x) => x.kind)).toEqual([
      'day', 'civil-twilight', 'nautical-twilight', 'astronomical-twilight', 'dark',
      'astronomical-twilight', 'nautical-twilight', 'civil-twilight', 'day',
    ]);
    expect(s[0]!.startMs).toBe(0);
    expect(s[s.length - 1]!.endMs).toBe(60 * MIN);
    for (let i = 1; i < s.length; i++) expect(s[i]!.startMs).toBe(s[i - 1]!.endMs);
    expect((s[4]!.endMs - s[4]!.startMs) / MIN).toBeCloseTo(20, 9);
  });

  it('needs at least two samples', () => {
    expect(() => twilightSegments([0], [0])).toThrow(RangeError);
  });
});
