import {
  cameraBodyResponseSchema,
  gearResponseSchema,
  gearSettingsResponseSchema,
  lensResponseSchema,
  type CameraBodyInputBody,
  type CameraBodyPatch,
  type CameraBodyRecord,
  type GearResponse,
  type GearSettings,
  type LensInputBody,
  type LensPatch,
  type LensRecord,
} from '../../shared/schemas/shot-plan';
import { request } from './client';

const bodyPath = (id: string) => `/gear/bodies/${encodeURIComponent(id)}`;
const lensPath = (id: string) => `/gear/lenses/${encodeURIComponent(id)}`;

/** GET /api/gear: the signed-in user's bodies, lenses and settings. */
export async function getGear(): Promise<GearResponse> {
  return request('GET', '/gear', { schema: gearResponseSchema });
}

/** POST /api/gear/bodies. */
export async function createBody(input: CameraBodyInputBody): Promise<CameraBodyRecord> {
  return (await request('POST', '/gear/bodies', { body: input, schema: cameraBodyResponseSchema })).body;
}

/** PATCH /api/gear/bodies/:id (`null` clears a pixel figure). */
export async function updateBody(id: string, change: CameraBodyPatch): Promise<CameraBodyRecord> {
  return (await request('PATCH', bodyPath(id), { body: change, schema: cameraBodyResponseSchema })).body;
}

/** DELETE /api/gear/bodies/:id. */
export async function deleteBody(id: string): Promise<void> {
  await request('DELETE', bodyPath(id));
}

/** POST /api/gear/lenses. */
export async function createLens(input: LensInputBody): Promise<LensRecord> {
  return (await request('POST', '/gear/lenses', { body: input, schema: lensResponseSchema })).lens;
}

/** PATCH /api/gear/lenses/:id (a prime's focal length clears a zoom's ends and the other way round). */
export async function updateLens(id: string, change: LensPatch): Promise<LensRecord> {
  return (await request('PATCH', lensPath(id), { body: change, schema: lensResponseSchema })).lens;
}

/** DELETE /api/gear/lenses/:id. */
export async function deleteLens(id: string): Promise<void> {
  await request('DELETE', lensPath(id));
}

/** PUT /api/gear/settings. */
export async function saveGearSettings(settings: GearSettings): Promise<GearSettings> {
  return (await request('PUT', '/gear/settings', { body: settings, schema: gearSettingsResponseSchema })).settings;
}
