import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { watchListResponseSchema, watchResponseSchema } from '../../shared/schemas/watch';
import { WatchModel } from '../../server/models/watch';
import { createTestContext, createUser, signedInAgent, type TestContext } from './helpers';
import { createSightline } from './watches-fixture';

let ctx: TestContext;
beforeAll(async () => { ctx = await createTestContext(); });
afterAll(async () => {
  // Active watches left behind would be scanned by the scheduler tests that run later.
  await WatchModel.destroy({ where: {} });
  await ctx.db.close();
});

// An invented site on a real coastline (50.6 N, Europe/London).
const coast = {
  name: 'Watch test stack',
  vantage: { lat: 50.6001, lon: -1.9502, elevationM: 4, cameraHeightM: 1.6 },
  landmark: { lat: 50.6045, lon: -1.9570, baseElevationM: 0, heightM: 30, widthM: 12 },
  targetId: 'm42',
};

async function owner() {
  const user = await createUser('member', 'Watch Owner');
  const agent = await signedInAgent(ctx.app, user);
  const sightline = await createSightline(agent, coast);
  return { user, agent, sightline };
}

describe('watch CRUD', () => {
  it('creates a watch with the defaults, the sightline\'s target and zone, and lists it', async () => {
    const { user, agent, sightline } = await owner();
    const res = await agent.post('/api/watches').send({ sightlineId: sightline.id });
    expect(res.status).toBe(201);
    const { watch } = watchResponseSchema.parse(res.body);
    expect(watch).toMatchObject({
      ownerId: user.id, sightlineId: sightline.id, sightlineName: coast.name, timezone: 'Europe/London',
      target: { id: 'm42' }, minScore: 0.3, minDurationMin: 5, reachableOnly: false,
      weekdays: [1, 2, 3, 4, 5, 6, 7], leadDays: [3, 0], paused: false, lastSentAt: null,
    });
    // The catalogue's name of M42 (OpenNGC's common name for NGC 1976), not the id.
    expect(watch.targetName).toBe('Orion Nebula');
    const list = watchListResponseSchema.parse((await agent.get('/api/watches')).body);
    expect(list.watches.map((w) => w.id)).toEqual([watch.id]);
    const bySightline = await agent.get(`/api/watches?sightlineId=${sightline.id}`);
    expect(bySightline.body.watches).toHaveLength(1);
  });

  it('takes a custom target and conditions, sorts weekdays and lead times, edits, pauses and deletes', async () => {
    const { agent, sightline } = await owner();
    const res = await agent.post('/api/watches').send({
      sightlineId: sightline.id,
      target: { name: 'My patch', raHours: 5.5, decDeg: -5 },
      minScore: 0.6, minDurationMin: 20, weekdays: [6, 5], leadDays: [0, 7, 2],
    });
    expect(res.status).toBe(201);
    const id = res.body.watch.id as string;
    expect(res.body.watch).toMatchObject({ targetName: 'My patch', weekdays: [5, 6], leadDays: [7, 2, 0] });

    const paused = await agent.patch(`/api/watches/${id}`).send({ paused: true, minScore: 0.5 });
    expect(paused.status).toBe(200);
    expect(paused.body.watch).toMatchObject({ paused: true, minScore: 0.5, minDurationMin: 20 });
    expect((await agent.get(`/api/watches/${id}`)).body.watch.paused).toBe(true);
    expect((await agent.get(`/api/watches/${id}/deliveries`)).body).toEqual({ deliveries: [] });

    expect((await agent.delete(`/api/watches/${id}`)).status).toBe(204);
    expect((await agent.get(`/api/watches/${id}`)).status).toBe(404);
  });

  it.each([
    [{ minScore: 1.5 }, 'minScore'],
    [{ minScore: 'high' }, 'minScore'],
    [{ minDurationMin: -1 }, 'minDurationMin'],
    [{ weekdays: [0] }, 'weekdays.0'],
    [{ weekdays: [] }, 'weekdays'],
    [{ weekdays: [2, 2] }, 'weekdays'],
    [{ leadDays: [1.5] }, 'leadDays.0'],
    [{ leadDays: [31] }, 'leadDays.0'],
    [{ leadDays: [3, 3] }, 'leadDays'],
    [{ leadDays: [5, 4, 3, 2, 1] }, 'leadDays'],
    [{ target: { id: 'no-such-object' } }, 'target.id'],
    [{ paused: 'yes' }, 'paused'],
  ])('refuses a bad watch %# with a message on %s', async (bad, field) => {
    const { agent, sightline } = await owner();
    const res = await agent.post('/api/watches').send({ sightlineId: sightline.id, ...bad });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation');
    expect(res.body.error.fields[field]).toBeTruthy();
  });

  it('refuses a missing or malformed sightline id, an empty change, and "reachable only" without a tide rule', async () => {
    const { agent, sightline } = await owner();
    const noSightline = await agent.post('/api/watches').send({});
    expect(noSightline.status).toBe(400);
    expect(noSightline.body.error.fields.sightlineId).toBeTruthy();
    expect((await agent.post('/api/watches').send({ sightlineId: 'abc' })).body.error.fields.sightlineId).toBeTruthy();

    const reachable = await agent.post('/api/watches').send({ sightlineId: sightline.id, reachableOnly: true });
    expect(reachable.status).toBe(400);
    expect(reachable.body.error.fields.reachableOnly).toMatch(/tide rule/);

    const id = (await agent.post('/api/watches').send({ sightlineId: sightline.id })).body.watch.id as string;
    const empty = await agent.patch(`/api/watches/${id}`).send({});
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields._).toBe('Nothing to change');
    // The sightline of a watch stays; a new watch is made for another one.
    expect((await agent.patch(`/api/watches/${id}`).send({ sightlineId: sightline.id })).status).toBe(400);

    // With a tide rule set, reachable-only is accepted.
    await agent.put(`/api/sightlines/${sightline.id}/tide-rule`).send({ rule: { mode: 'around-low', hoursBefore: 2, hoursAfter: 2 } });
    const ok = await agent.patch(`/api/watches/${id}`).send({ reachableOnly: true });
    expect(ok.status).toBe(200);
    expect(ok.body.watch.reachableOnly).toBe(true);
  });

  it('keeps watches to their owner: another member gets 404 and never sees them; signed out gets 401', async () => {
    const { agent, sightline } = await owner();
    const id = (await agent.post('/api/watches').send({ sightlineId: sightline.id })).body.watch.id as string;
    const other = await signedInAgent(ctx.app, await createUser('member', 'Other Member'));
    expect((await other.get(`/api/watches/${id}`)).status).toBe(404);
    expect((await other.patch(`/api/watches/${id}`).send({ paused: true })).status).toBe(404);
    expect((await other.delete(`/api/watches/${id}`)).status).toBe(404);
    expect((await other.get(`/api/watches/${id}/deliveries`)).status).toBe(404);
    expect((await other.get('/api/watches')).body.watches).toEqual([]);
    // Nor can a member watch someone else's sightline (404 as for the sightline itself).
    expect((await other.post('/api/watches').send({ sightlineId: sightline.id })).status).toBe(404);
    expect((await agent.get(`/api/watches/${id}`)).body.watch.paused).toBe(false);

    expect((await request(ctx.app).get('/api/watches')).status).toBe(401);
    expect((await request(ctx.app).post('/api/watches').send({ sightlineId: sightline.id })).status).toBe(401);
    expect((await agent.get('/api/watches/not-a-uuid')).status).toBe(400);
  });

  it('deletes the watches of a deleted sightline with it (foreign key ON DELETE CASCADE)', async () => {
    const { agent, sightline } = await owner();
    const id = (await agent.post('/api/watches').send({ sightlineId: sightline.id })).body.watch.id as string;
    expect((await agent.delete(`/api/sightlines/${sightline.id}`)).status).toBe(204);
    expect((await agent.get(`/api/watches/${id}`)).status).toBe(404);
  });

  it('has CHECK constraints in the database behind the schema', async () => {
    const { user, sightline } = await owner();
    const insert = (column: string, value: string) => ctx.db.sequelize.query(
      `INSERT INTO watches (id, owner_id, sightline_id, target, ${column}) VALUES (gen_random_uuid(), :owner, :sightline, '{"id":"m42"}', ${value})`,
      { replacements: { owner: user.id, sightline: sightline.id } },
    );
    await expect(insert('min_score', '1.2')).rejects.toThrow(/watches_min_score/);
    await expect(insert('weekdays', "'{0}'")).rejects.toThrow(/watches_weekdays/);
    await expect(insert('lead_days', "'{}'")).rejects.toThrow(/watches_lead_days/);
    await expect(insert('lead_days', "'{31}'")).rejects.toThrow(/watches_lead_days/);
    await expect(ctx.db.sequelize.query(
      `INSERT INTO watches (id, owner_id, sightline_id, target) VALUES (gen_random_uuid(), :owner, :sightline, '{"name":"x"}')`,
      { replacements: { owner: user.id, sightline: sightline.id } },
    )).rejects.toThrow(/watches_target/);
  });
});
