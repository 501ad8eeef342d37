import { Router } from 'express';
import { OUTLOOK_CAUTION } from '../../shared/outlook';
import { outlookRequestSchema, sightlineOutlookQuerySchema, type OutlookRequest, type OutlookResponse } from '../../shared/schemas/outlook';
import { requireAuth } from '../middleware/auth';
import { parseOrThrow, validateBody } from '../middleware/validate';
import type { ForecastService } from '../forecast/forecast-service';
import { idParamsSchema } from '../../shared/schemas/ids';

const sightlineParams = idParamsSchema;

/**
 * Mounted at /api/outlook. POST with `{ sightlineId | vantage, windows }`: the sky outlook of each
 * lineup window, in order. A sightline needs read access (404 otherwise). The forecast service
 * failing never fails the request: those windows say 'unavailable'.
 */
export function outlookRouter({ forecast }: { forecast: ForecastService }): Router {
  const router = Router();
  router.use(requireAuth);

  router.post('/', validateBody(outlookRequestSchema), async (req, res) => {
    const { sightlineId, vantage, windows } = req.body as OutlookRequest;
    const outlooks = sightlineId
      ? await forecast.outlookForSightline(req.user!, sightlineId, windows)
      : await forecast.outlookFor(vantage!.lat, vantage!.lon, windows);
    const body: OutlookResponse = { outlooks, caution: OUTLOOK_CAUTION };
    res.json(body);
  });

  return router;
}

/** Mounted at /api/sightlines/:id/outlook. GET ?from=&to=: the sky outlook of that one window. */
export function sightlineOutlookRouter({ forecast }: { forecast: ForecastService }): Router {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);

  router.get('/', async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    const { from, to } = parseOrThrow(sightlineOutlookQuerySchema, req.query);
    const outlooks = await forecast.outlookForSightline(req.user!, id, [{ start: from, end: to }]);
    const body: OutlookResponse = { outlooks, caution: OUTLOOK_CAUTION };
    res.json(body);
  });

  return router;
}
