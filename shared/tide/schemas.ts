/**
 * Schemas for tide data on a sightline: a tide event (one high or low water) and the tide rule that
 * says when the vantage or landmark can be reached on foot.
 */
import { z } from 'zod';

/**
 * Lowest and highest tide height accepted, metres above chart datum. Heights below datum occur at
 * big spring lows; the largest tidal ranges on Earth are about 16 m (from memory), so ±20 m leaves
 * room without letting typing slips (a time pasted as a height) through.
 */
export const MIN_TIDE_HEIGHT_M = -20;
export const MAX_TIDE_HEIGHT_M = 20;

/** Largest hours before or after a high or low water a tide rule may name (half a day). */
export const MAX_TIDE_RULE_HOURS = 12;

/** Longest free-text note on a tide rule, characters. */
export const MAX_TIDE_RULE_NOTE_CHARS = 500;

/** Whether a tide event is a high water or a low water. */
export const tideKindSchema = z.enum(['high', 'low'], { error: "Tide kind must be 'high' or 'low'" });
export type TideKind = z.infer<typeof tideKindSchema>;

/**
 * One predicted high or low water. `at` is the instant in ISO 8601 UTC with a `Z` suffix (e.g.
 * '2027-05-04T02:12:00.000Z'); `heightM` the predicted height in metres above chart datum, when
 * the table gives it.
 */
export const tideEventSchema = z.object({
  at: z.iso.datetime({ error: 'Tide time must be an ISO 8601 UTC time such as 2027-05-04T02:12:00Z' }),
  kind: tideKindSchema,
  heightM: z.number({ error: 'Tide height must be a number of metres' })
    .finite('Tide height must be a finite number')
    .min(MIN_TIDE_HEIGHT_M, `Tide height must be between ${MIN_TIDE_HEIGHT_M} and ${MAX_TIDE_HEIGHT_M} m`)
    .max(MAX_TIDE_HEIGHT_M, `Tide height must be between ${MIN_TIDE_HEIGHT_M} and ${MAX_TIDE_HEIGHT_M} m`)
    .optional(),
});
export type TideEvent = z.infer<typeof tideEventSchema>;

function ruleHoursSchema(label: string) {
  const range = `${label} must be between 0 and ${MAX_TIDE_RULE_HOURS} hours`;
  return z.number({ error: `${label} must be a number of hours` })
    .finite(`${label} must be a finite number`)
    .min(0, range)
    .max(MAX_TIDE_RULE_HOURS, range);
}

const ruleNoteSchema = z.string({ error: 'Tide rule note must be text' })
  .trim()
  .max(MAX_TIDE_RULE_NOTE_CHARS, `Tide rule note must be at most ${MAX_TIDE_RULE_NOTE_CHARS} characters`)
  .optional();

/**
 * A tide rule on a sightline: when the vantage or landmark can be reached.
 *
 * - `around-low`: reachable from `hoursBefore` hours before to `hoursAfter` hours after each low
 *   water, cut off at all other times.
 * - `except-around-high`: reachable at all times except from `hoursBefore` hours before to
 *   `hoursAfter` hours after each high water.
 *
 * Both hour values are 0..12 h; together they must be above 0 h (a window of no length would make
 * an `around-low` spot never reachable and an `except-around-high` rule have no effect).
 */
export const tideRuleSchema = z.discriminatedUnion('mode', [
  z.object({
    mode: z.literal('around-low'),
    hoursBefore: ruleHoursSchema('Hours before low water'),
    hoursAfter: ruleHoursSchema('Hours after low water'),
    note: ruleNoteSchema,
  }),
  z.object({
    mode: z.literal('except-around-high'),
    hoursBefore: ruleHoursSchema('Hours before high water'),
    hoursAfter: ruleHoursSchema('Hours after high water'),
    note: ruleNoteSchema,
  }),
], { error: "Tide rule mode must be 'around-low' or 'except-around-high'" })
  .refine((r) => r.hoursBefore + r.hoursAfter > 0, {
    message: 'Hours before and after cannot both be 0: the window would have no length',
    path: ['hoursAfter'],
  });
export type TideRule = z.infer<typeof tideRuleSchema>;
