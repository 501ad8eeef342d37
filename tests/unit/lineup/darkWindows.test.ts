import { describe, expect, it } from 'vitest';
import { computeDarkWindows, type DarkWindowSet } from '../../../shared/lineup';
import { oracleDarkWindows, oracleSunAltitudeDeg, type MsInterval, type OracleConditions } from './oracle';

const SUN_ONLY = { maxIllumination: 1 } as const;
const at = (iso: string): number => Date.parse(iso);

/** Pairs engine and reference windows one to one; returns the largest boundary difference, s. */
function matchWindows(engine: DarkWindowSet, reference: MsInterval[]): number {
  expect(engine.windows.map((w) => new Date(w.startMs).toISOString().slice(0, 16))).toEqual(
    reference.map((w) => new Date(w.startMs).toISOString().slice(0, 16)),
  );
  let worst = 0;
  reference.forEach((r, i) => {
    const e = engine.windows[i]!;
    worst = Math.max(worst, Math.abs(e.startMs - r.startMs), Math.abs(e.endMs - r.endMs));
  });
  return worst / 1000;
}

/** Dark windows by a dense scan of exact astronomy-engine altitudes (step, then bisection to 10 ms). */
function denseScan(site: { lat: number; lon: number; elevationM: number }, c: OracleConditions, from: string, to: string, stepS: number): MsInterval[] {
  return oracleDarkWindows(site, c, at(from), at(to), stepS * 1000, 10);
}

describe('dark windows against a dense scan of exact altitudes', () => {
  it('ends the 2027-05-20 short night at 52.1 N 7.0 W at 00:30:12.8 UT, not at the false crossing of SearchAltitude', () => {
    // Regression (engine issue, STACK.md): astronomy-engine 2.1.19's SearchAltitude, started just
    // after dusk, returns a false rising crossing at 00:18:22 UT; the dense scan keeps the Sun below
    // -18 deg until 00:30:12.8 UT.
    const site = { lat: 52.1, lon: -7.0, elevationM: 0 };
    const set = computeDarkWindows(site, new Date('2027-05-19T12:00:00Z'), new Date('2027-05-20T12:00:00Z'), { moon: SUN_ONLY });
    expect(set.windows).toHaveLength(1);
    const w = set.windows[0]!;
    expect(Math.abs(w.endMs - at('2027-05-20T00:30:12.8Z'))).toBeLessThan(150);
    // Around the true boundary the exact altitude crosses -18 deg.
    expect(oracleSunAltitudeDeg(site, w.endMs - 1000)).toBeLessThan(-18);
    expect(oracleSunAltitudeDeg(site, w.endMs + 1000)).toBeGreaterThan(-18);
    const scan = denseScan(site, { sunMaxAltDeg: -18, moon: SUN_ONLY }, '2027-05-19T12:00:00Z', '2027-05-20T12:00:00Z', 5);
    expect(matchWindows(set, scan)).toBeLessThan(0.05);
  });

  it('tracks the short nights of May 2027 at 52.1 N within 0.05 s', () => {
    const site = { lat: 52.1, lon: -7.0, elevationM: 0 };
    const set = computeDarkWindows(site, new Date('2027-05-14T12:00:00Z'), new Date('2027-05-26T12:00:00Z'), { moon: SUN_ONLY });
    const scan = denseScan(site, { sunMaxAltDeg: -18, moon: SUN_ONLY }, '2027-05-14T12:00:00Z', '2027-05-26T12:00:00Z', 30);
    expect(set.windows.length).toBeGreaterThanOrEqual(5);
    expect(matchWindows(set, scan)).toBeLessThan(0.05);
  });

  it('handles grazing nights at 48.6 N around the June solstice: a few minutes of darkness, then none', () => {
    // At 48.6 N the Sun's midnight depression peaks near 18.0 deg: windows shrink to minutes and
    // vanish for a week (the extremum decides, so no crossing is invented or lost).
    const site = { lat: 48.6, lon: 0, elevationM: 0 };
    const set = computeDarkWindows(site, new Date('2027-06-14T12:00:00Z'), new Date('2027-06-27T12:00:00Z'), { moon: SUN_ONLY });
    const scan = denseScan(site, { sunMaxAltDeg: -18, moon: SUN_ONLY }, '2027-06-14T12:00:00Z', '2027-06-27T12:00:00Z', 30);
    expect(matchWindows(set, scan)).toBeLessThan(0.05);
    const lengths = set.windows.map((w) => (w.endMs - w.startMs) / 60_000);
    expect(Math.min(...lengths)).toBeLessThan(10);
    expect(set.windows.some((w) => w.startMs > at('2027-06-18T12:00:00Z') && w.startMs < at('2027-06-24T12:00:00Z'))).toBe(false);
  });

  it('finds no dark window at 58 N in mid-summer, and the first ones when darkness returns', () => {
    const site = { lat: 58.0, lon: -5.0, elevationM: 30 };
    expect(computeDarkWindows(site, new Date('2027-06-01T00:00:00Z'), new Date('2027-07-20T00:00:00Z')).windows).toEqual([]);
    const set = computeDarkWindows(site, new Date('2027-08-08T12:00:00Z'), new Date('2027-08-20T12:00:00Z'), { moon: SUN_ONLY });
    const scan = denseScan(site, { sunMaxAltDeg: -18, moon: SUN_ONLY }, '2027-08-08T12:00:00Z', '2027-08-20T12:00:00Z', 30);
    expect(scan.length).toBeGreaterThan(0);
    expect(matchWindows(set, scan)).toBeLessThan(0.05);
  });

  it.each([
    { name: 'Moon down', moon: 'down' as const },
    { name: 'Moon up to 30 % lit', moon: { maxIllumination: 0.3 } },
  ])('combines Sun and Moon ($name) as the scan does at 45 N', ({ moon }) => {
    const site = { lat: 45.0, lon: 7.0, elevationM: 300 };
    const set = computeDarkWindows(site, new Date('2027-03-01T00:00:00Z'), new Date('2027-03-31T00:00:00Z'), { moon });
    const scan = denseScan(site, { sunMaxAltDeg: -18, moon }, '2027-03-01T00:00:00Z', '2027-03-31T00:00:00Z', 60);
    expect(set.windows.length).toBeGreaterThan(15);
    expect(matchWindows(set, scan)).toBeLessThan(0.05);
  });

  it('follows the Moon alone in the polar night at 85 N (the polar method)', () => {
    // The Sun stays below -18 deg all day in late December at 85 N; the Moon, circumpolar half the
    // month, decides.
    const site = { lat: 85.0, lon: 20.0, elevationM: 0 };
    const set = computeDarkWindows(site, new Date('2027-12-05T00:00:00Z'), new Date('2028-01-05T00:00:00Z'), { moon: 'down' });
    const scan = denseScan(site, { sunMaxAltDeg: -18, moon: 'down' }, '2027-12-05T00:00:00Z', '2028-01-05T00:00:00Z', 60);
    expect(set.windows.some((w) => w.endMs - w.startMs > 5 * 86_400_000)).toBe(true);
    expect(matchWindows(set, scan)).toBeLessThan(0.05);
  });

  it('lets the Moon alone decide at the South Pole in midwinter (declination extrema only)', () => {
    const site = { lat: -90, lon: 0, elevationM: 2835 };
    const set = computeDarkWindows(site, new Date('2027-05-20T00:00:00Z'), new Date('2027-07-10T00:00:00Z'), { moon: 'down' });
    const scan = denseScan(site, { sunMaxAltDeg: -18, moon: 'down' }, '2027-05-20T00:00:00Z', '2027-07-10T00:00:00Z', 120);
    expect(set.windows.length).toBeGreaterThanOrEqual(2);
    expect(matchWindows(set, scan)).toBeLessThan(0.05);
  });

  it('handles the Sun at 82 N in February by the polar method, as nights shrink to nothing', () => {
    // At 82 N the Sun's lower culmination is at dec - 8 deg: below -18 deg only while dec < -10 deg.
    const site = { lat: 82.0, lon: -62.3, elevationM: 0 };
    const set = computeDarkWindows(site, new Date('2027-02-12T00:00:00Z'), new Date('2027-03-04T00:00:00Z'), { moon: SUN_ONLY });
    const scan = denseScan(site, { sunMaxAltDeg: -18, moon: SUN_ONLY }, '2027-02-12T00:00:00Z', '2027-03-04T00:00:00Z', 30);
    expect(set.windows.length).toBeGreaterThan(5);
    expect(set.windows.at(-1)!.endMs).toBeLessThan(at('2027-03-01T00:00:00Z'));
    expect(matchWindows(set, scan)).toBeLessThan(0.05);
  });

  it('finds no darkness in the southern polar summer at 78 S and nightly windows in its winter', () => {
    // At 77.85 S the midwinter Sun culminates near -11 deg: dark at -18 deg part of each day only,
    // dark all day at a -10 deg limit.
    const site = { lat: -77.85, lon: 166.67, elevationM: 20 };
    expect(computeDarkWindows(site, new Date('2027-12-01T00:00:00Z'), new Date('2028-01-01T00:00:00Z'), { moon: SUN_ONLY }).windows).toEqual([]);
    const winter = computeDarkWindows(site, new Date('2027-06-10T00:00:00Z'), new Date('2027-06-20T00:00:00Z'), { moon: SUN_ONLY });
    const scan = denseScan(site, { sunMaxAltDeg: -18, moon: SUN_ONLY }, '2027-06-10T00:00:00Z', '2027-06-20T00:00:00Z', 60);
    expect(winter.windows.length).toBeGreaterThanOrEqual(9);
    expect(matchWindows(winter, scan)).toBeLessThan(0.05);
    const allDay = computeDarkWindows(site, new Date('2027-06-10T00:00:00Z'), new Date('2027-06-20T00:00:00Z'), { sunMaxAltDeg: -10, moon: SUN_ONLY });
    expect(allDay.windows).toEqual([{ startMs: at('2027-06-10T00:00:00Z'), endMs: at('2027-06-20T00:00:00Z') }]);
  });
});

describe('dark windows against published twilight tables', () => {
  it('matches USNO astronomical dawn 10:21 and dusk 23:56 UT at Orlando on 2021-11-07 within 1 min', () => {
    // astronomy-engine test data generate/riseset/twilight.txt (REFERENCES.md), tolerance 1 min.
    const set = computeDarkWindows({ lat: 28.538, lon: -81.379, elevationM: 0 }, new Date('2021-11-07T00:00:00Z'), new Date('2021-11-08T06:00:00Z'), { moon: SUN_ONLY });
    expect(set.windows).toHaveLength(2);
    expect(Math.abs(set.windows[0]!.endMs - at('2021-11-07T10:21:00Z'))).toBeLessThan(60_000);
    expect(Math.abs(set.windows[1]!.startMs - at('2021-11-07T23:56:00Z'))).toBeLessThan(60_000);
  });

  it('matches USNO sunrise 02:36 and sunset 21:28 UT at 60 N 0 E on 2019-06-21 with a -0.833 deg limit', () => {
    // US Naval Observatory tables kept in astronomy-engine generate/riseset/riseset.txt; rise and
    // set are at -0.833 deg (USNO Almanac for Computers). Tolerance 1 min (REFERENCES.md).
    const set = computeDarkWindows({ lat: 60, lon: 0, elevationM: 0 }, new Date('2019-06-21T00:00:00Z'), new Date('2019-06-21T23:59:00Z'), {
      sunMaxAltDeg: -0.8333,
      moon: SUN_ONLY,
    });
    expect(set.windows).toHaveLength(2);
    expect(Math.abs(set.windows[0]!.endMs - at('2019-06-21T02:36:00Z'))).toBeLessThan(60_000);
    expect(Math.abs(set.windows[1]!.startMs - at('2019-06-21T21:28:00Z'))).toBeLessThan(60_000);
  });
});

describe('dark window set', () => {
  it('is plain data that survives JSON and records what it was computed for', () => {
    const set = computeDarkWindows({ lat: 45, lon: 7, elevationM: 0 }, new Date('2027-01-01T00:00:00Z'), new Date('2027-01-10T00:00:00Z'), { moon: { maxIllumination: 0.2 } });
    expect(JSON.parse(JSON.stringify(set))).toEqual(set);
    expect(set.sunMaxAltDeg).toBe(-18);
    expect(set.moon).toEqual({ maxIllumination: 0.2 });
    for (let i = 1; i < set.windows.length; i++) expect(set.windows[i]!.startMs).toBeGreaterThan(set.windows[i - 1]!.endMs);
  });

  it.each([
    { name: 'NaN latitude', site: { lat: Number.NaN, lon: 0, elevationM: 0 }, from: '2027-01-01', to: '2027-02-01', c: {} },
    { name: 'latitude 91', site: { lat: 91, lon: 0, elevationM: 0 }, from: '2027-01-01', to: '2027-02-01', c: {} },
    { name: 'reversed range', site: { lat: 45, lon: 0, elevationM: 0 }, from: '2027-02-01', to: '2027-01-01', c: {} },
    { name: 'range over ten years', site: { lat: 45, lon: 0, elevationM: 0 }, from: '2027-01-01', to: '2037-01-03', c: {} },
    { name: 'Sun limit above the horizon', site: { lat: 45, lon: 0, elevationM: 0 }, from: '2027-01-01', to: '2027-02-01', c: { sunMaxAltDeg: 5 } },
    { name: 'illumination above 1', site: { lat: 45, lon: 0, elevationM: 0 }, from: '2027-01-01', to: '2027-02-01', c: { moon: { maxIllumination: 1.5 } } },
  ])('rejects $name with a RangeError', ({ site, from, to, c }) => {
    expect(() => computeDarkWindows(site, new Date(from), new Date(to), c)).toThrow(RangeError);
  });
});
