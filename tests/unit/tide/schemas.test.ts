import { describe, expect, it } from 'vitest';
import { fieldErrorsFromZod } from '../../../shared/errors';
import { TIDE_CAUTION, tideEventSchema, tideRuleSchema } from '../../../shared/tide';

describe('tideRuleSchema', () => {
  it.each([
    [{ mode: 'around-low', hoursBefore: 2, hoursAfter: 1.5 }],
    [{ mode: 'around-low', hoursBefore: 0, hoursAfter: 12 }],
    [{ mode: 'except-around-high', hoursBefore: 12, hoursAfter: 0 }],
    [{ mode: 'except-around-high', hoursBefore: 1, hoursAfter: 2, note: 'Stack is cut off by the gully first' }],
  ])('accepts %j', (rule) => {
    expect(tideRuleSchema.parse(rule)).toEqual(rule);
  });

  it('trims the note', () => {
    expect(tideRuleSchema.parse({ mode: 'around-low', hoursBefore: 2, hoursAfter: 2, note: '  via the slipway ' }).note).toBe('via the slipway');
  });

  it.each([
    ['no mode', { hoursBefore: 1, hoursAfter: 1 }, 'mode', "Tide rule mode must be 'around-low' or 'except-around-high'"],
    ['an unknown mode', { mode: 'around-high', hoursBefore: 1, hoursAfter: 1 }, 'mode', "Tide rule mode must be 'around-low' or 'except-around-high'"],
    ['negative hours before', { mode: 'around-low', hoursBefore: -0.5, hoursAfter: 1 }, 'hoursBefore', 'Hours before low water must be between 0 and 12 hours'],
    ['13 hours after', { mode: 'around-low', hoursBefore: 1, hoursAfter: 13 }, 'hoursAfter', 'Hours after low water must be between 0 and 12 hours'],
    ['12.5 hours before high water', { mode: 'except-around-high', hoursBefore: 12.5, hoursAfter: 1 }, 'hoursBefore', 'Hours before high water must be between 0 and 12 hours'],
    ['NaN hours', { mode: 'except-around-high', hoursBefore: Number.NaN, hoursAfter: 1 }, 'hoursBefore', 'Hours before high water must be a number of hours'],
    ['infinite hours', { mode: 'around-low', hoursBefore: 1, hoursAfter: Infinity }, 'hoursAfter', 'Hours after low water must be a number of hours'],
    ['hours as text', { mode: 'around-low', hoursBefore: '2', hoursAfter: 1 }, 'hoursBefore', 'Hours before low water must be a number of hours'],
    ['missing hours after', { mode: 'around-low', hoursBefore: 2 }, 'hoursAfter', 'Hours after low water must be a number of hours'],
    ['0 h before and 0 h after', { mode: 'around-low', hoursBefore: 0, hoursAfter: 0 }, 'hoursAfter', 'Hours before and after cannot both be 0: the window would have no length'],
    ['a note of 501 characters', { mode: 'around-low', hoursBefore: 1, hoursAfter: 1, note: 'x'.repeat(501) }, 'note', 'Tide rule note must be at most 500 characters'],
    ['a note that is not text', { mode: 'around-low', hoursBefore: 1, hoursAfter: 1, note: 3 }, 'note', 'Tide rule note must be text'],
  ])('rejects %s with a message on %s', (_label, rule, field, message) => {
    const result = tideRuleSchema.safeParse(rule);
    expect(result.success).toBe(false);
    if (!result.success) expect(fieldErrorsFromZod(result.error)[field]).toBe(message);
  });
});

describe('tideEventSchema', () => {
  it.each([
    [{ at: '2027-05-04T02:12:00.000Z', kind: 'low', heightM: 0.4 }],
    [{ at: '2027-05-04T02:12:00Z', kind: 'high' }],
    [{ at: '2027-05-04T02:12:00Z', kind: 'low', heightM: -0.3 }],
  ])('accepts %j', (event) => {
    expect(tideEventSchema.parse(event)).toEqual(event);
  });

  it.each([
    ['a local time with an offset', { at: '2027-05-04T03:12:00+01:00', kind: 'low' }, 'at', 'Tide time must be an ISO 8601 UTC time such as 2027-05-04T02:12:00Z'],
    ['a date alone', { at: '2027-05-04', kind: 'low' }, 'at', 'Tide time must be an ISO 8601 UTC time such as 2027-05-04T02:12:00Z'],
    ['an unknown kind', { at: '2027-05-04T02:12:00Z', kind: 'H' }, 'kind', "Tide kind must be 'high' or 'low'"],
    ['a height of 21 m', { at: '2027-05-04T02:12:00Z', kind: 'high', heightM: 21 }, 'heightM', 'Tide height must be between -20 and 20 m'],
    ['a NaN height', { at: '2027-05-04T02:12:00Z', kind: 'high', heightM: Number.NaN }, 'heightM', 'Tide height must be a number of metres'],
  ])('rejects %s with a message on %s', (_label, event, field, message) => {
    const result = tideEventSchema.safeParse(event);
    expect(result.success).toBe(false);
    if (!result.success) expect(fieldErrorsFromZod(result.error)[field]).toBe(message);
  });
});

describe('TIDE_CAUTION', () => {
  it.each([/predictions/, /surge/, /cut off/, /cliffs/, /cave/, /official tide table/, /local knowledge/])(
    'says %s', (words) => {
      expect(TIDE_CAUTION).toMatch(words);
    });
});
