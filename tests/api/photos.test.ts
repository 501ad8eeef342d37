import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { crc32, deflateSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import type { Express } from 'express';
import { photoListResponseSchema, photoResponseSchema, type Photo } from '../../shared/schemas/photo';
import { sightlineResponseSchema } from '../../shared/schemas/sightline';
import { PhotoService } from '../../server/services/photo-service';
import { SightlineService } from '../../server/services/sightline-service';
import { LocalPhotoStorage } from '../../server/storage/local-storage';
import { UNREADABLE_IMAGE_MESSAGE } from '../../server/services/photo-image';
import { createTestApp, createTestContext, createUser, signedInAgent, type TestContext } from './helpers';

const roots: string[] = [];
function tempPhotoDir(): string {
  const dir = mkdtempSync(join(tmpdir(), 'gnomon-test-photos-'));
  roots.push(dir);
  return dir;
}

/** Every file under the folder, recursively. */
function filesUnder(dir: string): string[] {
  return readdirSync(dir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).map((e) => join(e.parentPath, e.name));
}

let ctx: TestContext;
let photoDir: string;
beforeAll(async () => {
  photoDir = tempPhotoDir();
  ctx = await createTestContext({ PHOTO_DIR: photoDir });
});
afterAll(async () => {
  await ctx.db.close();
  for (const dir of roots) rmSync(dir, { recursive: true, force: true });
});

const sightlineBody = {
  name: 'Photo stack',
  vantage: { lat: 50.6001, lon: -1.9502, elevationM: 4, cameraHeightM: 1.6 },
  landmark: { lat: 50.6045, lon: -1.9570, baseElevationM: 0, heightM: 30, widthM: 12 },
};

async function ownedSightline(app: Express = ctx.app) {
  const owner = await createUser('member', 'Photo Owner');
  const agent = await signedInAgent(app, owner);
  const res = await agent.post('/api/sightlines').send(sightlineBody);
  expect(res.status).toBe(201);
  return { owner, agent, sightline: sightlineResponseSchema.parse(res.body).sightline };
}

// An invented test image, 400 x 200 px as stored: left half red, right half blue. EXIF orientation 6
// says "turn 90 degrees clockwise to view", so seen upright it is 200 x 400 with red on top.
const STORED_WIDTH_PX = 400;
const STORED_HEIGHT_PX = 200;
const GPS = { lat: 50 + 36 / 60 + 12 / 3600, lon: -(1 + 57 / 60 + 18 / 3600) };

async function exifJpeg(): Promise<Buffer> {
  const red = await sharp({ create: { width: 200, height: 200, channels: 3, background: { r: 220, g: 20, b: 20 } } }).png().toBuffer();
  return sharp({ create: { width: STORED_WIDTH_PX, height: STORED_HEIGHT_PX, channels: 3, background: { r: 20, g: 20, b: 220 } } })
    .composite([{ input: red, left: 0, top: 0 }])
    .jpeg({ quality: 90 })
    .withMetadata({ orientation: 6 })
    .withExif({
      IFD0: { Make: 'Testmaker', Model: 'Model T1' },
      IFD2: { DateTimeOriginal: '2026:06:15 14:30:05', OffsetTimeOriginal: '+01:00', FocalLength: '24/1', FocalLengthIn35mmFilm: '36', LensModel: 'Test 24mm F1.4' },
      IFD3: {
        GPSLatitudeRef: 'N', GPSLatitude: '50/1 36/1 12/1',
        GPSLongitudeRef: 'W', GPSLongitude: '1/1 57/1 18/1',
        GPSImgDirectionRef: 'T', GPSImgDirection: '3155/10',
      },
    })
    .toBuffer();
}

/** A grey noise JPEG: noise does not compress, so it is tens of kB. */
function noisyJpeg(): Promise<Buffer> {
  return sharp({ create: { width: 300, height: 300, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 60 } } }).jpeg({ quality: 95 }).toBuffer();
}

/** A PNG chunk: length, type, data, CRC-32 of type and data (PNG specification, section 5.3). */
function pngChunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body) >>> 0);
  return Buffer.concat([length, body, crc]);
}

/** A tiny PNG whose header declares 50 000 x 50 000 px (2.5 gigapixels): a decompression bomb's header. */
function pixelBombPng(): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(50_000, 0);
  ihdr.writeUInt32BE(50_000, 4);
  ihdr.writeUInt8(8, 8); // bit depth
  ihdr.writeUInt8(0, 9); // greyscale
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    pngChunk('IHDR', ihdr),
    pngChunk('IDAT', deflateSync(Buffer.alloc(50_001))),
    pngChunk('IEND', Buffer.alloc(0)),
  ]);
}

async function upload(agent: ReturnType<typeof request.agent>, sightlineId: string, data: Buffer, name = 'stack.jpg') {
  return agent.post(`/api/sightlines/${sightlineId}/photos`).attach('photo', data, { filename: name, contentType: 'image/jpeg' });
}

describe('photo upload', () => {
  it('stores a JPEG with EXIF: size seen upright, EXIF read back, renditions turned and sized, no metadata in them', async () => {
    const { agent, sightline, owner } = await ownedSightline();
    const jpeg = await exifJpeg();
    const res = await upload(agent, sightline.id, jpeg);
    expect(res.status).toBe(201);
    const photo = photoResponseSchema.parse(res.body).photo;
    expect(photo).toMatchObject({
      sightlineId: sightline.id, ownerId: owner.id, originalName: 'stack.jpg', mimeType: 'image/jpeg',
      width: STORED_HEIGHT_PX, height: STORED_WIDTH_PX, byteSize: jpeg.length, hideGps: true, calibration: null,
    });
    expect(photo.exif).toMatchObject({
      takenAt: '2026-06-15T14:30:05+01:00', camera: 'Testmaker Model T1', lens: 'Test 24mm F1.4',
      focalLengthMm: 24, focalLength35Mm: 36,
    });
    expect(photo.exif.imageDirectionDeg).toBeCloseTo(315.5, 6);
    expect(photo.exif.gps!.lat).toBeCloseTo(GPS.lat, 6);
    expect(photo.exif.gps!.lon).toBeCloseTo(GPS.lon, 6);

    const display = await agent.get(photo.displayUrl).buffer(true);
    expect(display.status).toBe(200);
    expect(display.headers['content-type']).toBe('image/webp');
    const displayMeta = await sharp(display.body as Buffer).metadata();
    // Smaller than 2048 px, so kept at its own size; turned upright (orientation applied, tag gone).
    expect([displayMeta.format, displayMeta.width, displayMeta.height]).toEqual(['webp', 200, 400]);
    expect(displayMeta.exif).toBeUndefined();
    expect(displayMeta.orientation).toBeUndefined();
    // No EXIF or XMP chunk in the WebP container (RIFF chunk names, WebP container specification).
    expect((display.body as Buffer).includes('EXIF')).toBe(false);
    expect((display.body as Buffer).includes('XMP ')).toBe(false);
    // Red (the stored left half) is now on top, blue below.
    const { data, info } = await sharp(display.body as Buffer).raw().toBuffer({ resolveWithObject: true });
    const pixel = (x: number, y: number) => [...data.subarray((y * info.width + x) * info.channels, (y * info.width + x) * info.channels + 3)];
    const [rTop, , bTop] = pixel(100, 50);
    const [rBottom, , bBottom] = pixel(100, 350);
    expect(rTop).toBeGreaterThan(150);
    expect(bTop).toBeLessThan(80);
    expect(bBottom).toBeGreaterThan(150);
    expect(rBottom).toBeLessThan(80);

    const thumb = await agent.get(photo.thumbUrl).buffer(true);
    const thumbMeta = await sharp(thumb.body as Buffer).metadata();
    expect([thumbMeta.format, thumbMeta.width, thumbMeta.height, thumbMeta.exif]).toEqual(['webp', 160, 320, undefined]);

    const original = await agent.get(photo.originalUrl!).buffer(true);
    expect(original.headers['content-type']).toBe('image/jpeg');
    expect(Buffer.compare(original.body as Buffer, jpeg)).toBe(0);

    const list = photoListResponseSchema.parse((await agent.get(`/api/sightlines/${sightline.id}/photos`)).body);
    expect(list.photos.map((p) => p.id)).toEqual([photo.id]);
    expect(filesUnder(join(photoDir, photo.id))).toHaveLength(3);
  });

  it('keeps the display at 2048 px on the long side for a large photo', async () => {
    const { agent, sightline } = await ownedSightline();
    const big = await sharp({ create: { width: 3000, height: 1500, channels: 3, background: '#336699' } }).png().toBuffer();
    const res = await upload(agent, sightline.id, big, 'wide.png');
    expect(res.status).toBe(201);
    const photo: Photo = res.body.photo;
    expect([photo.mimeType, photo.width, photo.height]).toEqual(['image/png', 3000, 1500]);
    const meta = await sharp((await agent.get(photo.displayUrl).buffer(true)).body as Buffer).metadata();
    expect([meta.width, meta.height]).toEqual([2048, 1024]);
  });

  it.each([
    ['a text file named .jpg', Buffer.from('Not a picture at all, only words.\n'.repeat(20)), 'fake.jpg'],
    ['a JPEG cut short after its header', Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]), 'cut.jpg'],
    ['an SVG (decodable, but not a photo type)', Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>'), 'x.jpg'],
  ])('refuses %s with 400 and the readable-image message, leaving no file', async (_label, data, name) => {
    const { agent, sightline } = await ownedSightline();
    const before = filesUnder(photoDir).length;
    const res = await upload(agent, sightline.id, data, name);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation', message: UNREADABLE_IMAGE_MESSAGE });
    expect(filesUnder(photoDir)).toHaveLength(before);
    expect((await agent.get(`/api/sightlines/${sightline.id}/photos`)).body.photos).toEqual([]);
  });

  it('refuses a PNG whose header declares 2.5 gigapixels with 400 and says why', async () => {
    const { agent, sightline } = await ownedSightline();
    const before = filesUnder(photoDir).length;
    const res = await upload(agent, sightline.id, pixelBombPng(), 'bomb.png');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/more than 100 million pixels/);
    expect(filesUnder(photoDir)).toHaveLength(before);
  });

  it('refuses an image over PHOTO_MAX_PIXELS with 400', async () => {
    const dir = tempPhotoDir();
    const { app } = createTestApp(ctx.db, { PHOTO_DIR: dir, PHOTO_MAX_PIXELS: '50000' });
    const { agent, sightline } = await ownedSightline(app);
    const res = await upload(agent, sightline.id, await exifJpeg());
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/more than 0\.1 million pixels/);
    expect(filesUnder(dir)).toEqual([]);
  });

  it('refuses a file over PHOTO_MAX_BYTES with 413 JSON, leaving no file or row', async () => {
    const dir = tempPhotoDir();
    const { app } = createTestApp(ctx.db, { PHOTO_DIR: dir, PHOTO_MAX_BYTES: '4096' });
    const { agent, sightline } = await ownedSightline(app);
    const big = await noisyJpeg();
    expect(big.length).toBeGreaterThan(4096);
    const res = await upload(agent, sightline.id, big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
    expect(filesUnder(dir)).toEqual([]);
    expect((await agent.get(`/api/sightlines/${sightline.id}/photos`)).body.photos).toEqual([]);
  });

  it('refuses a form without the photo field, or with the file under another name, with 400', async () => {
    const { agent, sightline } = await ownedSightline();
    const none = await agent.post(`/api/sightlines/${sightline.id}/photos`).field('note', 'x');
    expect(none.status).toBe(400);
    expect(none.body.error.fields.photo).toMatch(/Choose a photo/);
    const other = await agent.post(`/api/sightlines/${sightline.id}/photos`).attach('picture', await exifJpeg(), 'a.jpg');
    expect(other.status).toBe(400);
    expect(other.body.error.fields.photo).toMatch(/form field "photo"/);
  });

  it('refuses a photo past PHOTOS_PER_SIGHTLINE with 409', async () => {
    const dir = tempPhotoDir();
    const { app } = createTestApp(ctx.db, { PHOTO_DIR: dir, PHOTOS_PER_SIGHTLINE: '1' });
    const { agent, sightline } = await ownedSightline(app);
    expect((await upload(agent, sightline.id, await exifJpeg())).status).toBe(201);
    const second = await upload(agent, sightline.id, await exifJpeg());
    expect(second.status).toBe(409);
    expect(second.body.error.message).toMatch(/at most 1 photos/);
    expect(filesUnder(dir)).toHaveLength(3);
  });

  it('deletes the written files again when saving the row fails after them', async () => {
    const dir = tempPhotoDir();
    const owner = await createUser();
    // A sightline check that passes before the files are written and fails inside the transaction.
    const failing = {
      get: async (_user: unknown, _id: string, _action: string, transaction?: unknown) => {
        if (transaction) throw new Error('database went away');
        return {};
      },
    } as unknown as SightlineService;
    const service = new PhotoService(ctx.db.sequelize, failing, new LocalPhotoStorage(dir), { maxPixels: 1e8, perSightline: 20 });
    await expect(service.add(owner, '00000000-0000-4000-8000-000000000000', { buffer: await exifJpeg(), originalName: 'a.jpg' })).rejects.toThrow('database went away');
    expect(filesUnder(dir)).toEqual([]);
  });
});

describe('photo privacy and permissions', () => {
  async function withPhoto() {
    const owned = await ownedSightline();
    const res = await upload(owned.agent, owned.sightline.id, await exifJpeg());
    expect(res.status).toBe(201);
    return { ...owned, photo: photoResponseSchema.parse(res.body).photo };
  }

  it('another member gets 404 for the list, every rendition, the change and the delete', async () => {
    const { sightline, photo, agent } = await withPhoto();
    const other = await signedInAgent(ctx.app, await createUser());
    expect((await other.get(`/api/sightlines/${sightline.id}/photos`)).status).toBe(404);
    expect((await upload(other, sightline.id, await exifJpeg())).status).toBe(404);
    for (const url of [`/api/photos/${photo.id}`, photo.thumbUrl, photo.displayUrl, photo.originalUrl!]) {
      expect((await other.get(url)).status).toBe(404);
    }
    expect((await other.patch(`/api/photos/${photo.id}`).send({ hideGps: false })).status).toBe(404);
    expect((await other.delete(`/api/photos/${photo.id}`)).status).toBe(404);
    expect((await agent.get(`/api/photos/${photo.id}`)).status).toBe(200);
  });

  it('an admin sees the photo and renditions without GPS while hidden, never the original, and cannot change it (403)', async () => {
    const { agent, photo, sightline } = await withPhoto();
    const admin = await signedInAgent(ctx.app, await createUser('admin'));
    const listed = (await admin.get(`/api/sightlines/${sightline.id}/photos`)).body.photos[0];
    expect(listed.exif.gps).toBeUndefined();
    expect(listed.exif.focalLengthMm).toBe(24);
    expect(listed.originalUrl).toBeNull();
    expect((await admin.get(photo.thumbUrl)).status).toBe(200);
    expect((await admin.get(photo.originalUrl!)).status).toBe(403);
    expect((await admin.patch(`/api/photos/${photo.id}`).send({ hideGps: false })).status).toBe(403);
    expect((await admin.delete(`/api/photos/${photo.id}`)).status).toBe(403);
    expect((await upload(admin, sightline.id, await exifJpeg())).status).toBe(403);

    const shown = await agent.patch(`/api/photos/${photo.id}`).send({ hideGps: false });
    expect(shown.status).toBe(200);
    expect(shown.body.photo.hideGps).toBe(false);
    const after = (await admin.get(`/api/photos/${photo.id}`)).body.photo;
    expect(after.exif.gps.lat).toBeCloseTo(GPS.lat, 6);
  });

  it('refuses a bad change with a field message, and a bad id or rendition with 400', async () => {
    const { agent, photo } = await withPhoto();
    const bad = await agent.patch(`/api/photos/${photo.id}`).send({ hideGps: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.hideGps).toBeTruthy();
    expect((await agent.patch(`/api/photos/${photo.id}`).send({ hideGps: true, width: 1 })).status).toBe(400);
    expect((await agent.get('/api/photos/not-a-uuid/thumb')).status).toBe(400);
    expect((await agent.get(`/api/photos/${photo.id}/huge`)).status).toBe(400);
  });

  it('the owner deletes a photo: row and files go, its addresses answer 404', async () => {
    const { agent, photo, sightline } = await withPhoto();
    expect(filesUnder(join(photoDir, photo.id))).toHaveLength(3);
    expect((await agent.delete(`/api/photos/${photo.id}`)).status).toBe(204);
    expect(readdirSync(photoDir)).not.toContain(photo.id);
    const [rows] = await ctx.db.sequelize.query('SELECT count(*)::int AS n FROM photos WHERE id = $1', { bind: [photo.id] });
    expect((rows as Array<{ n: number }>)[0]!.n).toBe(0);
    expect((await agent.get(photo.thumbUrl)).status).toBe(404);
    expect((await agent.get(`/api/sightlines/${sightline.id}/photos`)).body.photos).toEqual([]);
  });

  it('removeAllOfSightline deletes every photo row and file of that sightline only', async () => {
    const { photo, sightline, agent } = await withPhoto();
    const second = await upload(agent, sightline.id, await exifJpeg());
    expect(second.status).toBe(201);
    const kept = await withPhoto();
    const service = new PhotoService(ctx.db.sequelize, new SightlineService(), new LocalPhotoStorage(photoDir), { maxPixels: 1e8, perSightline: 20 });
    expect(await service.removeAllOfSightline(sightline.id)).toBe(2);
    const entries = readdirSync(photoDir);
    expect(entries).not.toContain(photo.id);
    expect(entries).not.toContain(second.body.photo.id);
    expect(filesUnder(join(photoDir, kept.photo.id))).toHaveLength(3);
    expect((await agent.get(`/api/sightlines/${sightline.id}/photos`)).body.photos).toEqual([]);
    expect((await kept.agent.get(`/api/sightlines/${kept.sightline.id}/photos`)).body.photos).toHaveLength(1);
  });

  it('deleting the sightline deletes its photos\' rows and files', async () => {
    const { photo, sightline, agent } = await withPhoto();
    expect(filesUnder(join(photoDir, photo.id))).toHaveLength(3);
    expect((await agent.delete(`/api/sightlines/${sightline.id}`)).status).toBe(204);
    expect(readdirSync(photoDir)).not.toContain(photo.id);
    const [rows] = await ctx.db.sequelize.query('SELECT count(*)::int AS n FROM photos WHERE id = $1', { bind: [photo.id] });
    expect((rows as Array<{ n: number }>)[0]!.n).toBe(0);
  });

  it('anonymous calls get 401', async () => {
    const { photo, sightline } = await withPhoto();
    expect((await request(ctx.app).get(photo.thumbUrl)).status).toBe(401);
    expect((await request(ctx.app).get(`/api/sightlines/${sightline.id}/photos`)).status).toBe(401);
  });
});
