import { outlookResponseSchema, type OutlookRequestBody, type OutlookResponse } from '../../shared/schemas/outlook';
import { request } from './client';

/**
 * POST /api/outlook: the sky outlook of up to 100 lineup windows at once, at a saved sightline's
 * vantage or a typed position. The forecast service failing never fails the call: those windows
 * come back 'unavailable'. `signal` cancels it.
 */
export async function fetchOutlooks(body: OutlookRequestBody, signal?: AbortSignal): Promise<OutlookResponse> {
  return request('POST', '/outlook', { body, schema: outlookResponseSchema, ...(signal ? { signal } : {}) });
}

