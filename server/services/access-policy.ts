/**
 * Who may do what to a sightline and what hangs off it. The one place these rules live: routes
 * and services ask here. An outsider must not learn a sightline exists, so "cannot read" is a 404.
 */
import type { UserModel } from '../models/user';

export type SightlineAction = 'read' | 'edit' | 'delete' | 'add-note';

export interface SightlineRef {
  ownerId: string;
}

/** True when the user may do the action on the sightline. */
export function canOnSightline(user: UserModel, sightline: SightlineRef, action: SightlineAction): boolean {
  const isOwner = sightline.ownerId === user.id;
  switch (action) {
    case 'read':
      return isOwner || user.role === 'admin';
    case 'edit':
    case 'delete':
    case 'add-note':
      return isOwner;
  }
}

/** True when the user may change or delete a field note: its author, or the sightline's owner. */
export function canChangeNote(user: UserModel, sightline: SightlineRef, note: { authorId: string | null }): boolean {
  return note.authorId === user.id || sightline.ownerId === user.id;
}
