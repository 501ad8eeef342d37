import { Router } from 'express';
import { z } from 'zod';
import { crewInviteInputSchema, crewRoleUpdateSchema, handOverSchema, inviteTokenSchema } from '../../shared/schemas/crew';
import { requireAuth } from '../middleware/auth';
import { parseOrThrow, validateBody } from '../middleware/validate';
import type { CrewService } from '../services/crew-service';
import type { InviteService } from '../services/invite-service';
import { idSchema } from '../../shared/schemas/ids';

const uuid = idSchema;
const sightlineParams = z.object({ id: uuid });
const memberParams = z.object({ id: uuid, userId: uuid });
const inviteParams = z.object({ id: uuid, inviteId: uuid });

/** Mounted at /api/sightlines/:id/crew: members, roles, leaving, hand-over and invites. */
export function crewRouter({ crew, invites }: { crew: CrewService; invites: InviteService }): Router {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);

  router.get('/', async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    res.json(await crew.get(req.user!, id));
  });

  router.post('/invites', validateBody(crewInviteInputSchema), async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    res.status(201).json(await invites.create(req.user!, id, req.body));
  });

  router.delete('/invites/:inviteId', async (req, res) => {
    const { id, inviteId } = parseOrThrow(inviteParams, req.params);
    await invites.revoke(req.user!, id, inviteId);
    res.status(204).end();
  });

  router.post('/hand-over', validateBody(handOverSchema), async (req, res) => {
    const { id } = parseOrThrow(sightlineParams, req.params);
    await crew.handOver(req.user!, id, req.body.userId);
    res.json(await crew.get(req.user!, id));
  });

  router.patch('/:userId', validateBody(crewRoleUpdateSchema), async (req, res) => {
    const { id, userId } = parseOrThrow(memberParams, req.params);
    await crew.changeRole(req.user!, id, userId, req.body.role);
    res.json(await crew.get(req.user!, id));
  });

  /** The owner removes a member, or a member removes themselves (leaves: 204 then, nothing left to show). */
  router.delete('/:userId', async (req, res) => {
    const { id, userId } = parseOrThrow(memberParams, req.params);
    await crew.remove(req.user!, id, userId);
    if (userId === req.user!.id) res.status(204).end();
    else res.json(await crew.get(req.user!, id));
  });

  return router;
}

/** Mounted at /api/invites: what a link shows (no sign-in) and accepting it (signed in). */
export function invitesRouter({ invites }: { invites: InviteService }): Router {
  const router = Router();

  router.get('/lookup', async (req, res) => {
    const { token } = parseOrThrow(inviteTokenSchema, req.query);
    res.json({ invite: await invites.lookup(token) });
  });

  router.post('/accept', requireAuth, validateBody(inviteTokenSchema), async (req, res) => {
    res.json(await invites.accept(req.user!, req.body.token));
  });

  return router;
}
