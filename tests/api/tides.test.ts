import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tideTimesResponseSchema } from '../../shared/schemas/sightline';
import { createTestContext, createUser, signedInAgent, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => { ctx = await createTestContext(); });
afterAll(async () => { await ctx.db.close(); });

// An invented sightline on the English south coast (Europe/London: BST, UTC+1, in May).
async function owned() {
  const owner = await createUser();
  const agent = await signedInAgent(ctx.app, owner);
  const res = await agent.post('/api/sightlines').send({
    name: 'Tidal arch',
    vantage: { lat: 50.62, lon: -2.27 },
    landmark: { lat: 50.621, lon: -2.275, heightM: 20, widthM: 10 },
  });
  return { agent, id: res.body.sightline.id as string };
}

const PASTE = [
  '# Invented tide times for the test, local time',
  '2027-05-04 03:12 L 0.4',
  '2027-05-04 09:25 H 4.1',
  '2027-05-04 15:40 L 0.5',
  '2027-05-04 21:52 H 4.0',
].join('\n');

describe('tide times', () => {
  it('reads a paste in the site zone (local 03:12 BST is 02:12 UTC) and lists the events in order', async () => {
    const { agent, id } = await owned();
    const res = await agent.post(`/api/sightlines/${id}/tide-times`).send({ text: PASTE });
    expect(res.status).toBe(200);
    const { events } = tideTimesResponseSchema.parse(res.body);
    expect(events.map((e) => [e.at, e.kind, e.heightM])).toEqual([
      ['2027-05-04T02:12:00.000Z', 'low', 0.4],
      ['2027-05-04T08:25:00.000Z', 'high', 4.1],
      ['2027-05-04T14:40:00.000Z', 'low', 0.5],
      ['2027-05-04T20:52:00.000Z', 'high', 4],
    ]);
    const listed = await agent.get(`/api/sightlines/${id}/tide-times?from=2027-05-04T10:00:00Z`);
    expect(listed.body.events).toHaveLength(2);
  });

  it('refuses a paste with a bad line, names the line, and saves nothing from it', async () => {
    const { agent, id } = await owned();
    await agent.post(`/api/sightlines/${id}/tide-times`).send({ text: PASTE });
    const bad = await agent.post(`/api/sightlines/${id}/tide-times`).send({ text: '2027-05-05 04:01 L 0.3\n2027-05-05 25:70 H 4.2\n' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/nothing was saved/);
    expect(bad.body.error.fields['lines.2']).toMatch(/^Line 2/);
    const listed = await agent.get(`/api/sightlines/${id}/tide-times`);
    expect(listed.body.events).toHaveLength(4);
  });

  it('a second paste over the same span replaces those events, keeping the others', async () => {
    const { agent, id } = await owned();
    await agent.post(`/api/sightlines/${id}/tide-times`).send({ text: PASTE });
    const again = await agent.post(`/api/sightlines/${id}/tide-times`).send({ text: '2027-05-04 09:30 H 4.2\n2027-05-04 15:45 L 0.6' });
    expect(again.status).toBe(200);
    expect(again.body.events.map((e: { at: string }) => e.at)).toEqual([
      '2027-05-04T02:12:00.000Z', '2027-05-04T08:30:00.000Z', '2027-05-04T14:45:00.000Z', '2027-05-04T20:52:00.000Z',
    ]);
  });

  it('refuses a paste with nothing in it, and clears all events on DELETE', async () => {
    const { agent, id } = await owned();
    expect((await agent.post(`/api/sightlines/${id}/tide-times`).send({ text: '# only a comment' })).status).toBe(400);
    await agent.post(`/api/sightlines/${id}/tide-times`).send({ text: PASTE });
    expect((await agent.delete(`/api/sightlines/${id}/tide-times`)).status).toBe(204);
    expect((await agent.get(`/api/sightlines/${id}/tide-times`)).body.events).toEqual([]);
  });

  it('takes concurrent pastes over the same span one after the other, none failing, the events stored once', async () => {
    const { agent, id } = await owned();
    const results = await Promise.all([1, 2, 3, 4, 5, 6].map(() => agent.post(`/api/sightlines/${id}/tide-times`).send({ text: PASTE })));
    expect(results.map((r) => r.status)).toEqual([200, 200, 200, 200, 200, 200]);
    expect((await agent.get(`/api/sightlines/${id}/tide-times`)).body.events).toHaveLength(4);
  });

  it('refuses tide times outside 1900..2200 with 400, saving nothing', async () => {
    const { agent, id } = await owned();
    const res = await agent.post(`/api/sightlines/${id}/tide-times`).send({ text: '0001-01-01 00:00 H 1.0' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation');
    expect((await agent.get(`/api/sightlines/${id}/tide-times`)).body.events).toEqual([]);
  });

  it.each(['from=0000-01-01', 'to=0000-06-01T00:00:00Z'])('answers 400 for a listing range outside 1900..2200 (%s)', async (query) => {
    const { agent, id } = await owned();
    const res = await agent.get(`/api/sightlines/${id}/tide-times?${query}`);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual([query.split('=')[0]]);
  });

  it('refuses a tide rule note with a NUL character with 400, keeping the rule as it was', async () => {
    const { agent, id } = await owned();
    const res = await agent.put(`/api/sightlines/${id}/tide-rule`).send({ rule: { mode: 'around-low', hoursBefore: 1, hoursAfter: 2, note: 'a\u0000b' } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['rule.note']).toBeTruthy();
    expect((await agent.get(`/api/sightlines/${id}`)).body.sightline.tideRule).toBeNull();
  });

  it('sets, reads back and removes a tide rule; a bad rule gets field messages', async () => {
    const { agent, id } = await owned();
    const rule = { mode: 'around-low', hoursBefore: 2, hoursAfter: 1.5, note: 'The arch is reached over the sand' };
    const set = await agent.put(`/api/sightlines/${id}/tide-rule`).send({ rule });
    expect(set.status).toBe(200);
    expect(set.body.sightline.tideRule).toEqual(rule);
    const bad = await agent.put(`/api/sightlines/${id}/tide-rule`).send({ rule: { mode: 'around-low', hoursBefore: 13, hoursAfter: 1 } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields['rule.hoursBefore']).toMatch(/between 0 and 12/);
    const cleared = await agent.put(`/api/sightlines/${id}/tide-rule`).send({ rule: null });
    expect(cleared.body.sightline.tideRule).toBeNull();
  });

  it('another member can neither read nor paste tide times (404)', async () => {
    const { id } = await owned();
    const other = await signedInAgent(ctx.app, await createUser());
    expect((await other.get(`/api/sightlines/${id}/tide-times`)).status).toBe(404);
    expect((await other.post(`/api/sightlines/${id}/tide-times`).send({ text: PASTE })).status).toBe(404);
    expect((await other.put(`/api/sightlines/${id}/tide-rule`).send({ rule: null })).status).toBe(404);
  });
});
