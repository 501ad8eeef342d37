/**
 * Shot plan and shot card API: POST /api/sightlines/:id/shot-plan and /shot-card?format=html|pdf
 * on a fixed lineup, against the real database.
 * The real app, with its clock set to 2027-04-20 12:00 UTC.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import { SESSION_COOKIE } from '../../server/middleware/auth';
import { DateTime } from 'luxon';
import { PDFParse } from 'pdf-parse';
import { shotPlanResponseSchema, type ShotPlan } from '../../shared/schemas/shot-plan';
import { CrewMemberModel } from '../../server/models/crew-member';
import type { UserModel } from '../../server/models/user';
import { FieldNoteService } from '../../server/services/field-note-service';
import { GearService } from '../../server/services/gear-service';
import { SightlineService } from '../../server/services/sightline-service';
import { TideService } from '../../server/services/tide-service';
import { TokenService } from '../../server/services/token-service';
import { createTestApp, createTestContext, createUser, TEST_JWT_SECRET, type TestContext } from './helpers';

let ctx: TestContext;
let app: Express;
let sightlines: SightlineService;
let tides: TideService;
let gear: GearService;
const tokens = new TokenService(TEST_JWT_SECRET, 1);

beforeAll(async () => {
  ctx = await createTestContext();
  sightlines = new SightlineService();
  tides = new TideService(ctx.db.sequelize, sightlines);
  gear = new GearService(ctx.db.sequelize);
  app = createTestApp(ctx.db, {}, { clock: () => new Date('2027-04-20T12:00:00Z') }).app;
});
afterAll(async () => { await ctx.db.close(); });

const cookieOf = (user: UserModel) => `${SESSION_COOKIE}=${tokens.sign({ sub: user.id, role: user.role })}`;

/**
 * An invented sightline on a real coastline (50.58 N, 4.91 W: Europe/London, BST = UTC+1 in May)
 * and one of its galactic-centre lineups as the lineup search (shared/lineup) finds it for the
 * night of 30 April 2027, to the second.
 */
const SITE_NAME = 'Shot card test stack';
const sightlineInput = {
  name: SITE_NAME,
  vantage: { lat: 50.5755, lon: -4.9115, elevationM: 3, cameraHeightM: 1.5 },
  landmark: { lat: 50.5712, lon: -4.9085, baseElevationM: 0, heightM: 38, widthM: 60 },
  bandHeightDeg: 20,
  targetId: 'galactic-centre',
};
const LINEUP = { start: '2027-05-01T01:26:34Z', peak: '2027-05-01T01:43:56Z', end: '2027-05-01T01:57:39Z' };
const ZONE = 'Europe/London';

/** Invented tide times (local time): low water at 01:35 BST, so an around-low rule of 2.5 h / 2 h cuts the cove off at 03:35 BST. */
const TIDE_PASTE = ['2027-04-30 19:20 H 4.9', '2027-05-01 01:35 L 0.7', '2027-05-01 07:50 H 5.0', '2027-05-01 14:05 L 0.6'].join('\n');

/** 'HH:mm' in the site's zone, rounded to the nearest minute (luxon on the IANA time zone database). */
function siteClock(iso: string): string {
  const ms = Math.round(Date.parse(iso) / 60_000) * 60_000;
  return DateTime.fromMillis(ms, { zone: ZONE }).toFormat('HH:mm');
}

async function fixture() {
  const owner = await createUser('member', 'Shot Planner');
  const saved = await sightlines.create(owner, sightlineInput);
  await tides.setRule(owner, saved.id, { mode: 'around-low', hoursBefore: 2.5, hoursAfter: 2 });
  await tides.paste(owner, saved.id, TIDE_PASTE);
  await new FieldNoteService(sightlines).create(owner, saved.id, { kind: 'hazard', body: 'The incoming tide fills the cove from the north side first.' });
  const body = await gear.createBody(owner, { name: 'Night body', sensorWidthMm: 36, sensorHeightMm: 24, pixelPitchUm: 5.9 });
  const lens = await gear.createLens(owner, { name: 'Wide zoom', zoomMinMm: 14, zoomMaxMm: 24, widestApertureF: 2.8 });
  return { owner, sightlineId: saved.id, bodyId: body.id, lensId: lens.id, cookie: cookieOf(owner) };
}

type Fixture = Awaited<ReturnType<typeof fixture>>;
let f: Fixture;
beforeAll(async () => { f = await fixture(); });

function planBody(extra: Record<string, unknown> = {}) {
  return { lineup: LINEUP, bodyId: f.bodyId, lensId: f.lensId, focalLengthMm: 24, ...extra };
}

async function postPlan(extra: Record<string, unknown> = {}, cookie = f.cookie, sightlineId = f.sightlineId) {
  return request(app).post(`/api/sightlines/${sightlineId}/shot-plan`).set('Cookie', cookie).send(planBody(extra));
}

/** supertest body parser that keeps the raw bytes. */
function binary(res: request.Response, callback: (error: Error | null, body: Buffer) => void): void {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => callback(null, Buffer.concat(chunks)));
}

describe('POST /api/sightlines/:id/shot-plan on a fixed lineup', () => {
  let plan: ShotPlan;
  beforeAll(async () => {
    const res = await postPlan();
    expect(res.status).toBe(200);
    plan = shotPlanResponseSchema.parse(res.body).plan;
  });

  it('gives the field of view from the pinhole formula: 14 mm on 36 x 24 mm is 104.3 deg across', async () => {
    const res = await postPlan({ focalLengthMm: 14 });
    const wide = shotPlanResponseSchema.parse(res.body).plan;
    // Pinhole model (Hartley & Zisserman, Multiple View Geometry, ch. 6): 2 atan(36 / (2 x 14)) = 104.25 deg.
    const expected = (2 * Math.atan(36 / (2 * 14)) * 180) / Math.PI;
    expect(wide.framing.fov.horizontalDeg).toBeCloseTo(expected, 9);
    expect(Number(wide.framing.fov.horizontalDeg.toFixed(1))).toBe(104.3);
    // computed: 2 atan(24 / 28) = 81.2 deg up, 2 atan(43.27 / 28) = 114.2 deg along the diagonal.
    expect(Number(wide.framing.fov.verticalDeg.toFixed(1))).toBe(81.2);
    expect(Number(wide.framing.fov.diagonalDeg.toFixed(1))).toBe(114.2);
    expect(wide.gear).toMatchObject({ focalLengthMm: 14, fNumber: 2.8, tracked: false });
  });

  it('shows the 500 rule and the NPF rule side by side for 24 mm, f/2.8 and 5.9 um', () => {
    // ../shared/REFERENCES.md, rules of thumb: 500 / 24 = 20.8 s (common practice) and the NPF
    // rule (F. Michaud, 2016) (35 x 2.8 + 30 x 5.9) / 24 = 11.5 s.
    expect(Number(plan.exposure.untracked.rule500S.toFixed(1))).toBe(20.8);
    expect(Number(plan.exposure.untracked.npfSimpleS.toFixed(1))).toBe(11.5);
    expect(plan.exposure.untracked.npfFullS).not.toBeNull();
  });

  it('orders the night\'s events in time, with the tide cut-off from the stored tide times', () => {
    const times = plan.timeline.events.map((e) => Date.parse(e.at));
    expect([...times].sort((a, b) => a - b)).toEqual(times);
    const kinds = plan.timeline.events.map((e) => e.kind);
    for (const [a, b] of [['astronomical-dusk', 'lineup-start'], ['lineup-start', 'lineup-peak'], ['lineup-peak', 'lineup-end'], ['lineup-end', 'tide-cut-off']]) {
      expect(kinds.indexOf(a!)).toBeLessThan(kinds.indexOf(b!));
    }
    // The tide rule worked by hand: low water 01:35 BST (00:35 UTC) + 2 h = 02:35 UTC.
    expect(plan.tide).toEqual({ status: 'reachable', cutOffAt: '2027-05-01T02:35:00.000Z' });
    expect(plan.timeline.events.find((e) => e.kind === 'tide-cut-off')?.at).toBe('2027-05-01T02:35:00.000Z');
    expect(plan.cautions[0]).toBe('The tide cuts the spot off from 2027-05-01 03:35 BST: leave before then.');
    expect(plan.fieldNotes).toEqual([{ kind: 'hazard', body: 'The incoming tide fills the cove from the north side first.' }]);
    // Blocks follow one another, the first at the lineup start.
    expect(plan.timeline.blocks[0]?.start).toBe('2027-05-01T01:26:34.000Z');
    for (let i = 1; i < plan.timeline.blocks.length; i++) {
      expect(Date.parse(plan.timeline.blocks[i]!.start)).toBeGreaterThanOrEqual(Date.parse(plan.timeline.blocks[i - 1]!.end));
    }
  });

  it('warns when a block runs past a deadline', async () => {
    const res = await postPlan({ tracked: true, sky: { subExposureS: 120, totalIntegrationS: 3600 } });
    const late = shotPlanResponseSchema.parse(res.body).plan;
    expect(late.timeline.warnings.map((w) => [w.blockLabel, w.deadline])).toEqual([['Sky stack (tracked)', 'lineup-end']]);
    expect(late.exposure.sky.fits).toBe(false);
  });

  it('lets a crew viewer plan with their own gear', async () => {
    const viewer = await createUser('member', 'Crew Viewer');
    await CrewMemberModel.create({ sightlineId: f.sightlineId, userId: viewer.id, role: 'viewer' });
    const body = await gear.createBody(viewer, { name: 'Viewer body', sensorWidthMm: 23.5, sensorHeightMm: 15.6, widthPx: 6000 });
    const lens = await gear.createLens(viewer, { name: 'Viewer lens', focalLengthMm: 16, widestApertureF: 2 });
    const res = await postPlan({ bodyId: body.id, lensId: lens.id, focalLengthMm: undefined }, cookieOf(viewer));
    expect(res.status).toBe(200);
    expect(res.body.plan.gear).toMatchObject({ focalLengthMm: 16, fNumber: 2 });
  });
});

describe('who may plan, and what is refused', () => {
  it('answers 401 signed out and 404 for a sightline the user cannot read', async () => {
    expect((await request(app).post(`/api/sightlines/${f.sightlineId}/shot-plan`).send(planBody())).status).toBe(401);
    const outsider = await createUser('member', 'Outsider');
    const res = await postPlan({}, cookieOf(outsider));
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('No such sightline');
  });

  it('answers 404 for another user\'s body or lens', async () => {
    const other = await createUser('member', 'Other Owner');
    const body = await gear.createBody(other, { name: 'Not yours', sensorWidthMm: 36, sensorHeightMm: 24, pixelPitchUm: 4.4 });
    const lens = await gear.createLens(other, { name: 'Not yours either', focalLengthMm: 20, widestApertureF: 1.8 });
    const a = await postPlan({ bodyId: body.id });
    expect(a.status).toBe(404);
    expect(a.body.error.message).toBe('No such camera body in your gear');
    const b = await postPlan({ lensId: lens.id, focalLengthMm: 20 });
    expect(b.status).toBe(404);
    expect(b.body.error.message).toBe('No such lens in your gear');
  });

  it.each([
    [{ lineup: { ...LINEUP, end: '2027-05-01T01:00:00Z' } }, 'lineup.end', /end after it starts/],
    [{ lineup: { ...LINEUP, peak: '2027-05-01T03:00:00Z' } }, 'lineup.peak', /between the start and the end/],
    [{ lineup: { ...LINEUP, start: 'tonight' } }, 'lineup.start', /ISO date-time/],
    [{ focalLengthMm: 35 }, 'focalLengthMm', /zooms from 14 to 24 mm/],
    [{ fNumber: 2 }, 'fNumber', /opens to f\/2.8 at most/],
    [{ bodyId: 'my camera' }, 'bodyId', /Choose a camera body/],
    [{ panorama: { overlap: 0.95 } }, 'panorama.overlap', /0 to 0.9/],
    [{ target: { id: 'no-such-thing' } }, 'target', /target/i],
    [{ extra: true }, '_', /extra/],
  ])('refuses %j with a field message', async (extra, field, message) => {
    const res = await postPlan(extra);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation');
    const fields = res.body.error.fields as Record<string, string>;
    const key = Object.keys(fields).find((k) => k === field || k.startsWith(`${field}.`)) ?? field;
    expect(fields[key]).toMatch(message);
  });
});

describe('POST /api/sightlines/:id/shot-card', () => {
  it('renders a phone-friendly HTML page with the times in the site\'s zone', async () => {
    const res = await request(app).post(`/api/sightlines/${f.sightlineId}/shot-card?format=html`).set('Cookie', f.cookie).send(planBody());
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    const html = res.text;
    expect(html).toContain('<meta name="viewport"');
    expect(html).not.toContain('<script');
    expect(html).toContain(SITE_NAME);
    // 01:26:34 UTC is 02:27 BST (rounded to the minute), 01:57:39 UTC is 02:58 BST.
    expect(siteClock(LINEUP.start)).toBe('02:27');
    expect(html).toContain(`Lineup ${siteClock(LINEUP.start)}–${siteClock(LINEUP.end)} BST, peak ${siteClock(LINEUP.peak)} BST`);
    expect(html).toContain(`<th scope="row">Lineup starts</th><td>${siteClock(LINEUP.start)} BST</td>`);
    expect(html).toContain('Europe/London (BST)');
    expect(html).toContain('A plan, not a promise');
    expect(html).toMatch(/Tide times are predictions/);
    // The map snippet is inline SVG, no tiles.
    expect(html).toMatch(/<svg class="bearing"/);
    expect(html).not.toMatch(/https?:\/\//);
  });

  it('renders a one-page PDF whose text has the site, the lineup times in its zone and the exposure figures', async () => {
    const res = await request(app)
      .post(`/api/sightlines/${f.sightlineId}/shot-card?format=pdf`)
      .set('Cookie', f.cookie)
      .send(planBody())
      .buffer(true)
      .parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toBe('attachment; filename="shot-card-shot-card-test-stack-2027-04-30.pdf"');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    // pdf-parse (a PDF text extractor from the registry) reads the text back.
    const parser = new PDFParse({ data: new Uint8Array(pdf) });
    const { text, total } = await parser.getText();
    await parser.destroy();
    expect(total).toBe(1);
    expect(text).toContain(SITE_NAME);
    expect(text).toContain(`Lineup ${siteClock(LINEUP.start)}–${siteClock(LINEUP.end)} BST`);
    expect(text).toContain('Europe/London (BST)');
    // ../shared/REFERENCES.md: 20.8 s (500 rule, common practice) and 11.5 s (NPF, F. Michaud 2016).
    expect(text).toMatch(/500 rule\s+20\.8 s/);
    expect(text).toMatch(/NPF rule\s+11\.5 s/);
    expect(text).toContain('03:35 BST');
    expect(text).toContain('A plan, not a promise');
  });

  it('refuses an unknown format', async () => {
    const res = await request(app).post(`/api/sightlines/${f.sightlineId}/shot-card?format=docx`).set('Cookie', f.cookie).send(planBody());
    expect(res.status).toBe(400);
    expect(res.body.error.fields.format).toBe('Ask for format html or pdf');
  });
});
