import {
  crewInviteCreatedSchema,
  crewResponseSchema,
  inviteAcceptedSchema,
  inviteLookupResponseSchema,
  type CrewInviteCreated,
  type CrewInviteInput,
  type CrewResponse,
  type InviteLookup,
} from '../../shared/schemas/crew';
import type { CrewRole } from '../../shared/policy/sightline-policy';
import { request } from './client';

const crewPath = (sightlineId: string) => `/sightlines/${encodeURIComponent(sightlineId)}/crew`;

/** GET /api/sightlines/:id/crew. */
export function getCrew(sightlineId: string): Promise<CrewResponse> {
  return request('GET', crewPath(sightlineId), { schema: crewResponseSchema });
}

/** POST /api/sightlines/:id/crew/invites: the invite, its link and whether the e-mail went. */
export function inviteToCrew(sightlineId: string, input: CrewInviteInput): Promise<CrewInviteCreated> {
  return request('POST', `${crewPath(sightlineId)}/invites`, { body: input, schema: crewInviteCreatedSchema });
}

/** DELETE /api/sightlines/:id/crew/invites/:inviteId. */
export async function revokeInvite(sightlineId: string, inviteId: string): Promise<void> {
  await request('DELETE', `${crewPath(sightlineId)}/invites/${encodeURIComponent(inviteId)}`);
}

/** PATCH /api/sightlines/:id/crew/:userId. */
export function changeCrewRole(sightlineId: string, userId: string, role: CrewRole): Promise<CrewResponse> {
  return request('PATCH', `${crewPath(sightlineId)}/${encodeURIComponent(userId)}`, { body: { role }, schema: crewResponseSchema });
}

/** DELETE /api/sightlines/:id/crew/:userId: the owner removes someone. */
export function removeFromCrew(sightlineId: string, userId: string): Promise<CrewResponse> {
  return request('DELETE', `${crewPath(sightlineId)}/${encodeURIComponent(userId)}`, { schema: crewResponseSchema });
}

/** DELETE /api/sightlines/:id/crew/:myId: leave the crew. */
export async function leaveCrew(sightlineId: string, myId: string): Promise<void> {
  await request('DELETE', `${crewPath(sightlineId)}/${encodeURIComponent(myId)}`);
}

/** POST /api/sightlines/:id/crew/hand-over. */
export function handOver(sightlineId: string, userId: string): Promise<CrewResponse> {
  return request('POST', `${crewPath(sightlineId)}/hand-over`, { body: { userId }, schema: crewResponseSchema });
}

/** GET /api/invites/lookup?token=: what an invite link offers (no sign-in needed). */
export async function lookupInvite(token: string): Promise<InviteLookup> {
  return (await request('GET', `/invites/lookup?token=${encodeURIComponent(token)}`, { schema: inviteLookupResponseSchema })).invite;
}

/** POST /api/invites/accept. */
export function acceptInvite(token: string): Promise<{ sightlineId: string; role: CrewRole }> {
  return request('POST', '/invites/accept', { body: { token }, schema: inviteAcceptedSchema });
}
