import { describe, expect, it } from 'vitest';
import { CLIFF_CAUTION, COLD_CAUTION, DARKNESS_CAUTION, PLAN_NOT_PROMISE, shotPlanCautions } from '../../../shared/shotplan/cautions';
import { TIDE_CAUTION } from '../../../shared/tide/caution';

describe('shotPlanCautions', () => {
  it('always ends with cliffs, darkness, cold and that a plan is not a promise', () => {
    const list = shotPlanCautions({ hasTideRule: false });
    expect(list).toEqual([CLIFF_CAUTION, DARKNESS_CAUTION, COLD_CAUTION, PLAN_NOT_PROMISE]);
    expect(list.at(-1)).toMatch(/^A plan, not a promise/);
  });

  it('puts the tide first when the sightline has a tide rule, with the cut-off time', () => {
    const cut = shotPlanCautions({ hasTideRule: true, tideStatus: 'cut-off', tideCutOffText: '01:40 BST' });
    expect(cut[0]).toBe('The tide cuts the spot off during this lineup from 01:40 BST: plan to be out before then, or choose another night.');
    expect(cut[1]).toBe(TIDE_CAUTION);
    const reachable = shotPlanCautions({ hasTideRule: true, tideStatus: 'reachable', tideCutOffText: '03:10 BST' });
    expect(reachable[0]).toMatch(/from 03:10 BST: leave before then/);
    const unknown = shotPlanCautions({ hasTideRule: true, tideStatus: 'unknown' });
    expect(unknown[0]).toMatch(/do not cover this lineup/);
    expect(shotPlanCautions({ hasTideRule: false, tideStatus: 'cut-off' })).not.toContain(TIDE_CAUTION);
  });

  it('carries the timeline\'s warnings, compass and tracker notes before the general cautions', () => {
    const list = shotPlanCautions({
      hasTideRule: false,
      warnings: ['Sky stack ends 12 min after moonrise.'],
      compassReliable: false,
      declinationWarnings: ['The date is outside the magnetic model.'],
      trackedWithoutTracker: true,
      noAstronomicalDarkness: true,
    });
    expect(list.slice(0, 5)).toEqual([
      'Sky stack ends 12 min after moonrise.',
      'The Sun stays above -18 deg all night: the sky never gets fully dark.',
      'A compass cannot be trusted at this vantage: take the bearing from landmarks or the map.',
      'The date is outside the magnetic model.',
      'This plan tracks the sky, but your gear lists no star tracker.',
    ]);
    expect(() => shotPlanCautions(null as never)).toThrow(RangeError);
  });
});
