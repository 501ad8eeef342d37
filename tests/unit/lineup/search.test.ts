import { describe, expect, it } from 'vitest';
import { centringFromOffsets, computeDarkWindows, lineupScore, searchLineups, type Lineup } from '../../../shared/lineup';
import { oracleTargetHorizontal } from './oracle';

// Galactic centre, J2000 RA 17h45m37.20s Dec -28d56m10.2s (IAU frame as astropy defines it, REFERENCES.md).
const GALACTIC_CENTRE = { raHours: 17 + 45 / 60 + 37.2 / 3600, decDeg: -(28 + 56 / 60 + 10.2 / 3600) };
// OpenNGC M8 = NGC 6523, 18h03m41.27s -24d22m48.6s (REFERENCES.md).
const M8 = { raHours: 18 + 3 / 60 + 41.27 / 3600, decDeg: -(24 + 22 / 60 + 48.6 / 3600) };
const SITE = { lat: 44.3, lon: 9.2, elevationM: 150 };
const FRAME = { azimuthDeg: 150, halfWidthDeg: 25, bottomAltDeg: 3, topAltDeg: 28 };
const WHOLE_SKY_ABOVE = (bottomAltDeg: number) => ({ azimuthDeg: 0, halfWidthDeg: 180, bottomAltDeg, topAltDeg: 90 });
const d = (iso: string): Date => new Date(iso);
const strip = (l: Lineup) => ({ ...l, targetIndex: 0 });

describe('searchLineups results', () => {
  const lineups = searchLineups(FRAME, SITE, GALACTIC_CENTRE, d('2027-04-01T00:00:00Z'), d('2027-10-01T00:00:00Z'));

  it('are sorted by start, last at least the default 5 minutes and peak inside themselves', () => {
    expect(lineups.length).toBeGreaterThan(40);
    for (let i = 0; i < lineups.length; i++) {
      const l = lineups[i]!;
      if (i > 0) expect(l.start.getTime()).toBeGreaterThan(lineups[i - 1]!.end.getTime());
      expect(l.durationMin).toBeGreaterThanOrEqual(5);
      // Dates hold whole milliseconds; durationMin is computed before rounding.
      expect(Math.abs(l.durationMin - (l.end.getTime() - l.start.getTime()) / 60_000)).toBeLessThan(1e-4);
      expect(l.peak.getTime()).toBeGreaterThanOrEqual(l.start.getTime());
      expect(l.peak.getTime()).toBeLessThanOrEqual(l.end.getTime());
      // A peak on the edge of a dark window sits on the -18 deg crossing (solved to 0.01 s).
      expect(l.sunAltitudeDeg).toBeLessThan(-18 + 1e-6);
      expect(l.score).toBeGreaterThan(0);
      expect(l.score).toBeLessThanOrEqual(1);
    }
  });

  it('put the peak at the best centring: no better at the start, the end or the midpoint (exact positions)', () => {
    const mid = (FRAME.bottomAltDeg + FRAME.topAltDeg) / 2;
    const half = (FRAME.topAltDeg - FRAME.bottomAltDeg) / 2;
    const centringAt = (ms: number): number => {
      const h = oracleTargetHorizontal(SITE, GALACTIC_CENTRE, ms);
      const dAz = ((h.azimuthDeg - FRAME.azimuthDeg + 540) % 360) - 180;
      return centringFromOffsets(dAz / FRAME.halfWidthDeg, (h.altitudeDeg - mid) / half);
    };
    for (const l of lineups.slice(0, 30)) {
      expect(Math.abs(centringAt(l.peak.getTime()) - l.centring)).toBeLessThan(1e-4);
      for (const ms of [l.start.getTime(), l.end.getTime(), (l.start.getTime() + l.end.getTime()) / 2]) {
        expect(centringAt(ms)).toBeLessThanOrEqual(l.centring + 1e-4);
      }
    }
  });

  it('drop lineups shorter than minDurationMin and keep all with minDurationMin 0', () => {
    const all = searchLineups(FRAME, SITE, GALACTIC_CENTRE, d('2027-04-01T00:00:00Z'), d('2027-10-01T00:00:00Z'), { minDurationMin: 0 });
    const long = searchLineups(FRAME, SITE, GALACTIC_CENTRE, d('2027-04-01T00:00:00Z'), d('2027-10-01T00:00:00Z'), { minDurationMin: 60 });
    expect(all.filter((l) => l.durationMin >= 5)).toEqual(lineups);
    expect(long).toEqual(all.filter((l) => l.durationMin >= 60));
    expect(long.length).toBeLessThan(lineups.length);
  });

  it('give several targets in one search the same lineups as separate searches', () => {
    const both = searchLineups(FRAME, SITE, [GALACTIC_CENTRE, M8], d('2027-04-01T00:00:00Z'), d('2027-10-01T00:00:00Z'));
    const m8 = searchLineups(FRAME, SITE, M8, d('2027-04-01T00:00:00Z'), d('2027-10-01T00:00:00Z'));
    expect(both.filter((l) => l.targetIndex === 0)).toEqual(lineups);
    expect(both.filter((l) => l.targetIndex === 1).map(strip)).toEqual(m8);
    for (let i = 1; i < both.length; i++) expect(both[i]!.start.getTime()).toBeGreaterThanOrEqual(both[i - 1]!.start.getTime());
  });
});

describe('searchLineups with cached dark windows', () => {
  const from = d('2026-07-01T00:00:00Z');
  const to = d('2027-07-01T00:00:00Z');
  const conditions = { moon: { maxIllumination: 0.3 } } as const;
  const year2026 = computeDarkWindows(SITE, d('2026-01-01T00:00:00Z'), d('2027-01-01T00:00:00Z'), conditions);
  const year2027 = computeDarkWindows(SITE, d('2027-01-01T00:00:00Z'), d('2028-01-01T00:00:00Z'), conditions);

  it('finds the same lineups from two calendar-year sets (after JSON) as from its own computation', () => {
    const direct = searchLineups(FRAME, SITE, GALACTIC_CENTRE, from, to, conditions);
    const sets = JSON.parse(JSON.stringify([year2027, year2026]));
    const cached = searchLineups(FRAME, SITE, GALACTIC_CENTRE, from, to, conditions, { darkWindows: sets });
    expect(cached.length).toBe(direct.length);
    cached.forEach((l, i) => {
      const r = direct[i]!;
      expect(Math.abs(l.start.getTime() - r.start.getTime())).toBeLessThan(5);
      expect(Math.abs(l.end.getTime() - r.end.getTime())).toBeLessThan(5);
      expect(l.score).toBeCloseTo(r.score, 6);
    });
  });

  it.each([
    { name: 'other Moon rule', c: { moon: 'down' as const }, sets: () => [year2026, year2027] },
    { name: 'other Sun limit', c: { ...conditions, sunMaxAltDeg: -15 }, sets: () => [year2026, year2027] },
    { name: 'a gap in coverage', c: conditions, sets: () => [year2026] },
    { name: 'another site', c: conditions, sets: () => [{ ...year2026, site: { ...SITE, lat: 45 } }, year2027] },
  ])('refuses sets with $name', ({ c, sets }) => {
    expect(() => searchLineups(FRAME, SITE, GALACTIC_CENTRE, from, to, c, { darkWindows: sets() })).toThrow(RangeError);
  });
});

describe('searchLineups input guards', () => {
  it.each([
    { name: 'NaN right ascension', targets: { raHours: Number.NaN, decDeg: 0 } },
    { name: 'RA 24 h', targets: { raHours: 24, decDeg: 0 } },
    { name: 'declination 91', targets: { raHours: 1, decDeg: 91 } },
    { name: 'no target', targets: [] },
    { name: '101 targets', targets: Array.from({ length: 101 }, () => GALACTIC_CENTRE) },
  ])('rejects $name', ({ targets }) => {
    expect(() => searchLineups(FRAME, SITE, targets, d('2027-01-01T00:00:00Z'), d('2027-02-01T00:00:00Z'))).toThrow(RangeError);
  });

  it.each([
    { name: 'an invalid date', from: new Date('nonsense'), to: d('2027-02-01T00:00:00Z'), c: {} },
    { name: 'from after to', from: d('2027-02-01T00:00:00Z'), to: d('2027-01-01T00:00:00Z'), c: {} },
    { name: 'more than ten years', from: d('2027-01-01T00:00:00Z'), to: d('2037-01-02T00:00:00Z'), c: {} },
    { name: 'a negative minimum duration', from: d('2027-01-01T00:00:00Z'), to: d('2027-02-01T00:00:00Z'), c: { minDurationMin: -1 } },
    { name: 'an unknown Moon rule', from: d('2027-01-01T00:00:00Z'), to: d('2027-02-01T00:00:00Z'), c: { moon: 'up' as unknown as 'down' } },
  ])('rejects $name', ({ from, to, c }) => {
    expect(() => searchLineups(FRAME, SITE, GALACTIC_CENTRE, from, to, c)).toThrow(RangeError);
  });

  it('rejects a longitude out of range', () => {
    expect(() => searchLineups(FRAME, { lat: 0, lon: 181, elevationM: 0 }, GALACTIC_CENTRE, d('2027-01-01T00:00:00Z'), d('2027-02-01T00:00:00Z'))).toThrow(RangeError);
  });
});

describe('the score', () => {
  const base = { centring: 1, durationMin: 30, sunAltitudeDeg: -20, moonDown: true, moonAltitudeDeg: -10, moonIllumination: 0.9 };

  it('is 0.4 C + 0.2 (1 - exp(-min/30)) + 0.2 K + 0.2 M (computed values)', () => {
    // C = 1, D = 1 - e^-1, K = 1, M = 1.
    expect(lineupScore(base)).toBeCloseTo(0.4 + 0.2 * (1 - Math.exp(-1)) + 0.2 + 0.2, 12);
    // Moon up at 30 deg, half lit: M = 1 - 0.5 * sin 30 deg = 0.75; Sun at -15 deg: K = 0.5.
    expect(lineupScore({ ...base, moonDown: false, moonAltitudeDeg: 30, moonIllumination: 0.5, sunAltitudeDeg: -15 })).toBeCloseTo(
      0.4 + 0.2 * (1 - Math.exp(-1)) + 0.2 * 0.5 + 0.2 * 0.75,
      12,
    );
    expect(centringFromOffsets(0.5, 0.5)).toBeCloseTo(0.5625, 12);
    expect(centringFromOffsets(1, 0)).toBe(0);
  });

  it('falls with a brighter or higher Moon, a shorter lineup and worse centring', () => {
    const up = { ...base, moonDown: false, moonAltitudeDeg: 20 };
    expect(lineupScore({ ...up, moonIllumination: 0.2 })).toBeGreaterThan(lineupScore({ ...up, moonIllumination: 0.8 }));
    expect(lineupScore({ ...up, moonAltitudeDeg: 10 })).toBeGreaterThan(lineupScore({ ...up, moonAltitudeDeg: 60 }));
    expect(lineupScore({ ...base, durationMin: 90 })).toBeGreaterThan(lineupScore({ ...base, durationMin: 10 }));
    expect(lineupScore({ ...base, centring: 0.9 })).toBeGreaterThan(lineupScore({ ...base, centring: 0.3 }));
    expect(() => lineupScore({ ...base, centring: Number.NaN })).toThrow(RangeError);
  });
});

describe('facts of the trade', () => {
  const sunOnly = { moon: { maxIllumination: 1 }, minDurationMin: 0 } as const;
  const at52N = { lat: 52, lon: -1, elevationM: 0 };

  // Common practice: at 52 N the galactic centre never stands 5 deg or more above the horizon in a
  // dark sky between mid-November and the end of January.
  it('keeps the galactic centre below 5 deg in every dark sky at 52 N from mid-November to January', () => {
    expect(searchLineups(WHOLE_SKY_ABOVE(5), at52N, GALACTIC_CENTRE, d('2026-11-15T00:00:00Z'), d('2027-02-01T00:00:00Z'), sunOnly)).toEqual([]);
  });

  // REFERENCES.md (computed with astronomy-engine at 5-minute steps, which can under-read a maximum by
  // up to about 0.5 deg): highest apparent altitude while the Sun is below -18 deg at 52 N 1 W is
  // -1.9 deg from 2026-11-15 to 2027-01-31, 3.6 deg in February 2027 and 6.4 deg in March 2027.
  it.each([
    { from: '2026-11-15', to: '2027-02-01', max: -1.9 },
    { from: '2027-02-01', to: '2027-03-01', max: 3.6 },
    { from: '2027-03-01', to: '2027-04-01', max: 6.4 },
  ])('puts the galactic centre highest at about $max deg in dark skies from $from', ({ from, to, max }) => {
    const reaches = (alt: number): boolean => searchLineups(WHOLE_SKY_ABOVE(alt), at52N, GALACTIC_CENTRE, d(`${from}T00:00:00Z`), d(`${to}T00:00:00Z`), sunOnly).length > 0;
    expect(reaches(max - 0.3)).toBe(true);
    expect(reaches(max + 0.7)).toBe(false);
  });

  // REFERENCES.md: at 35 S in June 2027 the galactic centre reaches 84 deg in a dark sky
  // (90 - |(-35) - (-28.9)| = 83.9 deg at culmination).
  it('lifts the galactic centre to about 84 deg in dark June skies at 35 S', () => {
    const site = { lat: -35, lon: 149, elevationM: 0 };
    const r = searchLineups(WHOLE_SKY_ABOVE(83.5), site, GALACTIC_CENTRE, d('2027-06-01T00:00:00Z'), d('2027-07-01T00:00:00Z'), sunOnly);
    expect(r.length).toBeGreaterThan(20);
    expect(Math.max(...r.map((l) => l.peakAltitudeDeg))).toBeGreaterThan(83.9);
    expect(Math.max(...r.map((l) => l.peakAltitudeDeg))).toBeLessThan(84.1);
  });
});
