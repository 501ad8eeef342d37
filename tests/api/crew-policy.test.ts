/**
 * The crew's access rules through the API: role x action x resource, every cell asserted with the
 * status the route answers. Outsiders get 404 (they must not learn the sightline exists); people
 * who can see it but may not do the action get 403.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { CrewMemberModel } from '../../server/models/crew-member';
import { OutingModel } from '../../server/models/outing';
import { SightlineModel } from '../../server/models/sightline';
import type { UserModel } from '../../server/models/user';
import { createTestContext, createUser, signedInAgent, type TestContext } from './helpers';

type Role = 'owner' | 'editor' | 'viewer' | 'admin' | 'outsider';
const ROLES: Role[] = ['owner', 'editor', 'viewer', 'admin', 'outsider'];

let ctx: TestContext;
let photoDir: string;
beforeAll(async () => {
  photoDir = mkdtempSync(join(tmpdir(), 'gnomon-test-crew-photos-'));
  ctx = await createTestContext({ PHOTO_DIR: photoDir });
});
afterAll(async () => {
  await ctx.db.close();
  rmSync(photoDir, { recursive: true, force: true });
});

const sightlineBody = {
  name: 'Crew stack',
  vantage: { lat: 50.6001, lon: -1.9502, elevationM: 4, cameraHeightM: 1.6 },
  landmark: { lat: 50.6045, lon: -1.9570, baseElevationM: 0, heightM: 30, widthM: 12 },
};

interface Fixture {
  sightlineId: string;
  outingId: string;
  /** A photo the owner uploaded. */
  photoId: string;
  users: Record<Role, UserModel>;
  agents: Record<Role, request.Agent>;
}

/** A sightline with an owner, an editor, a viewer, plus an admin and an outsider who are not in the crew; one outing. */
async function fixture(): Promise<Fixture> {
  const users = {
    owner: await createUser('member', 'Olive Owner'),
    editor: await createUser('member', 'Eddie Editor'),
    viewer: await createUser('member', 'Vera Viewer'),
    admin: await createUser('admin', 'Ada Admin'),
    outsider: await createUser('member', 'Otto Outsider'),
  };
  const agents = {} as Record<Role, request.Agent>;
  for (const role of ROLES) agents[role] = await signedInAgent(ctx.app, users[role]);
  const created = await agents.owner.post('/api/sightlines').send(sightlineBody);
  expect(created.status).toBe(201);
  const sightlineId = created.body.sightline.id as string;
  await CrewMemberModel.create({ sightlineId, userId: users.editor.id, role: 'editor' });
  await CrewMemberModel.create({ sightlineId, userId: users.viewer.id, role: 'viewer' });
  const outing = await agents.owner.post(`/api/sightlines/${sightlineId}/outings`).send({
    night: '2027-06-05', meetingPoint: { lat: 50.601, lon: -1.951 }, meetingLocal: '2027-06-05T22:30',
  });
  expect(outing.status).toBe(201);
  const photo = await agents.owner.post(`/api/sightlines/${sightlineId}/photos`)
    .attach('photo', await sharp({ create: { width: 40, height: 30, channels: 3, background: '#224466' } }).jpeg().toBuffer(), { filename: 'o.jpg', contentType: 'image/jpeg' });
  expect(photo.status).toBe(201);
  return { sightlineId, outingId: outing.body.outing.id, photoId: photo.body.photo.id, users, agents };
}

let f: Fixture;
let jpeg: Buffer;
beforeAll(async () => {
  f = await fixture();
  jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#335577' } }).jpeg().toBuffer();
});

/** One cell's call: the request a person in `role` makes, on the shared fixture. */
type Call = (agent: request.Agent, fx: Fixture, role: Role) => Promise<request.Response>;

/**
 * Each row: the action, the call, and the status per role (written out, not derived from the
 * policy module, so the table checks it).
 */
const ROWS: Array<{ action: string; call: Call; expect: Record<Role, number> }> = [
  { action: 'read the sightline', call: (a, x) => a.get(`/api/sightlines/${x.sightlineId}`), expect: { owner: 200, editor: 200, viewer: 200, admin: 200, outsider: 404 } },
  { action: 'read the lineups', call: (a, x) => a.get(`/api/sightlines/${x.sightlineId}/next-lineups?count=1`), expect: { owner: 200, editor: 200, viewer: 200, admin: 200, outsider: 404 } },
  { action: 'rename', call: (a, x, r) => a.patch(`/api/sightlines/${x.sightlineId}`).send({ name: `Crew stack (${r})` }), expect: { owner: 200, editor: 200, viewer: 403, admin: 403, outsider: 404 } },
  { action: 'move the vantage', call: (a, x) => a.patch(`/api/sightlines/${x.sightlineId}`).send({ vantage: sightlineBody.vantage }), expect: { owner: 200, editor: 200, viewer: 403, admin: 403, outsider: 404 } },
  { action: 'set the tide rule', call: (a, x) => a.put(`/api/sightlines/${x.sightlineId}/tide-rule`).send({ rule: null }), expect: { owner: 200, editor: 200, viewer: 403, admin: 403, outsider: 404 } },
  { action: 'paste tide times', call: (a, x) => a.post(`/api/sightlines/${x.sightlineId}/tide-times`).send({ text: '2027-06-05 04:10 L 0.6' }), expect: { owner: 200, editor: 200, viewer: 403, admin: 403, outsider: 404 } },
  { action: 'upload a photo', call: (a, x) => a.post(`/api/sightlines/${x.sightlineId}/photos`).attach('photo', jpeg, { filename: 'p.jpg', contentType: 'image/jpeg' }), expect: { owner: 201, editor: 201, viewer: 403, admin: 403, outsider: 404 } },
  // The GPS privacy of a photo is its uploader's alone, whatever the role on the sightline.
  { action: "show or hide the owner's photo position", call: (a, x) => a.patch(`/api/photos/${x.photoId}`).send({ hideGps: true }), expect: { owner: 200, editor: 403, viewer: 403, admin: 403, outsider: 404 } },
  { action: 'list the photos', call: (a, x) => a.get(`/api/sightlines/${x.sightlineId}/photos`), expect: { owner: 200, editor: 200, viewer: 200, admin: 200, outsider: 404 } },
  { action: 'add a field note', call: (a, x) => a.post(`/api/sightlines/${x.sightlineId}/notes`).send({ kind: 'general', body: 'Seen from the crew' }), expect: { owner: 201, editor: 201, viewer: 201, admin: 403, outsider: 404 } },
  { action: 'list the field notes', call: (a, x) => a.get(`/api/sightlines/${x.sightlineId}/notes`), expect: { owner: 200, editor: 200, viewer: 200, admin: 200, outsider: 404 } },
  { action: 'see the crew', call: (a, x) => a.get(`/api/sightlines/${x.sightlineId}/crew`), expect: { owner: 200, editor: 200, viewer: 200, admin: 200, outsider: 404 } },
  { action: 'invite', call: (a, x, r) => a.post(`/api/sightlines/${x.sightlineId}/crew/invites`).send({ email: `new-${r}-${Date.now()}@example.test`, role: 'viewer' }), expect: { owner: 201, editor: 403, viewer: 403, admin: 403, outsider: 404 } },
  { action: 'change a role', call: (a, x) => a.patch(`/api/sightlines/${x.sightlineId}/crew/${x.users.viewer.id}`).send({ role: 'viewer' }), expect: { owner: 200, editor: 403, viewer: 403, admin: 403, outsider: 404 } },
  { action: 'plan an outing', call: (a, x) => a.post(`/api/sightlines/${x.sightlineId}/outings`).send({ night: '2027-06-06', meetingPoint: { lat: 50.6, lon: -1.95 }, meetingLocal: '2027-06-06T22:00' }), expect: { owner: 201, editor: 403, viewer: 403, admin: 403, outsider: 404 } },
  { action: 'list the outings', call: (a, x) => a.get(`/api/sightlines/${x.sightlineId}/outings`), expect: { owner: 200, editor: 200, viewer: 200, admin: 200, outsider: 404 } },
  { action: 'read an outing', call: (a, x) => a.get(`/api/outings/${x.outingId}`), expect: { owner: 200, editor: 200, viewer: 200, admin: 200, outsider: 404 } },
  { action: 'change an outing', call: (a, x) => a.patch(`/api/outings/${x.outingId}`).send({ gearNotes: 'Head torches with red light' }), expect: { owner: 200, editor: 403, viewer: 403, admin: 403, outsider: 404 } },
  { action: 'answer an outing', call: (a, x) => a.put(`/api/outings/${x.outingId}/answer`).send({ answer: 'going' }), expect: { owner: 200, editor: 200, viewer: 200, admin: 403, outsider: 404 } },
];

describe('role x action on a shared sightline', () => {
  for (const row of ROWS) {
    for (const role of ROLES) {
      it(`${role}: ${row.action} -> ${row.expect[role]}`, async () => {
        const res = await row.call(f.agents[role], f, role);
        expect(res.status, JSON.stringify(res.body)).toBe(row.expect[role]);
        if (res.status >= 400) expect(res.body.error.message).toBeTruthy();
      });
    }
  }
});

/** Cells that change who is in the crew or remove the sightline: each on a fresh fixture. */
describe('role x action that change the crew or delete', () => {
  const leave: Record<Role, number> = { owner: 403, editor: 204, viewer: 204, admin: 403, outsider: 404 };
  for (const role of ROLES) {
    it(`${role}: leave the crew -> ${leave[role]}`, async () => {
      const x = await fixture();
      const res = await x.agents[role].delete(`/api/sightlines/${x.sightlineId}/crew/${x.users[role].id}`);
      expect(res.status).toBe(leave[role]);
      if (res.status === 204) expect((await x.agents[role].get(`/api/sightlines/${x.sightlineId}`)).status).toBe(404);
    });
  }

  const removeOther: Record<Role, number> = { owner: 200, editor: 403, viewer: 403, admin: 403, outsider: 404 };
  for (const role of ROLES) {
    it(`${role}: remove the viewer -> ${removeOther[role]}`, async () => {
      const x = await fixture();
      // The viewer removing themselves is leaving; here the viewer removes the editor instead.
      const target = role === 'viewer' ? x.users.editor : x.users.viewer;
      const res = await x.agents[role].delete(`/api/sightlines/${x.sightlineId}/crew/${target.id}`);
      expect(res.status).toBe(removeOther[role]);
      expect(await CrewMemberModel.count({ where: { sightlineId: x.sightlineId, userId: target.id } })).toBe(res.status === 200 ? 0 : 1);
    });
  }

  const handOver: Record<Role, number> = { owner: 200, editor: 403, viewer: 403, admin: 403, outsider: 404 };
  for (const role of ROLES) {
    it(`${role}: hand the sightline over to the editor -> ${handOver[role]}`, async () => {
      const x = await fixture();
      const res = await x.agents[role].post(`/api/sightlines/${x.sightlineId}/crew/hand-over`).send({ userId: x.users.editor.id });
      expect(res.status).toBe(handOver[role]);
      const sightline = await SightlineModel.findByPk(x.sightlineId);
      expect(sightline!.ownerId).toBe(res.status === 200 ? x.users.editor.id : x.users.owner.id);
    });
  }

  const remove: Record<Role, number> = { owner: 204, editor: 403, viewer: 403, admin: 403, outsider: 404 };
  for (const role of ROLES) {
    it(`${role}: delete the sightline -> ${remove[role]}`, async () => {
      const x = await fixture();
      const res = await x.agents[role].delete(`/api/sightlines/${x.sightlineId}`);
      expect(res.status).toBe(remove[role]);
      expect(await SightlineModel.count({ where: { id: x.sightlineId } })).toBe(res.status === 204 ? 0 : 1);
      // Deleting the sightline takes its crew and outings with it (foreign keys, ON DELETE CASCADE).
      if (res.status === 204) {
        expect(await CrewMemberModel.count({ where: { sightlineId: x.sightlineId } })).toBe(0);
        expect(await OutingModel.count({ where: { sightlineId: x.sightlineId } })).toBe(0);
      }
    });
  }

  it('anonymous calls get 401', async () => {
    expect((await request(ctx.app).get(`/api/sightlines/${f.sightlineId}/crew`)).status).toBe(401);
    expect((await request(ctx.app).get(`/api/outings/${f.outingId}`)).status).toBe(401);
  });
});
