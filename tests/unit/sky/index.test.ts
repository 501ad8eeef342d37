import { describe, expect, it } from 'vitest';
import * as sky from '../../../shared/sky/index';

describe('sky public API', () => {
  // The index re-exports every module of shared/sky (own API contract).
  it.each([
    'sunHorizontal',
    'moonHorizontal',
    'targetHorizontal',
    'targetEquatorOfDate',
    'horizontalFromEquatorOfDate',
    'moonIllumination',
    'greenwichSiderealTimeHours',
    'refractionForApparentAltitudeDeg',
    'findThresholdCrossings',
    'nightReport',
    'timeZoneForSite',
    'toLocalInstant',
    'nightSpanUtc',
    'equatorialJ2000ToGalactic',
    'galacticToEquatorialJ2000',
    'galacticPlanePoints',
    'findTarget',
    'searchTargets',
  ])('exports %s', (name) => {
    expect(typeof (sky as Record<string, unknown>)[name]).toBe('function');
  });

  it('exports the catalogue and the galactic centre', () => {
    expect(sky.TARGETS.length).toBeGreaterThan(60);
    expect(sky.findTarget('galactic-centre')?.raHours).toBe(sky.GALACTIC_CENTRE_J2000.raHours);
  });
});
