import { apiErrorBodySchema } from '../../shared/errors';
import { shotPlanResponseSchema, type ShotCardFormat, type ShotPlan, type ShotPlanRequestBody } from '../../shared/schemas/shot-plan';
import { ApiError, request } from './client';

const sightlinePath = (id: string) => `/sightlines/${encodeURIComponent(id)}`;

/** A shot card file: its bytes and the name the server suggests. */
export interface ShotCardFile {
  blob: Blob;
  filename: string;
}

/** POST /api/sightlines/:id/shot-plan: the plan as JSON; `signal` cancels it. */
export async function getShotPlan(sightlineId: string, body: ShotPlanRequestBody, signal?: AbortSignal): Promise<ShotPlan> {
  return (await request('POST', `${sightlinePath(sightlineId)}/shot-plan`, { body, schema: shotPlanResponseSchema, ...(signal ? { signal } : {}) })).plan;
}

function filenameOf(response: Response, fallback: string): string {
  const header = response.headers.get('Content-Disposition') ?? '';
  const match = /filename\*?=(?:UTF-8'')?"?([^";]+)"?/i.exec(header);
  return match?.[1] ? decodeURIComponent(match[1]) : fallback;
}

/**
 * POST /api/sightlines/:id/shot-card?format=html|pdf: the shot card as a file. Not through
 * request(), which reads every answer as JSON; same conventions (same origin, cookies, errors as
 * ApiError from the shared error schema).
 */
export async function getShotCard(sightlineId: string, body: ShotPlanRequestBody, format: ShotCardFormat): Promise<ShotCardFile> {
  let response: Response;
  try {
    response = await fetch(`/api${sightlinePath(sightlineId)}/shot-card?format=${format}`, {
      method: 'POST',
      credentials: 'same-origin',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'network', 'Cannot reach the Gnomon server. Check your connection and try again.');
  }
  if (!response.ok) {
    let json: unknown;
    try { json = await response.json(); } catch { json = undefined; }
    const parsed = apiErrorBodySchema.safeParse(json);
    if (parsed.success) throw new ApiError(response.status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.fields);
    throw new ApiError(response.status, 'internal', `The server answered ${response.status}`);
  }
  return { blob: await response.blob(), filename: filenameOf(response, `shot-card.${format}`) };
}
