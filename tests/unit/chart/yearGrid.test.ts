import { describe, expect, it } from 'vitest';
import { bestScoresByNight, monthsOfNights, nightsWithDarkness, yearHeatmap, yearViewRange } from '../../../shared/chart';
import { computeDarkWindows } from '../../../shared/lineup';
import { nightReport } from '../../../shared/sky';

const SITE = { lat: 50.579, lon: -4.914, elevationM: 4.5 };
const ZONE = 'Europe/London';

describe('monthsOfNights', () => {
  it('gives twelve months with their real lengths, across a leap February', () => {
    const months = monthsOfNights('2027-03');
    expect(months.map((m) => m.key)).toEqual([
      '2027-03', '2027-04', '2027-05', '2027-06', '2027-07', '2027-08',
      '2027-09', '2027-10', '2027-11', '2027-12', '2028-01', '2028-02',
    ]);
    // Gregorian calendar: 2028 is a leap year (divisible by 4, not by 100).
    expect(months.map((m) => m.dates.length)).toEqual([31, 30, 31, 30, 31, 31, 30, 31, 30, 31, 31, 29]);
    expect(months[0]!.dates[0]).toBe('2027-03-01');
    expect(months[11]!.dates[28]).toBe('2028-02-29');
  });

  it.each([['2027-13', 12], ['2027-3', 12], ['2027-03', 0], ['2027-03', 25], ['2027-03', 1.5]] as const)('rejects %s for %s months', (start, n) => {
    expect(() => monthsOfNights(start, n)).toThrow(RangeError);
  });
});

describe('yearViewRange', () => {
  it('runs from local noon of the first date to local noon after the last', () => {
    const { from, to } = yearViewRange('2027-03', 12, ZONE);
    expect(from.toISOString()).toBe('2027-03-01T12:00:00.000Z'); // GMT in March before the change
    expect(to.toISOString()).toBe('2028-03-01T12:00:00.000Z');
  });
});

describe('bestScoresByNight', () => {
  it('files a lineup after midnight under the evening before, and keeps the best score', () => {
    const map = bestScoresByNight([
      { start: '2027-05-10T22:00:00Z', score: 0.4 }, // 23:00 BST on the 10th
      { start: '2027-05-11T01:00:00Z', score: 0.7 }, // 02:00 BST on the 11th: same night
      { start: '2027-05-11T22:00:00Z', score: 0.2 },
    ], ZONE);
    expect(map.get('2027-05-10')).toEqual({ bestScore: 0.7, count: 2 });
    expect(map.get('2027-05-11')).toEqual({ bestScore: 0.2, count: 1 });
  });

  it('rejects a score above 1 or an invalid start', () => {
    expect(() => bestScoresByNight([{ start: '2027-05-10T22:00:00Z', score: 1.2 }], ZONE)).toThrow(RangeError);
    expect(() => bestScoresByNight([{ start: 'not a date', score: 0.5 }], ZONE)).toThrow(RangeError);
  });
});

describe('nights without astronomical darkness at 50.57 N', () => {
  // At 50.57 N the Sun at the June solstice gets no lower than 90 - 50.57 - 23.44 = -15.99 deg
  // (computed), so midsummer nights have no astronomical darkness; winter nights do.
  const { from, to } = yearViewRange('2027-01', 12, ZONE);
  const windows = computeDarkWindows(SITE, from, to, { sunMaxAltDeg: -18, moon: { maxIllumination: 1 } }).windows;
  const dates = monthsOfNights('2027-01', 12).flatMap((m) => m.dates);
  const dark = nightsWithDarkness(windows, dates, ZONE);

  it('has no darkness on the solstice night and darkness in midwinter', () => {
    expect(dark.has('2027-06-21')).toBe(false);
    expect(dark.has('2027-12-21')).toBe(true);
  });

  it.each(['2027-05-10', '2027-05-25', '2027-05-31', '2027-06-05', '2027-07-10', '2027-07-20', '2027-07-31', '2027-08-15'])(
    'agrees with nightReport on %s',
    (date) => {
      const night = nightReport(SITE, date, { skipMoon: true });
      expect(dark.has(date)).toBe(night.state === 'dark');
    },
  );

  it('feeds the heat-map cells', () => {
    const months = yearHeatmap({ startMonth: '2027-06', months: 1, timeZone: ZONE, lineups: [{ start: '2027-06-02T00:30:00Z', score: 0.5 }], darkness: windows });
    const june = months[0]!;
    expect(june.nights).toHaveLength(30);
    expect(june.nights[0]).toMatchObject({ date: '2027-06-01', day: 1, weekday: 2, bestScore: 0.5, lineupCount: 1 }); // 2027-06-01 is a Tuesday
    expect(june.nights[20]).toMatchObject({ date: '2027-06-21', hasDarkness: false, bestScore: null });
  });

  it('leaves darkness unknown without windows', () => {
    const months = yearHeatmap({ startMonth: '2027-06', months: 1, timeZone: ZONE, lineups: [] });
    expect(months[0]!.nights.every((n) => n.hasDarkness === null)).toBe(true);
  });

  it('rejects a window that ends before it starts', () => {
    expect(() => nightsWithDarkness([{ startMs: 10, endMs: 5 }], ['2027-06-01'], ZONE)).toThrow(RangeError);
  });
});
