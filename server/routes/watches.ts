import { Router } from 'express';
import { unsubscribeRequestSchema, watchInputSchema, watchListQuerySchema, watchUpdateSchema } from '../../shared/schemas/watch';
import { requireAuth } from '../middleware/auth';
import { parseOrThrow, validateBody } from '../middleware/validate';
import type { UnsubscribeService } from '../services/unsubscribe-service';
import type { WatchService } from '../services/watch-service';
import { idParamsSchema } from '../../shared/schemas/ids';

const watchParams = idParamsSchema;

/** Mounted at /api/watches: the signed-in user's watches. */
export function watchesRouter({ watches }: { watches: WatchService }): Router {
  const router = Router();
  router.use(requireAuth);

  router.get('/', async (req, res) => {
    const { sightlineId } = parseOrThrow(watchListQuerySchema, req.query);
    const list = await watches.list(req.user!, { sightlineId });
    const last = await watches.lastSentAt(list.map((w) => w.id));
    res.json({ watches: list.map((w) => w.toPublic(last.get(w.id) ?? null)) });
  });

  router.post('/', validateBody(watchInputSchema), async (req, res) => {
    res.status(201).json({ watch: (await watches.create(req.user!, req.body)).toPublic() });
  });

  router.get('/:id', async (req, res) => {
    const { id } = parseOrThrow(watchParams, req.params);
    const watch = await watches.get(req.user!, id);
    res.json({ watch: watch.toPublic((await watches.lastSentAt([id])).get(id) ?? null) });
  });

  router.patch('/:id', validateBody(watchUpdateSchema), async (req, res) => {
    const { id } = parseOrThrow(watchParams, req.params);
    const watch = await watches.update(req.user!, id, req.body);
    res.json({ watch: watch.toPublic((await watches.lastSentAt([id])).get(id) ?? null) });
  });

  router.delete('/:id', async (req, res) => {
    const { id } = parseOrThrow(watchParams, req.params);
    await watches.remove(req.user!, id);
    res.status(204).end();
  });

  router.get('/:id/deliveries', async (req, res) => {
    const { id } = parseOrThrow(watchParams, req.params);
    res.json({ deliveries: (await watches.deliveries(req.user!, id)).map((d) => d.toPublic()) });
  });

  return router;
}

/**
 * Mounted at /api/watches/unsubscribe, before the signed-in routes: the pause link of an e-mail.
 * GET ?token= shows what it would do; POST pauses (token in the JSON body or the query, so the
 * one-click List-Unsubscribe POST of mail programs works too).
 */
export function unsubscribeRouter({ unsubscribe }: { unsubscribe: UnsubscribeService }): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const { token } = parseOrThrow(unsubscribeRequestSchema, req.query);
    res.setHeader('Cache-Control', 'no-store');
    res.json(await unsubscribe.state(token));
  });

  router.post('/', async (req, res) => {
    const body = req.body && typeof req.body === 'object' && 'token' in req.body ? req.body : req.query;
    const { token } = parseOrThrow(unsubscribeRequestSchema, body);
    res.setHeader('Cache-Control', 'no-store');
    res.json(await unsubscribe.use(token));
  });

  return router;
}
