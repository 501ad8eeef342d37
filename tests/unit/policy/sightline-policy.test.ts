import { describe, expect, it } from 'vitest';
import {
  canChangeNoteAs,
  roleAllows,
  SIGHTLINE_POLICY,
  sightlineActions,
  sightlineRoleOf,
  sightlineRoles,
  type SightlineAction,
  type SightlineRole,
} from '../../../shared/policy/sightline-policy';

/**
 * The access rules as the crew feature defines them, written out cell by cell (Y = allowed):
 * editors change the plan, viewers see everything and add notes, admins see all for support and
 * change nothing, outsiders get nothing.
 */
const EXPECTED: Record<SightlineAction, Record<SightlineRole, boolean>> = {
  read:            { owner: true,  editor: true,  viewer: true,  admin: true,  outsider: false },
  edit:            { owner: true,  editor: true,  viewer: false, admin: false, outsider: false },
  delete:          { owner: true,  editor: false, viewer: false, admin: false, outsider: false },
  'add-note':      { owner: true,  editor: true,  viewer: true,  admin: false, outsider: false },
  'manage-crew':   { owner: true,  editor: false, viewer: false, admin: false, outsider: false },
  leave:           { owner: false, editor: true,  viewer: true,  admin: false, outsider: false },
  'plan-outing':   { owner: true,  editor: false, viewer: false, admin: false, outsider: false },
  'answer-outing': { owner: true,  editor: true,  viewer: true,  admin: false, outsider: false },
};

describe('the sightline policy table', () => {
  it('has a row for every action and a column for every role', () => {
    expect(Object.keys(EXPECTED).sort()).toEqual([...sightlineActions].sort());
    expect(Object.keys(SIGHTLINE_POLICY).sort()).toEqual([...sightlineRoles].sort());
  });

  for (const action of sightlineActions) {
    for (const role of sightlineRoles) {
      it(`${role} ${EXPECTED[action][role] ? 'may' : 'may not'} ${action}`, () => {
        expect(roleAllows(role, action)).toBe(EXPECTED[action][role]);
      });
    }
  }

  it('refuses an unknown role or action', () => {
    expect(() => roleAllows('guest' as SightlineRole, 'read')).toThrow(RangeError);
    expect(() => roleAllows('owner', 'fly' as SightlineAction)).toThrow(RangeError);
  });
});

describe('sightlineRoleOf', () => {
  const member = { id: 'u1', role: 'member' };
  const admin = { id: 'a1', role: 'admin' };
  it('owner first, then the crew role, then admin support, else outsider', () => {
    expect(sightlineRoleOf(member, 'u1', null)).toBe('owner');
    expect(sightlineRoleOf(member, 'u1', 'viewer')).toBe('owner');
    expect(sightlineRoleOf(member, 'x', 'editor')).toBe('editor');
    expect(sightlineRoleOf(member, 'x', 'viewer')).toBe('viewer');
    // An admin in the crew acts as that crew role; outside it, with read-only support access.
    expect(sightlineRoleOf(admin, 'x', 'editor')).toBe('editor');
    expect(sightlineRoleOf(admin, 'x', null)).toBe('admin');
    expect(sightlineRoleOf(member, 'x', null)).toBe('outsider');
  });
});

describe('canChangeNoteAs', () => {
  it('the owner changes any note; a crew member their own; admins and outsiders none', () => {
    expect(canChangeNoteAs('owner', 'o', 'someone')).toBe(true);
    expect(canChangeNoteAs('viewer', 'v', 'v')).toBe(true);
    expect(canChangeNoteAs('viewer', 'v', 'someone')).toBe(false);
    expect(canChangeNoteAs('editor', 'e', 'e')).toBe(true);
    expect(canChangeNoteAs('editor', 'e', null)).toBe(false);
    expect(canChangeNoteAs('admin', 'a', 'a')).toBe(false);
    expect(canChangeNoteAs('outsider', 'x', 'x')).toBe(false);
  });
});
