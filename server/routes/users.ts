import { Router } from 'express';
import { z } from 'zod';
import { userUpdateRequestSchema } from '../../shared/schemas/auth';
import { requireRole } from '../middleware/auth';
import { parseOrThrow, validateBody } from '../middleware/validate';
import type { UserService } from '../services/user-service';

const idParams = z.object({ id: z.uuid({ error: 'Not an account id' }) });

/** Account administration, admins only. */
export function usersRouter({ users }: { users: UserService }): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', async (_req, res) => {
    const list = await users.list();
    res.json({ users: list.map((u) => u.toPublic()) });
  });

  router.patch('/:id', validateBody(userUpdateRequestSchema), async (req, res) => {
    const { id } = parseOrThrow(idParams, req.params);
    const user = await users.update(req.user!, id, req.body);
    res.json({ user: user.toPublic() });
  });

  return router;
}
