import sharp, { type Metadata, type SharpOptions } from 'sharp';
import exifr from 'exifr';
import { PHOTO_DISPLAY_LONG_SIDE_PX, PHOTO_THUMB_LONG_SIDE_PX, type PhotoExif, type PhotoMimeType } from '../../shared/schemas/photo';
import { AppError } from '../errors';

// HEIC is not named: the sharp build from the registry decodes AVIF but not HEIC.
export const UNREADABLE_IMAGE_MESSAGE = 'This file is not an image we can read (JPEG, PNG, WebP, AVIF)';

/** A decoded upload: what it is, its renditions, and what its EXIF says. */
export interface ProcessedPhoto {
  mimeType: PhotoMimeType;
  /** Size as meant to be seen (EXIF orientation applied), px. */
  width: number;
  height: number;
  display: Buffer;
  thumb: Buffer;
  exif: PhotoExif;
}

/** Orientations 5..8 turn the picture a quarter: width and height swap once applied. */
const QUARTER_TURN_ORIENTATIONS = new Set([5, 6, 7, 8]);

function mimeTypeOf(meta: Metadata): PhotoMimeType | undefined {
  switch (meta.format) {
    case 'jpeg': return 'image/jpeg';
    case 'png': return 'image/png';
    case 'webp': return 'image/webp';
    // HEIC and AVIF are both HEIF containers; the codec tells them apart.
    case 'heif': return meta.compression === 'av1' ? 'image/avif' : 'image/heif';
    default: return undefined;
  }
}

/**
 * Decodes the upload with sharp (the content decides, never the name), refuses anything that is not
 * JPEG, PNG, WebP or HEIF/AVIF, or holds more than maxPixels pixels (a decompression bomb), and
 * makes the display (long side 2048 px) and thumbnail (long side 320 px) renditions as WebP,
 * EXIF orientation applied. sharp writes no metadata unless asked, so the renditions carry no GPS.
 * Throws AppError 400 for every refusal.
 */
export async function processPhoto(data: Buffer, maxPixels: number): Promise<ProcessedPhoto> {
  const options: SharpOptions = { limitInputPixels: maxPixels, failOn: 'error', sequentialRead: true };
  let meta: Metadata;
  try {
    meta = await sharp(data, options).metadata();
  } catch (error) {
    if (isPixelLimitError(error)) throw tooManyPixels(maxPixels);
    throw new AppError('validation', UNREADABLE_IMAGE_MESSAGE, { photo: UNREADABLE_IMAGE_MESSAGE });
  }
  const mimeType = mimeTypeOf(meta);
  if (!mimeType || !meta.width || !meta.height) {
    throw new AppError('validation', UNREADABLE_IMAGE_MESSAGE, { photo: UNREADABLE_IMAGE_MESSAGE });
  }
  // The header is checked here; sharp's limitInputPixels checks again while decoding.
  if (meta.width * meta.height > maxPixels) throw tooManyPixels(maxPixels);

  const quarterTurn = QUARTER_TURN_ORIENTATIONS.has(meta.orientation ?? 1);
  const rendition = (longSide: number) => sharp(data, options)
    .rotate()
    .resize({ width: longSide, height: longSide, fit: 'inside', withoutEnlargement: true })
    .webp({ quality: 82 })
    .toBuffer();
  let display: Buffer;
  let thumb: Buffer;
  try {
    [display, thumb] = await Promise.all([rendition(PHOTO_DISPLAY_LONG_SIDE_PX), rendition(PHOTO_THUMB_LONG_SIDE_PX)]);
  } catch (error) {
    if (isPixelLimitError(error)) throw tooManyPixels(maxPixels);
    throw new AppError('validation', UNREADABLE_IMAGE_MESSAGE, { photo: UNREADABLE_IMAGE_MESSAGE });
  }
  return {
    mimeType,
    width: quarterTurn ? meta.height : meta.width,
    height: quarterTurn ? meta.width : meta.height,
    display,
    thumb,
    exif: await readExif(data),
  };
}

/** sharp's refusal under limitInputPixels ("Input image exceeds pixel limit"). */
function isPixelLimitError(error: unknown): boolean {
  return error instanceof Error && /pixel limit/i.test(error.message);
}

function tooManyPixels(maxPixels: number): AppError {
  const message = `This image has more than ${(maxPixels / 1e6).toLocaleString('en', { maximumFractionDigits: 1 })} million pixels; make it smaller and try again`;
  return new AppError('validation', message, { photo: message });
}

const MAX_TEXT_LENGTH = 100;

/** Trims, drops control characters (PostgreSQL JSONB refuses NUL), caps the length; undefined when empty. */
function cleanText(value: unknown): string | undefined {
  if (typeof value !== 'string') return undefined;
  // eslint-disable-next-line no-control-regex
  const text = value.replace(/[\u0000-\u001f\u007f]/g, '').trim().slice(0, MAX_TEXT_LENGTH);
  return text || undefined;
}

function finiteIn(value: unknown, min: number, max: number): number | undefined {
  return typeof value === 'number' && Number.isFinite(value) && value >= min && value <= max ? value : undefined;
}

const pad = (n: number, width = 2) => String(n).padStart(width, '0');

/**
 * The camera's clock as written. exifr revives EXIF date strings (which have no zone) as local
 * time of this process, so reading the local fields back gives the written digits unchanged.
 */
function takenAtOf(value: unknown, offset: unknown): string | undefined {
  if (!(value instanceof Date) || Number.isNaN(value.getTime())) return undefined;
  const year = value.getFullYear();
  if (year < 1800 || year > 2200) return undefined;
  const local = `${pad(year, 4)}-${pad(value.getMonth() + 1)}-${pad(value.getDate())}T${pad(value.getHours())}:${pad(value.getMinutes())}:${pad(value.getSeconds())}`;
  return typeof offset === 'string' && /^[+-]\d{2}:\d{2}$/.test(offset) ? `${local}${offset}` : local;
}

/** The EXIF fields the planner uses; an image without EXIF (or with broken EXIF) gives {}. */
export async function readExif(data: Buffer): Promise<PhotoExif> {
  let tags: Record<string, unknown> | undefined;
  try {
    tags = (await exifr.parse(data, { tiff: true, exif: true, gps: true, ifd1: false, interop: false, xmp: false, icc: false, iptc: false })) as Record<string, unknown> | undefined;
  } catch {
    return {};
  }
  if (!tags) return {};
  const make = cleanText(tags.Make);
  const model = cleanText(tags.Model);
  // Many cameras repeat the make at the start of the model name.
  const camera = make && model && !model.toLowerCase().startsWith(make.toLowerCase()) ? `${make} ${model}` : model ?? make;
  const lat = finiteIn(tags.latitude, -90, 90);
  const lon = finiteIn(tags.longitude, -180, 180);
  const exif: PhotoExif = {
    takenAt: takenAtOf(tags.DateTimeOriginal ?? tags.CreateDate, tags.OffsetTimeOriginal),
    camera: camera ? camera.slice(0, MAX_TEXT_LENGTH) : undefined,
    lens: cleanText(tags.LensModel) ?? cleanText(tags.Lens),
    focalLengthMm: finiteIn(tags.FocalLength, Number.MIN_VALUE, 10_000),
    focalLength35Mm: finiteIn(tags.FocalLengthIn35mmFormat, Number.MIN_VALUE, 10_000),
    gps: lat !== undefined && lon !== undefined && !(lat === 0 && lon === 0) ? { lat, lon } : undefined,
    imageDirectionDeg: finiteIn(tags.GPSImgDirection, 0, 360),
  };
  return Object.fromEntries(Object.entries(exif).filter(([, v]) => v !== undefined)) as PhotoExif;
}
