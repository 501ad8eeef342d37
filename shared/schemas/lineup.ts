import { z } from 'zod';
import { hasNoNul, NUL_MESSAGE } from './text';
import { findTarget } from '../sky/catalogue';
import { MS_PER_DAY } from '../units';
import { equatorialJ2000Schema, frameSchema, landmarkSchema, latitudeSchema, longitudeSchema, vantageSchema } from './geometry';

/** Longest search range, in days (ten years, with leap days). */
export const MAX_SEARCH_RANGE_DAYS = 3653;

/** True when YYYY-MM-DD names a day that exists (2027-02-30 does not). */
export function isRealCalendarDate(ymd: string): boolean {
  const [y, m, d] = ymd.split('-').map(Number) as [number, number, number];
  const date = new Date(Date.UTC(2000, m - 1, d));
  date.setUTCFullYear(y);
  return date.getUTCFullYear() === y && date.getUTCMonth() === m - 1 && date.getUTCDate() === d;
}

/** An ISO 8601 date ("2027-05-01") or date-time with zone ("2027-05-01T22:00:00Z"); midnight UTC for a date. */
export const isoInstantSchema = z.string({ error: 'Give an ISO date such as 2027-05-01' })
  .trim()
  .refine((s) => /^\d{4}-\d{2}-\d{2}(T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2}))?$/.test(s) && !Number.isNaN(Date.parse(s)), {
    message: 'Give an ISO date such as 2027-05-01 or 2027-05-01T22:00:00Z',
  })
  .refine((s) => isRealCalendarDate(s.slice(0, 10)), { message: 'That day does not exist' })
  .refine((s) => { const y = Number(s.slice(0, 4)); return y >= 1900 && y < 2200; }, { message: 'Dates from 1900 to 2199 only' })
  .transform((s) => new Date(/T/.test(s) ? s : `${s}T00:00:00Z`));

export const catalogueTargetRefSchema = z.object({
  id: z.string().trim().toLowerCase().refine((id) => findTarget(id) !== undefined, { message: 'Unknown target id' }),
});

export const customTargetSchema = equatorialJ2000Schema.extend({
  name: z.string().trim().min(1, 'Name the custom target').max(80).refine(hasNoNul, NUL_MESSAGE),
});

/** A catalogue target by id, or a custom J2000 position with a name. */
export const targetRefSchema = z.union([catalogueTargetRefSchema, customTargetSchema], {
  error: 'Give a catalogue target { id } or a custom target { raHours, decDeg, name }',
});
export type TargetRef = z.infer<typeof targetRefSchema>;

export const moonConditionSchema = z.union([
  z.literal('down'),
  z.object({ maxIllumination: z.number().finite().min(0).max(1, 'Illumination is a fraction from 0 to 1') }),
], { error: "Moon must be 'down' or { maxIllumination: 0..1 }" });

export const lineupConditionsSchema = z.object({
  sunMaxAltDeg: z.number().finite().min(-30, 'Sun limit must be between -30 and 0 deg').max(0, 'Sun limit must be between -30 and 0 deg').default(-18),
  moon: moonConditionSchema.default('down'),
  minDurationMin: z.number().finite().min(0).max(1440, 'Minimum duration must be at most 1440 min').default(5),
});
export type LineupConditionsInput = z.infer<typeof lineupConditionsSchema>;

/** Where the camera is for a frame typed by hand: height above sea level of the camera, m. */
export const searchVantageSchema = z.object({
  lat: latitudeSchema,
  lon: longitudeSchema,
  elevationM: z.number().finite().min(-500).max(9000).default(0),
});

export const lineupSearchRequestSchema = z.object({
  /** A saved sightline: its geometry is used unless frame or sightline is given, and lineups get a tide status. */
  sightlineId: z.uuid({ error: 'Not a valid sightline id' }).optional(),
  frame: frameSchema.optional(),
  sightline: z.object({
    vantage: vantageSchema,
    landmark: landmarkSchema,
    bandHeightDeg: z.number().finite().gt(0).max(90).default(20),
  }).optional(),
  vantage: searchVantageSchema.optional(),
  target: targetRefSchema,
  from: isoInstantSchema,
  to: isoInstantSchema,
  conditions: lineupConditionsSchema.default({ sunMaxAltDeg: -18, moon: 'down', minDurationMin: 5 }),
}).superRefine((r, ctx) => {
  if (!r.frame && !r.sightline && !r.sightlineId) ctx.addIssue({ code: 'custom', path: ['frame'], message: 'Give a frame or a sightline' });
  if (r.frame && !r.sightline && !r.vantage) ctx.addIssue({ code: 'custom', path: ['vantage'], message: 'A typed frame needs the vantage position' });
  // Dates that failed their own check are reported there.
  if (!(r.from instanceof Date) || !(r.to instanceof Date)) return;
  if (r.to.getTime() <= r.from.getTime()) ctx.addIssue({ code: 'custom', path: ['to'], message: 'The end must be after the start' });
  else if (r.to.getTime() - r.from.getTime() > MAX_SEARCH_RANGE_DAYS * MS_PER_DAY) {
    ctx.addIssue({ code: 'custom', path: ['to'], message: 'Search at most 10 years at once' });
  }
});
export type LineupSearchRequest = z.infer<typeof lineupSearchRequestSchema>;
/** What a client sends (dates as strings, defaults optional). */
export type LineupSearchRequestBody = z.input<typeof lineupSearchRequestSchema>;

export const lineupSchema = z.object({
  start: z.string(),
  end: z.string(),
  peak: z.string(),
  durationMin: z.number(),
  peakAzimuthDeg: z.number(),
  peakAltitudeDeg: z.number(),
  sunAltitudeDeg: z.number(),
  moonAltitudeDeg: z.number(),
  moonIllumination: z.number(),
  score: z.number().min(0).max(1),
  /** With a saved sightline that has a tide rule: can the spot be reached for the whole lineup? */
  tideStatus: z.enum(['reachable', 'cut-off', 'unknown']).optional(),
  /** When the tide cuts the spot off after the lineup starts (ISO UTC), if it does. */
  tideCutOffAt: z.string().nullable().optional(),
});
export type Lineup = z.infer<typeof lineupSchema>;

export const lineupSearchResponseSchema = z.object({
  lineups: z.array(lineupSchema),
  timezone: z.string(),
  target: z.object({ id: z.string().optional(), name: z.string(), raHours: z.number(), decDeg: z.number() }),
  frame: frameSchema,
  computeMs: z.number(),
});
export type LineupSearchResponse = z.infer<typeof lineupSearchResponseSchema>;
