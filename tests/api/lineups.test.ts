import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { lineupSearchResponseSchema } from '../../shared/schemas/lineup';
import { targetHorizontal } from '../../shared/sky/positions';
import { searchLineups } from '../../shared/lineup';
import { lineupTideStatus, parseTideTimes } from '../../shared/tide';
import { demoTideLines } from '../../server/seeders/demo-tides';
import ical from 'node-ical';
import { SightlineModel } from '../../server/models/sightline';
import { createTestContext, createUser, signedInAgent, type TestContext } from './helpers';

let ctx: TestContext;
let agent: request.Agent;
beforeAll(async () => {
  ctx = await createTestContext();
  agent = await signedInAgent(ctx.app, await createUser());
});
afterAll(async () => { await ctx.db.close(); });

// A wide frame facing north over the galactic centre's winter-night path, 35 deg S.
const southSite = { lat: -35, lon: 149, elevationM: 10 };
const wideFrame = { azimuthDeg: 10, halfWidthDeg: 60, bottomAltDeg: 20, topAltDeg: 88 };

describe('POST /api/lineups/search', () => {
  it('finds June lineups of the galactic centre at 35 S, each inside the frame at its peak (checked with astronomy-engine)', async () => {
    const res = await agent.post('/api/lineups/search').send({
      frame: wideFrame, vantage: southSite, target: { id: 'galactic-centre' }, from: '2027-06-01', to: '2027-07-01',
    });
    expect(res.status).toBe(200);
    const body = lineupSearchResponseSchema.parse(res.body);
    expect(body.timezone).toBe('Australia/Sydney');
    expect(body.lineups.length).toBeGreaterThan(10); // most nights when the Moon is down: common practice, the core is high in June down south
    const starts = body.lineups.map((l) => Date.parse(l.start));
    expect([...starts].sort((a, b) => a - b)).toEqual(starts);
    for (const l of body.lineups) {
      expect(Date.parse(l.end)).toBeGreaterThan(Date.parse(l.start));
      expect(Date.parse(l.peak)).toBeGreaterThanOrEqual(Date.parse(l.start));
      expect(Date.parse(l.peak)).toBeLessThanOrEqual(Date.parse(l.end));
      // Independent check through astronomy-engine (shared/sky): the target really is in the frame at the peak.
      const at = targetHorizontal({ raHours: body.target.raHours, decDeg: body.target.decDeg }, southSite, new Date(l.peak), { refraction: true });
      expect(at.altitudeDeg).toBeGreaterThan(wideFrame.bottomAltDeg - 0.05);
      expect(at.altitudeDeg).toBeLessThan(wideFrame.topAltDeg + 0.05);
      expect(Math.abs(((at.azimuthDeg - wideFrame.azimuthDeg + 540) % 360) - 180)).toBeLessThan(wideFrame.halfWidthDeg + 0.05);
      expect(Math.abs(at.altitudeDeg - l.peakAltitudeDeg)).toBeLessThan(0.05);
      expect(l.score).toBeGreaterThan(0);
      expect(l.score).toBeLessThanOrEqual(1);
    }
  });

  it('finds nothing at 52 N between mid-November and January with the frame 5 deg up (common practice: the core is out of reach in winter)', async () => {
    const res = await agent.post('/api/lineups/search').send({
      frame: { azimuthDeg: 180, halfWidthDeg: 90, bottomAltDeg: 5, topAltDeg: 60 },
      vantage: { lat: 52, lon: -1, elevationM: 50 }, target: { id: 'galactic-centre' }, from: '2026-11-15', to: '2027-01-31',
    });
    expect(res.status).toBe(200);
    expect(res.body.lineups).toEqual([]);
  });

  it('takes a sightline of two pins instead of a frame, and a custom RA/Dec target', async () => {
    const res = await agent.post('/api/lineups/search').send({
      sightline: {
        vantage: { lat: -35.0, lon: 149.0, elevationM: 5 },
        landmark: { lat: -35.0031, lon: 148.9897, heightM: 40, widthM: 400 },
        bandHeightDeg: 40,
      },
      target: { raHours: 17.7611, decDeg: -29.0078, name: 'Sgr A* region' },
      from: '2027-06-01', to: '2027-06-15',
    });
    expect(res.status).toBe(200);
    // The landmark lies west-south-west: the galactic centre sinks into that frame before dawn in June.
    expect(res.body.frame.azimuthDeg).toBeGreaterThan(245);
    expect(res.body.frame.azimuthDeg).toBeLessThan(255);
    expect(res.body.lineups.length).toBeGreaterThan(3);
    expect(res.body.target.name).toBe('Sgr A* region');
    expect(Array.isArray(res.body.lineups)).toBe(true);
  });

  it('stores each site-year of dark windows once: a repeated search adds no cache rows', async () => {
    const count = async () => ((await ctx.db.sequelize.query('SELECT count(*)::int AS n FROM dark_window_cache', { plain: true })) as { n: number }).n;
    const body = { frame: wideFrame, vantage: { lat: -33.5, lon: 151.2 }, target: { id: 'm8' }, from: '2027-03-01', to: '2028-02-01' };
    const before = await count();
    expect((await agent.post('/api/lineups/search').send(body)).status).toBe(200);
    const afterFirst = await count();
    expect(afterFirst - before).toBe(2); // 2027 and 2028
    const again = await agent.post('/api/lineups/search').send({ ...body, target: { id: 'm42' } });
    expect(again.status).toBe(200);
    expect(await count()).toBe(afterFirst);
  });

  it('answers a repeated identical search from its cache with the same lineups, as JSON with its own computeMs', async () => {
    const body = { frame: wideFrame, vantage: { lat: -34.2, lon: 150.1 }, target: { id: 'm8' }, from: '2027-05-01', to: '2027-06-01' };
    const first = await agent.post('/api/lineups/search').send(body);
    const second = await agent.post('/api/lineups/search').send(body);
    expect(second.status).toBe(200);
    expect(second.headers['content-type']).toMatch(/application\/json/);
    const a = lineupSearchResponseSchema.parse(first.body);
    const b = lineupSearchResponseSchema.parse(second.body);
    expect(b.lineups).toEqual(a.lineups);
    expect(b.lineups.length).toBeGreaterThan(0);
    expect(b.computeMs).toBeGreaterThanOrEqual(0);
  });

  it('runs a multi-year search on the worker pool with the same result as the engine called directly', async () => {
    const body = { frame: wideFrame, vantage: southSite, target: { id: 'galactic-centre' }, from: '2027-01-01', to: '2029-12-31' };
    const res = await agent.post('/api/lineups/search').send(body);
    expect(res.status).toBe(200);
    const direct = searchLineups(wideFrame, southSite, { raHours: res.body.target.raHours, decDeg: res.body.target.decDeg }, new Date('2027-01-01T00:00:00Z'), new Date('2029-12-31T00:00:00Z'));
    expect(res.body.lineups.length).toBe(direct.length);
    expect(res.body.lineups.length).toBeGreaterThan(200);
    // Cached dark windows are computed on a 0.01 deg grid, so boundaries agree to seconds, not exactly.
    res.body.lineups.forEach((l: { start: string }, i: number) => {
      expect(Math.abs(Date.parse(l.start) - direct[i]!.start.getTime())).toBeLessThan(60_000);
    });
  });

  it.each([
    [{ vantage: { lat: 95, lon: 0 } }, 'vantage.lat'],
    [{ vantage: { lat: 'NaN', lon: 0 } }, 'vantage.lat'],
    [{ from: '2027-07-01', to: '2027-06-01' }, 'to'],
    [{ from: '2027-01-01', to: '2037-06-01' }, 'to'],
    [{ from: 'next tuesday' }, 'from'],
    [{ from: '2027-02-30' }, 'from'],
    [{ from: '1850-06-01' }, 'from'],
    [{ target: { id: 'no-such-thing' } }, 'target'],
    [{ frame: undefined }, 'frame'],
    [{ frame: { ...wideFrame, topAltDeg: 10 } }, 'frame.topAltDeg'],
    [{ conditions: { moon: { maxIllumination: 2 } } }, 'conditions.moon'],
  ])('answers 400 with a field message for %j', async (change, field) => {
    const base = { frame: wideFrame, vantage: southSite, target: { id: 'galactic-centre' }, from: '2027-06-01', to: '2027-07-01' };
    const res = await agent.post('/api/lineups/search').send({ ...base, ...change });
    expect(res.status).toBe(400);
    const keys = Object.keys(res.body.error.fields);
    expect(keys.some((k) => k === field || k.startsWith(`${field}.`))).toBe(true);
  });

  it('needs a signed-in user', async () => {
    expect((await request(ctx.app).post('/api/lineups/search').send({})).status).toBe(401);
  });
});

describe('search input the engine refuses', () => {
  const farAway = { lat: 50.6045, lon: -1.957, heightM: 30, widthM: 12 };
  it.each([
    ['the vantage and the landmark coincide', { sightline: { vantage: { lat: -35, lon: 149 }, landmark: { lat: -35, lon: 149, heightM: 30 } } }],
    ['the landmark is half a world away', { sightline: { vantage: { lat: -35, lon: 149 }, landmark: farAway } }],
  ])('answers 400 JSON, not 500, when %s', async (_situation, geometry) => {
    const res = await agent.post('/api/lineups/search').send({ ...geometry, target: { id: 'galactic-centre' }, from: '2027-06-01', to: '2027-07-01' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation');
  });

  it('refuses to save such pins, and answers 400 for a sightline stored with them earlier, on search and on next-lineups', async () => {
    const refused = await agent.post('/api/sightlines').send({ name: 'Pins apart', vantage: { lat: -35, lon: 149 }, landmark: farAway });
    expect(refused.status).toBe(400);
    const created = await agent.post('/api/sightlines').send({ name: 'Pins apart', vantage: { lat: -35, lon: 149 }, landmark: { lat: -35.001, lon: 149.001 } });
    expect(created.status).toBe(201);
    const id = created.body.sightline.id as string;
    // A row saved before the distance rule existed.
    await SightlineModel.update({ landmarkLat: farAway.lat, landmarkLon: farAway.lon }, { where: { id } });
    const res = await agent.post('/api/lineups/search').send({ sightlineId: id, target: { id: 'galactic-centre' }, from: '2027-06-01', to: '2027-07-01' });
    expect(res.status).toBe(400);
    expect((await agent.get(`/api/sightlines/${id}/next-lineups`)).status).toBe(400);
  });

  // Date.UTC reads years 0..99 as 1900..1999, so such a range must be refused before any dark windows are cached.
  it.each(['0000-06-01', '0050-06-01'])('answers 400 for a range starting in the year of %s, outside the engine span 1900..2200', async (from) => {
    const res = await agent.post('/api/lineups/search').send({
      frame: wideFrame, vantage: southSite, target: { id: 'galactic-centre' }, from, to: from.replace(/-06-/, '-07-'),
    });
    expect(res.status).toBe(400);
    // The schema refuses it beside the field.
    expect(res.body.error.fields.from).toMatch(/1900/);
  });
});

describe('lineups of a saved sightline with a tide rule', () => {
  it('carry the tide status that the tide times give for each lineup', async () => {
    const owner = await createUser();
    const me = await signedInAgent(ctx.app, owner);
    const created = await me.post('/api/sightlines').send({
      name: 'Platform below the cliff',
      vantage: { lat: -35.0, lon: 149.0, elevationM: 5 },
      landmark: { lat: -35.0031, lon: 148.9897, heightM: 40, widthM: 400 },
      bandHeightDeg: 40,
    });
    const id = created.body.sightline.id as string;
    const rule = { mode: 'except-around-high', hoursBefore: 2, hoursAfter: 2 } as const;
    await me.put(`/api/sightlines/${id}/tide-rule`).send({ rule });
    // Invented tide times (test data only) for the whole range, in the site's zone.
    const text = demoTideLines({ startDate: '2027-05-30', days: 20, timeZone: 'Australia/Sydney', firstLowMinutes: 60, meanRangeM: 1.8 }).join('\n');
    expect((await me.post(`/api/sightlines/${id}/tide-times`).send({ text })).status).toBe(200);

    const res = await me.post('/api/lineups/search').send({ sightlineId: id, target: { id: 'galactic-centre' }, from: '2027-06-01', to: '2027-06-15' });
    expect(res.status).toBe(200);
    const { lineups } = lineupSearchResponseSchema.parse(res.body);
    expect(lineups.length).toBeGreaterThan(5);
    const events = parseTideTimes(text, 'Australia/Sydney').events;
    for (const l of lineups) {
      expect(l.tideStatus).toBe(lineupTideStatus(rule, events, new Date(l.start), new Date(l.end)).status);
    }
    const statuses = new Set(lineups.map((l) => l.tideStatus));
    expect(statuses.has('reachable') || statuses.has('cut-off')).toBe(true);

    // Another member cannot search on this sightline.
    const other = await signedInAgent(ctx.app, await createUser());
    expect((await other.post('/api/lineups/search').send({ sightlineId: id, target: { id: 'galactic-centre' }, from: '2027-06-01', to: '2027-06-15' })).status).toBe(404);
  });
});

describe('POST /api/lineups/export', () => {
  const body = { frame: wideFrame, vantage: southSite, target: { id: 'galactic-centre' }, from: '2027-06-01', to: '2027-06-20' };

  it('gives an iCalendar file that an iCalendar parser reads back with one event per lineup', async () => {
    const search = await agent.post('/api/lineups/search').send(body);
    const res = await agent.post('/api/lineups/export?format=ics').send(body).buffer(true).parse((r, cb) => {
      let text = ''; r.on('data', (c: Buffer) => { text += c.toString(); }); r.on('end', () => cb(null, text));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/calendar/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="?gnomon-galactic-centre-lineups\.ics"?/);
    // node-ical, a general iCalendar parser from the registry, checks the file independently.
    const parsed = ical.sync.parseICS(res.body as string);
    const events = Object.values(parsed).filter((e) => e.type === 'VEVENT') as Array<{ start: Date; end: Date; summary: string }>;
    expect(events).toHaveLength(search.body.lineups.length);
    const starts = events.map((e) => e.start.toISOString()).sort();
    expect(starts).toEqual(search.body.lineups.map((l: { start: string }) => l.start.replace(/\.\d{3}Z$/, '.000Z')).sort());
    expect(events[0]!.summary).toMatch(/Galactic centre/i);
  });

  it('gives CSV with a header and one quoted-as-needed row per lineup, local times in the site zone', async () => {
    const search = await agent.post('/api/lineups/search').send(body);
    const res = await agent.post('/api/lineups/export?format=csv').send(body);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const lines = (res.text as string).trim().split('\r\n');
    expect(lines[0]).toMatch(/^night,start_local,end_local,peak_local,timezone,/);
    expect(lines).toHaveLength(search.body.lineups.length + 1);
    expect(lines[1]).toContain('Australia/Sydney');
    expect(lines[1]).toMatch(/AEST/);
  });

  it('refuses an unknown format', async () => {
    const res = await agent.post('/api/lineups/export?format=pdf').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.fields.format).toBeTruthy();
  });
});

describe('GET /api/sightlines/:id/next-lineups', () => {
  it('gives the next good lineups of a saved sightline, starting now, at most the count asked for', async () => {
    const owner = await createUser();
    const me = await signedInAgent(ctx.app, owner);
    const created = await me.post('/api/sightlines').send({
      name: 'Wide southern frame',
      vantage: { lat: -35.0, lon: 149.0, elevationM: 5 },
      landmark: { lat: -35.0031, lon: 148.9897, heightM: 40, widthM: 400 },
      bandHeightDeg: 40,
    });
    const id = created.body.sightline.id as string;
    const res = await me.get(`/api/sightlines/${id}/next-lineups?count=2`);
    expect(res.status).toBe(200);
    const { lineups } = lineupSearchResponseSchema.parse(res.body);
    expect(lineups.length).toBeLessThanOrEqual(2);
    expect(lineups.length).toBeGreaterThan(0); // the galactic centre sets into a west-south-west frame every year
    for (const l of lineups) {
      expect(Date.parse(l.end)).toBeGreaterThan(Date.now() - 60_000);
      expect(l.score).toBeGreaterThanOrEqual(0.3);
    }
    expect((await me.get(`/api/sightlines/${id}/next-lineups?target=nope`)).status).toBe(400);
    const other = await signedInAgent(ctx.app, await createUser());
    expect((await other.get(`/api/sightlines/${id}/next-lineups`)).status).toBe(404);
  });
});
