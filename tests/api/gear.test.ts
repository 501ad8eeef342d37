/**
 * Gear API: camera bodies, lenses and settings per user, against the real database.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import request from 'supertest';
import {
  cameraBodyResponseSchema,
  gearResponseSchema,
  gearSettingsResponseSchema,
  lensResponseSchema,
} from '../../shared/schemas/shot-plan';
import { SESSION_COOKIE } from '../../server/middleware/auth';
import { CameraBodyModel } from '../../server/models/camera-body';
import { GearSettingsModel } from '../../server/models/gear-settings';
import { LensModel } from '../../server/models/lens';
import type { UserModel } from '../../server/models/user';
import { seedDemoGear } from '../../server/seeders/demo-gear';
import { TokenService } from '../../server/services/token-service';
import { createTestContext, createUser, TEST_JWT_SECRET, uniqueEmail, type TestContext } from './helpers';

let ctx: TestContext;
let app: Express;
const tokens = new TokenService(TEST_JWT_SECRET, 1);

beforeAll(async () => {
  ctx = await createTestContext();
  app = ctx.app;
});
afterAll(async () => { await ctx.db.close(); });

/** Requests signed in as the user (a session cookie as the sign-in route would set it). */
function as(user: UserModel) {
  const cookie = `${SESSION_COOKIE}=${tokens.sign({ sub: user.id, role: user.role })}`;
  return {
    get: (path: string) => request(app).get(path).set('Cookie', cookie),
    post: (path: string, body: object) => request(app).post(path).set('Cookie', cookie).send(body),
    patch: (path: string, body: object) => request(app).patch(path).set('Cookie', cookie).send(body),
    put: (path: string, body: object) => request(app).put(path).set('Cookie', cookie).send(body),
    delete: (path: string) => request(app).delete(path).set('Cookie', cookie),
  };
}

const apsBody = { name: 'Travel body', sensorWidthMm: 23.5, sensorHeightMm: 15.6, widthPx: 6000 };
const fullFrameBody = { name: 'Night body', sensorWidthMm: 36, sensorHeightMm: 24, pixelPitchUm: 5.9 };
const prime = { name: 'Wide prime', focalLengthMm: 14, widestApertureF: 1.8 };
const zoom = { name: 'Everyday zoom', zoomMinMm: 24, zoomMaxMm: 70, widestApertureF: 2.8 };

describe('camera bodies and lenses: create, list, change, delete', () => {
  it('creates a body with its crop factor and pixel pitch derived, lists it, changes and deletes it', async () => {
    const user = await createUser('member', 'Gear Owner');
    const me = as(user);
    const created = await me.post('/api/gear/bodies', apsBody);
    expect(created.status).toBe(201);
    const { body } = cameraBodyResponseSchema.parse(created.body);
    expect(body).toMatchObject({ name: 'Travel body', sensorWidthMm: 23.5, sensorHeightMm: 15.6, widthPx: 6000, pixelPitchUm: null, megapixels: null });
    // Crop factor: 43.27 mm (the 36 x 24 mm diagonal) over sqrt(23.5^2 + 15.6^2) = 28.206 mm: 1.534
    // (computed by hand from the convention in shared/shotplan/gear.ts).
    expect(body.derived.cropFactor).toBeCloseTo(Math.hypot(36, 24) / Math.hypot(23.5, 15.6), 9);
    expect(body.derived.cropFactor).toBeCloseTo(1.534, 3);
    // Pixel pitch: 23.5 mm / 6000 px = 3.917 um (computed).
    expect(body.derived.pixelPitchUm).toBeCloseTo(3.917, 3);
    expect(body.derived.heightPx).toBe(Math.round((6000 * 15.6) / 23.5));

    const list = gearResponseSchema.parse((await me.get('/api/gear')).body);
    expect(list.bodies.map((b) => b.id)).toEqual([body.id]);
    expect(list.settings).toEqual({ starTrackerAvailable: false });

    // A new pixel pitch replaces the width in pixels (the pixel figures change together).
    const changed = await me.patch(`/api/gear/bodies/${body.id}`, { name: '  Travel body II ', pixelPitchUm: 3.76 });
    expect(changed.status).toBe(200);
    expect(changed.body.body).toMatchObject({ name: 'Travel body II', pixelPitchUm: 3.76, widthPx: null });
    expect(changed.body.body.derived.pixelPitchSource).toBe('pixel-pitch');

    expect((await me.delete(`/api/gear/bodies/${body.id}`)).status).toBe(204);
    expect(gearResponseSchema.parse((await me.get('/api/gear')).body).bodies).toEqual([]);
    expect((await me.delete(`/api/gear/bodies/${body.id}`)).status).toBe(404);
  });

  it('creates a prime and a zoom, lists lenses by focal length, turns a prime into a zoom and deletes', async () => {
    const me = as(await createUser('member', 'Lens Owner'));
    const z = lensResponseSchema.parse((await me.post('/api/gear/lenses', zoom)).body).lens;
    const p = lensResponseSchema.parse((await me.post('/api/gear/lenses', prime)).body).lens;
    expect(p.range).toEqual({ minMm: 14, maxMm: 14, isZoom: false });
    expect(z.range).toEqual({ minMm: 24, maxMm: 70, isZoom: true });
    const list = gearResponseSchema.parse((await me.get('/api/gear')).body);
    expect(list.lenses.map((l) => l.name)).toEqual(['Wide prime', 'Everyday zoom']);

    const turned = await me.patch(`/api/gear/lenses/${p.id}`, { zoomMinMm: 14, zoomMaxMm: 24 });
    expect(turned.status).toBe(200);
    expect(turned.body.lens).toMatchObject({ focalLengthMm: null, zoomMinMm: 14, zoomMaxMm: 24, range: { minMm: 14, maxMm: 24, isZoom: true } });
    expect((await me.delete(`/api/gear/lenses/${z.id}`)).status).toBe(204);
    expect(gearResponseSchema.parse((await me.get('/api/gear')).body).lenses.map((l) => l.id)).toEqual([p.id]);
  });

  it('keeps the star-tracker setting per user', async () => {
    const me = as(await createUser('member', 'Tracker Owner'));
    const saved = await me.put('/api/gear/settings', { starTrackerAvailable: true });
    expect(saved.status).toBe(200);
    expect(gearSettingsResponseSchema.parse(saved.body).settings).toEqual({ starTrackerAvailable: true });
    expect(gearResponseSchema.parse((await me.get('/api/gear')).body).settings.starTrackerAvailable).toBe(true);
    const other = as(await createUser('member', 'No Tracker'));
    expect(gearResponseSchema.parse((await other.get('/api/gear')).body).settings.starTrackerAvailable).toBe(false);
    const bad = await me.put('/api/gear/settings', { starTrackerAvailable: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.starTrackerAvailable).toMatch(/true or false/);
  });
});

describe('validation with field messages', () => {
  it.each([
    ['height above width', { ...fullFrameBody, sensorWidthMm: 24, sensorHeightMm: 36 }, 'sensorHeightMm', /long side/],
    ['no pixel figure', { name: 'Bare', sensorWidthMm: 36, sensorHeightMm: 24 }, 'pixelPitchUm', /pixel pitch, the image width in pixels or the megapixels/],
    ['pitch and pixel count disagree', { ...fullFrameBody, megapixels: 45 }, 'pixelPitchUm', /does not match the pixel count/],
    ['sensor too large', { ...fullFrameBody, sensorWidthMm: 150 }, 'sensorWidthMm', /between 1 and 100 mm/],
    ['a name missing', { ...fullFrameBody, name: '  ' }, 'name', /Name the camera body/],
    ['a width in pixels that is not whole', { ...apsBody, widthPx: 6000.5 }, 'widthPx', /whole number/],
  ])('refuses a body with %s', async (_what, input, field, message) => {
    const res = await as(await createUser()).post('/api/gear/bodies', input);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation');
    expect(res.body.error.fields[field]).toMatch(message);
  });

  it.each([
    ['a prime and a zoom at once', { ...prime, zoomMinMm: 10, zoomMaxMm: 20 }, 'focalLengthMm', /not both/],
    ['no focal length', { name: 'Mystery', widestApertureF: 2 }, 'focalLengthMm', /Give the focal length/],
    ['a zoom whose long end is not above its short end', { ...zoom, zoomMaxMm: 24 }, 'zoomMaxMm', /above the shortest/],
    ['an aperture beyond f/0.7', { ...prime, widestApertureF: 0.5 }, 'widestApertureF', /between 0.7 and 32/],
  ])('refuses a lens with %s', async (_what, input, field, message) => {
    const res = await as(await createUser()).post('/api/gear/lenses', input);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toMatch(message);
  });

  it('checks a changed body as a whole and refuses an empty change', async () => {
    const me = as(await createUser());
    const { body } = cameraBodyResponseSchema.parse((await me.post('/api/gear/bodies', fullFrameBody)).body);
    const taller = await me.patch(`/api/gear/bodies/${body.id}`, { sensorHeightMm: 40 });
    expect(taller.status).toBe(400);
    expect(taller.body.error.fields.sensorHeightMm).toMatch(/long side/);
    const empty = await me.patch(`/api/gear/bodies/${body.id}`, {});
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields._).toBe('Nothing to change');
    const unknown = await me.patch(`/api/gear/bodies/${body.id}`, { colour: 'black' });
    expect(unknown.status).toBe(400);
    expect((await me.patch('/api/gear/bodies/not-an-id', { name: 'x' })).body.error.fields.id).toBe('Not a valid id');
  });

  it('holds the bounds in the database too (CHECK constraints), whatever the code sends', async () => {
    const user = await createUser();
    await expect(CameraBodyModel.create({ ownerId: user.id, name: 'Tall', sensorWidthMm: 24, sensorHeightMm: 36, pixelPitchUm: 5, widthPx: null, megapixels: null }))
      .rejects.toThrow(/camera_bodies_sensor/);
    await expect(CameraBodyModel.create({ ownerId: user.id, name: 'No pixels', sensorWidthMm: 36, sensorHeightMm: 24, pixelPitchUm: null, widthPx: null, megapixels: null }))
      .rejects.toThrow(/camera_bodies_pixel_figure/);
    await expect(LensModel.create({ ownerId: user.id, name: 'Both', focalLengthMm: 24, zoomMinMm: 10, zoomMaxMm: 20, widestApertureF: 2 }))
      .rejects.toThrow(/lenses_prime_or_zoom/);
    await expect(LensModel.create({ ownerId: user.id, name: 'Fast', focalLengthMm: 24, zoomMinMm: null, zoomMaxMm: null, widestApertureF: 0.3 }))
      .rejects.toThrow(/lenses_widest_aperture/);
  });
});

describe('who sees which gear', () => {
  it('answers 401 signed out', async () => {
    expect((await request(app).get('/api/gear')).status).toBe(401);
    expect((await request(app).post('/api/gear/bodies').send(fullFrameBody)).status).toBe(401);
  });

  it('shows each user only their own gear and answers 404 for another user\'s', async () => {
    const alice = as(await createUser('member', 'Alice'));
    const bob = as(await createUser('member', 'Bob'));
    const { body } = cameraBodyResponseSchema.parse((await alice.post('/api/gear/bodies', fullFrameBody)).body);
    const { lens } = lensResponseSchema.parse((await alice.post('/api/gear/lenses', prime)).body);
    expect(gearResponseSchema.parse((await bob.get('/api/gear')).body)).toMatchObject({ bodies: [], lenses: [] });
    for (const res of [
      await bob.patch(`/api/gear/bodies/${body.id}`, { name: 'Mine now' }),
      await bob.delete(`/api/gear/bodies/${body.id}`),
      await bob.patch(`/api/gear/lenses/${lens.id}`, { widestApertureF: 4 }),
      await bob.delete(`/api/gear/lenses/${lens.id}`),
    ]) {
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('not_found');
    }
    // Still there, unchanged.
    const aliceGear = gearResponseSchema.parse((await alice.get('/api/gear')).body);
    expect(aliceGear.bodies[0]?.name).toBe('Night body');
    expect(aliceGear.lenses[0]?.widestApertureF).toBe(1.8);
  });

  it('deletes a user\'s gear with the account (ON DELETE CASCADE)', async () => {
    const user = await createUser();
    const me = as(user);
    await me.post('/api/gear/bodies', fullFrameBody);
    await me.post('/api/gear/lenses', prime);
    await me.put('/api/gear/settings', { starTrackerAvailable: true });
    await user.destroy();
    expect(await CameraBodyModel.count({ where: { ownerId: user.id } })).toBe(0);
    expect(await LensModel.count({ where: { ownerId: user.id } })).toBe(0);
    expect(await GearSettingsModel.count({ where: { userId: user.id } })).toBe(0);
  });
});

describe('names are unique per user', () => {
  it('answers 409 with a field message for a name the user already has, ignoring case and spaces', async () => {
    const me = as(await createUser());
    expect((await me.post('/api/gear/bodies', fullFrameBody)).status).toBe(201);
    const again = await me.post('/api/gear/bodies', { ...apsBody, name: ' NIGHT BODY ' });
    expect(again.status).toBe(409);
    expect(again.body.error).toMatchObject({ code: 'conflict', fields: { name: 'You already have a camera body named "NIGHT BODY"' } });
    const travel = cameraBodyResponseSchema.parse((await me.post('/api/gear/bodies', apsBody)).body).body;
    const rename = await me.patch(`/api/gear/bodies/${travel.id}`, { name: 'night body' });
    expect(rename.status).toBe(409);
    expect((await me.post('/api/gear/lenses', prime)).status).toBe(201);
    expect((await me.post('/api/gear/lenses', { ...prime, focalLengthMm: 20 })).status).toBe(409);
    // A body and a lens may share a name.
    expect((await me.post('/api/gear/lenses', { ...prime, name: 'Night body' })).status).toBe(201);
  });

  it('lets two users use the same name', async () => {
    expect((await as(await createUser()).post('/api/gear/bodies', fullFrameBody)).status).toBe(201);
    expect((await as(await createUser()).post('/api/gear/bodies', fullFrameBody)).status).toBe(201);
  });
});

describe('demo gear', () => {
  it('adds invented gear once for the accounts that exist, and again adds nothing', async () => {
    const email = uniqueEmail('demo-gear');
    const owner = await createUser('member', 'Demo Gear');
    await owner.update({ email });
    const gear = [
      { email, bodies: [fullFrameBody], lenses: [prime, zoom], starTrackerAvailable: true },
      { email: uniqueEmail('nobody'), bodies: [apsBody], lenses: [], starTrackerAvailable: false },
    ];
    expect(await seedDemoGear(ctx.db.sequelize, gear)).toBe(3);
    expect(await seedDemoGear(ctx.db.sequelize, gear)).toBe(0);
    const list = gearResponseSchema.parse((await as(owner).get('/api/gear')).body);
    expect(list.bodies.map((b) => b.name)).toEqual(['Night body']);
    expect(list.lenses.map((l) => l.name)).toEqual(['Wide prime', 'Everyday zoom']);
    expect(list.settings.starTrackerAvailable).toBe(true);
  });
});
