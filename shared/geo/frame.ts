/**
 * From a sightline (vantage + landmark) to the frame of sky behind the landmark, and the live
 * readout of the sightline's geometry for the map panel.
 */
import type { Frame, Landmark, Vantage } from '../schemas/geometry';
import { landmarkSchema, vantageSchema } from '../schemas/geometry';
import {
  angularWidthDeg as angularWidthOf,
  DEFAULT_REFRACTION_COEFFICIENT,
  elevationAngleDeg,
  MIN_SIGHTLINE_DISTANCE_M,
} from './elevation';
import { geodesicInverse } from './geodesy';
import { assertPositiveUpTo, parseOrThrow } from '../guards';
import { magneticBearingDeg as toMagneticBearing, magneticDeclination } from './magnetic';

/** Default height of the frame's altitude band above the landmark top, degrees. */
export const DEFAULT_BAND_HEIGHT_DEG = 20;
/**
 * Smallest half-width a frame gets, degrees. A lone tree or a thin spire far away subtends a
 * sliver of a degree; a target counts as "behind" it when it is within about the Moon's apparent
 * diameter (0.5 deg) of its line, so the frame is at least 1 deg wide. It is also well above the
 * geometry's and the sky engine's errors (~0.01 deg), so a lineup is never decided by rounding.
 * Callers can pass their own minimum.
 */
export const MIN_FRAME_HALF_WIDTH_DEG = 0.5;

/** Options for {@link frameFromSightline}. */
export interface FrameOptions {
  /** Height of the altitude band above the landmark top, degrees, (0, 90]; default 20. */
  bandHeightDeg?: number;
  /** Refraction coefficient for the landmark top, -1..1; default 0.13. */
  k?: number;
  /** Smallest half-width, degrees, (0, 90]; default {@link MIN_FRAME_HALF_WIDTH_DEG}. */
  minHalfWidthDeg?: number;
}

interface ParsedSightline {
  vantage: Vantage;
  landmark: Landmark;
  distanceM: number;
  trueBearingDeg: number;
}

function parseSightline(vantage: Vantage, landmark: Landmark): ParsedSightline {
  const v = parseOrThrow('vantage', vantageSchema, vantage);
  const l = parseOrThrow('landmark', landmarkSchema, landmark);
  const line = geodesicInverse(v, l);
  if (line.distanceM < MIN_SIGHTLINE_DISTANCE_M) {
    throw new RangeError(`The vantage and the landmark coincide (distance ${line.distanceM} m): move one of them`);
  }
  return { vantage: v, landmark: l, distanceM: line.distanceM, trueBearingDeg: line.initialBearingDeg };
}

/**
 * The frame a sightline defines: centred on the true bearing vantage to landmark, half as wide
 * as the landmark's angular width (at least {@link MIN_FRAME_HALF_WIDTH_DEG}), from the landmark
 * top's apparent elevation angle up by the band height (capped at 90 deg).
 *
 * @param vantage - where the camera stands (schema ranges; eye = ground elevation + camera height)
 * @param landmark - the foreground subject (schema ranges)
 * @param options - band height (deg), refraction coefficient k, minimum half-width (deg)
 * @returns the frame: azimuthDeg `[0, 360)`, halfWidthDeg, bottomAltDeg, topAltDeg (degrees)
 * @throws RangeError on invalid input, out-of-range options, or coincident vantage and landmark
 */
export function frameFromSightline(vantage: Vantage, landmark: Landmark, options: FrameOptions = {}): Frame {
  const bandHeight = assertPositiveUpTo(options.bandHeightDeg ?? DEFAULT_BAND_HEIGHT_DEG, 'bandHeightDeg', 90);
  const minHalfWidth = assertPositiveUpTo(options.minHalfWidthDeg ?? MIN_FRAME_HALF_WIDTH_DEG, 'minHalfWidthDeg', 90);
  const k = options.k ?? DEFAULT_REFRACTION_COEFFICIENT;
  const s = parseSightline(vantage, landmark);
  const eye = s.vantage.elevationM + s.vantage.cameraHeightM;
  const bottom = elevationAngleDeg(eye, s.landmark.baseElevationM + s.landmark.heightM, s.distanceM, k);
  return {
    azimuthDeg: s.trueBearingDeg,
    halfWidthDeg: Math.max(angularWidthOf(s.landmark.widthM, s.distanceM) / 2, minHalfWidth),
    bottomAltDeg: bottom,
    topAltDeg: Math.min(bottom + bandHeight, 90),
  };
}

/** What the map's readout panel shows for a sightline. */
export interface SightlineGeometry {
  /** WGS84 geodesic distance vantage to landmark, metres. */
  distanceM: number;
  /** True bearing vantage to landmark, degrees `[0, 360)`. */
  trueBearingDeg: number;
  /** What a compass reads for that bearing at the vantage on the date, degrees `[0, 360)`. */
  magneticBearingDeg: number;
  /** Magnetic declination at the vantage on the date (WMM2025), degrees east positive. */
  declinationDeg: number;
  /** True when the date lies in WMM2025's validity (2025.0-2030.0). */
  declinationWithinModelValidity: boolean;
  /** False near the magnetic poles, where a compass cannot be trusted. */
  compassReliable: boolean;
  /** Warnings about the declination (date outside the model, compass near a pole); empty when none. */
  declinationWarnings: string[];
  /** Apparent elevation angle of the landmark top from the eye, degrees. */
  topElevationDeg: number;
  /** Apparent elevation angle of the landmark base from the eye, degrees. */
  baseElevationDeg: number;
  /** Angular width (azimuth span) of the landmark, degrees. */
  angularWidthDeg: number;
}

/**
 * The sightline's geometry for the live readout: one geodesic, two elevation angles and one
 * magnetic-model evaluation (a few microseconds), cheap enough to call on every pin move.
 *
 * @param vantage - where the camera stands (schema ranges)
 * @param landmark - the foreground subject (schema ranges)
 * @param date - the shoot's date and time for the declination; default now
 * @param options - `k`: refraction coefficient -1..1, default 0.13
 * @returns distance, true and magnetic bearings, declination with its validity, top and base
 *   elevation angles and angular width
 * @throws RangeError on invalid input, an invalid Date, or coincident vantage and landmark
 */
export function sightlineGeometry(
  vantage: Vantage,
  landmark: Landmark,
  date: Date = new Date(),
  options: { k?: number } = {},
): SightlineGeometry {
  const k = options.k ?? DEFAULT_REFRACTION_COEFFICIENT;
  const s = parseSightline(vantage, landmark);
  const eye = s.vantage.elevationM + s.vantage.cameraHeightM;
  const magnetic = magneticDeclination({ lat: s.vantage.lat, lon: s.vantage.lon, heightM: eye }, date);
  return {
    distanceM: s.distanceM,
    trueBearingDeg: s.trueBearingDeg,
    magneticBearingDeg: toMagneticBearing(s.trueBearingDeg, magnetic.declinationDeg),
    declinationDeg: magnetic.declinationDeg,
    declinationWithinModelValidity: magnetic.withinModelValidity,
    compassReliable: magnetic.compassReliable,
    declinationWarnings: magnetic.warnings,
    topElevationDeg: elevationAngleDeg(eye, s.landmark.baseElevationM + s.landmark.heightM, s.distanceM, k),
    baseElevationDeg: elevationAngleDeg(eye, s.landmark.baseElevationM, s.distanceM, k),
    angularWidthDeg: angularWidthOf(s.landmark.widthM, s.distanceM),
  };
}
