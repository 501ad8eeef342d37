import { Router } from 'express';
import { z } from 'zod';
import { AppError } from '../errors';
import { requireAuth } from '../middleware/auth';
import type { CalendarFeedService } from '../services/calendar-feed-service';

const feedFileParams = z.object({ file: z.string().regex(/^[A-Za-z0-9_-]{32,64}\.ics$/) });

/**
 * Mounted at /api/calendar. GET /feed and POST /feed/rotate for the signed-in user; GET
 * /<secret>.ics for calendar apps (no sign-in: the secret is the key).
 */
export function calendarRouter({ feeds }: { feeds: CalendarFeedService }): Router {
  const router = Router();

  router.get('/feed', requireAuth, async (req, res) => {
    res.json({ feed: await feeds.feed(req.user!) });
  });

  router.post('/feed/rotate', requireAuth, async (req, res) => {
    res.json({ feed: await feeds.rotate(req.user!) });
  });

  router.get('/:file', async (req, res) => {
    const parsed = feedFileParams.safeParse(req.params);
    if (!parsed.success) throw AppError.notFound('No such calendar feed');
    const ics = await feeds.ics(parsed.data.file.slice(0, -'.ics'.length));
    res.setHeader('Cache-Control', 'private, max-age=300');
    res.type('text/calendar').send(ics);
  });

  return router;
}
