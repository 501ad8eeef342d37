import { Router } from 'express';
import { outingAnswerInputSchema, outingInputSchema, outingUpdateSchema } from '../../shared/schemas/outing';
import { requireAuth } from '../middleware/auth';
import { parseOrThrow, validateBody } from '../middleware/validate';
import type { OutingService } from '../services/outing-service';
import { idParamsSchema } from '../../shared/schemas/ids';

const params = idParamsSchema;

/** Mounted at /api/sightlines/:id/outings: list and plan. */
export function sightlineOutingsRouter({ outings }: { outings: OutingService }): Router {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);

  router.get('/', async (req, res) => {
    const { id } = parseOrThrow(params, req.params);
    res.json({ outings: await outings.list(req.user!, id) });
  });

  router.post('/', validateBody(outingInputSchema), async (req, res) => {
    const { id } = parseOrThrow(params, req.params);
    res.status(201).json({ outing: await outings.create(req.user!, id, req.body) });
  });

  return router;
}

/** Mounted at /api/outings: one outing, its changes and the crew's answers. */
export function outingsRouter({ outings }: { outings: OutingService }): Router {
  const router = Router();
  router.use(requireAuth);

  router.get('/:id', async (req, res) => {
    const { id } = parseOrThrow(params, req.params);
    res.json({ outing: await outings.get(req.user!, id) });
  });

  router.patch('/:id', validateBody(outingUpdateSchema), async (req, res) => {
    const { id } = parseOrThrow(params, req.params);
    res.json({ outing: await outings.update(req.user!, id, req.body) });
  });

  router.delete('/:id', async (req, res) => {
    const { id } = parseOrThrow(params, req.params);
    await outings.remove(req.user!, id);
    res.status(204).end();
  });

  router.put('/:id/answer', validateBody(outingAnswerInputSchema), async (req, res) => {
    const { id } = parseOrThrow(params, req.params);
    res.json({ outing: await outings.answer(req.user!, id, req.body) });
  });

  return router;
}
