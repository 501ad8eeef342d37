import { describe, expect, it } from 'vitest';
import { computeFramePassages } from '../../../shared/lineup';
import { checkPeakValues, compareWithOracle, type OracleCase } from './compareWithOracle';

// OpenNGC (mattiaverga/OpenNGC, CC-BY-SA-4.0) positions, J2000: NGC 3372 (Carina nebula)
// 10h45m08.5s -59d52m04s and IC 1805 02h32m41.5s +61d27m25s (from memory of the catalogue rows,
// for test geometry only), M31 00h42m44.35s +41d16m08.6s (REFERENCES.md).
const NGC_3372 = { raHours: 10 + 45 / 60 + 8.5 / 3600, decDeg: -(59 + 52 / 60 + 4 / 3600) };
const IC_1805 = { raHours: 2 + 32 / 60 + 41.5 / 3600, decDeg: 61 + 27 / 60 + 25 / 3600 };
const M31 = { raHours: 0 + 42 / 60 + 44.35 / 3600, decDeg: 41 + 16 / 60 + 8.6 / 3600 };

const cases: OracleCase[] = [
  {
    name: 'a target that never rises at 52 N (Carina nebula) finds nothing',
    site: { lat: 52.0, lon: -1.0, elevationM: 100 },
    frame: { azimuthDeg: 180, halfWidthDeg: 40, bottomAltDeg: 0, topAltDeg: 30 },
    target: NGC_3372,
    from: '2027-02-01T00:00:00Z',
    to: '2027-03-01T00:00:00Z',
    conditions: { sunMaxAltDeg: -18, moon: { maxIllumination: 1 } },
    minLineups: 0,
  },
  {
    name: 'a frame across north (352..4 deg) with IC 1805 at lower culmination, Moon up to 50 % (45 N)',
    site: { lat: 45.0, lon: 7.0, elevationM: 0 },
    frame: { azimuthDeg: 358, halfWidthDeg: 6, bottomAltDeg: 5, topAltDeg: 25 },
    target: IC_1805,
    from: '2027-03-01T00:00:00Z',
    to: '2027-04-01T00:00:00Z',
    conditions: { sunMaxAltDeg: -18, moon: { maxIllumination: 0.5 } },
    minLineups: 15,
  },
  {
    name: 'a narrow frame centred on north (azimuth 0, 1 deg either side), Moon down (45 N)',
    site: { lat: 45.0, lon: 7.0, elevationM: 0 },
    frame: { azimuthDeg: 0, halfWidthDeg: 1, bottomAltDeg: 20, topAltDeg: 40 },
    // A custom position at Dec +75 that passes below the pole, due north, near midnight in January.
    target: { raHours: 19.6, decDeg: 75 },
    from: '2027-01-01T00:00:00Z',
    to: '2027-02-01T00:00:00Z',
    conditions: { sunMaxAltDeg: -18, moon: 'down' },
    minLineups: 8,
  },
  {
    name: 'the polar night at 85 N with M31 circling (polar method), Moon down',
    site: { lat: 85.0, lon: 20.0, elevationM: 0 },
    frame: { azimuthDeg: 90, halfWidthDeg: 30, bottomAltDeg: 35, topAltDeg: 50 },
    target: M31,
    from: '2027-12-01T00:00:00Z',
    to: '2028-01-01T00:00:00Z',
    conditions: { sunMaxAltDeg: -18, moon: 'down' },
    minLineups: 10,
  },
  {
    name: 'a zenith band on the equator (whole horizon, 70..90 deg), where the azimuth jumps',
    site: { lat: -0.5, lon: -78.5, elevationM: 2800 },
    frame: { azimuthDeg: 0, halfWidthDeg: 180, bottomAltDeg: 70, topAltDeg: 90 },
    target: { raHours: 6.0, decDeg: -0.3 },
    from: '2027-11-01T00:00:00Z',
    to: '2027-12-01T00:00:00Z',
    conditions: { sunMaxAltDeg: -18, moon: { maxIllumination: 0.6 } },
    minLineups: 10,
  },
];

describe('lineup search against the minute-by-minute oracle: edge cases', () => {
  it.each(cases)('$name: boundaries within 1 min, nothing of 2 min or more missed or invented', (c) => {
    const { worstS, engine } = compareWithOracle(c);
    expect(worstS).toBeLessThan(1);
    checkPeakValues(c, engine);
  });

  it('never puts the Carina nebula above -20 deg at 52 N (its passages through a whole-sky frame are empty)', () => {
    // Highest altitude 90 - 52 - 59.9 = -21.9 deg.
    const wholeSky = { azimuthDeg: 0, halfWidthDeg: 180, bottomAltDeg: -20, topAltDeg: 90 };
    expect(computeFramePassages(wholeSky, { lat: 52, lon: -1, elevationM: 0 }, NGC_3372, new Date('2027-01-01T00:00:00Z'), new Date('2028-01-01T00:00:00Z'))).toEqual([]);
    const lower = { ...wholeSky, bottomAltDeg: -23 };
    expect(computeFramePassages(lower, { lat: 52, lon: -1, elevationM: 0 }, NGC_3372, new Date('2027-01-01T00:00:00Z'), new Date('2027-01-03T00:00:00Z')).length).toBeGreaterThan(0);
  });
});
