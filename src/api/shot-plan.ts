import { shotPlanResponseSchema, type ShotCardFormat, type ShotPlan, type ShotPlanRequestBody } from '../../shared/schemas/shot-plan';
import { request, requestFile, type DownloadedFile } from './client';

const sightlinePath = (id: string) => `/sightlines/${encodeURIComponent(id)}`;

/** A shot card file: its bytes and the name the server suggests. */
export type ShotCardFile = DownloadedFile;

/** POST /api/sightlines/:id/shot-plan: the plan as JSON; `signal` cancels it. */
export async function getShotPlan(sightlineId: string, body: ShotPlanRequestBody, signal?: AbortSignal): Promise<ShotPlan> {
  return (await request('POST', `${sightlinePath(sightlineId)}/shot-plan`, { body, schema: shotPlanResponseSchema, ...(signal ? { signal } : {}) })).plan;
}

/** POST /api/sightlines/:id/shot-card?format=html|pdf: the shot card as a file. */
export function getShotCard(sightlineId: string, body: ShotPlanRequestBody, format: ShotCardFormat): Promise<ShotCardFile> {
  return requestFile(`${sightlinePath(sightlineId)}/shot-card?format=${format}`, body, `shot-card.${format}`);
}
