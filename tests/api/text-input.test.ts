/**
 * Free text and dates at the API edge: a NUL character (PostgreSQL cannot store one in text or
 * jsonb) and years the database cannot hold are refused with a field message, never a 500.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { createTestContext, createUser, signedInAgent, type TestContext } from './helpers';

let ctx: TestContext;
let agent: request.Agent;
let sightlineId = '';
beforeAll(async () => {
  ctx = await createTestContext();
  agent = await signedInAgent(ctx.app, await createUser('member', 'Text Tester'));
  const res = await agent.post('/api/sightlines').send({
    name: 'Text stack',
    vantage: { lat: 50.6001, lon: -1.9502, elevationM: 4, cameraHeightM: 1.6 },
    landmark: { lat: 50.6045, lon: -1.9570, baseElevationM: 0, heightM: 30, widthM: 12 },
  });
  sightlineId = res.body.sightline.id;
});
afterAll(async () => { await ctx.db.close(); });

const NUL = 'a\u0000b';

describe('a NUL character in free text', () => {
  const cases: Array<[string, () => Promise<request.Response>, string]> = [
    ['a sightline name', () => agent.patch(`/api/sightlines/${sightlineId}`).send({ name: NUL }), 'name'],
    ['a field note', () => agent.post(`/api/sightlines/${sightlineId}/notes`).send({ kind: 'general', body: NUL }), 'body'],
    ['a lens name', () => agent.post('/api/gear/lenses').send({ name: NUL, focalLengthMm: 20, widestApertureF: 1.8 }), 'name'],
    ['an outing note', () => agent.post(`/api/sightlines/${sightlineId}/outings`).send({ night: '2027-06-05', meetingPoint: { lat: 50.6, lon: -1.95 }, meetingLocal: '2027-06-05T22:00', gearNotes: NUL }), 'gearNotes'],
    ['a custom target name in a watch', () => agent.post('/api/watches').send({ sightlineId, target: { raHours: 1, decDeg: 1, name: NUL } }), 'target.name'],
  ];
  for (const [what, call, field] of cases) {
    it(`is refused in ${what} with a field message`, async () => {
      const res = await call();
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.error.fields[field]).toMatch(/NUL/);
    });
  }

  it('is refused in a new account name', async () => {
    const { default: supertest } = await import('supertest');
    const res = await supertest(ctx.app).post('/api/auth/register').send({ name: NUL, email: 'nul-name@example.test', password: 'a-long-enough-password' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.name).toMatch(/NUL/);
  });
});

describe('years the database cannot hold', () => {
  it('refuses a meeting time in year 0 or 9999 with a field message', async () => {
    for (const meetingLocal of ['0000-01-01T20:00', '9999-12-31T23:30']) {
      const res = await agent.post(`/api/sightlines/${sightlineId}/outings`).send({ night: '2027-06-05', meetingPoint: { lat: 50.6, lon: -1.95 }, meetingLocal });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.meetingLocal).toMatch(/1900 to 2199/);
    }
  });

  it('refuses a shot plan lineup in year 0 with a field message', async () => {
    const res = await agent.post(`/api/sightlines/${sightlineId}/shot-plan`).send({
      lineup: { start: '0000-01-02T00:00:00Z', end: '0000-01-02T01:00:00Z', peak: '0000-01-02T00:30:00Z' },
    });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.error.fields)).toMatch(/1900 and 2199/);
  });
});

describe('two calendar feed rotations at once', () => {
  it('both answer 200 and one address is left', async () => {
    const [a, b] = await Promise.all([agent.post('/api/calendar/feed/rotate'), agent.post('/api/calendar/feed/rotate')]);
    expect([a.status, b.status]).toEqual([200, 200]);
    const now = await agent.get('/api/calendar/feed');
    expect([a.body.feed.url, b.body.feed.url]).toContain(now.body.feed.url);
  });
});
