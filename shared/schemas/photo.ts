import { z } from 'zod';
import { cameraPoseSchema, MAX_HORIZONTAL_FOV_DEG, MIN_HORIZONTAL_FOV_DEG } from '../projection/camera';

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

/** A pixel in the upright original (x right, y down, origin top-left), px. */
export const photoPixelSchema = z.strictObject({
  x: z.number({ error: 'Give x in pixels' }).finite(),
  y: z.number({ error: 'Give y in pixels' }).finite(),
});

/** Widest sensor accepted, mm (larger than any medium-format back). */
export const MAX_SENSOR_WIDTH_MM = 100;
/** Longest focal length accepted, mm. */
export const MAX_FOCAL_LENGTH_MM = 5000;

/**
 * How the horizontal field of view was given: a focal length with the sensor width
 * (FOV = 2 atan(w / 2f)), a 35 mm-equivalent focal length, or the angle itself.
 */
export const photoFovInputSchema = z.discriminatedUnion('kind', [
  z.strictObject({
    kind: z.literal('focal'),
    focalLengthMm: z.number({ error: 'Give the focal length in mm' }).positive('The focal length must be above 0 mm').max(MAX_FOCAL_LENGTH_MM, `At most ${MAX_FOCAL_LENGTH_MM} mm`),
    sensorWidthMm: z.number({ error: 'Give the sensor width in mm' }).positive('The sensor width must be above 0 mm').max(MAX_SENSOR_WIDTH_MM, `At most ${MAX_SENSOR_WIDTH_MM} mm`),
  }),
  z.strictObject({
    kind: z.literal('equivalent35'),
    focal35Mm: z.number({ error: 'Give the 35 mm-equivalent focal length in mm' }).positive('The focal length must be above 0 mm').max(MAX_FOCAL_LENGTH_MM, `At most ${MAX_FOCAL_LENGTH_MM} mm`),
  }),
  z.strictObject({
    kind: z.literal('angle'),
    horizontalFovDeg: z.number({ error: 'Give the horizontal field of view in degrees' }).min(MIN_HORIZONTAL_FOV_DEG, `At least ${MIN_HORIZONTAL_FOV_DEG} deg`).max(MAX_HORIZONTAL_FOV_DEG, `At most ${MAX_HORIZONTAL_FOV_DEG} deg`),
  }),
], { error: 'Give the field of view as focal length + sensor width, a 35 mm-equivalent focal length, or an angle' });
export type PhotoFovInput = z.infer<typeof photoFovInputSchema>;

/** PUT /api/photos/:id/calibration: the clicks and the lens; the server solves the pose. */
export const photoCalibrationInputSchema = z.strictObject({
  /** Where the landmark top is in the photo. */
  landmarkTopPx: photoPixelSchema,
  fov: photoFovInputSchema,
  /** Two points on a level horizon, to set the roll; without them the camera is taken as level. */
  horizonPx: z.tuple([photoPixelSchema, photoPixelSchema], { error: 'Give two horizon points or none' }).optional(),
});
export type PhotoCalibrationInput = z.infer<typeof photoCalibrationInputSchema>;

/** A saved calibration: what was given, the landmark direction used, and the solved pose. */
export const photoCalibrationSchema = photoCalibrationInputSchema.extend({
  /** The landmark top's true azimuth and apparent elevation angle from the vantage when calibrated, deg. */
  landmark: z.object({ azimuthDeg: z.number(), altitudeDeg: z.number() }),
  /** Camera pose in the upright original's pixels. */
  pose: cameraPoseSchema,
  /** How far the landmark top projects from the click with the pose, px (about 0 normally). */
  residualPx: z.number().min(0),
  calibratedAt: z.iso.datetime(),
});
export type PhotoCalibration = z.infer<typeof photoCalibrationSchema>;

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
  /** The sky overlay's calibration; null until the photo is calibrated. */
  calibration: photoCalibrationSchema.nullable(),
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

