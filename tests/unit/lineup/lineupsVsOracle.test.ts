import { describe, expect, it } from 'vitest';
import { checkPeakValues, compareWithOracle, type OracleCase } from './compareWithOracle';

// The galactic centre (l = 0, b = 0) in J2000 from the IAU frame as astropy defines it:
// RA 17h45m37.20s, Dec -28d56m10.2s (REFERENCES.md, computed from the frame constants).
const GALACTIC_CENTRE = { raHours: 17 + 45 / 60 + 37.2 / 3600, decDeg: -(28 + 56 / 60 + 10.2 / 3600) };
// OpenNGC (mattiaverga/OpenNGC, CC-BY-SA-4.0), REFERENCES.md: NGC 7000 20h59m17.14s +44d31m43.6s.
const NGC_7000 = { raHours: 20 + 59 / 60 + 17.14 / 3600, decDeg: 44 + 31 / 60 + 43.6 / 3600 };

const cases: OracleCase[] = [
  {
    name: 'northern summer, galactic centre low in the south, Moon down (44.3 N)',
    site: { lat: 44.3, lon: 9.2, elevationM: 150 },
    frame: { azimuthDeg: 165, halfWidthDeg: 15, bottomAltDeg: 5, topAltDeg: 25 },
    target: GALACTIC_CENTRE,
    from: '2027-07-01T00:00:00Z',
    to: '2027-08-01T00:00:00Z',
    conditions: { sunMaxAltDeg: -18, moon: 'down' },
    minLineups: 6,
  },
  {
    name: 'southern winter, galactic centre rising in the east, Moon up to 25 % lit (35.3 S)',
    site: { lat: -35.3, lon: 149.1, elevationM: 600 },
    frame: { azimuthDeg: 100, halfWidthDeg: 20, bottomAltDeg: 5, topAltDeg: 35 },
    target: GALACTIC_CENTRE,
    from: '2027-05-01T00:00:00Z',
    to: '2027-06-01T00:00:00Z',
    conditions: { sunMaxAltDeg: -18, moon: { maxIllumination: 0.25 } },
    minLineups: 10,
  },
  {
    name: 'the same southern frame with the Moon down',
    site: { lat: -35.3, lon: 149.1, elevationM: 600 },
    frame: { azimuthDeg: 100, halfWidthDeg: 20, bottomAltDeg: 5, topAltDeg: 35 },
    target: GALACTIC_CENTRE,
    from: '2027-05-01T00:00:00Z',
    to: '2027-06-01T00:00:00Z',
    conditions: { sunMaxAltDeg: -18, moon: 'down' },
    minLineups: 8,
  },
  {
    name: 'high latitude summer without astronomical darkness finds nothing (57.5 N)',
    site: { lat: 57.5, lon: -4.2, elevationM: 10 },
    frame: { azimuthDeg: 70, halfWidthDeg: 30, bottomAltDeg: 35, topAltDeg: 70 },
    target: NGC_7000,
    from: '2027-06-01T00:00:00Z',
    to: '2027-07-01T00:00:00Z',
    conditions: { sunMaxAltDeg: -18, moon: { maxIllumination: 1 } },
    minLineups: 0,
  },
];

describe('lineup search against the minute-by-minute oracle', () => {
  it.each(cases)('$name: boundaries within 1 min, nothing of 2 min or more missed or invented', (c) => {
    const { worstS, engine } = compareWithOracle(c);
    // Measured accuracy (the oracle bisects to 0.2 s): far inside the 1 min contract.
    expect(worstS).toBeLessThan(1);
    checkPeakValues(c, engine);
  });

  it('finds the high-latitude frame every night once a bright twilight sky (Sun below -8 deg) is allowed', () => {
    // The midsummer Sun at 57.5 N dips to about -9 deg at midnight.
    const c: OracleCase = { ...cases[3]!, name: 'twilight', conditions: { sunMaxAltDeg: -8, moon: { maxIllumination: 1 } }, minLineups: 25 };
    const { worstS } = compareWithOracle(c);
    expect(worstS).toBeLessThan(1);
  });
});
