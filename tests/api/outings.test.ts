import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CrewMemberModel } from '../../server/models/crew-member';
import { outingResponseSchema } from '../../shared/schemas/outing';
import { createTestContext, createUser, signedInAgent, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => { ctx = await createTestContext(); });
afterAll(async () => { await ctx.db.close(); });

// An invented sightline on the English south coast: Europe/London, BST (UTC+1) in summer.
const sightlineBody = {
  name: 'Outing stack',
  vantage: { lat: 50.6001, lon: -1.9502, elevationM: 4, cameraHeightM: 1.6 },
  landmark: { lat: 50.6045, lon: -1.9570, baseElevationM: 0, heightM: 30, widthM: 12 },
};

async function crewSightline() {
  const owner = await createUser('member', 'Oona Owner');
  const viewer = await createUser('member', 'Vic Viewer');
  const agent = await signedInAgent(ctx.app, owner);
  const res = await agent.post('/api/sightlines').send(sightlineBody);
  const sightlineId = res.body.sightline.id as string;
  await CrewMemberModel.create({ sightlineId, userId: viewer.id, role: 'viewer' });
  return { owner, viewer, agent, viewerAgent: await signedInAgent(ctx.app, viewer), sightlineId };
}

describe('outings', () => {
  it('keeps the meeting time in the site zone, the lineup and the notes; the crew answers and everyone sees who is coming', async () => {
    const { owner, viewer, agent, viewerAgent, sightlineId } = await crewSightline();
    const res = await agent.post(`/api/sightlines/${sightlineId}/outings`).send({
      night: '2027-06-05',
      lineup: { start: '2027-06-05T23:40:00Z', end: '2027-06-06T00:35:00Z', peak: '2027-06-06T00:10:00Z' },
      meetingPoint: { lat: 50.6010, lon: -1.9510 },
      meetingLocal: '2027-06-05T22:30',
      meetingNote: '  Lay-by at the top of the lane  ',
      gearNotes: 'Head torch with red light, warm layers',
    });
    expect(res.status).toBe(201);
    const outing = outingResponseSchema.parse(res.body).outing;
    // 22:30 BST (UTC+1, from the IANA tz database's Europe/London rules) is 21:30 UTC.
    expect(outing.meetingAt).toBe('2027-06-05T21:30:00.000Z');
    expect(outing.meetingLocal).toBe('2027-06-05T22:30');
    expect(outing.timezone).toBe('Europe/London');
    expect(outing.meetingNote).toBe('Lay-by at the top of the lane');
    expect(outing.lineup).toEqual({ start: '2027-06-05T23:40:00.000Z', end: '2027-06-06T00:35:00.000Z', peak: '2027-06-06T00:10:00.000Z' });
    expect(outing.people.map((p) => [p.name, p.role, p.answer])).toEqual([['Oona Owner', 'owner', null], ['Vic Viewer', 'viewer', null]]);

    const answered = await viewerAgent.put(`/api/outings/${outing.id}/answer`).send({ answer: 'maybe', note: 'If the wind drops' });
    expect(answered.status).toBe(200);
    const changed = await viewerAgent.put(`/api/outings/${outing.id}/answer`).send({ answer: 'going' });
    const people = outingResponseSchema.parse(changed.body).outing.people;
    expect(people.find((p) => p.userId === viewer.id)).toMatchObject({ answer: 'going', note: '' });
    expect(people.find((p) => p.userId === owner.id)!.answer).toBeNull();

    const listed = await viewerAgent.get(`/api/sightlines/${sightlineId}/outings`);
    expect(listed.body.outings).toHaveLength(1);
    expect(listed.body.outings[0].people[1].answer).toBe('going');
  });

  it('refuses a meeting time the clocks skip, a bad night, a lineup that ends before it starts and a bad answer', async () => {
    const { agent, viewerAgent, sightlineId } = await crewSightline();
    const base = { night: '2027-03-27', meetingPoint: { lat: 50.6, lon: -1.95 } };
    // Europe/London springs forward at 01:00 UTC on 2027-03-28 (last Sunday of March, EU rule): 01:30 local does not exist.
    const gap = await agent.post(`/api/sightlines/${sightlineId}/outings`).send({ ...base, meetingLocal: '2027-03-28T01:30' });
    expect(gap.status).toBe(400);
    expect(gap.body.error.fields.meetingLocal).toMatch(/does not exist/);

    const badNight = await agent.post(`/api/sightlines/${sightlineId}/outings`).send({ ...base, night: '2027-02-30', meetingLocal: '2027-03-27T21:00' });
    expect(badNight.status).toBe(400);
    expect(badNight.body.error.fields.night).toMatch(/does not exist/);

    const backwards = await agent.post(`/api/sightlines/${sightlineId}/outings`).send({
      ...base, meetingLocal: '2027-03-27T21:00', lineup: { start: '2027-03-28T02:00:00Z', end: '2027-03-28T01:00:00Z', peak: '2027-03-28T01:30:00Z' },
    });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields['lineup.end']).toBeTruthy();

    const noPoint = await agent.post(`/api/sightlines/${sightlineId}/outings`).send({ night: '2027-03-27', meetingLocal: '2027-03-27T21:00' });
    expect(noPoint.status).toBe(400);
    expect(noPoint.body.error.fields.meetingPoint).toBeTruthy();

    // The meeting belongs to the night: 06:00 on its date to 12:00 the next day, site time.
    const otherDay = await agent.post(`/api/sightlines/${sightlineId}/outings`).send({ ...base, meetingLocal: '2027-03-30T21:00' });
    expect(otherDay.status).toBe(400);
    expect(otherDay.body.error.fields.meetingLocal).toMatch(/night of 2027-03-27/);

    const ok = await agent.post(`/api/sightlines/${sightlineId}/outings`).send({ ...base, meetingLocal: '2027-03-27T21:00' });
    expect(ok.status).toBe(201);
    const bad = await viewerAgent.put(`/api/outings/${ok.body.outing.id}/answer`).send({ answer: 'perhaps' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.answer).toBeTruthy();
  });

  it('the owner changes and cancels an outing', async () => {
    const { agent, viewerAgent, sightlineId } = await crewSightline();
    const created = await agent.post(`/api/sightlines/${sightlineId}/outings`).send({ night: '2027-07-01', meetingPoint: { lat: 50.6, lon: -1.95 }, meetingLocal: '2027-07-01T22:00' });
    const id = created.body.outing.id as string;
    const moved = await agent.patch(`/api/outings/${id}`).send({ meetingLocal: '2027-07-01T22:45', gearNotes: 'Spare batteries' });
    expect(moved.body.outing.meetingAt).toBe('2027-07-01T21:45:00.000Z');
    expect(moved.body.outing.gearNotes).toBe('Spare batteries');
    expect((await agent.patch(`/api/outings/${id}`).send({})).status).toBe(400);
    expect((await agent.delete(`/api/outings/${id}`)).status).toBe(204);
    expect((await viewerAgent.get(`/api/outings/${id}`)).status).toBe(404);
  });
});
