import { z } from 'zod';

/** Latitude in degrees, -90..90 (WGS84). */
export const latitudeSchema = z.number({ error: 'Latitude must be a number' })
  .finite('Latitude must be a finite number')
  .min(-90, 'Latitude must be between -90 and 90')
  .max(90, 'Latitude must be between -90 and 90');

/** Longitude in degrees, -180..180 (WGS84, east positive). */
export const longitudeSchema = z.number({ error: 'Longitude must be a number' })
  .finite('Longitude must be a finite number')
  .min(-180, 'Longitude must be between -180 and 180')
  .max(180, 'Longitude must be between -180 and 180');

/** Height or elevation in metres; bounded to what exists on Earth's surface. */
const elevationSchema = z.number().finite().min(-500, 'Elevation below -500 m is not on land').max(9000, 'Elevation above 9000 m is not on land');

/**
 * Where the camera stands. `elevationM` is the ground elevation above sea level,
 * `cameraHeightM` the lens height above that ground.
 */
export const vantageSchema = z.object({
  lat: latitudeSchema,
  lon: longitudeSchema,
  elevationM: elevationSchema.default(0),
  cameraHeightM: z.number().finite().min(0).max(100, 'Camera height above 100 m is not supported').default(1.5),
});
export type Vantage = z.infer<typeof vantageSchema>;

/** The foreground subject: base elevation above sea level, its own height and width in metres. */
export const landmarkSchema = z.object({
  lat: latitudeSchema,
  lon: longitudeSchema,
  baseElevationM: elevationSchema.default(0),
  heightM: z.number().finite().min(0).max(2000, 'Landmark height above 2000 m is not supported').default(0),
  widthM: z.number().finite().min(0).max(10000, 'Landmark width above 10 km is not supported').default(0),
});
export type Landmark = z.infer<typeof landmarkSchema>;

/**
 * The patch of sky the landmark covers as seen from the vantage. Azimuth is true (from north,
 * clockwise), 0..360; the altitude band runs from `bottomAltDeg` to `topAltDeg` (apparent altitude).
 */
export const frameSchema = z.object({
  azimuthDeg: z.number().finite().min(0).max(360),
  halfWidthDeg: z.number().finite().gt(0, 'Half-width must be above 0').max(180),
  bottomAltDeg: z.number().finite().min(-90).max(90),
  topAltDeg: z.number().finite().min(-90).max(90),
}).refine((f) => f.topAltDeg > f.bottomAltDeg, { message: 'Top altitude must be above bottom altitude', path: ['topAltDeg'] });
export type Frame = z.infer<typeof frameSchema>;

/** An observer on Earth: latitude, longitude (deg) and height above sea level in metres. */
export const observerSiteSchema = z.object({
  lat: latitudeSchema,
  lon: longitudeSchema,
  elevationM: z.number().finite().min(-500).max(9000).default(0),
});
export type ObserverSite = z.infer<typeof observerSiteSchema>;

/** A sky position in the J2000 equatorial frame: RA in hours 0..24, Dec in degrees -90..90. */
export const equatorialJ2000Schema = z.object({
  raHours: z.number().finite().min(0).lt(24, 'RA must be below 24 h'),
  decDeg: z.number().finite().min(-90).max(90),
});
export type EquatorialJ2000 = z.infer<typeof equatorialJ2000Schema>;
