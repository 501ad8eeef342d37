import { describe, expect, it } from 'vitest';
import * as geo from '../../../shared/geo';

describe('the shared/geo public API', () => {
  it.each([
    'geodesicInverse', 'distanceM', 'initialBearingDeg', 'destinationPoint',
    'sphericalDistanceM', 'sphericalInitialBearingDeg', 'sphericalDestinationPoint',
    'elevationAngleDeg', 'landmarkElevationAnglesDeg', 'curvatureRefractionDropM', 'angularWidthDeg', 'eyeElevationM',
    'magneticDeclination', 'magneticBearingDeg', 'trueBearingFromMagneticDeg',
    'frameFromSightline', 'sightlineGeometry',
    'whereToStand', 'whereToStandLine', 'distanceForElevationAngleM',
    'parseCoordinates', 'formatDms', 'formatDecimalDegrees',
    'normalizeDegrees360', 'angleDifferenceDeg',
  ])('exports the function %s', (name) => {
    expect(typeof (geo as Record<string, unknown>)[name]).toBe('function');
  });

  it.each([
    ['normalizeDegrees360', -30, 330],
    ['normalizeDegrees360', 720, 0],
    ['normalizeDegrees360', -1e-15, 0],
  ])('%s(%s) gives %s', (_name, input, expected) => {
    expect(geo.normalizeDegrees360(input)).toBeCloseTo(expected, 12);
  });

  it.each([
    [1, 359, 2],
    [359, 1, -2],
    [180, 0, 180],
    [0, 180, 180],
  ])('angleDifferenceDeg(%s, %s) folds to %s', (a, b, expected) => {
    expect(geo.angleDifferenceDeg(a, b)).toBeCloseTo(expected, 12);
  });
});
