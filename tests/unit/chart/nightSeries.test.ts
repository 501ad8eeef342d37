import { describe, expect, it } from 'vitest';
import { Body, DefineStar, Equator, Horizon, MakeTime, Observer } from 'astronomy-engine';
import { nightChartSeries, type NightChartSeries } from '../../../shared/chart';
import { frameFromSightline } from '../../../shared/geo';
import { searchLineups } from '../../../shared/lineup';
import type { EquatorialJ2000, Frame, ObserverSite } from '../../../shared/schemas/geometry';
import { findTarget, nightReport, targetHorizontal, timeZoneForSite, type NightReport } from '../../../shared/sky';

const MINUTE_MS = 60_000;
const HOUR_MS = 3_600_000;
const GC = findTarget('galactic-centre')!;

// The demo's south-facing sightline at 50.57 N (server/seeders/demo.ts): camera eye 4.5 m.
const KESTREL_VANTAGE = { lat: 50.579, lon: -4.914, elevationM: 3, cameraHeightM: 1.5 };
const KESTREL_LANDMARK = { lat: 50.5712, lon: -4.9085, baseElevationM: 0, heightM: 38, widthM: 14 };
const KESTREL_SITE: ObserverSite = { lat: 50.579, lon: -4.914, elevationM: 4.5 };
const KESTREL_FRAME: Frame = frameFromSightline(KESTREL_VANTAGE, KESTREL_LANDMARK, { bandHeightDeg: 20 });

const cache = new Map<string, NightChartSeries>();
function series(site: ObserverSite, date: string, target: EquatorialJ2000 = GC, frame: Frame = KESTREL_FRAME): NightChartSeries {
  const key = JSON.stringify([site, date, target, frame]);
  let s = cache.get(key);
  if (!s) {
    s = nightChartSeries({ site, timeZone: timeZoneForSite(site.lat, site.lon), date, target, frame });
    cache.set(key, s);
  }
  return s;
}

function crossingAt(s: NightChartSeries, limitDeg: number, direction: 'setting' | 'rising'): number | null {
  const found = s.sunCrossings.filter((c) => c.direction === direction && Math.abs(c.limitDeg - limitDeg) < 1e-9);
  if (found.length === 0) return null;
  return (direction === 'setting' ? found[found.length - 1] : found[0])!.atMs;
}

describe('the time axis of a night chart', () => {
  it.each([
    [KESTREL_SITE, '2027-05-10'],
    [KESTREL_SITE, '2027-12-21'],
    [{ lat: -38.665, lon: 143.104, elevationM: 41 }, '2027-06-20'],
  ])('at %j on %s is strictly increasing by the 5 min step and spans sunset to sunrise with margin', (site, date) => {
    const s = series(site, date);
    expect(s.stepMs).toBe(5 * MINUTE_MS);
    for (let i = 1; i < s.timesMs.length; i++) expect(s.timesMs[i]! - s.timesMs[i - 1]!).toBe(s.stepMs);
    for (const key of ['sunAltDeg', 'moonAltDeg', 'targetAltDeg', 'targetAzDeg'] as const) expect(s[key]).toHaveLength(s.timesMs.length);
    const night = nightReport(site, date, { skipMoon: true });
    // The margin is 60 min before sunset and after sunrise; the span finder adds up to one coarse
    // (10 min) step and rounds to the 5 min grid.
    const before = (night.sunset!.utc.getTime() - s.span.startMs) / MINUTE_MS;
    const after = (s.span.endMs - night.sunrise!.utc.getTime()) / MINUTE_MS;
    expect(before).toBeGreaterThanOrEqual(60);
    expect(before).toBeLessThanOrEqual(60 + 10 + 5);
    expect(after).toBeGreaterThanOrEqual(60);
    expect(after).toBeLessThanOrEqual(60 + 10 + 5);
    expect(s.span.startMs).toBeGreaterThanOrEqual(s.window.startMs);
    expect(s.span.endMs).toBeLessThanOrEqual(s.window.endMs);
  });

  it('puts the hour ticks on full hours of the site zone (Europe/London in May is UTC+1)', () => {
    const s = series(KESTREL_SITE, '2027-05-10');
    expect(s.hourTicks.length).toBeGreaterThan(8);
    for (const tick of s.hourTicks) {
      expect((tick.atMs + HOUR_MS) % HOUR_MS).toBe(0);
      expect(new Date(tick.atMs + HOUR_MS).getUTCHours()).toBe(tick.hour);
    }
  });
});

describe('twilight boundaries against nightReport', () => {
  const cases: Array<[string, ObserverSite, string]> = [
    ['50.57 N in May', KESTREL_SITE, '2027-05-10'],
    ['50.57 N at the December solstice', KESTREL_SITE, '2027-12-21'],
    ['38.7 S in the austral winter', { lat: -38.665, lon: 143.104, elevationM: 41 }, '2027-06-20'],
    ['Orlando in November', { lat: 28.538, lon: -81.379, elevationM: 0 }, '2021-11-07'],
  ];
  const events: Array<[keyof NightReport, number, 'setting' | 'rising']> = [
    ['sunset', -50 / 60, 'setting'],
    ['civilDusk', -6, 'setting'],
    ['nauticalDusk', -12, 'setting'],
    ['astronomicalDusk', -18, 'setting'],
    ['astronomicalDawn', -18, 'rising'],
    ['nauticalDawn', -12, 'rising'],
    ['civilDawn', -6, 'rising'],
    ['sunrise', -50 / 60, 'rising'],
  ];
  it.each(cases)('%s: every band boundary is within one sample step of the event', (_label, site, date) => {
    const s = series(site, date);
    const night = nightReport(site, date, { skipMoon: true });
    for (const [key, limit, direction] of events) {
      const event = night[key] as { utc: Date } | null;
      const atMs = crossingAt(s, limit, direction);
      expect(event, `${String(key)} in nightReport`).not.toBeNull();
      expect(atMs, `${String(key)} in the chart`).not.toBeNull();
      expect(Math.abs(atMs! - event!.utc.getTime())).toBeLessThan(s.stepMs);
    }
  });

  it('Orlando 2021-11-07 dusk matches the astronomy-engine twilight test table to 1 min', () => {
    // astronomy-engine generate/riseset/twilight.txt (REFERENCES.md): civil, nautical, astronomical
    // dusk at 23:00, 23:28, 23:56 UT; the table is to the minute.
    const s = series({ lat: 28.538, lon: -81.379, elevationM: 0 }, '2021-11-07');
    expect(Math.abs(crossingAt(s, -6, 'setting')! - Date.parse('2021-11-07T23:00:00Z'))).toBeLessThanOrEqual(MINUTE_MS);
    expect(Math.abs(crossingAt(s, -12, 'setting')! - Date.parse('2021-11-07T23:28:00Z'))).toBeLessThanOrEqual(MINUTE_MS);
    expect(Math.abs(crossingAt(s, -18, 'setting')! - Date.parse('2021-11-07T23:56:00Z'))).toBeLessThanOrEqual(MINUTE_MS);
  });

  it('Orlando dawn of 2021-11-07 (in the night of 11-06, which has the clock change) matches the table to 1 min', () => {
    // Same table: astronomical, nautical, civil dawn 10:21, 10:49, 11:17 UT.
    const s = series({ lat: 28.538, lon: -81.379, elevationM: 0 }, '2021-11-06');
    expect(s.window.endMs - s.window.startMs).toBe(25 * HOUR_MS);
    expect(Math.abs(crossingAt(s, -18, 'rising')! - Date.parse('2021-11-07T10:21:00Z'))).toBeLessThanOrEqual(MINUTE_MS);
    expect(Math.abs(crossingAt(s, -12, 'rising')! - Date.parse('2021-11-07T10:49:00Z'))).toBeLessThanOrEqual(MINUTE_MS);
    expect(Math.abs(crossingAt(s, -6, 'rising')! - Date.parse('2021-11-07T11:17:00Z'))).toBeLessThanOrEqual(MINUTE_MS);
  });

  it('at 60 N in June the night gets no further than nautical twilight: no -12 or -18 crossing', () => {
    // At 60 N the June Sun gets no lower than 90 - 60 - 23.44 = -6.56 deg (computed).
    const s = series({ lat: 60, lon: 0, elevationM: 0 }, '2027-06-20');
    expect(s.twilight.map((x) => x.kind)).toEqual(['day', 'civil-twilight', 'nautical-twilight', 'civil-twilight', 'day']);
    expect(crossingAt(s, -12, 'setting')).toBeNull();
    expect(crossingAt(s, -18, 'setting')).toBeNull();
    expect(Math.min(...s.sunAltDeg)).toBeCloseTo(-6.56, 0);
  });

  it('under the midnight sun (70 N in June) shows 6 h either side of the lowest Sun, all day', () => {
    const s = series({ lat: 70, lon: 20, elevationM: 0 }, '2027-06-20');
    expect(s.twilight.map((x) => x.kind)).toEqual(['day']);
    expect(s.span.endMs - s.span.startMs).toBeGreaterThanOrEqual(12 * HOUR_MS - s.stepMs);
  });
});

describe('the target curve', () => {
  it('agrees with targetHorizontal between samples to 0.05 deg (linear drawing between 5 min samples)', () => {
    const s = series(KESTREL_SITE, '2027-05-10');
    for (let i = 1; i < s.timesMs.length; i += 7) {
      const mid = (s.timesMs[i - 1]! + s.timesMs[i]!) / 2;
      const drawn = (s.targetAltDeg[i - 1]! + s.targetAltDeg[i]!) / 2;
      expect(Math.abs(drawn - targetHorizontal(GC, KESTREL_SITE, new Date(mid)).altitudeDeg)).toBeLessThan(0.05);
    }
  });

  it('agrees at the samples with astronomy-engine DefineStar + Equator + Horizon to 0.02 deg', () => {
    // An independent path through astronomy-engine: a user-defined star (J2000, with aberration)
    // instead of the J2000 -> of-date rotation; they differ by aberration (<= 20.5 arcsec).
    DefineStar(Body.Star1, GC.raHours, GC.decDeg, 1000);
    const observer = new Observer(KESTREL_SITE.lat, KESTREL_SITE.lon, KESTREL_SITE.elevationM);
    const s = series(KESTREL_SITE, '2027-05-10');
    for (let i = 0; i < s.timesMs.length; i += 5) {
      const time = MakeTime(new Date(s.timesMs[i]!));
      const eq = Equator(Body.Star1, time, observer, true, true);
      const hor = Horizon(time, observer, eq.ra, eq.dec, 'normal');
      expect(Math.abs(s.targetAltDeg[i]! - hor.altitude)).toBeLessThan(0.02);
      const dAz = ((s.targetAzDeg[i]! - hor.azimuth + 540) % 360) - 180;
      expect(Math.abs(dAz * Math.cos((hor.altitude * Math.PI) / 180))).toBeLessThan(0.02);
    }
  });
});

describe('the frame runs', () => {
  it('match a 10 s scan of targetHorizontal to 30 s at each end', () => {
    const s = series(KESTREL_SITE, '2027-05-10');
    expect(s.frameRuns.length).toBeGreaterThan(0);
    const inFrame = (ms: number): boolean => {
      const p = targetHorizontal(GC, KESTREL_SITE, new Date(ms));
      const d = ((p.azimuthDeg - KESTREL_FRAME.azimuthDeg + 540) % 360) - 180;
      return Math.abs(d) < KESTREL_FRAME.halfWidthDeg && p.altitudeDeg > KESTREL_FRAME.bottomAltDeg && p.altitudeDeg < KESTREL_FRAME.topAltDeg;
    };
    const scanned: Array<[number, number]> = [];
    let open: number | null = null;
    for (let t = s.span.startMs; t <= s.span.endMs; t += 10_000) {
      const inside = inFrame(t);
      if (inside && open === null) open = t;
      if (!inside && open !== null) {
        scanned.push([open, t]);
        open = null;
      }
    }
    expect(s.frameRuns).toHaveLength(scanned.length);
    s.frameRuns.forEach((run, i) => {
      expect(Math.abs(run.startMs - scanned[i]![0])).toBeLessThan(30_000);
      expect(Math.abs(run.endMs - scanned[i]![1])).toBeLessThan(30_000);
    });
  });

  it('contain the lineup the engine finds that night (Sun below -18, Moon ignored)', () => {
    const s = series(KESTREL_SITE, '2027-05-10');
    const lineups = searchLineups(KESTREL_FRAME, KESTREL_SITE, GC, new Date(s.window.startMs), new Date(s.window.endMs), { moon: { maxIllumination: 1 }, minDurationMin: 0 });
    expect(lineups).toHaveLength(1);
    const run = s.frameRuns[0]!;
    // Both end at the frame here (the passage lies in full darkness); 30 s for the chart's sampling.
    expect(Math.abs(lineups[0]!.start.getTime() - run.startMs)).toBeLessThan(30_000);
    expect(Math.abs(lineups[0]!.end.getTime() - run.endMs)).toBeLessThan(30_000);
  });
});

describe('input guards', () => {
  const base = { site: KESTREL_SITE, timeZone: 'Europe/London', date: '2027-05-10', target: GC, frame: KESTREL_FRAME };
  it.each([
    ['a NaN latitude', { site: { ...KESTREL_SITE, lat: Number.NaN } }],
    ['an unknown zone', { timeZone: 'Nowhere/Land' }],
    ['a date that does not exist', { date: '2027-02-30' }],
    ['RA of 24 h', { target: { raHours: 24, decDeg: 0 } }],
    ['a frame with top below bottom', { frame: { ...KESTREL_FRAME, topAltDeg: 0, bottomAltDeg: 5 } }],
    ['a step of 0 min', { stepMin: 0 }],
    ['a step of 45 min', { stepMin: 45 }],
    ['a negative margin', { marginMin: -1 }],
  ])('rejects %s', (_label, change) => {
    expect(() => nightChartSeries({ ...base, ...change })).toThrow(RangeError);
  });
});
