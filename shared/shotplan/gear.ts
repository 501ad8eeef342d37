/**
 * Derived figures of a camera body and a lens in the gear: sensor diagonal, crop factor, pixel
 * pitch and pixel grid of a body; the focal-length range of a prime or a zoom.
 *
 * Crop factor convention: the ratio of the diagonal of the 36 x 24 mm frame ("full frame",
 * sqrt(36^2 + 24^2) = 43.27 mm) to the sensor's diagonal, so a 36 x 24 mm sensor has crop
 * factor 1 and a 23.5 x 15.6 mm sensor about 1.53. Pixels are taken as square.
 */
import { parseOrThrow } from '../guards';
import { FULL_FRAME_WIDTH_MM } from '../projection/camera';
import { type CameraBody, cameraBodySchema, type Lens, lensSchema, pixelPitchFromCountUm } from '../schemas/gear';

export { pixelPitchFromCountUm };

/** Height of the 36 x 24 mm frame (full frame), mm; its width is FULL_FRAME_WIDTH_MM (36). */
export const FULL_FRAME_HEIGHT_MM = 24;
/** Diagonal of the 36 x 24 mm frame, mm (43.2666, usually quoted as 43.27 mm). */
export const FULL_FRAME_DIAGONAL_MM = Math.hypot(FULL_FRAME_WIDTH_MM, FULL_FRAME_HEIGHT_MM);

/** Which given figure the pixel pitch comes from. */
export type PixelPitchSource = 'pixel-pitch' | 'width-px' | 'megapixels';

/** A camera body's derived figures; see {@link deriveBody}. */
export interface DerivedBody {
  /** Sensor diagonal, mm. */
  diagonalMm: number;
  /** 43.27 mm (the 36 x 24 mm diagonal) divided by the sensor diagonal. */
  cropFactor: number;
  /** Pixel pitch (centre-to-centre spacing of square pixels), micrometres. */
  pixelPitchUm: number;
  /** Which given figure the pitch was taken from (pitch first, then width in pixels, then megapixels). */
  pixelPitchSource: PixelPitchSource;
  /** Image width, pixels (sensor width / pitch, rounded). */
  widthPx: number;
  /** Image height, pixels (sensor height / pitch, rounded). */
  heightPx: number;
  /** Pixel count, millions (width x height / 1e6, from the rounded sides). */
  megapixels: number;
  /** Sensor width / height (1.5 for 36 x 24 mm). */
  aspectRatio: number;
}

/**
 * Crop factor and pixel figures of a camera body.
 * @param body - a camera body (see cameraBodySchema: sensor 1..100 mm a side, width the long side,
 *   and a pixel pitch, a width in pixels or a pixel count in megapixels)
 * @returns diagonal, crop factor (43.27 mm / diagonal), pitch, pixel grid and aspect ratio
 * @throws RangeError naming the bad fields when the body does not fit the schema
 */
export function deriveBody(body: CameraBody): DerivedBody {
  const b = parseOrThrow('camera body', cameraBodySchema, body);
  const diagonalMm = Math.hypot(b.sensorWidthMm, b.sensorHeightMm);
  let pixelPitchUm: number;
  let pixelPitchSource: PixelPitchSource;
  if (b.pixelPitchUm !== undefined) {
    pixelPitchUm = b.pixelPitchUm;
    pixelPitchSource = 'pixel-pitch';
  } else if (b.widthPx !== undefined) {
    pixelPitchUm = pixelPitchFromCountUm(b.sensorWidthMm, b.sensorHeightMm, { widthPx: b.widthPx });
    pixelPitchSource = 'width-px';
  } else {
    // The schema guarantees one of the three.
    pixelPitchUm = pixelPitchFromCountUm(b.sensorWidthMm, b.sensorHeightMm, { megapixels: b.megapixels as number });
    pixelPitchSource = 'megapixels';
  }
  const widthPx = b.widthPx ?? Math.round((1000 * b.sensorWidthMm) / pixelPitchUm);
  const heightPx = Math.round((widthPx * b.sensorHeightMm) / b.sensorWidthMm);
  return {
    diagonalMm,
    cropFactor: FULL_FRAME_DIAGONAL_MM / diagonalMm,
    pixelPitchUm,
    pixelPitchSource,
    widthPx,
    heightPx,
    megapixels: (widthPx * heightPx) / 1e6,
    aspectRatio: b.sensorWidthMm / b.sensorHeightMm,
  };
}

/** The focal lengths a lens offers, mm; `minMm === maxMm` for a prime. */
export interface FocalRange {
  minMm: number;
  maxMm: number;
  isZoom: boolean;
}

/**
 * The focal-length range of a lens.
 * @param lens - a lens (see lensSchema: a prime's `focalLengthMm` or a zoom's `zoomMinMm`..`zoomMaxMm`)
 * @returns min and max focal length, mm, and whether it is a zoom
 * @throws RangeError naming the bad fields when the lens does not fit the schema
 */
export function lensFocalRange(lens: Lens): FocalRange {
  const l = parseOrThrow('lens', lensSchema, lens);
  if (l.focalLengthMm !== undefined) return { minMm: l.focalLengthMm, maxMm: l.focalLengthMm, isZoom: false };
  return { minMm: l.zoomMinMm as number, maxMm: l.zoomMaxMm as number, isZoom: true };
}
