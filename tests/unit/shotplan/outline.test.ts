import { describe, expect, it } from 'vitest';
import { skyToPixel } from '../../../shared/projection/camera';
import { frameOutlineDirections, unwrapAzimuthDeg, unwrapAzimuthSequence } from '../../../shared/shotplan/outline';

const RAD = Math.PI / 180;

describe('frameOutlineDirections: a level frame\'s edge on the sky (pinhole model, Hartley & Zisserman ch. 6)', () => {
  const fov = { horizontalDeg: 90, verticalDeg: 60 };
  const outline = frameOutlineDirections({ azimuthDeg: 180, altitudeDeg: 0 }, fov, 4);

  it('goes round the border once, four points an edge, from the top-left corner', () => {
    expect(outline).toHaveLength(16);
    // The top-left corner of a level frame on the horizon has camera coordinates (-tan 45, tan 30, 1):
    // azimuth 45 deg left of the axis, altitude atan(tan 30 / sqrt(1 + tan^2 45)) = 22.21 deg (computed).
    expect(outline[0]!.azimuthDeg).toBeCloseTo(135, 9);
    expect(outline[0]!.altitudeDeg).toBeCloseTo(Math.atan(Math.tan(30 * RAD) / Math.SQRT2) / RAD, 9);
    expect(outline[0]!.altitudeDeg).toBeCloseTo(22.21, 2);
    // The middle of the top edge is straight above the axis at half the vertical angle: alt 30 deg.
    expect(outline[2]!.azimuthDeg).toBeCloseTo(180, 9);
    expect(outline[2]!.altitudeDeg).toBeCloseTo(30, 9);
    // The middle of the right edge lies on the horizon 45 deg to the right.
    expect(outline[6]!.azimuthDeg).toBeCloseTo(225, 9);
    expect(outline[6]!.altitudeDeg).toBeCloseTo(0, 9);
  });

  it('lands on the border of the image when projected back with the same camera', () => {
    const pose = { azimuthDeg: 200, altitudeDeg: 35, rollDeg: 0, horizontalFovDeg: 60, widthPx: 600, heightPx: 600 * Math.tan(20 * RAD) / Math.tan(30 * RAD) };
    const points = frameOutlineDirections({ azimuthDeg: 200, altitudeDeg: 35 }, { horizontalDeg: 60, verticalDeg: 40 }, 10);
    for (const p of points) {
      const px = skyToPixel(pose, p);
      expect(px.inFront).toBe(true);
      const onBorder = Math.min(Math.abs(px.x), Math.abs(px.x - pose.widthPx), Math.abs(px.y), Math.abs(px.y - pose.heightPx));
      expect(onBorder).toBeLessThan(1e-6);
    }
  });

  it('refuses bad input', () => {
    expect(() => frameOutlineDirections({ azimuthDeg: 400, altitudeDeg: 0 }, fov)).toThrow(RangeError);
    expect(() => frameOutlineDirections({ azimuthDeg: 0, altitudeDeg: 0 }, { horizontalDeg: 180, verticalDeg: 60 })).toThrow(RangeError);
    expect(() => frameOutlineDirections({ azimuthDeg: 0, altitudeDeg: 0 }, fov, 0)).toThrow(RangeError);
  });
});

describe('unwrapAzimuthDeg and unwrapAzimuthSequence: continuous azimuths for flat sketches', () => {
  it.each([
    [350, 0, -10],
    [10, 350, 370],
    [180, 0, -180],
    [179, 0, 179],
    [720, 10, 0],
    [45, 45, 45],
  ])('%s deg near %s deg is %s deg', (az, around, expected) => {
    expect(unwrapAzimuthDeg(az, around)).toBeCloseTo(expected, 12);
  });

  it('keeps a path across north in one piece', () => {
    expect(unwrapAzimuthSequence([350, 355, 5, 10, 20], 0)).toEqual([-10, -5, 5, 10, 20]);
    expect(unwrapAzimuthSequence([170, 190, 210], 180)).toEqual([170, 190, 210]);
    expect(unwrapAzimuthSequence([], 0)).toEqual([]);
  });

  it('refuses a non-finite azimuth', () => {
    expect(() => unwrapAzimuthDeg(Number.NaN, 0)).toThrow(RangeError);
    expect(() => unwrapAzimuthSequence([1, Number.POSITIVE_INFINITY], 0)).toThrow(/azimuthsDeg\[1\]/);
  });
});
