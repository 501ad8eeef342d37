/**
 * Crew invites through the local SMTP fake: the e-mail, a link that works once, for the invited
 * address only, expires and can be revoked; registering from the link; ownership hand-over; leaving.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { simpleParser } from 'mailparser';
import { SmtpFake } from '../../server/mail/smtp-fake';
import { OutboxMessageModel } from '../../server/models/outbox-message';
import { WatchModel } from '../../server/models/watch';
import { MAX_INVITES_PER_SIGHTLINE_PER_DAY } from '../../server/services/invite-service';
import { MAX_WATCHES_PER_USER } from '../../server/services/watch-service';
import { crewInviteCreatedSchema, crewResponseSchema, INVITE_VALID_DAYS } from '../../shared/schemas/crew';
import { createTestApp, createTestContext, createUser, signedInAgent, TEST_PASSWORD, uniqueEmail, type TestContext } from './helpers';

let ctx: TestContext;
let fake: SmtpFake;
beforeAll(async () => {
  fake = new SmtpFake({ port: 0 });
  await fake.start();
  ctx = await createTestContext({ SMTP_URL: fake.url, APP_URL: 'http://gnomon.test:8080' });
});
afterAll(async () => {
  await fake.stop();
  await ctx.db.close();
});

const sightlineBody = {
  name: 'Invite arch',
  vantage: { lat: 50.6001, lon: -1.9502, elevationM: 4, cameraHeightM: 1.6 },
  landmark: { lat: 50.6045, lon: -1.9570, baseElevationM: 0, heightM: 30, widthM: 12 },
};

async function ownerWithSightline() {
  const owner = await createUser('member', 'Iris Inviter');
  const agent = await signedInAgent(ctx.app, owner);
  const res = await agent.post('/api/sightlines').send(sightlineBody);
  expect(res.status).toBe(201);
  return { owner, agent, sightlineId: res.body.sightline.id as string };
}

/** The last message the fake stored for the address, parsed. */
async function lastMailTo(email: string) {
  const rows = await OutboxMessageModel.findAll({ order: [['receivedAt', 'DESC']], limit: 50 });
  const row = rows.find((r) => r.envelopeTo.includes(email));
  if (!row) throw new Error(`no mail to ${email}`);
  return simpleParser(row.raw);
}

function tokenOf(link: string): string {
  return new URL(link).searchParams.get('token')!;
}

describe('crew invites', () => {
  it('e-mails the invite with a link; the invitee registers from it, accepts once and sees the sightline as a viewer', async () => {
    const { agent, sightlineId } = await ownerWithSightline();
    const email = uniqueEmail('invitee');
    const res = await agent.post(`/api/sightlines/${sightlineId}/crew/invites`).send({ email: email.toUpperCase(), role: 'viewer' });
    expect(res.status).toBe(201);
    const created = crewInviteCreatedSchema.parse(res.body);
    expect(created.mailSent).toBe(true);
    expect(created.invite.email).toBe(email);
    expect(created.invite.status).toBe('pending');
    // Expires INVITE_VALID_DAYS (14) days after it was made.
    expect(Date.parse(created.invite.expiresAt) - Date.parse(created.invite.createdAt)).toBeCloseTo(INVITE_VALID_DAYS * 86_400_000, -4);

    const mail = await lastMailTo(email);
    expect(mail.subject).toContain('Invite arch');
    expect(mail.text).toContain(created.link);
    expect(mail.html).toContain('Accept the invite');
    expect(created.link.startsWith('http://gnomon.test:8080/invites/accept?token=')).toBe(true);
    const token = tokenOf(created.link);

    // Before signing in, the link tells who invited and whether an account exists.
    const lookup = await request(ctx.app).get('/api/invites/lookup').query({ token });
    expect(lookup.status).toBe(200);
    expect(lookup.body.invite).toMatchObject({ sightlineName: 'Invite arch', inviterName: 'Iris Inviter', role: 'viewer', email, status: 'pending', accountExists: false });

    const invitee = request.agent(ctx.app);
    expect((await invitee.post('/api/auth/register').send({ name: 'Nina Newcomer', email, password: TEST_PASSWORD })).status).toBe(201);
    const accepted = await invitee.post('/api/invites/accept').send({ token });
    expect(accepted.status).toBe(200);
    expect(accepted.body).toEqual({ sightlineId, role: 'viewer' });
    const seen = await invitee.get(`/api/sightlines/${sightlineId}`);
    expect(seen.status).toBe(200);
    expect(seen.body.sightline.myRole).toBe('viewer');
    expect((await invitee.get('/api/sightlines')).body.sightlines.map((s: { id: string }) => s.id)).toContain(sightlineId);
    expect((await invitee.patch(`/api/sightlines/${sightlineId}`).send({ name: 'Mine now' })).status).toBe(403);

    // The link works once.
    const again = await invitee.post('/api/invites/accept').send({ token });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/used already/);
    const after = crewResponseSchema.parse((await agent.get(`/api/sightlines/${sightlineId}/crew`)).body);
    expect(after.members.map((m) => [m.name, m.role])).toEqual([['Iris Inviter', 'owner'], ['Nina Newcomer', 'viewer']]);
    expect(after.invites[0]!.status).toBe('accepted');
  });

  it('refuses the link for another account, a forged or altered token, and a revoked invite', async () => {
    const { agent, sightlineId } = await ownerWithSightline();
    const email = uniqueEmail('meant-for');
    const created = crewInviteCreatedSchema.parse((await agent.post(`/api/sightlines/${sightlineId}/crew/invites`).send({ email, role: 'editor' })).body);
    const token = tokenOf(created.link);

    const someoneElse = await signedInAgent(ctx.app, await createUser('member', 'Wrong Person'));
    const wrong = await someoneElse.post('/api/invites/accept').send({ token });
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.message).toContain(email);
    expect((await someoneElse.get(`/api/sightlines/${sightlineId}`)).status).toBe(404);

    // Altered: one character of the signature changed; forged: signed with another key.
    const altered = token.slice(0, -2) + (token.endsWith('A') ? 'B' : 'A') + token.slice(-1);
    for (const bad of [altered, 'not-a-token', `${token.split('.')[0]}.e30.c2ln`]) {
      const res = await request(ctx.app).get('/api/invites/lookup').query({ token: bad });
      expect(res.status).toBe(400);
      expect(res.body.error.message).toMatch(/not valid/);
    }

    const revoked = await agent.delete(`/api/sightlines/${sightlineId}/crew/invites/${created.invite.id}`);
    expect(revoked.status).toBe(204);
    const invitee = await signedInAgent(ctx.app, await createUser('member', 'Late Invitee').then(async (u) => { await u.update({ email }); return u; }));
    const late = await invitee.post('/api/invites/accept').send({ token });
    expect(late.status).toBe(410);
    expect(late.body.error.message).toMatch(/withdrawn/);
    // Revoking twice: nothing open any more.
    expect((await agent.delete(`/api/sightlines/${sightlineId}/crew/invites/${created.invite.id}`)).status).toBe(404);
  });

  it('an expired invite is refused (clock moved past the expiry)', async () => {
    const { owner, sightlineId } = await ownerWithSightline();
    let now = new Date('2027-03-01T12:00:00Z');
    const { app } = createTestApp(ctx.db, { SMTP_URL: fake.url, APP_URL: 'http://gnomon.test:8080' }, { clock: () => now });
    const agent = await signedInAgent(app, owner);
    const email = uniqueEmail('slow');
    const created = crewInviteCreatedSchema.parse((await agent.post(`/api/sightlines/${sightlineId}/crew/invites`).send({ email, role: 'viewer' })).body);
    expect(created.invite.expiresAt).toBe('2027-03-15T12:00:00.000Z');
    now = new Date('2027-03-15T12:00:01Z');
    const invitee = await signedInAgent(app, await createUser('member', 'Slow Invitee').then(async (u) => { await u.update({ email }); return u; }));
    const res = await invitee.post('/api/invites/accept').send({ token: tokenOf(created.link) });
    expect(res.status).toBe(410);
    expect(res.body.error.message).toMatch(/expired/);
    const crew = crewResponseSchema.parse((await agent.get(`/api/sightlines/${sightlineId}/crew`)).body);
    expect(crew.invites[0]!.status).toBe('expired');
  });

  it('refuses inviting yourself or a member, and a bad address or role, with field messages', async () => {
    const { owner, agent, sightlineId } = await ownerWithSightline();
    const self = await agent.post(`/api/sightlines/${sightlineId}/crew/invites`).send({ email: owner.email, role: 'viewer' });
    expect(self.status).toBe(400);
    expect(self.body.error.fields.email).toBeTruthy();
    const bad = await agent.post(`/api/sightlines/${sightlineId}/crew/invites`).send({ email: 'nobody', role: 'boss' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.email).toBeTruthy();
    expect(bad.body.error.fields.role).toBeTruthy();
  });

  it('saves the invite and says so when the mail server refuses it; a new invite to the same address replaces the open one', async () => {
    const { agent, sightlineId } = await ownerWithSightline();
    const email = uniqueEmail('bounced');
    fake.refuse('Mailbox busy', 451);
    try {
      const res = await agent.post(`/api/sightlines/${sightlineId}/crew/invites`).send({ email, role: 'viewer' });
      expect(res.status).toBe(201);
      expect(res.body.mailSent).toBe(false);
      expect(res.body.mailError).toMatch(/could not be sent/);
    } finally {
      fake.accept();
    }
    const second = await agent.post(`/api/sightlines/${sightlineId}/crew/invites`).send({ email, role: 'editor' });
    expect(second.body.mailSent).toBe(true);
    const crew = crewResponseSchema.parse((await agent.get(`/api/sightlines/${sightlineId}/crew`)).body);
    expect(crew.invites.map((i) => [i.role, i.status])).toEqual([['editor', 'pending'], ['viewer', 'revoked']]);
  });
});

describe('limits', () => {
  it('refuses the 31st invite of a sightline within a day with 429', async () => {
    const { agent, sightlineId } = await ownerWithSightline();
    for (let i = 0; i < MAX_INVITES_PER_SIGHTLINE_PER_DAY; i++) {
      expect((await agent.post(`/api/sightlines/${sightlineId}/crew/invites`).send({ email: uniqueEmail(`many${i}`), role: 'viewer' })).status).toBe(201);
    }
    const refused = await agent.post(`/api/sightlines/${sightlineId}/crew/invites`).send({ email: uniqueEmail('one-more'), role: 'viewer' });
    expect(refused.status).toBe(429);
    expect(refused.body.error.message).toMatch(/in the last day/);
  });

  it('refuses a watch past the per-person limit with 409 and keeps the others', async () => {
    const { owner, agent, sightlineId } = await ownerWithSightline();
    // Paused watches, made directly: the scheduler tests must find no active watch left behind.
    await WatchModel.bulkCreate(Array.from({ length: MAX_WATCHES_PER_USER }, () => ({
      ownerId: owner.id, sightlineId, target: { id: 'galactic-centre' }, minScore: 0.3, minDurationMin: 5,
      reachableOnly: false, weekdays: [1, 2, 3, 4, 5, 6, 7], leadDays: [3, 0], paused: true, maxCloudPct: null,
    })));
    const refused = await agent.post('/api/watches').send({ sightlineId, paused: true });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/delete one first/);
    expect(await WatchModel.count({ where: { ownerId: owner.id } })).toBe(MAX_WATCHES_PER_USER);
    await WatchModel.destroy({ where: { ownerId: owner.id } });
  });
});

describe('ownership and leaving', () => {
  it('hands the sightline over to a crew member: they own it, the old owner stays as an editor', async () => {
    const { owner, agent, sightlineId } = await ownerWithSightline();
    const email = uniqueEmail('heir');
    const created = crewInviteCreatedSchema.parse((await agent.post(`/api/sightlines/${sightlineId}/crew/invites`).send({ email, role: 'editor' })).body);
    const heir = await createUser('member', 'Hal Heir');
    await heir.update({ email });
    const heirAgent = await signedInAgent(ctx.app, heir);
    expect((await heirAgent.post('/api/invites/accept').send({ token: tokenOf(created.link) })).status).toBe(200);

    const refused = await agent.post(`/api/sightlines/${sightlineId}/crew/hand-over`).send({ userId: (await createUser()).id });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.userId).toMatch(/crew member/);

    const res = await agent.post(`/api/sightlines/${sightlineId}/crew/hand-over`).send({ userId: heir.id });
    expect(res.status).toBe(200);
    const crew = crewResponseSchema.parse(res.body);
    expect(crew.myRole).toBe('editor');
    expect(crew.members.map((m) => [m.userId, m.role])).toEqual([[heir.id, 'owner'], [owner.id, 'editor']]);
    expect((await heirAgent.get(`/api/sightlines/${sightlineId}`)).body.sightline.myRole).toBe('owner');
    // The old owner can no longer delete it; the new one can manage the crew.
    expect((await agent.delete(`/api/sightlines/${sightlineId}`)).status).toBe(403);
    expect((await heirAgent.patch(`/api/sightlines/${sightlineId}/crew/${owner.id}`).send({ role: 'viewer' })).status).toBe(200);
  });

  it('a member leaves and loses access; the owner cannot leave', async () => {
    const { owner, agent, sightlineId } = await ownerWithSightline();
    const email = uniqueEmail('leaver');
    const created = crewInviteCreatedSchema.parse((await agent.post(`/api/sightlines/${sightlineId}/crew/invites`).send({ email, role: 'viewer' })).body);
    const leaver = await createUser('member', 'Lee Leaver');
    await leaver.update({ email });
    const leaverAgent = await signedInAgent(ctx.app, leaver);
    await leaverAgent.post('/api/invites/accept').send({ token: tokenOf(created.link) });
    // A watch the member keeps on it goes with the membership: its e-mails must stop.
    const watch = await leaverAgent.post('/api/watches').send({ sightlineId, paused: true });
    expect(watch.status).toBe(201);
    expect((await leaverAgent.delete(`/api/sightlines/${sightlineId}/crew/${leaver.id}`)).status).toBe(204);
    expect((await leaverAgent.get(`/api/watches/${watch.body.watch.id}`)).status).toBe(404);
    expect((await leaverAgent.get(`/api/sightlines/${sightlineId}`)).status).toBe(404);
    const ownerLeaves = await agent.delete(`/api/sightlines/${sightlineId}/crew/${owner.id}`);
    expect(ownerLeaves.status).toBe(403);
    expect(ownerLeaves.body.error.message).toMatch(/hand the sightline over/);
  });
});
