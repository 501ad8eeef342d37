import { describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import { findTarget } from '../../../shared/sky/catalogue';
import { nightReport } from '../../../shared/sky/night';
import { targetHorizontal } from '../../../shared/sky/positions';
import type { ObserverSite } from '../../../shared/schemas/geometry';

const STEP_MS = 5 * 60_000;
const galacticCentre = findTarget('galactic-centre') ?? { raHours: Number.NaN, decDeg: Number.NaN };

/** Local dates from `first` to `last` inclusive, 'YYYY-MM-DD'. */
function dates(first: string, last: string): string[] {
  const out: string[] = [];
  const end = DateTime.fromISO(last, { zone: 'UTC' });
  for (let d = DateTime.fromISO(first, { zone: 'UTC' }); d <= end; d = d.plus({ days: 1 })) out.push(d.toISODate() ?? '');
  return out;
}

interface Highest {
  /** Highest apparent altitude (astronomy-engine 'normal' refraction), degrees. */
  apparentDeg: number;
  /** Highest geometric (airless) altitude, degrees. */
  geometricDeg: number;
  /** Highest apparent altitude of each night, degrees (-Infinity for a night without darkness). */
  apparentPerNightDeg: number[];
}

/**
 * Highest altitude of the galactic centre while the Sun is below -18 deg, over the nights that
 * start on the evenings of the given local dates: the dark intervals come from nightReport, the
 * target is sampled every 5 minutes within them, ends included.
 */
function highestInDark(site: ObserverSite, nights: string[]): Highest {
  let geometricDeg = -Infinity;
  const apparentPerNightDeg = nights.map((date) => {
    let best = -Infinity;
    for (const interval of nightReport(site, date, { skipMoon: true }).darkIntervals) {
      const end = interval.end.utc.getTime();
      for (let t = interval.start.utc.getTime(); ; t = Math.min(t + STEP_MS, end)) {
        const when = new Date(t);
        best = Math.max(best, targetHorizontal(galacticCentre, site, when).altitudeDeg);
        geometricDeg = Math.max(geometricDeg, targetHorizontal(galacticCentre, site, when, { refraction: false }).altitudeDeg);
        if (t === end) break;
      }
    }
    return best;
  });
  return { apparentDeg: Math.max(...apparentPerNightDeg), geometricDeg, apparentPerNightDeg };
}

describe('season of the galactic centre (common practice)', () => {
  const site: ObserverSite = { lat: 52, lon: -1, elevationM: 0 };

  // Common practice (REFERENCES.md, rules of thumb of the trade): at 52 N the core is out of reach
  // in winter: it never reaches 5 deg in a dark sky (Sun below -18 deg) between 2026-11-15 and
  // 2027-01-31 (nights starting on those evenings). REFERENCES.md gives the highest altitude then
  // as -1.9 deg (*computed* with astronomy-engine at 5-minute steps); that figure matches the
  // geometric (airless) altitude, checked within 0.3 deg. Near and below the horizon refraction
  // adds about 0.6 deg, so the apparent altitude is checked against the 5 deg rule only.
  it('stays below 5 deg in a dark sky at 52 N, 1 W from 2026-11-15 to 2027-01-31', () => {
    const h = highestInDark(site, dates('2026-11-15', '2027-01-31'));
    expect(h.apparentPerNightDeg.every((a) => a < 5)).toBe(true);
    expect(h.apparentDeg).toBeLessThan(5);
    expect(Math.abs(h.geometricDeg - -1.9)).toBeLessThan(0.3);
  });

  // REFERENCES.md (*computed*): 3.6 deg in February 2027, 6.4 deg in March 2027 (geometric, as
  // above); within 0.3 deg. In March the core does clear 5 deg before dawn.
  it.each([
    ['2027-02-01', '2027-02-28', 3.6],
    ['2027-03-01', '2027-03-31', 6.4],
  ])('reaches the computed highest dark-sky altitude on the nights %s to %s (%s deg)', (first, last, expected) => {
    expect(Math.abs(highestInDark(site, dates(first, last)).geometricDeg - expected)).toBeLessThan(0.3);
  });

  // Common practice: at 35 S in June the core stands high in a dark sky, above 70 deg, every
  // night. REFERENCES.md gives 84 deg (*computed*; at the meridian 90 - |(-35) - (-28.94)| =
  // 83.9 deg); within 0.3 deg. Longitude 149.1 E (south-east Australia, zone Australia/Sydney).
  it('stands above 70 deg in a dark sky every June 2027 night at 35 S, 149.1 E', () => {
    const h = highestInDark({ lat: -35, lon: 149.1, elevationM: 0 }, dates('2027-06-01', '2027-06-30'));
    expect(h.apparentPerNightDeg.every((a) => a > 70)).toBe(true);
    expect(Math.abs(h.apparentDeg - 84)).toBeLessThan(0.3);
  });
});
