import { z } from 'zod';

/** Image types the server accepts, by what the content decodes as (never by file name). */
export const photoMimeTypes = ['image/jpeg', 'image/png', 'image/webp', 'image/heif', 'image/avif'] as const;
export type PhotoMimeType = (typeof photoMimeTypes)[number];

/** The three stored renditions of a photo. */
export const photoVariants = ['original', 'display', 'thumb'] as const;
export type PhotoVariant = (typeof photoVariants)[number];

/** Long side of the display rendition, px. */
export const PHOTO_DISPLAY_LONG_SIDE_PX = 2048;
/** Long side of the thumbnail, px. */
export const PHOTO_THUMB_LONG_SIDE_PX = 320;

/** A GPS position read from EXIF, degrees (WGS84): lat -90..90, lon -180..180. */
export const photoGpsSchema = z.object({
  lat: z.number().min(-90).max(90),
  lon: z.number().min(-180).max(180),
});

/**
 * What was read from the photo's EXIF; every field is optional (many photos carry none).
 * takenAt is the camera's clock as written, `YYYY-MM-DDTHH:mm:ss`, with the offset (`+01:00`) only
 * when the camera recorded one. Focal lengths in mm (> 0); imageDirectionDeg is the camera bearing,
 * 0..360 degrees (true or magnetic as the camera wrote it).
 */
export const photoExifSchema = z.object({
  takenAt: z.string().optional(),
  camera: z.string().optional(),
  lens: z.string().optional(),
  focalLengthMm: z.number().positive().optional(),
  focalLength35Mm: z.number().positive().optional(),
  gps: photoGpsSchema.optional(),
  imageDirectionDeg: z.number().min(0).max(360).optional(),
});
export type PhotoExif = z.infer<typeof photoExifSchema>;

/** A reference photo as the API returns it. exif.gps is left out for others when the owner hides it. */
export const photoSchema = z.object({
  id: z.uuid(),
  sightlineId: z.uuid(),
  ownerId: z.uuid(),
  originalName: z.string(),
  mimeType: z.enum(photoMimeTypes),
  /** Size of the original as it is meant to be seen (EXIF orientation applied), px. */
  width: z.number().int().positive(),
  height: z.number().int().positive(),
  byteSize: z.number().int().positive(),
  exif: photoExifSchema,
  hideGps: z.boolean(),
  /** Filled by the sky overlay's calibration step later; null until then. */
  calibration: z.record(z.string(), z.unknown()).nullable(),
  thumbUrl: z.string(),
  displayUrl: z.string(),
  /** Only for the owner. */
  originalUrl: z.string().nullable(),
  createdAt: z.iso.datetime(),
});
export type Photo = z.infer<typeof photoSchema>;

export const photoResponseSchema = z.object({ photo: photoSchema });
export const photoListResponseSchema = z.object({ photos: z.array(photoSchema) });

/** PATCH /api/photos/:id */
export const photoUpdateSchema = z.strictObject({
  hideGps: z.boolean({ error: 'Say whether to hide the GPS position (true or false)' }),
});
export type PhotoUpdate = z.infer<typeof photoUpdateSchema>;
