/**
 * The pause link of a watch e-mail: no sign-in, works once, refuses forged and altered tokens.
 */
import { createHmac, createSecretKey } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import jwt from 'jsonwebtoken';
import { DateTime } from 'luxon';
import { unsubscribeStateSchema } from '../../shared/schemas/watch';
import { SmtpFake } from '../../server/mail/smtp-fake';
import { WatchDeliveryModel } from '../../server/models/watch-delivery';
import { WatchModel } from '../../server/models/watch';
import { createTestContext, createUser, signedInAgent, TEST_JWT_SECRET, type TestContext } from './helpers';
import { createSightline, createWatchApp, FakeClock, mailsTo, scanAndDrain, searchLineups, type WatchApp } from './watches-fixture';

let ctx: TestContext;
let fake: SmtpFake;
let watchApp: WatchApp;
const clock = new FakeClock(new Date('2027-06-01T00:00:00Z'));
beforeAll(async () => {
  ctx = await createTestContext();
  fake = new SmtpFake({ port: 0 });
  await fake.start();
  watchApp = createWatchApp(ctx.db, clock, fake);
  await watchApp.scheduler.start();
});
afterAll(async () => {
  await watchApp.close();
  await WatchModel.destroy({ where: {} });
  await fake.stop();
  await ctx.db.close();
});

/** A watch that has sent one e-mail (lead 3 days) for a June lineup; its pause link and watch id. */
async function sentOne() {
  const user = await createUser('member', 'Pauser');
  const agent = await signedInAgent(watchApp.app, user);
  const sightline = await createSightline(agent);
  const { lineups } = await searchLineups(agent, sightline.id, '2027-06-01', '2027-07-01');
  const L = lineups.find((l) => l.start >= '2027-06-08' && l.score >= 0.5)!;
  const weekday = DateTime.fromISO(L.start, { zone: 'Australia/Sydney' }).minus({ hours: 12 }).weekday;
  const res = await agent.post('/api/watches').send({ sightlineId: sightline.id, weekdays: [weekday], leadDays: [3, 0] });
  const watchId = res.body.watch.id as string;
  clock.set(new Date(Date.parse(L.start) - 3 * 86_400_000));
  await scanAndDrain(watchApp.scheduler);
  const mails = await mailsTo(user.email);
  expect(mails).toHaveLength(1);
  const link = /(http\S+\/watches\/unsubscribe\?token=(\S+))/.exec(mails[0]!.mail.text!)!;
  return { user, agent, watchId, L, link: link[1]!, token: decodeURIComponent(link[2]!) };
}

describe('the pause link', () => {
  it('shows the watch, pauses it without signing in, and works once', async () => {
    const { agent, watchId, token, link } = await sentOne();
    expect(link.startsWith('http://gnomon.test:8080/watches/unsubscribe?token=')).toBe(true);
    const anon = request(ctx.app);
    const before = await anon.get('/api/watches/unsubscribe').query({ token });
    expect(before.status).toBe(200);
    expect(unsubscribeStateSchema.parse(before.body)).toMatchObject({
      watch: { id: watchId, sightlineName: 'Test ridge at 35 S', targetName: 'Galactic Centre', paused: false }, used: false, usedAt: null,
    });

    const used = await anon.post('/api/watches/unsubscribe').send({ token });
    expect(used.status).toBe(200);
    expect(used.body).toMatchObject({ watch: { paused: true }, used: true });
    expect((await agent.get(`/api/watches/${watchId}`)).body.watch.paused).toBe(true);

    // A second use says so and changes nothing, even after the owner resumed the watch.
    expect((await agent.patch(`/api/watches/${watchId}`).send({ paused: false })).status).toBe(200);
    const again = await anon.post('/api/watches/unsubscribe').send({ token });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('conflict');
    expect(again.body.error.message).toMatch(/already used/);
    expect((await agent.get(`/api/watches/${watchId}`)).body.watch.paused).toBe(false);
    expect((await anon.get('/api/watches/unsubscribe').query({ token })).body).toMatchObject({ used: true, watch: { paused: false } });
  }, 60_000);

  it('refuses a forged or altered token with a clear message, and a missing one', async () => {
    const { token, watchId } = await sentOne();
    const anon = request(ctx.app);
    const [header, payload, signature] = token.split('.') as [string, string, string];
    const claims = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as { sub: string; w: string };
    const purposeKey = createSecretKey(createHmac('sha256', TEST_JWT_SECRET).update('gnomon/watch-unsubscribe/v1').digest());
    const forged = [
      // One character of the signature changed.
      `${header}.${payload}.${signature.slice(0, -2)}${signature.endsWith('AA') ? 'BB' : 'AA'}`,
      // The payload swapped for another delivery's, the old signature kept.
      `${header}.${Buffer.from(JSON.stringify({ ...claims, sub: '00000000-0000-4000-8000-000000000000' })).toString('base64url')}.${signature}`,
      // Signed with the session key instead of the purpose-derived key.
      jwt.sign({ w: claims.w }, TEST_JWT_SECRET, { subject: claims.sub, audience: 'gnomon:watch-unsubscribe', algorithm: 'HS256' }),
      // The right key, another audience.
      jwt.sign({ w: claims.w }, purposeKey, { subject: claims.sub, audience: 'gnomon:session', algorithm: 'HS256' }),
      // No signature at all (alg none, RFC 7518 section 3.6).
      `${Buffer.from('{"alg":"none","typ":"JWT"}').toString('base64url')}.${payload}.`,
      'not-a-token',
    ];
    for (const bad of forged) {
      for (const res of [await anon.get('/api/watches/unsubscribe').query({ token: bad }), await anon.post('/api/watches/unsubscribe').send({ token: bad })]) {
        expect(res.status).toBe(400);
        expect(res.body.error.message).toMatch(/not valid: it may have been altered or copied incompletely/);
        expect(res.body.error.fields.token).toBeTruthy();
      }
    }
    // An expired link says it expired.
    const expired = jwt.sign({ w: claims.w }, purposeKey, { subject: claims.sub, audience: 'gnomon:watch-unsubscribe', algorithm: 'HS256', expiresIn: -10 });
    expect((await anon.get('/api/watches/unsubscribe').query({ token: expired })).body.error.message).toMatch(/expired/);
    const missing = await anon.post('/api/watches/unsubscribe').send({});
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.token).toBe('The link has no token');
    expect((await WatchModel.findByPk(watchId))!.paused).toBe(false);
  }, 60_000);

  it('pauses through the one-click List-Unsubscribe POST (RFC 8058: form body, token in the address)', async () => {
    const { user, watchId, L } = await sentOne();
    // Unpaused, the lead-0 e-mail of the same lineup comes on the day; its header link pauses the watch.
    clock.set(DateTime.fromISO(L.start, { zone: 'Australia/Sydney' }).minus({ hours: 12 }).set({ hour: 10 }).toJSDate());
    await scanAndDrain(watchApp.scheduler);
    const mails = await mailsTo(user.email);
    expect(mails).toHaveLength(2);
    const header = mails[1]!.mail.headerLines.find((h) => h.key === 'list-unsubscribe')!.line;
    const url = new URL(/<([^>]+)>/.exec(header)![1]!);
    const res = await request(ctx.app).post(`${url.pathname}${url.search}`).type('form').send('List-Unsubscribe=One-Click');
    expect(res.status).toBe(200);
    expect(res.body.watch.paused).toBe(true);
    const deliveries = await WatchDeliveryModel.findAll({ where: { watchId }, order: [['leadDays', 'ASC']] });
    expect(deliveries.map((d) => d.unsubscribeUsedAt !== null)).toEqual([true, false]);
  }, 60_000);
});
