import { Router } from 'express';
import { lineupSearchRequestSchema } from '../../shared/schemas/lineup';
import { requireAuth } from '../middleware/auth';
import { validateBody } from '../middleware/validate';
import type { LineupService } from '../services/lineup-service';

/** The lineup search. */
export function lineupsRouter({ lineups }: { lineups: LineupService }): Router {
  const router = Router();
  router.use(requireAuth);
  router.post('/search', validateBody(lineupSearchRequestSchema), async (req, res) => {
    res.json(await lineups.search(req.user!, req.body));
  });
  return router;
}
