import { describe, expect, it } from 'vitest';
import { cameraBodySchema, gearProfileSchema, lensSchema, shotGearSchema } from '../../../shared/schemas/gear';
import { deriveBody, FULL_FRAME_DIAGONAL_MM, lensFocalRange, pixelPitchFromCountUm } from '../../../shared/shotplan/gear';

/** The messages of a failed parse, by field path. */
function fieldMessages(result: { success: boolean; error?: { issues: Array<{ path: PropertyKey[]; message: string }> } }): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of result.error?.issues ?? []) {
    const key = issue.path.map(String).join('.');
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

const fullFrame = { name: 'Night body', sensorWidthMm: 36, sensorHeightMm: 24, megapixels: 24 };

describe('cameraBodySchema', () => {
  it('accepts a body with a pixel count, a width in pixels or a pixel pitch', () => {
    expect(cameraBodySchema.safeParse(fullFrame).success).toBe(true);
    expect(cameraBodySchema.safeParse({ ...fullFrame, megapixels: undefined, widthPx: 6000 }).success).toBe(true);
    expect(cameraBodySchema.safeParse({ ...fullFrame, megapixels: undefined, pixelPitchUm: 5.9 }).success).toBe(true);
  });

  it('asks for one of the pixel figures, beside the pixel pitch field', () => {
    const r = cameraBodySchema.safeParse({ name: 'Night body', sensorWidthMm: 36, sensorHeightMm: 24 });
    expect(fieldMessages(r).pixelPitchUm).toEqual(['Give the pixel pitch, the image width in pixels or the megapixels']);
  });

  it.each([
    [{ sensorWidthMm: 0.5 }, 'sensorWidthMm', 'Sensor width must be between 1 and 100 mm'],
    [{ sensorWidthMm: 150 }, 'sensorWidthMm', 'Sensor width must be between 1 and 100 mm'],
    [{ sensorHeightMm: 40 }, 'sensorHeightMm', 'Give the long side of the sensor as its width'],
    [{ megapixels: 0 }, 'megapixels', 'Pixel count must be between 0.1 and 1000 megapixels'],
    [{ megapixels: undefined, widthPx: 6000.5 }, 'widthPx', 'Image width must be a whole number of pixels'],
    [{ megapixels: undefined, pixelPitchUm: 80 }, 'pixelPitchUm', 'Pixel pitch must be between 0.5 and 50 um'],
    [{ name: '   ' }, 'name', 'Name the camera body'],
    [{ sensorWidthMm: Number.NaN }, 'sensorWidthMm', undefined],
  ])('refuses %o with a message on %s', (change, field, message) => {
    const messages = fieldMessages(cameraBodySchema.safeParse({ ...fullFrame, ...change }));
    expect(messages[field]).toBeDefined();
    if (message !== undefined) expect(messages[field]).toContain(message);
  });

  it('refuses a pixel pitch that disagrees with the pixel count by more than 10 %', () => {
    // computed: 24 MP on 36 x 24 mm is a 6.0 um pitch (sqrt(864 mm^2 / 24e6)); 7 um is 17 % off, 6.3 um 5 %.
    const off = fieldMessages(cameraBodySchema.safeParse({ ...fullFrame, pixelPitchUm: 7 }));
    expect(off.pixelPitchUm?.[0]).toMatch(/does not match the pixel count \(which gives about 6\.00 um\)/);
    expect(cameraBodySchema.safeParse({ ...fullFrame, pixelPitchUm: 6.3 }).success).toBe(true);
  });

  it('refuses a width in pixels that disagrees with the megapixels', () => {
    // computed: 24 MP at 3:2 is 6000 x 4000 px; 4000 px across is a third short.
    expect(fieldMessages(cameraBodySchema.safeParse({ ...fullFrame, widthPx: 4000 })).widthPx).toEqual(['Image width in pixels does not match the megapixels']);
  });
});

describe('deriveBody (crop factor = 43.27 mm / sensor diagonal)', () => {
  it('a 36 x 24 mm body of 24 MP has crop factor 1, a 6.0 um pitch and 6000 x 4000 px', () => {
    const d = deriveBody(fullFrame);
    // computed: the 36 x 24 mm diagonal sqrt(36^2 + 24^2) = 43.2666 mm is the convention's reference.
    expect(FULL_FRAME_DIAGONAL_MM).toBeCloseTo(43.2666, 4);
    expect(d.diagonalMm).toBeCloseTo(43.2666, 4);
    expect(d.cropFactor).toBeCloseTo(1, 12);
    // computed: sqrt(36 x 24 mm^2 / 24e6) = 6.0e-3 mm.
    expect(d.pixelPitchUm).toBeCloseTo(6, 10);
    expect(d.pixelPitchSource).toBe('megapixels');
    expect([d.widthPx, d.heightPx]).toEqual([6000, 4000]);
    expect(d.megapixels).toBeCloseTo(24, 10);
    expect(d.aspectRatio).toBeCloseTo(1.5, 12);
  });

  it('a 23.5 x 15.6 mm sensor has a 28.21 mm diagonal and crop factor 1.534', () => {
    // computed: sqrt(23.5^2 + 15.6^2) = 28.2066 mm; 43.2666 / 28.2066 = 1.5339.
    const d = deriveBody({ name: 'Small body', sensorWidthMm: 23.5, sensorHeightMm: 15.6, pixelPitchUm: 3.9 });
    expect(d.diagonalMm).toBeCloseTo(28.2066, 4);
    expect(d.cropFactor).toBeCloseTo(1.5339, 4);
    expect(d.pixelPitchUm).toBe(3.9);
    expect(d.pixelPitchSource).toBe('pixel-pitch');
    // computed: 23.5 mm / 3.9 um = 6025.6 -> 6026 px; 6026 x 15.6 / 23.5 = 4000.2 -> 4000 px.
    expect([d.widthPx, d.heightPx]).toEqual([6026, 4000]);
  });

  it('takes the pitch from the width in pixels when no pitch is given', () => {
    // computed: 36 mm / 6000 px = 6 um.
    const d = deriveBody({ name: 'W', sensorWidthMm: 36, sensorHeightMm: 24, widthPx: 6000, megapixels: 24 });
    expect(d.pixelPitchSource).toBe('width-px');
    expect(d.pixelPitchUm).toBeCloseTo(6, 12);
    expect(pixelPitchFromCountUm(36, 24, { widthPx: 6000 })).toBeCloseTo(6, 12);
    expect(pixelPitchFromCountUm(36, 24, { megapixels: 24 })).toBeCloseTo(6, 12);
  });

  it('refuses a body that does not fit the schema with a RangeError naming the field', () => {
    expect(() => deriveBody({ ...fullFrame, sensorHeightMm: 0 })).toThrow(RangeError);
    expect(() => deriveBody({ ...fullFrame, sensorHeightMm: 0 })).toThrow(/sensorHeightMm/);
    expect(() => deriveBody(null as never)).toThrow(RangeError);
  });
});

describe('lensSchema and lensFocalRange', () => {
  it('a prime has one focal length, a zoom a range', () => {
    expect(lensFocalRange({ name: 'Fast wide', focalLengthMm: 14, widestApertureF: 1.8 })).toEqual({ minMm: 14, maxMm: 14, isZoom: false });
    expect(lensFocalRange({ name: 'Wide zoom', zoomMinMm: 16, zoomMaxMm: 35, widestApertureF: 2.8 })).toEqual({ minMm: 16, maxMm: 35, isZoom: true });
  });

  it.each([
    [{ focalLengthMm: 14, zoomMinMm: 14, zoomMaxMm: 24 }, 'focalLengthMm', 'Give a focal length for a prime or a zoom range, not both'],
    [{}, 'focalLengthMm', 'Give the focal length, or both ends of the zoom range'],
    [{ zoomMinMm: 24 }, 'zoomMaxMm', 'Give the longest focal length of the zoom'],
    [{ zoomMaxMm: 24 }, 'zoomMinMm', 'Give the shortest focal length of the zoom'],
    [{ zoomMinMm: 24, zoomMaxMm: 24 }, 'zoomMaxMm', 'The longest focal length must be above the shortest'],
    [{ focalLengthMm: 0.5 }, 'focalLengthMm', 'Focal length must be between 1 and 5000 mm'],
  ])('refuses %o with a message on %s', (focal, field, message) => {
    const r = lensSchema.safeParse({ name: 'Lens', widestApertureF: 2.8, ...focal });
    expect(fieldMessages(r)[field]).toContain(message);
  });

  it('refuses an aperture outside f/0.7..f/32', () => {
    expect(fieldMessages(lensSchema.safeParse({ name: 'L', focalLengthMm: 24, widestApertureF: 0.5 })).widestApertureF).toEqual(['Widest aperture must be between 0.7 and 32 (f-number)']);
    expect(() => lensFocalRange({ name: 'L', focalLengthMm: 24, widestApertureF: 40 })).toThrow(RangeError);
  });
});

describe('gearProfileSchema and shotGearSchema', () => {
  it('a gear profile defaults to no gear and no star tracker', () => {
    expect(gearProfileSchema.parse({})).toEqual({ bodies: [], lenses: [], starTrackerAvailable: false });
    expect(fieldMessages(gearProfileSchema.safeParse({ starTrackerAvailable: 'yes' })).starTrackerAvailable).toEqual(['Say whether a star tracker is available (true or false)']);
  });

  it('refuses a focal length outside the lens and an aperture wider than it opens', () => {
    const lens = { name: 'Wide zoom', zoomMinMm: 16, zoomMaxMm: 35, widestApertureF: 2.8 };
    const r = shotGearSchema.safeParse({ body: fullFrame, lens, focalLengthMm: 50, fNumber: 2 });
    const m = fieldMessages(r);
    expect(m.focalLengthMm).toEqual(['This lens zooms from 16 to 35 mm']);
    expect(m.fNumber).toEqual(['This lens opens to f/2.8 at most']);
    const ok = shotGearSchema.parse({ body: fullFrame, lens, focalLengthMm: 24, fNumber: 2.8 });
    expect(ok.tracked).toBe(false);
  });
});
