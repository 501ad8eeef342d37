import { Router } from 'express';
import { z } from 'zod';
import { fieldNoteInputSchema, sightlineInputSchema, sightlineUpdateSchema, tideRuleRequestSchema, tideTimesPasteSchema } from '../../shared/schemas/sightline';
import { isoInstantSchema } from '../../shared/schemas/lineup';
import { ENGINE_MAX_UNIX_MS, ENGINE_MIN_UNIX_MS } from '../../shared/lineup/time';
import { requireAuth } from '../middleware/auth';
import { parseOrThrow, validateBody } from '../middleware/validate';
import type { FieldNoteService } from '../services/field-note-service';
import type { SightlineService } from '../services/sightline-service';
import type { TideService } from '../services/tide-service';
import type { LineupService } from '../services/lineup-service';
import type { PhotoService } from '../services/photo-service';
import { catalogueTargetRefSchema } from '../../shared/schemas/lineup';
import { idSchema } from '../../shared/schemas/ids';

const uuid = idSchema;
const sightlineParams = z.object({ id: uuid });
const noteParams = z.object({ id: uuid, noteId: uuid });
const listQuery = z.object({ all: z.enum(['true', 'false']).optional() });
const nextQuery = z.object({
  target: catalogueTargetRefSchema.shape.id.optional(),
  count: z.coerce.number().int().min(1).max(20).optional(),
});
// The engine span; also keeps years PostgreSQL cannot store (year 0) out of the query.
const spanInstant = isoInstantSchema.refine((d) => d.getTime() >= ENGINE_MIN_UNIX_MS && d.getTime() <= ENGINE_MAX_UNIX_MS, { message: 'Give a date between 1900 and 2200' });
const rangeQuery = z.object({ from: spanInstant.optional(), to: spanInstant.optional() });

export interface SightlineRouterDeps {
  sightlines: SightlineService;
  notes: FieldNoteService;
  tides: TideService;
  lineups: LineupService;
  photos: PhotoService;
}

/** Sightlines and their field notes. */
export function sightlinesRouter({ sightlines, notes, tides, lineups, photos }: SightlineRouterDeps): Router {
  const router = Router();
  router.use(requireAuth);

  router.get('/', async (req, res) => {
    const { all } = parseOrThrow(listQuery, req.query);
    const list = await sightlines.list(req.user!, { all: all === 'true' });
    res.json({ sightlines: list.map((s) => s.toPublic()) });
  });

  router.post('/', validateBody(sightlineInputSchema), async (req, res) => {
    res.status(201).json({ sightline: (await sightlines.create(req.user!, req.body)).toPublic() });
  });

  router.get('/:id', async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    res.json({ sightline: (await sightlines.get(req.user!, id)).toPublic() });
  });

  router.patch('/:id', validateBody(sightlineUpdateSchema), async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    res.json({ sightline: (await sightlines.update(req.user!, id, req.body)).toPublic() });
  });

  router.delete('/:id', async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    // The photo rows would go with the cascade, but their files would stay: remove them first.
    await sightlines.get(req.user!, id, 'delete');
    await photos.removeAllOfSightline(id);
    await sightlines.remove(req.user!, id);
    res.status(204).end();
  });

  router.get('/:id/notes', async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    res.json({ notes: (await notes.list(req.user!, id)).map((n) => n.toPublic()) });
  });

  router.post('/:id/notes', validateBody(fieldNoteInputSchema), async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    res.status(201).json({ note: (await notes.create(req.user!, id, req.body)).toPublic() });
  });

  router.put('/:id/notes/:noteId', validateBody(fieldNoteInputSchema), async (req, res) => {
    const { id, noteId } = parseOrThrow(noteParams, req.params);
    res.json({ note: (await notes.update(req.user!, id, noteId, req.body)).toPublic() });
  });

  router.delete('/:id/notes/:noteId', async (req, res) => {
    const { id, noteId } = parseOrThrow(noteParams, req.params);
    await notes.remove(req.user!, id, noteId);
    res.status(204).end();
  });

  router.get('/:id/next-lineups', async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    const { target, count } = parseOrThrow(nextQuery, req.query);
    res.json(await lineups.nextLineups(req.user!, id, { targetId: target, count }));
  });

  router.put('/:id/tide-rule', validateBody(tideRuleRequestSchema), async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    res.json({ sightline: (await tides.setRule(req.user!, id, req.body.rule)).toPublic() });
  });

  router.get('/:id/tide-times', async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    const range = parseOrThrow(rangeQuery, req.query);
    res.json({ events: await tides.events(req.user!, id, range), warnings: [] });
  });

  router.post('/:id/tide-times', validateBody(tideTimesPasteSchema), async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    res.json(await tides.paste(req.user!, id, req.body.text));
  });

  router.delete('/:id/tide-times', async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    await tides.clear(req.user!, id);
    res.status(204).end();
  });

  return router;
}
