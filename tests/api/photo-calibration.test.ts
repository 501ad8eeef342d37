import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import geodesicModule from 'geographiclib-geodesic';
import { photoResponseSchema, type Photo } from '../../shared/schemas/photo';
import { sightlineResponseSchema } from '../../shared/schemas/sightline';
import { skyToPixel } from '../../shared/projection';
import { createTestContext, createUser, signedInAgent, type TestContext } from './helpers';

const { Geodesic } = geodesicModule;

let ctx: TestContext;
let photoDir: string;
beforeAll(async () => {
  photoDir = mkdtempSync(join(tmpdir(), 'gnomon-test-calibration-'));
  ctx = await createTestContext({ PHOTO_DIR: photoDir });
});
afterAll(async () => {
  await ctx.db.close();
  rmSync(photoDir, { recursive: true, force: true });
});

// Invented pins: a 30 m stack about 690 m from the vantage.
const vantage = { lat: 50.6001, lon: -1.9502, elevationM: 4, cameraHeightM: 1.6 };
const landmark = { lat: 50.6045, lon: -1.9570, baseElevationM: 0, heightM: 30, widthM: 12 };
const WIDTH = 600;
const HEIGHT = 400;

async function photoOnSightline() {
  const owner = await createUser('member', 'Calibrating Owner');
  const agent = await signedInAgent(ctx.app, owner);
  const created = await agent.post('/api/sightlines').send({ name: 'Calibration stack', vantage, landmark });
  expect(created.status).toBe(201);
  const sightline = sightlineResponseSchema.parse(created.body).sightline;
  const jpeg = await sharp({ create: { width: WIDTH, height: HEIGHT, channels: 3, background: '#556677' } }).jpeg().toBuffer();
  const uploaded = await agent.post(`/api/sightlines/${sightline.id}/photos`).attach('photo', jpeg, { filename: 'day.jpg', contentType: 'image/jpeg' });
  expect(uploaded.status).toBe(201);
  return { owner, agent, sightline, photo: photoResponseSchema.parse(uploaded.body).photo };
}

/** The landmark top's direction worked out here from a reference library and the textbook formula. */
function expectedLandmarkDirection() {
  // Bearing and distance from GeographicLib (WGS84), an outside reference library.
  const line = Geodesic.WGS84.Inverse(vantage.lat, vantage.lon, landmark.lat, landmark.lon);
  const d = line.s12!;
  // Drop = d^2 / 2R (1 - k), R = 6371 km, k = 0.13 (common survey value, ../shared/REFERENCES.md).
  const drop = (d * d) / (2 * 6_371_000) * (1 - 0.13);
  const eye = vantage.elevationM + vantage.cameraHeightM;
  const top = landmark.baseElevationM + landmark.heightM;
  return { azimuthDeg: (line.azi1! + 360) % 360, altitudeDeg: (Math.atan2(top - drop - eye, d) * 180) / Math.PI };
}

describe('photo calibration', () => {
  it('a click at the image centre points the camera at the landmark top; the pose is saved and read back', async () => {
    const { agent, photo } = await photoOnSightline();
    const res = await agent.put(`/api/photos/${photo.id}/calibration`).send({
      landmarkTopPx: { x: WIDTH / 2, y: HEIGHT / 2 },
      fov: { kind: 'focal', focalLengthMm: 24, sensorWidthMm: 36 },
    });
    expect(res.status).toBe(200);
    const calibration = photoResponseSchema.parse(res.body).photo.calibration!;
    const expected = expectedLandmarkDirection();
    expect(calibration.landmark.azimuthDeg).toBeCloseTo(expected.azimuthDeg, 6);
    expect(calibration.landmark.altitudeDeg).toBeCloseTo(expected.altitudeDeg, 6);
    expect(calibration.pose.azimuthDeg).toBeCloseTo(expected.azimuthDeg, 6);
    expect(calibration.pose.altitudeDeg).toBeCloseTo(expected.altitudeDeg, 6);
    expect(calibration.pose.rollDeg).toBe(0);
    // Pinhole camera: horizontal FOV = 2 atan(w / 2f) (e.g. Hartley & Zisserman, Multiple View
    // Geometry, ch. 6); 36 mm / 24 mm gives 2 atan(0.75) = 73.740 deg (computed).
    expect(calibration.pose.horizontalFovDeg).toBeCloseTo(73.740, 3);
    expect(calibration.pose.widthPx).toBe(WIDTH);
    expect(calibration.pose.heightPx).toBe(HEIGHT);
    expect(calibration.residualPx).toBeLessThan(1e-6);

    const listed = await agent.get(`/api/sightlines/${photo.sightlineId}/photos`);
    expect((listed.body.photos as Photo[])[0]?.calibration?.pose.azimuthDeg).toBeCloseTo(expected.azimuthDeg, 6);
  });

  it('an off-centre click with a tilted horizon: the landmark projects back to the click and the roll follows the horizon', async () => {
    const { agent, photo } = await photoOnSightline();
    const click = { x: 410, y: 150 };
    const res = await agent.put(`/api/photos/${photo.id}/calibration`).send({
      landmarkTopPx: click,
      fov: { kind: 'equivalent35', focal35Mm: 35 },
      // The horizon rises 20 px over 400 px to the right: roll atan(20 / 400) = 2.862 deg (computed).
      horizonPx: [{ x: 100, y: 300 }, { x: 500, y: 280 }],
    });
    expect(res.status).toBe(200);
    const calibration = photoResponseSchema.parse(res.body).photo.calibration!;
    expect(calibration.pose.rollDeg).toBeCloseTo((Math.atan(20 / 400) * 180) / Math.PI, 6);
    // 35 mm-equivalent: 2 atan(36 / 70) = 54.432 deg (computed from the pinhole formula).
    expect(calibration.pose.horizontalFovDeg).toBeCloseTo(54.432, 3);
    const back = skyToPixel(calibration.pose, expectedLandmarkDirection());
    expect(back.x).toBeCloseTo(click.x, 3);
    expect(back.y).toBeCloseTo(click.y, 3);
  });

  it('refuses clicks outside the photo, a lens outside 1-179 deg, coinciding horizon points and a bad shape, each with a field message', async () => {
    const { agent, photo } = await photoOnSightline();
    const put = (body: unknown) => agent.put(`/api/photos/${photo.id}/calibration`).send(body as object);
    const lens = { kind: 'focal', focalLengthMm: 24, sensorWidthMm: 36 };

    const outside = await put({ landmarkTopPx: { x: WIDTH + 1, y: 10 }, fov: lens });
    expect(outside.status).toBe(400);
    expect(outside.body.error.fields.landmarkTopPx).toMatch(/inside the 600 x 400 px photo/);

    // 0.01 mm on a 36 mm sensor: 2 atan(1800) = 179.94 deg, past what a rectilinear model draws.
    const fisheye = await put({ landmarkTopPx: { x: 10, y: 10 }, fov: { kind: 'focal', focalLengthMm: 0.01, sensorWidthMm: 36 } });
    expect(fisheye.status).toBe(400);
    expect(fisheye.body.error.fields['fov.focalLengthMm']).toMatch(/field of view/);

    const sameHorizon = await put({ landmarkTopPx: { x: 10, y: 10 }, fov: lens, horizonPx: [{ x: 50, y: 50 }, { x: 50, y: 50 }] });
    expect(sameHorizon.status).toBe(400);
    expect(sameHorizon.body.error.fields.horizonPx).toMatch(/two different points/);

    const badKind = await put({ landmarkTopPx: { x: 10, y: 10 }, fov: { kind: 'fisheye', focalLengthMm: 8 } });
    expect(badKind.status).toBe(400);
    expect(badKind.body.error.fields['fov.kind']).toMatch(/focal length/);

    const extra = await put({ landmarkTopPx: { x: 10, y: 10 }, fov: lens, pose: { azimuthDeg: 1 } });
    expect(extra.status).toBe(400);

    const missing = await put({ fov: lens });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.landmarkTopPx).toBeTruthy();

    // Nothing was saved by the refused calls.
    const after = await agent.get(`/api/photos/${photo.id}`);
    expect(after.body.photo.calibration).toBeNull();
  });

  it('clears a calibration; another member gets 404, an admin 403, anonymous 401', async () => {
    const { agent, photo } = await photoOnSightline();
    const body = { landmarkTopPx: { x: 300, y: 200 }, fov: { kind: 'angle', horizontalFovDeg: 60 } };
    expect((await agent.put(`/api/photos/${photo.id}/calibration`).send(body)).status).toBe(200);

    const other = await signedInAgent(ctx.app, await createUser('member', 'Someone Else'));
    expect((await other.put(`/api/photos/${photo.id}/calibration`).send(body)).status).toBe(404);
    expect((await other.delete(`/api/photos/${photo.id}/calibration`)).status).toBe(404);
    const admin = await signedInAgent(ctx.app, await createUser('admin', 'Support Admin'));
    expect((await admin.put(`/api/photos/${photo.id}/calibration`).send(body)).status).toBe(403);

    const { default: request } = await import('supertest');
    expect((await request(ctx.app).put(`/api/photos/${photo.id}/calibration`).send(body)).status).toBe(401);

    const cleared = await agent.delete(`/api/photos/${photo.id}/calibration`);
    expect(cleared.status).toBe(200);
    expect(cleared.body.photo.calibration).toBeNull();
  });
});
