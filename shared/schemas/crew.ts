import { z } from 'zod';
import { crewRoles, sightlineRoles } from '../policy/sightline-policy';
import { emailSchema } from './auth';

/** How long an invite link works, days. */
export const INVITE_VALID_DAYS = 14;

export const crewRoleSchema = z.enum(crewRoles, { error: 'The role is editor or viewer' });

/** POST /api/sightlines/:id/crew/invites */
export const crewInviteInputSchema = z.strictObject({
  email: emailSchema,
  role: crewRoleSchema,
});
export type CrewInviteInput = z.infer<typeof crewInviteInputSchema>;

/** PATCH /api/sightlines/:id/crew/:userId */
export const crewRoleUpdateSchema = z.strictObject({ role: crewRoleSchema });

/** POST /api/sightlines/:id/crew/hand-over: the new owner must be in the crew; the old owner becomes an editor. */
export const handOverSchema = z.strictObject({ userId: z.uuid({ error: 'Choose a crew member' }) });

/** A person on the sightline: the owner or a crew member. */
export const crewMemberSchema = z.object({
  userId: z.string(),
  name: z.string(),
  /** Only the owner sees the members' addresses. */
  email: z.string().nullable(),
  role: z.enum(['owner', ...crewRoles]),
  since: z.string(),
});
export type CrewMember = z.infer<typeof crewMemberSchema>;

export const inviteStatuses = ['pending', 'accepted', 'revoked', 'expired'] as const;
export type InviteStatus = (typeof inviteStatuses)[number];

export const crewInviteSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: crewRoleSchema,
  invitedByName: z.string(),
  status: z.enum(inviteStatuses),
  expiresAt: z.string(),
  createdAt: z.string(),
});
export type CrewInvite = z.infer<typeof crewInviteSchema>;

/** GET /api/sightlines/:id/crew: invites are listed for the owner only (empty for others). */
export const crewResponseSchema = z.object({
  myRole: z.enum(sightlineRoles),
  members: z.array(crewMemberSchema),
  invites: z.array(crewInviteSchema),
});
export type CrewResponse = z.infer<typeof crewResponseSchema>;

/** POST /api/sightlines/:id/crew/invites answers 201 with the invite and whether its e-mail went out. */
export const crewInviteCreatedSchema = z.object({
  invite: crewInviteSchema,
  /** The link in the e-mail, for the owner to pass on another way if the mail did not go. */
  link: z.string(),
  mailSent: z.boolean(),
  /** Why the e-mail did not go, when it did not. */
  mailError: z.string().nullable(),
});
export type CrewInviteCreated = z.infer<typeof crewInviteCreatedSchema>;

/** The invite token from a link: GET /api/invites/lookup?token=, POST /api/invites/accept { token }. */
export const inviteTokenSchema = z.object({
  token: z.string({ error: 'The link has no invite token' }).trim().min(1, 'The link has no invite token').max(500, 'The invite token is too long'),
});

/** What an invite link shows before sign-in. */
export const inviteLookupSchema = z.object({
  sightlineName: z.string(),
  inviterName: z.string(),
  role: crewRoleSchema,
  /** The address the invite was sent to: the account that accepts must have it. */
  email: z.string(),
  status: z.enum(inviteStatuses),
  expiresAt: z.string(),
  /** True when an account with that address exists (sign in rather than register). */
  accountExists: z.boolean(),
});
export type InviteLookup = z.infer<typeof inviteLookupSchema>;
export const inviteLookupResponseSchema = z.object({ invite: inviteLookupSchema });

/** POST /api/invites/accept answers with the sightline to open. */
export const inviteAcceptedSchema = z.object({ sightlineId: z.string(), role: crewRoleSchema });
