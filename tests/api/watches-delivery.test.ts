/**
 * The watch scheduler end to end: a fake clock, the real pg-boss queue on the test database, mail
 * through nodemailer to the local SMTP fake, and the outbox read back with mailparser.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { DateTime } from 'luxon';
import ical from 'node-ical';
import type { Lineup } from '../../shared/schemas/lineup';
import { targetHorizontal } from '../../shared/sky/positions';
import { GALACTIC_CENTRE_J2000 } from '../../shared/sky/galactic';
import { SmtpFake } from '../../server/mail/smtp-fake';
import { WatchDeliveryModel } from '../../server/models/watch-delivery';
import { WatchModel } from '../../server/models/watch';
import { deliveryMessageId } from '../../server/services/watch-delivery-service';
import { createTestContext, createUser, signedInAgent, type TestContext } from './helpers';
import {
  APP_URL, createSightline, createWatchApp, FakeClock, mailsTo, scanAndDrain, searchLineups, southSightline, waitFor, type WatchApp,
} from './watches-fixture';

const TZ = 'Australia/Sydney';
let ctx: TestContext;
let fake: SmtpFake;
const apps: WatchApp[] = [];
beforeAll(async () => {
  ctx = await createTestContext();
  fake = new SmtpFake({ port: 0 });
  await fake.start();
});
afterEach(async () => {
  fake.accept();
  await Promise.all(apps.splice(0).map((a) => a.close()));
  // Each test's watches go with it, so later scans do not search them again.
  await WatchModel.destroy({ where: {} });
});
afterAll(async () => {
  await fake.stop();
  await ctx.db.close();
});

async function startApp(clock: FakeClock): Promise<WatchApp> {
  const app = createWatchApp(ctx.db, clock, fake);
  apps.push(app);
  await app.scheduler.start();
  return app;
}

/** The night a lineup belongs to, by the definition of a night: the local date of its evening (start - 12 h). */
function nightByLuxon(l: Lineup): DateTime {
  return DateTime.fromISO(l.start, { zone: TZ }).minus({ hours: 12 }).startOf('day');
}

/** A local time as the e-mail shows it, computed with luxon from the IANA zone (rounded to the minute). */
function localByLuxon(iso: string): string {
  const ms = Math.round(Date.parse(iso) / 60_000) * 60_000;
  return DateTime.fromMillis(ms, { zone: TZ }).toFormat('yyyy-MM-dd HH:mm');
}

/**
 * A user with the southern sightline, a hazard note, and the planner's lineups for June 2027; the
 * chosen lineup L is one of the good mid-June ones (long and well centred).
 */
async function scenario() {
  const user = await createUser('member', 'Watcher');
  const agent = await signedInAgent(ctx.app, user);
  const sightline = await createSightline(agent);
  await agent.post(`/api/sightlines/${sightline.id}/notes`).send({ kind: 'hazard', body: 'Loose scree on the last bend of the ridge path.' });
  const { lineups, timezone } = await searchLineups(agent, sightline.id, '2027-05-25', '2027-07-01');
  expect(timezone).toBe(TZ);
  const chosen = lineups.find((l) => l.start >= '2027-06-08' && l.score >= 0.5 && l.durationMin >= 30);
  expect(chosen, 'a good lineup in mid June (common practice: the galactic centre is high in the southern winter)').toBeDefined();
  return { user, sightline, lineups, L: chosen! };
}

async function createWatch(agent: request.Agent, body: object): Promise<string> {
  const res = await agent.post('/api/watches').send(body);
  expect(res.status).toBe(201);
  return res.body.watch.id as string;
}

describe('watch e-mails', () => {
  it('sends exactly one e-mail three days before a lineup, with local times, cautions and a parsable .ics; not again on a rescan or after a restart; then the on-the-day one', async () => {
    const { user, sightline, L } = await scenario();
    const weekday = nightByLuxon(L).weekday;
    // Created a week before L (the same weekday's lineup before it has begun already): nothing due.
    const clock = new FakeClock(new Date(Date.parse(L.start) - 6 * 86_400_000));
    const a = await startApp(clock);
    const agent = await signedInAgent(a.app, user);
    const watchId = await createWatch(agent, { sightlineId: sightline.id, weekdays: [weekday], leadDays: [3, 0], minScore: 0.3 });
    await scanAndDrain(a.scheduler);
    expect(await mailsTo(user.email)).toHaveLength(0);

    clock.set(new Date(Date.parse(L.start) - 3 * 86_400_000));
    await scanAndDrain(a.scheduler);
    const mails = await mailsTo(user.email);
    expect(mails).toHaveLength(1);
    const { mail, row } = mails[0]!;

    // Times in the site's zone: Australia/Sydney is UTC+10 (AEST) in June, no daylight saving (IANA tz database).
    expect(DateTime.fromISO(L.start, { zone: TZ }).offset).toBe(600);
    const text = mail.text!;
    expect(text).toContain(`Start: ${localByLuxon(L.start)} AEST`);
    expect(text).toContain(`Peak: ${localByLuxon(L.peak)} AEST`);
    expect(text).toContain(`End: ${localByLuxon(L.end)} AEST`);
    expect(text).toContain(`Night: ${nightByLuxon(L).setLocale('en-GB').toFormat('cccc d LLLL yyyy')}`);
    // Altitude and azimuth at the peak, checked against astronomy-engine (shared/sky) for the vantage.
    const site = { lat: southSightline.vantage.lat, lon: southSightline.vantage.lon, elevationM: southSightline.vantage.elevationM + southSightline.vantage.cameraHeightM };
    const sky = targetHorizontal(GALACTIC_CENTRE_J2000, site, new Date(L.peak), { refraction: true });
    const altAz = /altitude (-?\d+\.\d)°, azimuth (\d+\.\d)°/.exec(text)!;
    expect(Math.abs(Number(altAz[1]) - sky.altitudeDeg)).toBeLessThan(0.2);
    expect(Math.abs(Number(altAz[2]) - sky.azimuthDeg)).toBeLessThan(0.2);
    expect(text).toMatch(/Moon: (below the horizon|up at)/);
    expect(text).toContain('Tide: no tide rule on this sightline');
    expect(text).toContain('Hazard: Loose scree on the last bend of the ridge path.');
    expect(text).toMatch(/plan, not a promise/);
    expect(text).toContain(`${APP_URL}/sightlines/${sightline.id}?tab=night&night=${nightByLuxon(L).toISODate()}`);
    expect(text).toMatch(new RegExp(`${APP_URL}/watches/unsubscribe\\?token=`));
    expect(mail.html).toContain('background:#000000');
    expect(mail.html).toContain('name="viewport"');
    expect(mail.to && !Array.isArray(mail.to) ? mail.to.text : '').toBe(user.email);
    // One-click unsubscribe headers (RFC 8058).
    expect(mail.headerLines.find((h) => h.key === 'list-unsubscribe')?.line).toMatch(/<http:\/\/gnomon\.test:8080\/api\/watches\/unsubscribe\?token=[^>]+>/);
    expect(mail.headerLines.find((h) => h.key === 'list-unsubscribe-post')?.line).toMatch(/List-Unsubscribe=One-Click/);

    const shown = (await agent.get(`/api/watches/${watchId}`)).body.watch;
    expect(Date.parse(shown.lastSentAt)).toBeGreaterThan(Date.now() - 60_000);
    expect((await agent.get('/api/watches')).body.watches[0].lastSentAt).toBe(shown.lastSentAt);

    // Deterministic Message-ID from (watch, lineup start, lead).
    const delivery = await WatchDeliveryModel.findOne({ where: { watchId } });
    expect(delivery).toMatchObject({ status: 'sent', leadDays: 3, attempts: 1, recipient: user.email });
    expect(row.messageId).toBe(deliveryMessageId(watchId, delivery!.lineupStart, 3));
    expect(mail.messageId).toBe(`<${row.messageId}>`);

    // The .ics attachment parses with node-ical and holds the lineup (iCalendar keeps whole seconds, RFC 5545).
    const attachment = mail.attachments.find((x) => x.contentType === 'text/calendar');
    expect(attachment?.filename).toBe(`gnomon-lineup-${nightByLuxon(L).toISODate()}.ics`);
    const events = Object.values(ical.sync.parseICS(attachment!.content.toString('utf8'))).filter((e) => e.type === 'VEVENT') as Array<{ start: Date; end: Date; summary: string; uid: string }>;
    expect(events).toHaveLength(1);
    expect(Math.abs(events[0]!.start.getTime() - Date.parse(L.start))).toBeLessThan(1000);
    expect(Math.abs(events[0]!.end.getTime() - Date.parse(L.end))).toBeLessThan(1000);
    expect(events[0]!.summary).toBe(`Lineup: Galactic Centre at ${southSightline.name}`);

    // The same scan again, and a restart (a new app and scheduler on the same database): no second e-mail.
    await scanAndDrain(a.scheduler);
    await a.close();
    const b = await startApp(clock);
    await scanAndDrain(b.scheduler);
    expect(await mailsTo(user.email)).toHaveLength(1);

    // On the day, after 09:00 local: the lead-0 e-mail, once.
    const onTheDay = nightByLuxon(L).set({ hour: 10 });
    clock.set(onTheDay.toJSDate());
    await scanAndDrain(b.scheduler);
    await scanAndDrain(b.scheduler);
    const after = await mailsTo(user.email);
    expect(after).toHaveLength(2);
    expect(after[1]!.mail.subject).toMatch(/^Lineup tonight: Galactic Centre at /);
    expect(after[1]!.row.messageId).toBe(deliveryMessageId(watchId, delivery!.lineupStart, 0));

    // After the lineup has begun nothing more is sent for it.
    clock.set(new Date(Date.parse(L.start) + 60_000));
    await scanAndDrain(b.scheduler);
    expect(await mailsTo(user.email)).toHaveLength(2);
    const list = await (await signedInAgent(b.app, user)).get(`/api/watches/${watchId}/deliveries`);
    expect(list.body.deliveries.map((d: { leadDays: number; status: string }) => [d.leadDays, d.status])).toEqual([[0, 'sent'], [3, 'sent']]);
  }, 90_000);

  it('runs three weeks of a season in seconds: each lineup gets one e-mail per lead time', async () => {
    const { user, sightline, lineups } = await scenario();
    const clock = new FakeClock(new Date('2027-05-31T00:00:00Z'));
    const a = await startApp(clock);
    const agent = await signedInAgent(a.app, user);
    const watchId = await createWatch(agent, { sightlineId: sightline.id, leadDays: [3, 0], minScore: 0 });
    const scans: Date[] = [];
    // One scan a day at 00:00 UTC, 10:00 in Sydney: after the 09:00 local send hour.
    for (let t = Date.parse('2027-05-31T00:00:00Z'); t <= Date.parse('2027-06-21T00:00:00Z'); t += 86_400_000) {
      clock.set(new Date(t));
      scans.push(new Date(t));
      await scanAndDrain(a.scheduler);
    }
    // Expected by the definition of the leads: lead n is due from 09:00 local n days before the
    // night's evening, and gives way to a shorter lead once that one is due; nothing after the start.
    const expected = new Set<string>();
    for (const l of lineups.filter((x) => x.durationMin >= 5)) {
      for (const t of scans) {
        if (t.getTime() >= Date.parse(l.start)) continue;
        const due = [3, 0].filter((n) => nightByLuxon(l).minus({ days: n }).set({ hour: 9 }).toMillis() <= t.getTime());
        if (due.length) expected.add(`${localByLuxon(l.start)}/${Math.min(...due)}`);
      }
    }
    const deliveries = await WatchDeliveryModel.findAll({ where: { watchId } });
    const got = new Set(deliveries.map((d) => `${localByLuxon(d.lineupStart.toISOString())}/${d.leadDays}`));
    expect(got).toEqual(expected);
    expect(expected.size).toBeGreaterThan(20);
    const mails = await mailsTo(user.email);
    expect(mails).toHaveLength(expected.size);
    expect(new Set(mails.map((m) => m.row.messageId)).size).toBe(mails.length);
    expect(deliveries.every((d) => d.status === 'sent')).toBe(true);
  }, 120_000);

  it('retries while the SMTP server refuses (451) and sends once when it is back; a permanent 550 fails at once', async () => {
    const { user, sightline, L } = await scenario();
    const clock = new FakeClock(new Date(Date.parse(L.start) - 3 * 86_400_000));
    const a = await startApp(clock);
    const agent = await signedInAgent(a.app, user);
    const watchId = await createWatch(agent, { sightlineId: sightline.id, weekdays: [nightByLuxon(L).weekday], leadDays: [3] });
    fake.refuse('Mail service busy, try again later', 451);
    await a.scheduler.scanNow();
    // Two attempts claimed and refused: the row is back to pending, waiting for its next retry.
    await waitFor(async () => {
      const d = await WatchDeliveryModel.findOne({ where: { watchId } });
      return d !== null && d.attempts >= 2 && d.status === 'pending';
    }, 20_000, 'two refused attempts');
    const refused = await WatchDeliveryModel.findOne({ where: { watchId } });
    expect(refused!.status).not.toBe('sent');
    expect(refused!.lastError).toMatch(/451/);
    expect(await mailsTo(user.email)).toHaveLength(0);

    fake.accept();
    await a.scheduler.drain(30_000);
    const sent = await WatchDeliveryModel.findOne({ where: { watchId } });
    expect(sent!.status).toBe('sent');
    expect(sent!.attempts).toBeGreaterThanOrEqual(3);
    expect(await mailsTo(user.email)).toHaveLength(1);
    await scanAndDrain(a.scheduler);
    expect(await mailsTo(user.email)).toHaveLength(1);

    // A permanent refusal (RFC 5321: 5yz replies are permanent) is not retried.
    const other = await createUser('member', 'Refused');
    const otherAgent = await signedInAgent(a.app, other);
    const s2 = await createSightline(otherAgent);
    const w2 = await createWatch(otherAgent, { sightlineId: s2.id, weekdays: [nightByLuxon(L).weekday], leadDays: [3] });
    fake.refuse('No such mailbox', 550);
    await scanAndDrain(a.scheduler);
    const failed = await WatchDeliveryModel.findOne({ where: { watchId: w2 } });
    expect(failed).toMatchObject({ status: 'failed', attempts: 1 });
    expect(failed!.lastError).toMatch(/550/);
    expect(await mailsTo(other.email)).toHaveLength(0);
  }, 90_000);

  it('sends a delivery claimed by a sender that died (claim older than the lease) once, and leaves a fresh claim alone', async () => {
    const { user, sightline, L } = await scenario();
    const clock = new FakeClock(new Date(Date.parse(L.start) - 3 * 86_400_000));
    const a = await startApp(clock);
    const agent = await signedInAgent(a.app, user);
    const watchId = await createWatch(agent, { sightlineId: sightline.id, weekdays: [nightByLuxon(L).weekday], leadDays: [3] });
    // The scan step alone records the delivery; then a sender "claims" it and dies before marking it.
    const scanned = await a.scheduler.deliveries.scan(clock.now());
    expect(scanned.created).toBe(1);
    const claim = (age: string) => ctx.db.sequelize.query(
      `UPDATE watch_deliveries SET status = 'sending', claimed_at = now() - interval '${age}', claim_token = :token, attempts = 1 WHERE watch_id = :watchId`,
      { replacements: { token: randomUUID(), watchId } },
    );
    await claim('5 seconds');
    await scanAndDrain(a.scheduler);
    expect(await mailsTo(user.email)).toHaveLength(0);
    expect((await WatchDeliveryModel.findOne({ where: { watchId } }))!.status).toBe('sending');

    await claim('1 hour');
    await scanAndDrain(a.scheduler);
    await scanAndDrain(a.scheduler);
    expect(await mailsTo(user.email)).toHaveLength(1);
    expect(await WatchDeliveryModel.findOne({ where: { watchId } })).toMatchObject({ status: 'sent', attempts: 2 });
  }, 60_000);

  it('two app copies scanning and sending at once send each e-mail once', async () => {
    const { user, sightline, L } = await scenario();
    const clock = new FakeClock(new Date(Date.parse(L.start) - 3 * 86_400_000));
    const [a, b] = [await startApp(clock), await startApp(clock)];
    const agent = await signedInAgent(a.app, user);
    const watchId = await createWatch(agent, { sightlineId: sightline.id, leadDays: [3, 0], minScore: 0 });
    await Promise.all([a.scheduler.scanNow(), b.scheduler.scanNow(), a.scheduler.scanNow()]);
    await Promise.all([a.scheduler.drain(30_000), b.scheduler.drain(30_000)]);
    const deliveries = await WatchDeliveryModel.findAll({ where: { watchId } });
    expect(deliveries.length).toBeGreaterThanOrEqual(3);
    expect(await mailsTo(user.email)).toHaveLength(deliveries.length);

    // The send step itself, raced by both copies on one delivery: one sends, the other finds it claimed.
    clock.set(nightByLuxon(L).set({ hour: 10 }).toJSDate());
    const next = await a.scheduler.deliveries.scan(clock.now());
    expect(next.created).toBeGreaterThanOrEqual(1);
    const outcomes = await Promise.all(next.toSend.flatMap((id) => [a.scheduler.deliveries.send(id, clock.now()), b.scheduler.deliveries.send(id, clock.now())]));
    expect(outcomes.filter((o) => o === 'sent')).toHaveLength(next.toSend.length);
    expect(outcomes.filter((o) => o === 'not-claimed')).toHaveLength(next.toSend.length);
    expect(await mailsTo(user.email)).toHaveLength(deliveries.length + next.toSend.length);
  }, 60_000);

  it('a paused watch sends nothing, and a watch paused after its e-mail was recorded skips it', async () => {
    const { user, sightline, L } = await scenario();
    const clock = new FakeClock(new Date(Date.parse(L.start) - 3 * 86_400_000));
    const a = await startApp(clock);
    const agent = await signedInAgent(a.app, user);
    const paused = await createWatch(agent, { sightlineId: sightline.id, leadDays: [3, 0], minScore: 0, paused: true });
    await scanAndDrain(a.scheduler);
    expect(await mailsTo(user.email)).toHaveLength(0);
    expect(await WatchDeliveryModel.count({ where: { watchId: paused } })).toBe(0);

    const later = await createWatch(agent, { sightlineId: sightline.id, weekdays: [nightByLuxon(L).weekday], leadDays: [3] });
    const scanned = await a.scheduler.deliveries.scan(clock.now());
    expect(scanned.created).toBe(1);
    expect((await agent.patch(`/api/watches/${later}`).send({ paused: true })).status).toBe(200);
    expect(await a.scheduler.deliveries.send(scanned.toSend[0]!, clock.now())).toBe('skipped');
    expect(await mailsTo(user.email)).toHaveLength(0);
    expect((await WatchDeliveryModel.findByPk(scanned.toSend[0]!))!.status).toBe('skipped');
  }, 60_000);
});
