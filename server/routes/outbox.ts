import { Router } from 'express';
import { outboxListQuerySchema } from '../../shared/schemas/outbox';
import { requireRole } from '../middleware/auth';
import { parseOrThrow } from '../middleware/validate';
import type { OutboxService } from '../services/outbox-service';
import { idParamsSchema } from '../../shared/schemas/ids';

const messageParams = idParamsSchema;

/** Mounted at /api/outbox: what the local SMTP fake received. Admins only. */
export function outboxRouter({ outbox }: { outbox: OutboxService }): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', async (req, res) => {
    res.json(await outbox.list(parseOrThrow(outboxListQuerySchema, req.query)));
  });

  router.get('/:id', async (req, res) => {
    const { id } = parseOrThrow(messageParams, req.params);
    res.json({ message: await outbox.get(id) });
  });

  // The message as received, to save as an .eml file.
  router.get('/:id/raw', async (req, res) => {
    const { id } = parseOrThrow(messageParams, req.params);
    res.type('message/rfc822').attachment(`${id}.eml`).send(await outbox.raw(id));
  });

  return router;
}
