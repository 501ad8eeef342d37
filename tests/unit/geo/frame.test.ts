import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import fc from 'fast-check';
import { frameFromSightline, MIN_FRAME_HALF_WIDTH_DEG, sightlineGeometry } from '../../../shared/geo/frame';
import { destinationPoint } from '../../../shared/geo/geodesy';
import { magneticDeclination } from '../../../shared/geo/magnetic';
import { frameSchema } from '../../../shared/schemas/geometry';
import type { Landmark, Vantage } from '../../../shared/schemas/geometry';

let warnSpy: ReturnType<typeof vi.spyOn>;
beforeAll(() => { warnSpy = vi.spyOn(console, 'warn').mockImplementation(() => undefined); });
afterAll(() => { warnSpy.mockRestore(); });

const vantage: Vantage = { lat: 52.1, lon: -7.1, elevationM: 0, cameraHeightM: 1.5 };

/** A landmark placed at a known WGS84 bearing and distance from the vantage. */
function landmarkAt(bearingDeg: number, distanceM: number, rest: Omit<Landmark, 'lat' | 'lon'>): Landmark {
  const p = destinationPoint(vantage, bearingDeg, distanceM);
  return { lat: p.lat, lon: p.lon, ...rest };
}

describe('frame from a sightline', () => {
  const stack = landmarkAt(250, 800, { baseElevationM: 0, heightM: 50, widthM: 40 });

  // Hand-worked (computed): 800 m, eye 1.5 m, top 50 m, k = 0.13: drop = 800^2 / 12 742 000 * 0.87
  // = 0.043698 m, bottom = atan((50 - 0.043698 - 1.5) / 800) = 3.466192 deg; half-width =
  // atan(20 / 800) = 1.432096 deg.
  it('centres on the true bearing and spans the stack: 250 deg, 1.432096 deg half-width, 3.466192 to 23.466192 deg', () => {
    const frame = frameFromSightline(vantage, stack);
    expect(Math.abs(frame.azimuthDeg - 250)).toBeLessThan(1e-9);
    expect(Math.abs(frame.halfWidthDeg - 1.432096)).toBeLessThan(1e-6);
    expect(Math.abs(frame.bottomAltDeg - 3.466192)).toBeLessThan(1e-6);
    expect(Math.abs(frame.topAltDeg - 23.466192)).toBeLessThan(1e-6);
  });

  it('takes a band height', () => {
    const frame = frameFromSightline(vantage, stack, { bandHeightDeg: 8 });
    expect(frame.topAltDeg - frame.bottomAltDeg).toBeCloseTo(8, 12);
  });

  it('lowers the bottom without refraction (k = 0)', () => {
    expect(frameFromSightline(vantage, stack, { k: 0 }).bottomAltDeg).toBeLessThan(frameFromSightline(vantage, stack).bottomAltDeg);
  });

  it('widens a thin spire to the minimum half-width of 0.5 deg', () => {
    const spire = landmarkAt(90, 3000, { baseElevationM: 0, heightM: 60, widthM: 2 });
    expect(frameFromSightline(vantage, spire).halfWidthDeg).toBe(MIN_FRAME_HALF_WIDTH_DEG);
    expect(frameFromSightline(vantage, spire, { minHalfWidthDeg: 0.1 }).halfWidthDeg).toBe(0.1);
  });

  // Hand-worked (computed): 100 m tower at 10 m, eye 1.5 m: atan(98.49999 / 10) = 84.203031 deg.
  it('caps the band at 90 deg when the landmark towers over the vantage', () => {
    const tower = landmarkAt(10, 10, { baseElevationM: 0, heightM: 100, widthM: 5 });
    const frame = frameFromSightline(vantage, tower);
    expect(Math.abs(frame.bottomAltDeg - 84.203031)).toBeLessThan(1e-5);
    expect(frame.topAltDeg).toBe(90);
  });

  it('gives an azimuth just under 360 for a landmark a little west of north', () => {
    const frame = frameFromSightline(vantage, landmarkAt(359.6, 2000, { baseElevationM: 0, heightM: 30, widthM: 30 }));
    expect(Math.abs(frame.azimuthDeg - 359.6)).toBeLessThan(1e-9);
  });

  it('makes frames that satisfy the shared frame schema for random sightlines', () => {
    fc.assert(fc.property(
      fc.double({ min: 0, max: 359.999, noNaN: true }),
      fc.double({ min: 5, max: 30_000, noNaN: true }),
      fc.double({ min: 0, max: 500, noNaN: true }),
      fc.double({ min: 0, max: 500, noNaN: true }),
      (bearing, distance, height, width) => {
        const frame = frameFromSightline(vantage, landmarkAt(bearing, distance, { baseElevationM: 0, heightM: height, widthM: width }));
        expect(frameSchema.safeParse(frame).success).toBe(true);
      },
    ), { numRuns: 300 });
  });

  it.each([
    ['a band height of 0', { bandHeightDeg: 0 }],
    ['a band height over 90', { bandHeightDeg: 91 }],
    ['a NaN minimum half-width', { minHalfWidthDeg: Number.NaN }],
    ['a refraction coefficient of 2', { k: 2 }],
  ])('throws a RangeError on %s', (_situation, options) => {
    expect(() => frameFromSightline(vantage, stack, options)).toThrow(RangeError);
  });

  it('throws a RangeError when the vantage stands on the landmark', () => {
    expect(() => frameFromSightline(vantage, { lat: vantage.lat, lon: vantage.lon, baseElevationM: 0, heightM: 5, widthM: 5 })).toThrow(RangeError);
  });
});

describe('sightline readout', () => {
  const stack = landmarkAt(250, 800, { baseElevationM: 0, heightM: 50, widthM: 40 });
  const night = new Date('2027-06-15T23:00:00Z');

  it('reads the distance, bearing, elevation angles and width of the sightline', () => {
    const g = sightlineGeometry(vantage, stack, night);
    expect(Math.abs(g.distanceM - 800)).toBeLessThan(1e-6);
    expect(Math.abs(g.trueBearingDeg - 250)).toBeLessThan(1e-9);
    expect(Math.abs(g.topElevationDeg - 3.466192)).toBeLessThan(1e-6);
    // Hand-worked (computed): atan((0 - 0.043698 - 1.5) / 800) = -0.110559 deg; 2 atan(20 / 800) = 2.864192 deg.
    expect(Math.abs(g.baseElevationDeg - -0.110559)).toBeLessThan(1e-6);
    expect(Math.abs(g.angularWidthDeg - 2.864192)).toBeLessThan(1e-6);
  });

  it('agrees with the frame it would make', () => {
    const g = sightlineGeometry(vantage, stack, night);
    const frame = frameFromSightline(vantage, stack);
    expect(frame.azimuthDeg).toBe(g.trueBearingDeg);
    expect(frame.bottomAltDeg).toBe(g.topElevationDeg);
  });

  it('gives the magnetic bearing as the true bearing less the declination at the vantage on that night', () => {
    const g = sightlineGeometry(vantage, stack, night);
    const d = magneticDeclination({ lat: vantage.lat, lon: vantage.lon, heightM: 1.5 }, night).declinationDeg;
    expect(g.declinationDeg).toBe(d);
    // In Ireland in 2027 the declination is a degree or two west: the compass reads more than the true bearing.
    expect(d).toBeLessThan(0);
    expect(Math.abs(g.magneticBearingDeg - (250 - d))).toBeLessThan(1e-9);
    expect(g.declinationWithinModelValidity).toBe(true);
    expect(g.declinationWarnings).toEqual([]);
  });

  it('flags a declination outside the model for a shoot in 2031', () => {
    const g = sightlineGeometry(vantage, stack, new Date('2031-03-01T00:00:00Z'));
    expect(g.declinationWithinModelValidity).toBe(false);
    expect(g.declinationWarnings.length).toBe(1);
  });

  it('throws a RangeError on an invalid date', () => {
    expect(() => sightlineGeometry(vantage, stack, new Date(Number.NaN))).toThrow(RangeError);
  });
});
