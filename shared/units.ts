/**
 * Units of time and angle shared by the geometry, sky, lineup and tide modules: conversion
 * constants (unit in the name) and the folding of angles into their usual ranges. One home, so
 * that every module converts with the same numbers and folds with the same edge rules.
 */

/** Milliseconds in one second. */
export const MS_PER_SECOND = 1000;
/** Milliseconds in one minute. */
export const MS_PER_MINUTE = 60_000;
/** Milliseconds in one hour. */
export const MS_PER_HOUR = 3_600_000;
/** Milliseconds in one day of 86 400 s (UTC days; leap seconds are not counted, as in JS Dates). */
export const MS_PER_DAY = 86_400_000;
/** Minutes in one day. */
export const MINUTES_PER_DAY = 1440;

/** Degrees in one radian. */
export const DEG_PER_RAD = 180 / Math.PI;
/** Radians in one degree. */
export const RAD_PER_DEG = Math.PI / 180;

/**
 * Folds an angle in degrees into `[0, 360)`: azimuths, bearings, longitudes measured from 0.
 *
 * @param angleDeg - any finite angle in degrees (not checked: callers guard their input)
 * @returns the same direction in `[0, 360)` degrees
 */
export function normalizeDegrees360(angleDeg: number): number {
  const wrapped = angleDeg % 360;
  const positive = wrapped < 0 ? wrapped + 360 : wrapped;
  // -1e-15 % 360 + 360 rounds to 360 exactly: fold it back to 0.
  return positive >= 360 ? 0 : positive;
}

/**
 * Folds an angle in degrees into `[-180, 180)`: longitudes, small signed offsets.
 *
 * @param angleDeg - any finite angle in degrees (not checked: callers guard their input)
 * @returns the same direction in `[-180, 180)` degrees
 */
export function normalizeDegrees180(angleDeg: number): number {
  return normalizeDegrees360(angleDeg + 180) - 180;
}

/**
 * Signed smallest difference `a - b` between two directions, in `(-180, 180]` degrees.
 *
 * @param aDeg - first direction in degrees, any finite value
 * @param bDeg - second direction in degrees, any finite value
 * @returns `a - b` folded to `(-180, 180]` degrees
 */
export function angleDifferenceDeg(aDeg: number, bDeg: number): number {
  const d = normalizeDegrees360(aDeg - bDeg);
  return d > 180 ? d - 360 : d;
}
