import { describe, expect, it } from 'vitest';
import * as shotplan from '../../../shared/shotplan';

describe('shared/shotplan barrel', () => {
  it.each([
    'deriveBody',
    'lensFocalRange',
    'pixelPitchFromCountUm',
    'fieldOfView',
    'heldFieldOfView',
    'focalLengthForFovMm',
    'fitInFrame',
    'longestFittingFocalLength',
    'frameAzimuthHalfWidthDeg',
    'panoramaGrid',
    'skySpanOf',
    'rule500Seconds',
    'npfSimpleSeconds',
    'npfFullSeconds',
    'untrackedLimits',
    'suggestedSubExposureRange',
    'framesForIntegration',
    'timeAvailable',
    'trackedStackPlan',
    'nightTimelineEvents',
    'nightEventsFromReport',
    'planNight',
    'framesBlock',
    'panoramaRowBlocks',
  ])('re-exports %s as a function', (name) => {
    expect(typeof (shotplan as Record<string, unknown>)[name]).toBe('function');
  });

  it('re-exports the constants the client shows', () => {
    expect(shotplan.DEFAULT_PANORAMA_OVERLAP).toBe(0.3);
    // computed: sqrt(36^2 + 24^2) = 43.2666 mm, the crop-factor reference.
    expect(shotplan.FULL_FRAME_DIAGONAL_MM).toBeCloseTo(43.2666, 4);
    expect(shotplan.NIGHT_EVENT_KINDS).toHaveLength(7);
    expect(Object.keys(shotplan.BLOCK_DEADLINES)).toEqual([...shotplan.SHOOTING_BLOCK_KINDS]);
  });
});
