import { describe, expect, it } from 'vitest';
import * as shotplan from '../../../shared/shotplan';

describe('shared/shotplan barrel: the plan, cautions and drawing layouts', () => {
  it.each([
    'buildShotPlan',
    'roundDownExposureS',
    'loopRunNear',
    'shotPlanCautions',
    'frameOutlineDirections',
    'unwrapAzimuthDeg',
    'unwrapAzimuthSequence',
    'timelineBarLayout',
    'azAltBox',
  ])('re-exports %s as a function', (name) => {
    expect(typeof (shotplan as Record<string, unknown>)[name]).toBe('function');
  });

  it('re-exports the input error and the last caution', () => {
    expect(new shotplan.ShotPlanInputError('focalLengthMm', 'x')).toBeInstanceOf(RangeError);
    expect(shotplan.PLAN_NOT_PROMISE).toMatch(/^A plan, not a promise/);
  });
});
