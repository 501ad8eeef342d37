import { z } from 'zod';
import { hasNoNul, NUL_MESSAGE } from './text';
import { latitudeSchema, longitudeSchema } from './geometry';
import { isoInstantSchema, isRealCalendarDate } from './lineup';

export const outingAnswers = ['going', 'maybe', 'not-going'] as const;
export type OutingAnswer = (typeof outingAnswers)[number];

const nightSchema = z.string({ error: 'Choose the night' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the night as YYYY-MM-DD (the date of its evening)')
  .refine(isRealCalendarDate, 'That day does not exist')
  .refine((s) => { const y = Number(s.slice(0, 4)); return y >= 1900 && y < 2200; }, 'Nights from 1900 to 2199 only');

/** A wall-clock time in the site's zone: 'YYYY-MM-DDTHH:mm'. */
export const localDateTimeSchema = z.string({ error: 'Give the meeting time' })
  .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, 'Give the meeting time as YYYY-MM-DDTHH:mm in the site\'s time zone')
  .refine((s) => isRealCalendarDate(s.slice(0, 10)), 'That day does not exist')
  .refine((s) => { const [h, m] = s.slice(11).split(':').map(Number) as [number, number]; return h < 24 && m < 60; }, 'That time does not exist')
  .refine((s) => { const y = Number(s.slice(0, 4)); return y >= 1900 && y < 2200; }, 'Meeting times from 1900 to 2199 only');

/** The lineup an outing is for, as the search gave it. */
export const outingLineupSchema = z.strictObject({
  start: isoInstantSchema,
  end: isoInstantSchema,
  peak: isoInstantSchema,
}).refine((l) => l.start < l.end && l.start <= l.peak && l.peak <= l.end, { message: 'The lineup must start before it ends, with the peak between', path: ['end'] });

const meetingNoteSchema = z.string().trim().max(500, 'At most 500 characters').refine(hasNoNul, NUL_MESSAGE);
const gearNotesSchema = z.string().trim().max(5000, 'At most 5000 characters').refine(hasNoNul, NUL_MESSAGE);

/** POST /api/sightlines/:id/outings */
export const outingInputSchema = z.strictObject({
  night: nightSchema,
  lineup: outingLineupSchema.nullable().default(null),
  meetingPoint: z.strictObject({ lat: latitudeSchema, lon: longitudeSchema }, { error: 'Put a meeting point on the map' }),
  /** Meeting time in the site's zone. */
  meetingLocal: localDateTimeSchema,
  meetingNote: meetingNoteSchema.default(''),
  gearNotes: gearNotesSchema.default(''),
});
export type OutingInput = z.infer<typeof outingInputSchema>;
export type OutingInputBody = z.input<typeof outingInputSchema>;

/** PATCH /api/outings/:id */
export const outingUpdateSchema = z.strictObject({
  meetingPoint: z.strictObject({ lat: latitudeSchema, lon: longitudeSchema }).optional(),
  meetingLocal: localDateTimeSchema.optional(),
  meetingNote: meetingNoteSchema.optional(),
  gearNotes: gearNotesSchema.optional(),
}).refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Nothing to change', path: ['_'] });
export type OutingUpdate = z.infer<typeof outingUpdateSchema>;

/** PUT /api/outings/:id/answer */
export const outingAnswerInputSchema = z.strictObject({
  answer: z.enum(outingAnswers, { error: 'Answer going, maybe or not-going' }),
  note: z.string().trim().max(500, 'At most 500 characters').refine(hasNoNul, NUL_MESSAGE).default(''),
});
export type OutingAnswerInput = z.infer<typeof outingAnswerInputSchema>;

export const outingPersonSchema = z.object({
  userId: z.string(),
  name: z.string(),
  role: z.enum(['owner', 'editor', 'viewer']),
  /** null: not answered yet. */
  answer: z.enum(outingAnswers).nullable(),
  note: z.string(),
  answeredAt: z.string().nullable(),
});
export type OutingPerson = z.infer<typeof outingPersonSchema>;

export const outingSchema = z.object({
  id: z.string(),
  sightlineId: z.string(),
  sightlineName: z.string(),
  /** IANA zone of the site: every local time below is in it. */
  timezone: z.string(),
  night: z.string(),
  lineup: z.object({ start: z.string(), end: z.string(), peak: z.string() }).nullable(),
  meetingPoint: z.object({ lat: z.number(), lon: z.number() }),
  meetingAt: z.string(),
  /** 'YYYY-MM-DDTHH:mm' in the site zone. */
  meetingLocal: z.string(),
  meetingNote: z.string(),
  gearNotes: z.string(),
  createdByName: z.string(),
  /** The crew (owner first) with their answers. */
  people: z.array(outingPersonSchema),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Outing = z.infer<typeof outingSchema>;
export const outingResponseSchema = z.object({ outing: outingSchema });
export const outingListResponseSchema = z.object({ outings: z.array(outingSchema) });
