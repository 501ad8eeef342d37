import { Router } from 'express';
import {
  cameraBodyInputSchema,
  cameraBodyPatchSchema,
  gearSettingsSchema,
  lensInputSchema,
  lensPatchSchema,
} from '../../shared/schemas/shot-plan';
import { requireAuth } from '../middleware/auth';
import { parseOrThrow, validateBody } from '../middleware/validate';
import type { GearService } from '../services/gear-service';
import { idParamsSchema } from '../../shared/schemas/ids';

const idParams = idParamsSchema;

/** Mounted at /api/gear: the signed-in user's camera bodies, lenses and gear settings. */
export function gearRouter({ gear }: { gear: GearService }): Router {
  const router = Router();
  router.use(requireAuth);

  router.get('/', async (req, res) => {
    res.json(await gear.list(req.user!));
  });

  router.post('/bodies', validateBody(cameraBodyInputSchema), async (req, res) => {
    const body = await gear.createBody(req.user!, req.body);
    res.status(201).json({ body: body.toPublic() });
  });

  router.patch('/bodies/:id', validateBody(cameraBodyPatchSchema), async (req, res) => {
    const { id } = parseOrThrow(idParams, req.params);
    const body = await gear.updateBody(req.user!, id, req.body);
    res.json({ body: body.toPublic() });
  });

  router.delete('/bodies/:id', async (req, res) => {
    const { id } = parseOrThrow(idParams, req.params);
    await gear.removeBody(req.user!, id);
    res.status(204).end();
  });

  router.post('/lenses', validateBody(lensInputSchema), async (req, res) => {
    const lens = await gear.createLens(req.user!, req.body);
    res.status(201).json({ lens: lens.toPublic() });
  });

  router.patch('/lenses/:id', validateBody(lensPatchSchema), async (req, res) => {
    const { id } = parseOrThrow(idParams, req.params);
    const lens = await gear.updateLens(req.user!, id, req.body);
    res.json({ lens: lens.toPublic() });
  });

  router.delete('/lenses/:id', async (req, res) => {
    const { id } = parseOrThrow(idParams, req.params);
    await gear.removeLens(req.user!, id);
    res.status(204).end();
  });

  router.put('/settings', validateBody(gearSettingsSchema), async (req, res) => {
    res.json({ settings: await gear.saveSettings(req.user!, req.body) });
  });

  return router;
}
