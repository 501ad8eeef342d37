import { describe, expect, it } from 'vitest';
import * as projection from '../../../shared/projection';

describe('shared/projection barrel', () => {
  it.each([
    'horizontalFovDeg',
    'fovFrom35mmEquivalent',
    'focalLengthPx',
    'skyToPixel',
    'pixelToSky',
    'angularSeparationDeg',
    'cameraBasis',
    'calibrateFromLandmark',
    'rollFromHorizonDeg',
    'projectPolyline',
    'frameOutline',
    'galacticPlaneHorizontal',
    'svgPathData',
    'targetTrack',
    'projectTicks',
  ])('re-exports %s as a function', (name) => {
    expect(typeof (projection as Record<string, unknown>)[name]).toBe('function');
  });

  it('re-exports the camera pose schema, which refuses a FOV of 180 deg', () => {
    const pose = { azimuthDeg: 10, altitudeDeg: 5, horizontalFovDeg: 180, widthPx: 100, heightPx: 100 };
    expect(projection.cameraPoseSchema.safeParse(pose).success).toBe(false);
    expect(projection.cameraPoseSchema.parse({ ...pose, horizontalFovDeg: 60 }).rollDeg).toBe(0);
  });
});
