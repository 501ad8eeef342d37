import { Router } from 'express';
import { shotCardQuerySchema, shotPlanRequestSchema } from '../../shared/schemas/shot-plan';
import { requireAuth } from '../middleware/auth';
import { parseOrThrow, validateBody } from '../middleware/validate';
import type { ShotCardService } from '../services/shot-card-service';
import { idParamsSchema } from '../../shared/schemas/ids';

const sightlineParams = idParamsSchema;

/**
 * Mounted at /api/sightlines/:id: POST shot-plan (the plan as JSON) and POST shot-card
 * (?format=html|pdf). Only these two paths are handled; every other path falls through.
 */
export function shotPlanRouter({ shotCards }: { shotCards: ShotCardService }): Router {
  const router = Router({ mergeParams: true });

  router.post('/shot-plan', requireAuth, validateBody(shotPlanRequestSchema), async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    res.json({ plan: await shotCards.plan(req.user!, id, req.body) });
  });

  router.post('/shot-card', requireAuth, validateBody(shotPlanRequestSchema), async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    const { format } = parseOrThrow(shotCardQuerySchema, req.query);
    const card = await shotCards.card(req.user!, id, req.body, format);
    res.setHeader('Content-Type', card.contentType);
    res.setHeader('Cache-Control', 'private, no-store');
    res.setHeader('Content-Disposition', `${format === 'pdf' ? 'attachment' : 'inline'}; filename="${card.filename}"`);
    res.send(card.body);
  });

  return router;
}
