/**
 * Who may do what to a sightline and what hangs off it. The rules are one table in
 * shared/policy/sightline-policy.ts; routes and services ask here. An outsider must not learn a
 * sightline exists, so "cannot read" is a 404, and "can read but not do" is a 403.
 */
import type { UserModel } from '../models/user';
import {
  canChangeNoteAs,
  roleAllows,
  sightlineRoleOf,
  type CrewRole,
  type SightlineAction,
  type SightlineRole,
} from '../../shared/policy/sightline-policy';

export type { SightlineAction, SightlineRole, CrewRole };

export interface SightlineRef {
  ownerId: string;
}

/** The user's role on the sightline, given their crew role there (null when not in the crew). */
export function roleOnSightline(user: UserModel, sightline: SightlineRef, crewRole: CrewRole | null): SightlineRole {
  return sightlineRoleOf(user, sightline.ownerId, crewRole);
}

/** True when the role allows the action. */
export function canAs(role: SightlineRole, action: SightlineAction): boolean {
  return roleAllows(role, action);
}

/** True when the user may change or delete a field note: its author (still in the crew), or the owner. */
export function canChangeNote(user: UserModel, role: SightlineRole, note: { authorId: string | null }): boolean {
  return canChangeNoteAs(role, user.id, note.authorId);
}

/** The message of a 403 for an action the role may not do. */
export function forbiddenMessage(action: SightlineAction): string {
  switch (action) {
    case 'edit': return 'Only the owner and editors can change this sightline';
    case 'delete': return 'Only the owner can delete this sightline';
    case 'manage-crew': return 'Only the owner can manage the crew';
    case 'plan-outing': return 'Only the owner can plan outings';
    case 'leave': return 'The owner cannot leave; hand the sightline over first';
    case 'add-note':
    case 'answer-outing':
      return 'Only the crew can do this';
    case 'read': return 'No such sightline';
  }
}
