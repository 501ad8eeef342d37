import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { normalizeDegrees360 } from '../../../shared/units';
import {
  angularSeparationDeg,
  type CameraPose,
  focalLengthPx,
  fovFrom35mmEquivalent,
  horizontalFovDeg,
  pixelToSky,
  skyToPixel,
} from '../../../shared/projection/camera';

const RAD = Math.PI / 180;

/** A 6000 x 4000 px photo from a 24 mm lens on a 36 mm-wide sensor, level, looking north-east. */
function pose(overrides: Partial<CameraPose> = {}): CameraPose {
  return { azimuthDeg: 45, altitudeDeg: 0, rollDeg: 0, horizontalFovDeg: horizontalFovDeg(24, 36), widthPx: 6000, heightPx: 4000, ...overrides };
}

describe('horizontalFovDeg (pinhole: FOV = 2 atan(w / 2f), Hartley & Zisserman, Multiple View Geometry, ch. 6)', () => {
  it.each([
    // computed: 18/24 = 3/4 is the 3-4-5 triangle, atan(3/4) = 36.869897646 deg.
    [24, 36, 73.739795292],
    // computed: 2 atan(18/50) = 2 x 19.798876 deg.
    [50, 36, 39.597752709],
    // computed: focal length equal to half the sensor width gives 2 atan(1) = 90 deg.
    [11.8, 23.6, 90],
  ])('%s mm on a %s mm-wide sensor gives %s deg', (f, w, expected) => {
    expect(horizontalFovDeg(f, w)).toBeCloseTo(expected, 8);
  });

  it('a 35 mm-equivalent focal length uses the 36 mm frame width', () => {
    // computed: same 3-4-5 case as above.
    expect(fovFrom35mmEquivalent(24)).toBeCloseTo(73.739795292, 8);
  });

  it.each([
    [0, 36],
    [-24, 36],
    [Number.NaN, 36],
    [24, 0],
    [24, Number.POSITIVE_INFINITY],
  ])('focal %s mm, sensor %s mm is refused with a RangeError', (f, w) => {
    expect(() => horizontalFovDeg(f, w)).toThrow(RangeError);
  });

  it('the pixel focal length of 24 mm on 36 mm at 6000 px wide is 4000 px', () => {
    // computed: f_px = f_mm x width_px / sensor_mm = 24 x 6000 / 36.
    expect(focalLengthPx(horizontalFovDeg(24, 36), 6000)).toBeCloseTo(4000, 6);
  });
});

describe('skyToPixel: hand-worked pinhole cases (x = cx + f_px tan, Hartley & Zisserman)', () => {
  const fPx = 4000; // computed above: 24 mm on 36 mm, 6000 px wide

  it('a point 10 deg right of a level axis lands at x = w/2 + f_px tan 10 deg on the centre row', () => {
    // computed: 3000 + 4000 x tan(10 deg) = 3705.3079 px.
    const p = skyToPixel(pose(), { azimuthDeg: 55, altitudeDeg: 0 });
    expect(p.inFront).toBe(true);
    expect(p.x).toBeCloseTo(3000 + fPx * Math.tan(10 * RAD), 6);
    expect(p.x).toBeCloseTo(3705.3079, 3);
    expect(p.y).toBeCloseTo(2000, 6);
  });

  it('a point 5 deg above the axis lands f_px tan 5 deg above the centre', () => {
    // computed: 2000 - 4000 x tan(5 deg) = 2000 - 349.9547 = 1650.0453 px.
    const p = skyToPixel(pose(), { azimuthDeg: 45, altitudeDeg: 5 });
    expect(p.x).toBeCloseTo(3000, 6);
    expect(p.y).toBeCloseTo(1650.0453, 3);
  });

  it('with the camera rolled 90 deg clockwise, a point above the axis lands left of the centre', () => {
    // computed: the image's right now points to the world's down, its top to the world's right.
    const p = skyToPixel(pose({ rollDeg: 90 }), { azimuthDeg: 45, altitudeDeg: 5 });
    expect(p.x).toBeCloseTo(3000 - fPx * Math.tan(5 * RAD), 6);
    expect(p.y).toBeCloseTo(2000, 6);
  });

  it('with a positive roll, a level horizon rises to the right', () => {
    const rolled = pose({ rollDeg: 5 });
    const left = skyToPixel(rolled, { azimuthDeg: 35, altitudeDeg: 0 });
    const right = skyToPixel(rolled, { azimuthDeg: 55, altitudeDeg: 0 });
    expect(right.y).toBeLessThan(left.y - 100);
    // computed: the horizon through the axis is a straight line tilted by the roll.
    expect(Math.atan2(left.y - right.y, right.x - left.x) / RAD).toBeCloseTo(5, 9);
  });
});

describe('skyToPixel and pixelToSky: centre and edges', () => {
  it.each([
    [45, 0, 0],
    [350, 30, 10],
    [180, -20, -45],
    [0, 89, 0],
    [270, 90, 30],
  ])('the image centre looks along the axis (az %s, alt %s, roll %s) and back', (az, alt, roll) => {
    const p = pose({ azimuthDeg: az, altitudeDeg: alt, rollDeg: roll });
    const c = skyToPixel(p, { azimuthDeg: az, altitudeDeg: alt });
    expect(c.x).toBeCloseTo(3000, 6);
    expect(c.y).toBeCloseTo(2000, 6);
    expect(angularSeparationDeg(pixelToSky(p, { x: 3000, y: 2000 }), { azimuthDeg: az, altitudeDeg: alt })).toBeLessThan(1e-9);
  });

  it.each([10, 50, 73.74, 120, 170])('for a level camera with roll 0 and %s deg FOV, half the FOV to each side lands on the edges', (fov) => {
    const p = pose({ horizontalFovDeg: fov });
    const left = skyToPixel(p, { azimuthDeg: normalizeDegrees360(45 - fov / 2), altitudeDeg: 0 });
    const right = skyToPixel(p, { azimuthDeg: 45 + fov / 2, altitudeDeg: 0 });
    expect(left.x).toBeCloseTo(0, 6);
    expect(right.x).toBeCloseTo(6000, 6);
    expect(left.y).toBeCloseTo(2000, 6);
    expect(right.y).toBeCloseTo(2000, 6);
  });

  it.each([
    [30, 0],
    [-40, 20],
    [75, -15],
  ])('for an axis at altitude %s deg (roll %s), the edge midpoints are half the FOV from the axis', (alt, roll) => {
    const p = pose({ altitudeDeg: alt, rollDeg: roll });
    const axis = { azimuthDeg: 45, altitudeDeg: alt };
    for (const x of [0, 6000]) {
      // computed: the edge midpoint is tan^-1((w/2) / f_px) = FOV/2 off the axis.
      expect(angularSeparationDeg(pixelToSky(p, { x, y: 2000 }), axis)).toBeCloseTo(p.horizontalFovDeg / 2, 9);
    }
  });

  it('a direction behind the camera is reported as not in front, without coordinates', () => {
    const p = skyToPixel(pose(), { azimuthDeg: 225, altitudeDeg: 0 });
    expect(p.inFront).toBe(false);
    expect(Number.isNaN(p.x) && Number.isNaN(p.y)).toBe(true);
    expect(skyToPixel(pose(), { azimuthDeg: 135.01, altitudeDeg: 0 }).inFront).toBe(false);
    expect(skyToPixel(pose(), { azimuthDeg: 134.99, altitudeDeg: 0 }).inFront).toBe(true);
  });

  it.each([
    ['azimuth NaN', { azimuthDeg: Number.NaN }],
    ['azimuth 361', { azimuthDeg: 361 }],
    ['altitude 91', { altitudeDeg: 91 }],
    ['roll 181', { rollDeg: 181 }],
    ['FOV 0.5', { horizontalFovDeg: 0.5 }],
    ['FOV 180', { horizontalFovDeg: 180 }],
    ['width 0', { widthPx: 0 }],
    ['height NaN', { heightPx: Number.NaN }],
  ])('a pose with %s is refused with a RangeError', (_label, bad) => {
    expect(() => skyToPixel(pose(bad), { azimuthDeg: 45, altitudeDeg: 0 })).toThrow(RangeError);
    expect(() => pixelToSky(pose(bad), { x: 0, y: 0 })).toThrow(RangeError);
  });

  it('a sky point or pixel that is not finite is refused with a RangeError', () => {
    expect(() => skyToPixel(pose(), { azimuthDeg: 45, altitudeDeg: Number.NaN })).toThrow(RangeError);
    expect(() => skyToPixel(pose(), { azimuthDeg: -1, altitudeDeg: 0 })).toThrow(RangeError);
    expect(() => pixelToSky(pose(), { x: Number.POSITIVE_INFINITY, y: 0 })).toThrow(RangeError);
  });
});

const poseArb = fc.record({
  azimuthDeg: fc.double({ min: 0, max: 360, noNaN: true }),
  altitudeDeg: fc.double({ min: -90, max: 90, noNaN: true }),
  rollDeg: fc.double({ min: -180, max: 180, noNaN: true }),
  horizontalFovDeg: fc.double({ min: 1, max: 150, noNaN: true }),
  widthPx: fc.integer({ min: 100, max: 10_000 }),
  heightPx: fc.integer({ min: 100, max: 10_000 }),
});
const fractionArb = fc.double({ min: 0, max: 1, noNaN: true });

describe('round trip over random poses and points in view (fast-check)', () => {
  it('sky -> pixel -> sky returns the direction within 0.01 deg', () => {
    fc.assert(
      fc.property(poseArb, fractionArb, fractionArb, (p, fx, fy) => {
        // A direction in view: the one seen at a random pixel of the image.
        const sky = pixelToSky(p, { x: fx * p.widthPx, y: fy * p.heightPx });
        const px = skyToPixel(p, sky);
        expect(px.inFront).toBe(true);
        expect(angularSeparationDeg(pixelToSky(p, px), sky)).toBeLessThan(0.01);
        expect(Math.hypot(px.x - fx * p.widthPx, px.y - fy * p.heightPx)).toBeLessThan(1e-6 * p.widthPx);
      }),
      { numRuns: 500 },
    );
  });

  it('a pixel at distance r from the centre looks atan(r / f_px) off the axis', () => {
    fc.assert(
      fc.property(poseArb, fractionArb, fractionArb, (p, fx, fy) => {
        const x = fx * p.widthPx;
        const y = fy * p.heightPx;
        const r = Math.hypot(x - p.widthPx / 2, y - p.heightPx / 2);
        const fPx = p.widthPx / 2 / Math.tan((p.horizontalFovDeg / 2) * RAD);
        // computed: pinhole geometry, the ray makes angle atan(r / f) with the optical axis.
        const off = angularSeparationDeg(pixelToSky(p, { x, y }), { azimuthDeg: p.azimuthDeg, altitudeDeg: p.altitudeDeg });
        expect(off).toBeCloseTo(Math.atan(r / fPx) / RAD, 6);
      }),
      { numRuns: 300 },
    );
  });
});

describe('skyToPixel agrees with the published gnomonic projection formulas (fast-check)', () => {
  // Snyder, "Map Projections: A Working Manual", USGS Professional Paper 1395 (1987), ch. 22,
  // gnomonic projection, spherical formulas (transcribed from memory), with longitude = azimuth
  // and latitude = altitude, centre (az0, alt0):
  //   cos c = sin alt0 sin alt + cos alt0 cos alt cos(az - az0),  k' = 1 / cos c
  //   x = k' cos alt sin(az - az0),  y = k' (cos alt0 sin alt - sin alt0 cos alt cos(az - az0))
  // Pixels: px = w/2 + f_px (x cos roll - y sin roll), py = h/2 - f_px (y cos roll + x sin roll)
  // (computed: the roll turns the camera's axes, positive tipping its top toward its right).
  it('matches within 1e-6 of the image width for points in front', () => {
    fc.assert(
      fc.property(
        poseArb,
        fc.double({ min: 0, max: 360, noNaN: true }),
        fc.double({ min: -90, max: 90, noNaN: true }),
        (p, az, alt) => {
          const a0 = p.altitudeDeg * RAD;
          const a = alt * RAD;
          const dl = (az - p.azimuthDeg) * RAD;
          const cosC = Math.sin(a0) * Math.sin(a) + Math.cos(a0) * Math.cos(a) * Math.cos(dl);
          fc.pre(cosC > 0.05);
          const x = (Math.cos(a) * Math.sin(dl)) / cosC;
          const y = (Math.cos(a0) * Math.sin(a) - Math.sin(a0) * Math.cos(a) * Math.cos(dl)) / cosC;
          const r = p.rollDeg * RAD;
          const fPx = p.widthPx / 2 / Math.tan((p.horizontalFovDeg / 2) * RAD);
          const got = skyToPixel(p, { azimuthDeg: az, altitudeDeg: alt });
          expect(got.inFront).toBe(true);
          const tol = 1e-6 * p.widthPx * Math.max(1, 1 / cosC);
          expect(Math.abs(got.x - (p.widthPx / 2 + fPx * (x * Math.cos(r) - y * Math.sin(r))))).toBeLessThan(tol);
          expect(Math.abs(got.y - (p.heightPx / 2 - fPx * (y * Math.cos(r) + x * Math.sin(r))))).toBeLessThan(tol);
        },
      ),
      { numRuns: 500 },
    );
  });
});
