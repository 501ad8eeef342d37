import { z } from 'zod';
import { hasNoNul, NUL_MESSAGE } from './text';
import { sightlineRoles } from '../policy/sightline-policy';
import { landmarkSchema, vantageSchema } from './geometry';
import { catalogueTargetRefSchema } from './lineup';
import { tideEventSchema, tideRuleSchema } from '../tide/schemas';

export const sightlineNameSchema = z.string({ error: 'Name the sightline' }).trim().min(1, 'Name the sightline').max(100, 'Name is at most 100 characters').refine(hasNoNul, NUL_MESSAGE);

/** What a user saves: the two pins with their heights, the band above the landmark, the usual target. */
export const sightlineInputSchema = z.object({
  name: sightlineNameSchema,
  vantage: vantageSchema,
  landmark: landmarkSchema,
  bandHeightDeg: z.number().finite().gt(0, 'Band height must be above 0 deg').max(90).default(20),
  targetId: catalogueTargetRefSchema.shape.id.default('galactic-centre'),
});
export type SightlineInput = z.infer<typeof sightlineInputSchema>;
export type SightlineInputBody = z.input<typeof sightlineInputSchema>;

/** A partial change: any field of the input (a rename is `{ name }`). */
export const sightlineUpdateSchema = z.object({
  name: sightlineNameSchema.optional(),
  vantage: vantageSchema.optional(),
  landmark: landmarkSchema.optional(),
  bandHeightDeg: z.number().finite().gt(0).max(90).optional(),
  targetId: catalogueTargetRefSchema.shape.id.optional(),
}).refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Nothing to change', path: ['_'] });
export type SightlineUpdate = z.infer<typeof sightlineUpdateSchema>;

export const sightlineSchema = z.object({
  id: z.string(),
  name: z.string(),
  ownerId: z.string(),
  ownerName: z.string(),
  vantage: vantageSchema,
  landmark: landmarkSchema,
  bandHeightDeg: z.number(),
  targetId: z.string(),
  /** IANA time zone of the site, from the vantage's coordinates. */
  timezone: z.string(),
  /** When the spot can be reached on foot; null when tides do not matter here or no rule is set. */
  tideRule: tideRuleSchema.nullable(),
  /** The role of the person asking: owner, editor or viewer in the crew, or admin (support). */
  myRole: z.enum(sightlineRoles),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Sightline = z.infer<typeof sightlineSchema>;

export const sightlineResponseSchema = z.object({ sightline: sightlineSchema });
export const sightlineListResponseSchema = z.object({ sightlines: z.array(sightlineSchema) });

export const fieldNoteKinds = ['access', 'tide', 'hazard', 'general'] as const;
export const fieldNoteInputSchema = z.object({
  kind: z.enum(fieldNoteKinds, { error: 'Kind is one of access, tide, hazard, general' }),
  body: z.string({ error: 'Write the note' }).trim().min(1, 'Write the note').max(5000, 'A note is at most 5000 characters').refine(hasNoNul, NUL_MESSAGE),
});
export type FieldNoteInput = z.infer<typeof fieldNoteInputSchema>;

export const fieldNoteSchema = fieldNoteInputSchema.extend({
  id: z.string(),
  sightlineId: z.string(),
  authorId: z.string().nullable(),
  authorName: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type FieldNote = z.infer<typeof fieldNoteSchema>;
export const fieldNoteResponseSchema = z.object({ note: fieldNoteSchema });
export const fieldNoteListResponseSchema = z.object({ notes: z.array(fieldNoteSchema) });

export const tideRuleRequestSchema = z.object({ rule: tideRuleSchema.nullable() });

/** Tide times pasted from an official table: local times in the site's zone, one event a line. */
export const tideTimesPasteSchema = z.object({
  text: z.string({ error: 'Paste the tide times' }).min(1, 'Paste the tide times').max(500_000, 'That is more than a paste of tide times'),
});

export const tideTimesResponseSchema = z.object({
  events: z.array(tideEventSchema),
  /** Notes about the paste that did not stop it (e.g. a time in a clock-change hour). */
  warnings: z.array(z.object({ line: z.number(), text: z.string(), message: z.string() })).default([]),
});
export type TideTimesResponse = z.infer<typeof tideTimesResponseSchema>;
