import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { sightlineResponseSchema, fieldNoteResponseSchema } from '../../shared/schemas/sightline';
import { createTestContext, createUser, signedInAgent, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => { ctx = await createTestContext(); });
afterAll(async () => { await ctx.db.close(); });

// An invented site on a real coastline: a vantage on a beach looking north-west at a stack.
const body = {
  name: 'Test stack',
  vantage: { lat: 50.6001, lon: -1.9502, elevationM: 4, cameraHeightM: 1.6 },
  landmark: { lat: 50.6045, lon: -1.9570, baseElevationM: 0, heightM: 30, widthM: 12 },
};

async function owned() {
  const owner = await createUser('member', 'Owner Person');
  const agent = await signedInAgent(ctx.app, owner);
  const res = await agent.post('/api/sightlines').send(body);
  expect(res.status).toBe(201);
  return { owner, agent, sightline: sightlineResponseSchema.parse(res.body).sightline };
}

describe('sightline CRUD', () => {
  it('creates with defaults filled, the site time zone derived from the vantage, and lists it', async () => {
    const { agent, sightline, owner } = await owned();
    expect(sightline).toMatchObject({ name: 'Test stack', ownerId: owner.id, ownerName: 'Owner Person', bandHeightDeg: 20, targetId: 'galactic-centre', timezone: 'Europe/London' });
    expect(sightline.landmark).toEqual(body.landmark);
    const list = await agent.get('/api/sightlines');
    expect(list.body.sightlines.map((s: { id: string }) => s.id)).toEqual([sightline.id]);
  });

  it('renames, moves the vantage (zone follows), and deletes', async () => {
    const { agent, sightline } = await owned();
    const renamed = await agent.patch(`/api/sightlines/${sightline.id}`).send({ name: '  Stack at dusk  ' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.sightline.name).toBe('Stack at dusk');
    const moved = await agent.patch(`/api/sightlines/${sightline.id}`).send({ vantage: { lat: -33.89, lon: 151.27 }, landmark: { lat: -33.895, lon: 151.28 } });
    expect(moved.body.sightline.timezone).toBe('Australia/Sydney');
    expect(moved.body.sightline.vantage.cameraHeightM).toBe(1.5);
    expect((await agent.delete(`/api/sightlines/${sightline.id}`)).status).toBe(204);
    expect((await agent.get(`/api/sightlines/${sightline.id}`)).status).toBe(404);
  });

  it.each([
    [{ ...body, name: '' }, 'name'],
    [{ ...body, vantage: { ...body.vantage, lat: 91 } }, 'vantage.lat'],
    [{ ...body, landmark: { ...body.landmark, lon: 'west' } }, 'landmark.lon'],
    [{ ...body, landmark: { ...body.landmark, heightM: -3 } }, 'landmark.heightM'],
    [{ ...body, targetId: 'no-such-object' }, 'targetId'],
    [{ name: 'x' }, 'vantage'],
  ])('refuses a bad sightline with a message on %#: the field %s', async (bad, field) => {
    const agent = await signedInAgent(ctx.app, await createUser());
    const res = await agent.post('/api/sightlines').send(bad);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toBeTruthy();
  });

  it('refuses pins in the same place or farther apart than 1000 km, on create and on change', async () => {
    const agent = await signedInAgent(ctx.app, await createUser());
    const same = await agent.post('/api/sightlines').send({ ...body, landmark: { ...body.landmark, lat: body.vantage.lat, lon: body.vantage.lon } });
    expect(same.status).toBe(400);
    expect(same.body.error.fields.landmark).toMatch(/away from the vantage/);
    const { agent: owner, sightline } = await owned();
    const far = await owner.patch(`/api/sightlines/${sightline.id}`).send({ vantage: { lat: -33.89, lon: 151.27 } });
    expect(far.status).toBe(400);
    expect(far.body.error.fields.landmark).toMatch(/within sight/);
    expect((await owner.get(`/api/sightlines/${sightline.id}`)).body.sightline.vantage.lat).toBe(body.vantage.lat);
  });

  it('refuses an empty change and a bad id', async () => {
    const { agent, sightline } = await owned();
    expect((await agent.patch(`/api/sightlines/${sightline.id}`).send({})).status).toBe(400);
    expect((await agent.get('/api/sightlines/not-a-uuid')).status).toBe(400);
  });

  it('keeps nothing half-saved: a refused change leaves the sightline as it was', async () => {
    const { agent, sightline } = await owned();
    await agent.patch(`/api/sightlines/${sightline.id}`).send({ name: 'New name', landmark: { lat: 200, lon: 0 } });
    const after = await agent.get(`/api/sightlines/${sightline.id}`);
    expect(after.body.sightline.name).toBe('Test stack');
  });
});

describe('sightline ownership', () => {
  it('another member can neither read, change, delete nor annotate it (404), nor see it listed', async () => {
    const { sightline } = await owned();
    const other = await signedInAgent(ctx.app, await createUser());
    expect((await other.get(`/api/sightlines/${sightline.id}`)).status).toBe(404);
    expect((await other.patch(`/api/sightlines/${sightline.id}`).send({ name: 'Mine now' })).status).toBe(404);
    expect((await other.delete(`/api/sightlines/${sightline.id}`)).status).toBe(404);
    expect((await other.get(`/api/sightlines/${sightline.id}/notes`)).status).toBe(404);
    expect((await other.post(`/api/sightlines/${sightline.id}/notes`).send({ kind: 'general', body: 'hi' })).status).toBe(404);
    expect((await other.get('/api/sightlines')).body.sightlines).toEqual([]);
  });

  it('an admin can read it and list everyone\'s, but not change it (403)', async () => {
    const { sightline } = await owned();
    const admin = await signedInAgent(ctx.app, await createUser('admin'));
    expect((await admin.get(`/api/sightlines/${sightline.id}`)).status).toBe(200);
    const all = await admin.get('/api/sightlines?all=true');
    expect(all.body.sightlines.some((s: { id: string }) => s.id === sightline.id)).toBe(true);
    expect((await admin.get('/api/sightlines')).body.sightlines.some((s: { id: string }) => s.id === sightline.id)).toBe(false);
    expect((await admin.patch(`/api/sightlines/${sightline.id}`).send({ name: 'x' })).status).toBe(403);
    expect((await admin.delete(`/api/sightlines/${sightline.id}`)).status).toBe(403);
  });

  it('anonymous calls get 401', async () => {
    const { sightline } = await owned();
    expect((await request(ctx.app).get('/api/sightlines')).status).toBe(401);
    expect((await request(ctx.app).get(`/api/sightlines/${sightline.id}`)).status).toBe(401);
  });
});

describe('field notes', () => {
  it('adds notes of each kind with author and date, newest first, edits and deletes them', async () => {
    const { agent, sightline } = await owned();
    const first = await agent.post(`/api/sightlines/${sightline.id}/notes`).send({ kind: 'access', body: 'Path from the car park, 20 min.' });
    expect(first.status).toBe(201);
    const note = fieldNoteResponseSchema.parse(first.body).note;
    expect(note).toMatchObject({ kind: 'access', authorName: 'Owner Person' });
    await agent.post(`/api/sightlines/${sightline.id}/notes`).send({ kind: 'hazard', body: 'Loose rock below the headland.' });
    const list = await agent.get(`/api/sightlines/${sightline.id}/notes`);
    expect(list.body.notes.map((n: { kind: string }) => n.kind)).toEqual(['hazard', 'access']);
    const edited = await agent.put(`/api/sightlines/${sightline.id}/notes/${note.id}`).send({ kind: 'access', body: 'Path from the car park, 25 min.' });
    expect(edited.body.note.body).toBe('Path from the car park, 25 min.');
    expect((await agent.delete(`/api/sightlines/${sightline.id}/notes/${note.id}`)).status).toBe(204);
    expect((await agent.get(`/api/sightlines/${sightline.id}/notes`)).body.notes).toHaveLength(1);
  });

  it('refuses an unknown kind and an empty body with field messages', async () => {
    const { agent, sightline } = await owned();
    const res = await agent.post(`/api/sightlines/${sightline.id}/notes`).send({ kind: 'gossip', body: '  ' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['body', 'kind']);
  });

  it('deleting a sightline deletes its notes', async () => {
    const { agent, sightline } = await owned();
    const note = (await agent.post(`/api/sightlines/${sightline.id}/notes`).send({ kind: 'general', body: 'x' })).body.note;
    await agent.delete(`/api/sightlines/${sightline.id}`);
    const [rows] = await ctx.db.sequelize.query('SELECT count(*)::int AS n FROM field_notes WHERE id = $1', { bind: [note.id] });
    expect((rows as Array<{ n: number }>)[0]!.n).toBe(0);
  });
});
