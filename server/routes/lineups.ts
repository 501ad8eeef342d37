import { Router } from 'express';
import { z } from 'zod';
import { lineupSearchRequestSchema } from '../../shared/schemas/lineup';
import { requireAuth } from '../middleware/auth';
import { parseOrThrow, validateBody } from '../middleware/validate';
import { lineupsToCsv, lineupsToIcs } from '../services/lineup-export';
import type { LineupService } from '../services/lineup-service';

const exportQuery = z.object({ format: z.enum(['ics', 'csv'], { error: 'format is ics or csv' }) });

/** The lineup search and its exports. */
export function lineupsRouter({ lineups }: { lineups: LineupService }): Router {
  const router = Router();
  router.use(requireAuth);

  router.post('/search', validateBody(lineupSearchRequestSchema), async (req, res) => {
    res.type('json').send(await lineups.searchAsJson(req.user!, req.body));
  });

  // POST /api/lineups/export?format=ics|csv with the search body: the same lineups as a file.
  router.post('/export', validateBody(lineupSearchRequestSchema), async (req, res) => {
    const { format } = parseOrThrow(exportQuery, req.query);
    const result = await lineups.search(req.user!, req.body);
    const title = `${result.target.name} lineups`;
    const base = `gnomon-${(result.target.id ?? 'custom').replace(/[^a-z0-9-]/gi, '')}-lineups`;
    if (format === 'ics') {
      res.type('text/calendar').attachment(`${base}.ics`).send(lineupsToIcs(result, title));
    } else {
      res.type('text/csv').attachment(`${base}.csv`).send(lineupsToCsv(result));
    }
  });

  return router;
}
