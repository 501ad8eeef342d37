import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  equatorialJ2000ToGalactic,
  GALACTIC_CENTRE_J2000,
  galacticPlanePoints,
  galacticToEquatorialJ2000,
  NORTH_CELESTIAL_POLE_GALACTIC_LON_DEG,
  NORTH_GALACTIC_POLE_DEC_DEG,
  NORTH_GALACTIC_POLE_RA_DEG,
  SGR_A_STAR_J2000,
} from '../../../shared/sky/galactic';

const ARCSEC_DEG = 1 / 3600;

/** Angular separation, degrees, of two J2000 positions (RA in hours). */
function separationDeg(a: { raHours: number; decDeg: number }, b: { raHours: number; decDeg: number }): number {
  const r = Math.PI / 180;
  const c =
    Math.sin(a.decDeg * r) * Math.sin(b.decDeg * r) + Math.cos(a.decDeg * r) * Math.cos(b.decDeg * r) * Math.cos((a.raHours - b.raHours) * 15 * r);
  return Math.acos(Math.max(-1, Math.min(1, c))) / r;
}

describe('galactic frame (IAU, as astropy defines it)', () => {
  // REFERENCES.md, Sky positions J2000: astropy's constants (NGP RA 192.8594812065348 deg,
  // Dec +27.12825118085622 deg, l of the celestial pole 122.9319185680026 deg).
  it('uses the astropy constants', () => {
    expect(NORTH_GALACTIC_POLE_RA_DEG).toBe(192.8594812065348);
    expect(NORTH_GALACTIC_POLE_DEC_DEG).toBe(27.12825118085622);
    expect(NORTH_CELESTIAL_POLE_GALACTIC_LON_DEG).toBe(122.9319185680026);
  });

  // REFERENCES.md: l = 0, b = 0 is at RA 17h45m37.20s, Dec -28d56m10.2s (*computed* from those
  // constants). Tolerance 1 arcsec.
  it('puts l = 0, b = 0 at 17h45m37.20s -28d56m10.2s within 1 arcsec', () => {
    const expected = { raHours: 17 + 45 / 60 + 37.2 / 3600, decDeg: -(28 + 56 / 60 + 10.2 / 3600) };
    expect(separationDeg(GALACTIC_CENTRE_J2000, expected)).toBeLessThan(ARCSEC_DEG);
    expect(separationDeg(galacticToEquatorialJ2000(0, 0), expected)).toBeLessThan(ARCSEC_DEG);
  });

  // Definition of the frame: the galactic pole has b = 90 and the celestial pole has
  // l = 122.9319185680026 deg, b = Dec of the galactic pole.
  it('maps the poles as the frame defines them', () => {
    const ngp = equatorialJ2000ToGalactic({ raHours: NORTH_GALACTIC_POLE_RA_DEG / 15, decDeg: NORTH_GALACTIC_POLE_DEC_DEG });
    expect(ngp.bDeg).toBeCloseTo(90, 9);
    const ncp = equatorialJ2000ToGalactic({ raHours: 0, decDeg: 90 });
    expect(ncp.lDeg).toBeCloseTo(NORTH_CELESTIAL_POLE_GALACTIC_LON_DEG, 9);
    expect(ncp.bDeg).toBeCloseTo(NORTH_GALACTIC_POLE_DEC_DEG, 9);
  });

  // REFERENCES.md: Sgr A* at 17h45m40.04s -29d00m28.1s, the alternative "galactic centre". It lies
  // just west of l = 0 and just south of b = 0, 4.4 arcmin from l = 0, b = 0 (*computed* from the
  // two REFERENCES.md positions with the spherical law of cosines).
  it('places Sgr A* 4.4 arcmin from l = 0, b = 0', () => {
    const g = equatorialJ2000ToGalactic(SGR_A_STAR_J2000);
    expect(g.lDeg).toBeGreaterThan(359.9);
    expect(g.bDeg).toBeLessThan(0);
    expect(g.bDeg).toBeGreaterThan(-0.1);
    expect(Math.abs(separationDeg(SGR_A_STAR_J2000, GALACTIC_CENTRE_J2000) * 60 - 4.4)).toBeLessThan(0.1);
  });

  it('round-trips galactic -> J2000 -> galactic to 1e-9 deg', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 359.999, noNaN: true }), fc.double({ min: -89.9, max: 89.9, noNaN: true }), (l, b) => {
        const back = equatorialJ2000ToGalactic(galacticToEquatorialJ2000(l, b));
        const dl = ((back.lDeg - l + 540) % 360) - 180;
        expect(Math.abs(dl * Math.cos((b * Math.PI) / 180))).toBeLessThan(1e-9);
        expect(Math.abs(back.bDeg - b)).toBeLessThan(1e-9);
      }),
      { numRuns: 200, seed: 7 },
    );
  });

  it('wraps longitudes and rejects bad input', () => {
    const a = galacticToEquatorialJ2000(-10, 5);
    const b = galacticToEquatorialJ2000(350, 5);
    expect(separationDeg(a, b)).toBeLessThan(1e-9);
    expect(() => galacticToEquatorialJ2000(0, 91)).toThrow(RangeError);
    expect(() => galacticToEquatorialJ2000(Number.NaN, 0)).toThrow(RangeError);
    expect(() => equatorialJ2000ToGalactic({ raHours: 25, decDeg: 0 })).toThrow(RangeError);
  });
});

describe('galactic plane points', () => {
  it('lie on b = 0, spaced by the step, in longitude order', () => {
    const points = galacticPlanePoints(2);
    expect(points).toHaveLength(180);
    expect(points[0]?.lDeg).toBe(0);
    points.forEach((p, i) => {
      expect(p.lDeg).toBeCloseTo(2 * i, 9);
      expect(Math.abs(equatorialJ2000ToGalactic(p).bDeg)).toBeLessThan(1e-9);
      expect(p.raHours).toBeGreaterThanOrEqual(0);
      expect(p.raHours).toBeLessThan(24);
      const next = points[(i + 1) % points.length];
      if (next) expect(separationDeg(p, next)).toBeCloseTo(2, 9);
    });
  });

  // The galactic plane is inclined 62.87 deg (= 90 - Dec of the pole) to the equator, so its
  // points reach Dec +-62.87 deg (*computed* from the frame).
  it('reaches declination +-(90 - Dec of the galactic pole)', () => {
    const decs = galacticPlanePoints(0.5).map((p) => p.decDeg);
    expect(Math.max(...decs)).toBeCloseTo(90 - NORTH_GALACTIC_POLE_DEC_DEG, 3);
    expect(Math.min(...decs)).toBeCloseTo(-(90 - NORTH_GALACTIC_POLE_DEC_DEG), 3);
  });

  it.each([0, 0.05, 100, Number.NaN])('rejects step %s', (step) => {
    expect(() => galacticPlanePoints(step)).toThrow(RangeError);
  });
});
