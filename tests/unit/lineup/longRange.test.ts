import { describe, expect, it } from 'vitest';
import { computeDarkWindows, searchLineups, type Lineup } from '../../../shared/lineup';
import { compareWithOracle } from './compareWithOracle';

// Galactic centre, J2000 (IAU frame as astropy defines it, REFERENCES.md).
const GALACTIC_CENTRE = { raHours: 17 + 45 / 60 + 37.2 / 3600, decDeg: -(28 + 56 / 60 + 10.2 / 3600) };
const SITE = { lat: -31.3, lon: 149.1, elevationM: 1100 };
const FRAME = { azimuthDeg: 120, halfWidthDeg: 30, bottomAltDeg: 2, topAltDeg: 40 };
const d = (iso: string): Date => new Date(iso);

describe('ten-year searches', () => {
  const ten = searchLineups(FRAME, SITE, GALACTIC_CENTRE, d('2027-01-01T00:00:00Z'), d('2037-01-01T00:00:00Z'), { minDurationMin: 0 });

  it('equal the yearly searches joined, except for lineups cut by the year boundaries', () => {
    const yearly: Lineup[] = [];
    for (let y = 2027; y < 2037; y++) {
      yearly.push(...searchLineups(FRAME, SITE, GALACTIC_CENTRE, d(`${y}-01-01T00:00:00Z`), d(`${y + 1}-01-01T00:00:00Z`), { minDurationMin: 0 }));
    }
    const cut = (l: Lineup): boolean => l.start.getUTCMonth() === 0 && l.start.getUTCDate() === 1 && l.start.getUTCHours() === 0 && l.start.getUTCMinutes() === 0;
    const cutEnd = (l: Lineup): boolean => l.end.getUTCMonth() === 0 && l.end.getUTCDate() === 1 && l.end.getUTCHours() === 0 && l.end.getUTCMinutes() === 0;
    const a = ten.filter((l) => !cut(l) && !cutEnd(l));
    const b = yearly.filter((l) => !cut(l) && !cutEnd(l));
    expect(a.length).toBeGreaterThan(1000);
    expect(b.length).toBe(a.length);
    // The two differ only by where the daily solutions and the apparent-place nodes fall (a few
    // hundredths of a second).
    a.forEach((l, i) => {
      expect(Math.abs(l.start.getTime() - b[i]!.start.getTime())).toBeLessThan(100);
      expect(Math.abs(l.end.getTime() - b[i]!.end.getTime())).toBeLessThan(100);
    });
  });

  it('stay on the oracle in the tenth year of the range (no drift)', () => {
    const { engine } = compareWithOracle({
      name: 'tenth year',
      site: SITE,
      frame: FRAME,
      target: GALACTIC_CENTRE,
      from: '2036-06-01T00:00:00Z',
      to: '2036-07-01T00:00:00Z',
      conditions: { sunMaxAltDeg: -18, moon: 'down' },
      minLineups: 10,
    });
    for (const l of engine) {
      const match = ten.find((x) => x.start.getTime() < l.end.getTime() && l.start.getTime() < x.end.getTime());
      expect(match).toBeDefined();
      // Inside the month the two searches agree to hundredths of a second; at its ends the month's
      // search is clipped.
      if (l.start.getTime() > Date.parse('2036-06-01T00:00:00Z') && l.end.getTime() < Date.parse('2036-07-01T00:00:00Z')) {
        expect(Math.abs(match!.start.getTime() - l.start.getTime())).toBeLessThan(100);
        expect(Math.abs(match!.end.getTime() - l.end.getTime())).toBeLessThan(100);
      }
    }
  });
});

describe('range edges', () => {
  it('clips lineups and dark windows to a range that starts and ends inside them', () => {
    const month = searchLineups(FRAME, SITE, GALACTIC_CENTRE, d('2027-04-01T00:00:00Z'), d('2027-05-01T00:00:00Z'), { minDurationMin: 30 });
    expect(month.length).toBeGreaterThan(0);
    const l = month[0]!;
    const from = new Date((l.start.getTime() * 2 + l.end.getTime()) / 3);
    const to = new Date((l.start.getTime() + l.end.getTime() * 2) / 3);
    const inner = searchLineups(FRAME, SITE, GALACTIC_CENTRE, from, to, { minDurationMin: 0 });
    expect(inner).toHaveLength(1);
    expect(inner[0]!.start).toEqual(from);
    expect(inner[0]!.end).toEqual(to);
    const windows = computeDarkWindows(SITE, from, to).windows;
    expect(windows).toEqual([{ startMs: from.getTime(), endMs: to.getTime() }]);
  });

  it('handles a range shorter than a minute', () => {
    const from = d('2027-06-10T15:00:00Z');
    const to = d('2027-06-10T15:00:30Z');
    expect(() => searchLineups(FRAME, SITE, GALACTIC_CENTRE, from, to)).not.toThrow();
    expect(searchLineups(FRAME, SITE, GALACTIC_CENTRE, from, to)).toEqual([]);
  });
});
