/**
 * Who may do what on a sightline: one table, role x action. The server enforces it; the client
 * reads the same table to show only the controls a person may use.
 */

/** Roles in a sightline's crew besides the owner. */
export const crewRoles = ['editor', 'viewer'] as const;
export type CrewRole = (typeof crewRoles)[number];

/**
 * A person's standing on one sightline: its owner, a crew member (editor or viewer), an admin
 * looking in for support (not in the crew), or an outsider.
 */
export const sightlineRoles = ['owner', 'editor', 'viewer', 'admin', 'outsider'] as const;
export type SightlineRole = (typeof sightlineRoles)[number];

/**
 * What can be done on a sightline and what hangs off it:
 * - read: see the sightline, its lineups, notes, tides, photos, crew and outings;
 * - edit: change the plan: pins, heights, target, tide rule and times, photos and their calibration;
 * - delete: delete the sightline;
 * - add-note: add a field note (and change one's own notes);
 * - manage-crew: invite, change roles, remove members, revoke invites, hand over ownership;
 * - leave: leave the crew;
 * - plan-outing: mark, change and cancel outings;
 * - answer-outing: say going / maybe / not going.
 */
export const sightlineActions = ['read', 'edit', 'delete', 'add-note', 'manage-crew', 'leave', 'plan-outing', 'answer-outing'] as const;
export type SightlineAction = (typeof sightlineActions)[number];

/** The access rules. Anything not listed is refused. */
export const SIGHTLINE_POLICY: Readonly<Record<SightlineRole, readonly SightlineAction[]>> = {
  owner: ['read', 'edit', 'delete', 'add-note', 'manage-crew', 'plan-outing', 'answer-outing'],
  editor: ['read', 'edit', 'add-note', 'leave', 'answer-outing'],
  viewer: ['read', 'add-note', 'leave', 'answer-outing'],
  // Support: admins see everything and change nothing.
  admin: ['read'],
  outsider: [],
};

/**
 * A person's role on a sightline.
 * @param person - the signed-in person's id and account role
 * @param ownerId - the sightline's owner
 * @param crewRole - the person's crew role on this sightline, or null when not in the crew
 * @returns owner, the crew role, admin (support access) or outsider, in that order of precedence
 */
export function sightlineRoleOf(person: { id: string; role: string }, ownerId: string, crewRole: CrewRole | null): SightlineRole {
  if (person.id === ownerId) return 'owner';
  if (crewRole) return crewRole;
  return person.role === 'admin' ? 'admin' : 'outsider';
}

/**
 * True when the role allows the action.
 * @param role - one of {@link sightlineRoles}
 * @param action - one of {@link sightlineActions}
 * @throws RangeError on an unknown role or action
 */
export function roleAllows(role: SightlineRole, action: SightlineAction): boolean {
  const allowed = SIGHTLINE_POLICY[role];
  if (!allowed) throw new RangeError(`Unknown sightline role: ${String(role)}`);
  if (!(sightlineActions as readonly string[]).includes(action)) throw new RangeError(`Unknown sightline action: ${String(action)}`);
  return allowed.includes(action);
}

/**
 * True when a person may change or delete a field note: its author while still allowed to add
 * notes, or the sightline's owner.
 * @param role - the person's role on the sightline
 * @param personId - the person's id
 * @param authorId - the note's author (null when the author's account is gone)
 */
export function canChangeNoteAs(role: SightlineRole, personId: string, authorId: string | null): boolean {
  if (role === 'owner') return true;
  return authorId === personId && roleAllows(role, 'add-note');
}
