/**
 * The secret calendar feed of a user's watched lineups, read back with node-ical.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import ical from 'node-ical';
import { calendarFeedResponseSchema } from '../../shared/schemas/watch';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { WatchModel } from '../../server/models/watch';
import { createTestContext, createUser, signedInAgent, TEST_JWT_SECRET, type TestContext } from './helpers';
import { APP_URL, createSightline, FakeClock, searchLineups } from './watches-fixture';

let ctx: TestContext;
let app: ReturnType<typeof createApp>;
// 1 June 2027: the feed lists the next 60 days of lineups from the app's clock.
const clock = new FakeClock(new Date('2027-06-01T00:00:00Z'));
beforeAll(async () => {
  ctx = await createTestContext();
  app = createApp({ config: loadConfig({ NODE_ENV: 'test', BCRYPT_ROUNDS: '4', APP_URL }), sequelize: ctx.db.sequelize, jwtSecret: TEST_JWT_SECRET, clock: clock.now });
});
afterAll(async () => {
  // Active watches left behind would be scanned by the scheduler tests that run later.
  await WatchModel.destroy({ where: {} });
  await ctx.db.close();
});

type FeedEvent = { type: string; start: Date; end: Date; summary: string; uid: string; url?: string | { val: string } };
function events(text: string): FeedEvent[] {
  return (Object.values(ical.sync.parseICS(text)) as FeedEvent[]).filter((e) => e.type === 'VEVENT');
}

describe('calendar feed', () => {
  it('lists the watched lineups of active watches for a calendar app without sign-in; rotating the secret stops the old address', async () => {
    const user = await createUser('member', 'Feed Reader');
    const agent = await signedInAgent(app, user);
    const sightline = await createSightline(agent);
    const active = (await agent.post('/api/watches').send({ sightlineId: sightline.id, minScore: 0.5, weekdays: [5, 6, 7] })).body.watch.id as string;
    // A paused watch on every night adds nothing.
    await agent.post('/api/watches').send({ sightlineId: sightline.id, minScore: 0, paused: true });

    const first = await agent.get('/api/calendar/feed');
    expect(first.status).toBe(200);
    const { feed } = calendarFeedResponseSchema.parse(first.body);
    expect(feed.url).toMatch(new RegExp(`^${APP_URL}/api/calendar/[A-Za-z0-9_-]{43}\\.ics$`));
    // Asking again gives the same address.
    expect((await agent.get('/api/calendar/feed')).body.feed.url).toBe(feed.url);

    const path = new URL(feed.url).pathname;
    const res = await request(app).get(path);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/calendar/);
    const got = events(res.text);

    // Expected: the planner's own search over the same 60 days, with the watch's conditions (score >= 0.5,
    // Friday to Sunday nights by the evening's local date in Australia/Sydney).
    const { lineups } = await searchLineups(agent, sightline.id, '2027-05-31T00:00:00Z', '2027-07-31T00:00:00Z');
    const wanted = lineups.filter((l) => {
      const evening = new Date(Date.parse(l.start) - 12 * 3_600_000);
      const day = new Intl.DateTimeFormat('en-GB', { timeZone: 'Australia/Sydney', weekday: 'short' }).format(evening);
      return l.score >= 0.5 && ['Fri', 'Sat', 'Sun'].includes(day) && Date.parse(l.end) > clock.now().getTime();
    });
    expect(wanted.length).toBeGreaterThan(2);
    expect(got).toHaveLength(wanted.length);
    got.forEach((e, i) => {
      // iCalendar DATE-TIME has whole seconds (RFC 5545 3.3.5); the search gives milliseconds.
      expect(Math.abs(e.start.getTime() - Date.parse(wanted[i]!.start))).toBeLessThan(1000);
      expect(Math.abs(e.end.getTime() - Date.parse(wanted[i]!.end))).toBeLessThan(1000);
      expect(e.summary).toBe('Lineup: Galactic Centre at Test ridge at 35 S');
      expect(e.uid).toMatch(new RegExp(`^watch-${active}-`));
      expect(typeof e.url === 'object' ? e.url.val : e.url).toMatch(new RegExp(`/sightlines/${sightline.id}\\?tab=night&night=\\d{4}-\\d{2}-\\d{2}$`));
    });
    // The same feed fetched again names the same events (stable UIDs for the calendar app).
    expect(events((await request(app).get(path)).text).map((e) => e.uid)).toEqual(got.map((e) => e.uid));

    const rotated = await agent.post('/api/calendar/feed/rotate');
    expect(rotated.status).toBe(200);
    const newUrl = rotated.body.feed.url as string;
    expect(newUrl).not.toBe(feed.url);
    expect((await request(app).get(path)).status).toBe(404);
    const fresh = await request(app).get(new URL(newUrl).pathname);
    expect(fresh.status).toBe(200);
    expect(events(fresh.text)).toHaveLength(wanted.length);
    expect((await agent.get('/api/calendar/feed')).body.feed.url).toBe(newUrl);
  }, 60_000);

  it('needs sign-in to see or rotate the address; keeps feeds apart; answers 404 for made-up secrets', async () => {
    expect((await request(app).get('/api/calendar/feed')).status).toBe(401);
    expect((await request(app).post('/api/calendar/feed/rotate')).status).toBe(401);
    const a = await signedInAgent(app, await createUser());
    const b = await signedInAgent(app, await createUser());
    const urlA = (await a.get('/api/calendar/feed')).body.feed.url as string;
    const urlB = (await b.get('/api/calendar/feed')).body.feed.url as string;
    expect(urlA).not.toBe(urlB);
    // A user with no watches gets a valid, empty calendar.
    const empty = await request(app).get(new URL(urlA).pathname);
    expect(empty.status).toBe(200);
    expect(events(empty.text)).toEqual([]);
    expect(empty.text).toMatch(/^BEGIN:VCALENDAR/);
    for (const bad of ['/api/calendar/short.ics', `/api/calendar/${'A'.repeat(43)}.ics`, `/api/calendar/${'A'.repeat(43)}`, '/api/calendar/..%2F..%2Fetc.ics']) {
      const res = await request(app).get(bad);
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('not_found');
    }
  });
});
