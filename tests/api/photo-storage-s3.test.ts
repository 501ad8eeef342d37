import { createHash, randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { z } from 'zod';
import { PHOTO_THUMB_LONG_SIDE_PX } from '../../shared/schemas/photo';
import { sightlineInputSchema } from '../../shared/schemas/sightline';
import { AppError } from '../../server/errors';
import { PhotoModel } from '../../server/models/photo';
import type { UserModel } from '../../server/models/user';
import { PhotoService } from '../../server/services/photo-service';
import { SightlineService } from '../../server/services/sightline-service';
import {
  createPhotoStorage,
  LocalPhotoStorage,
  photoStorageEnvCheck,
  photoStorageEnvSchema,
  photoStorageEnvShape,
  photoStorageKeys,
  photoStorageOptionsFromEnv,
  S3PhotoStorage,
  S3StorageError,
  StorageNotFoundError,
  type S3PhotoStorageOptions,
} from '../../server/storage';
import { canonicalRequest, EMPTY_SHA256, sigV4Signature, startFakeS3, type FakeS3 } from '../support/fake-s3';
import { createTestContext, createUser, type TestContext } from './helpers';

let fake: FakeS3;
const drivers: S3PhotoStorage[] = [];

/** A driver pointed at the fake, path-style as a self-hosted service needs. */
function driverFor(overrides: Partial<S3PhotoStorageOptions> = {}): S3PhotoStorage {
  const driver = new S3PhotoStorage({
    endpoint: fake.endpoint,
    region: fake.region,
    bucket: fake.bucket,
    accessKeyId: fake.accessKeyId,
    secretAccessKey: fake.secretAccessKey,
    forcePathStyle: true,
    ...overrides,
  });
  drivers.push(driver);
  return driver;
}

async function bytesOf(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(Buffer.from(chunk as Uint8Array));
  return Buffer.concat(chunks);
}

function sha256Hex(text: string): string {
  return createHash('sha256').update(text).digest('hex');
}

const newKeys = () => photoStorageKeys(randomUUID());

beforeAll(async () => {
  fake = await startFakeS3();
});
afterEach(() => {
  fake.reset();
});
afterAll(async () => {
  for (const driver of drivers) driver.close();
  await fake.close();
});

describe('the fake object store\'s Signature Version 4 check', () => {
  // Amazon S3 API Reference, "Signature Calculations for the Authorization Header: Transferring
  // Payload in a Single Chunk (AWS Signature Version 4)": its example key pair and worked examples.
  const SECRET = 'wJalrXUtnFEMI/K7MDENG/bPxRfiCYEXAMPLEKEY';
  const AMZ_DATE = '20130524T000000Z';

  it('reproduces the published GET Object example', () => {
    const req = {
      method: 'GET',
      path: '/test.txt',
      query: '',
      headers: { host: 'examplebucket.s3.amazonaws.com', range: 'bytes=0-9', 'x-amz-content-sha256': EMPTY_SHA256, 'x-amz-date': AMZ_DATE },
      signedHeaders: ['host', 'range', 'x-amz-content-sha256', 'x-amz-date'],
      payloadHash: EMPTY_SHA256,
    };
    // Same source: the SHA-256 of the canonical request, then the signature.
    expect(sha256Hex(canonicalRequest(req))).toBe('7344ae5b7ee6c3e7e6b0fe0640412a37625d1fbfff95c48bbb2dc43964946972');
    expect(sigV4Signature(req, SECRET, AMZ_DATE, 'us-east-1')).toBe('f0e8bdb87c964420e857bd35b5d6ed310bd44f0170aba48dd91039c6036bdb41');
  });

  it('reproduces the published GET Bucket (list objects) example, sorting the query', () => {
    const req = {
      method: 'GET',
      path: '/',
      // Sent in the other order on purpose: the canonical query is sorted by name (same source).
      query: 'prefix=J&max-keys=2',
      headers: { host: 'examplebucket.s3.amazonaws.com', 'x-amz-content-sha256': EMPTY_SHA256, 'x-amz-date': AMZ_DATE },
      signedHeaders: ['host', 'x-amz-content-sha256', 'x-amz-date'],
      payloadHash: EMPTY_SHA256,
    };
    expect(sigV4Signature(req, SECRET, AMZ_DATE, 'us-east-1')).toBe('34b48302e7b5fa45bde8084f4b7868a86f0a534bc59db6670ed5711ef69dc6f7');
  });

  it('refuses an unsigned request with 403 AccessDenied as an S3 XML error, storing nothing', async () => {
    const key = newKeys().original;
    const res = await fetch(`${fake.endpoint}/${fake.bucket}/${key}`, { method: 'PUT', body: 'not signed', headers: { 'content-type': 'image/jpeg' } });
    // Amazon S3 API Reference, "Error responses": the status, and an <Error> document with its <Code>.
    expect(res.status).toBe(403);
    expect(res.headers.get('content-type')).toBe('application/xml');
    expect(await res.text()).toMatch(/^<\?xml version="1.0" encoding="UTF-8"\?>\n<Error><Code>AccessDenied<\/Code><Message>/);
    expect(fake.objects.size).toBe(0);
    expect(fake.requests).toMatchObject([{ method: 'PUT', key, accessKeyId: undefined, status: 403, errorCode: 'AccessDenied' }]);
  });
});

describe('S3PhotoStorage against the fake', () => {
  it('puts, gets and deletes an object through the real SDK, signed, with its content type', async () => {
    const storage = driverFor();
    const keys = newKeys();
    const data = Buffer.from('invented original bytes \u0000\u00ff', 'latin1');
    await storage.put(keys.original, data, 'image/jpeg');

    const stored = fake.objects.get(keys.original);
    expect(stored?.body.equals(data)).toBe(true);
    expect(stored?.contentType).toBe('image/jpeg');
    // RFC 1864 / S3 PutObject: a single-request upload's ETag is the quoted MD5 of the body.
    expect(stored?.etag).toBe(`"${createHash('md5').update(data).digest('hex')}"`);
    // The SDK sent a CRC32 of the body (S3 flexible checksums), which the fake recomputed.
    expect(stored?.checksumCrc32).toMatch(/^[A-Za-z0-9+/]{6}==$/);
    // Path-style addressing: /<bucket>/<key>, signed with the configured key id.
    expect(fake.requests[0]).toMatchObject({ method: 'PUT', bucket: fake.bucket, key: keys.original, accessKeyId: fake.accessKeyId, status: 200 });

    expect((await bytesOf(await storage.get(keys.original))).equals(data)).toBe(true);

    await storage.delete(keys.original);
    expect(fake.objects.has(keys.original)).toBe(false);
    await expect(storage.get(keys.original)).rejects.toBeInstanceOf(StorageNotFoundError);
    expect(fake.requests.map((r) => `${r.method} ${r.status} ${r.errorCode ?? ''}`)).toEqual(['PUT 200 ', 'GET 200 ', 'DELETE 204 ', 'GET 404 NoSuchKey']);
  });

  it('stores the renditions\' content type and replaces an object put twice', async () => {
    const storage = driverFor();
    const keys = newKeys();
    await storage.put(keys.thumb, Buffer.from('first'), 'image/webp');
    await storage.put(keys.thumb, Buffer.from('second'), 'image/webp');
    expect(fake.objects.get(keys.thumb)).toMatchObject({ contentType: 'image/webp', body: Buffer.from('second') });
    // S3 PutObject: the Content-Type request header is what the object keeps.
    expect(fake.requests.map((r) => r.contentType)).toEqual(['image/webp', 'image/webp']);
  });

  it('fails the read of a download whose bytes do not match the stored CRC32', async () => {
    const storage = driverFor();
    const keys = newKeys();
    await storage.put(keys.original, Buffer.from('bytes that will arrive changed'), 'image/jpeg');
    fake.faults.push({ method: 'GET', reply: 'corrupt' });
    // S3 flexible checksums: with x-amz-checksum-mode ENABLED the SDK checks the returned CRC32
    // against the bytes as they stream; the driver hands that checking stream on.
    await expect(storage.get(keys.original).then(bytesOf)).rejects.toThrow(/checksum/i);
    expect(fake.requests.at(-1)).toMatchObject({ method: 'GET', status: 200 });
  });

  it('treats deleting a missing key as done (S3 DeleteObject answers 204 either way)', async () => {
    const storage = driverFor();
    await expect(storage.delete(newKeys().display)).resolves.toBeUndefined();
    expect(fake.requests).toMatchObject([{ method: 'DELETE', status: 204 }]);
  });

  it('reads a bare 404 (no error body) as a missing key, and a 404 for a stricter delete as done', async () => {
    const storage = driverFor();
    const keys = newKeys();
    fake.faults.push({ method: 'GET', reply: { status: 404 } }, { method: 'DELETE', reply: { status: 404, code: 'NoSuchKey' } });
    await expect(storage.get(keys.original)).rejects.toBeInstanceOf(StorageNotFoundError);
    await expect(storage.delete(keys.original)).resolves.toBeUndefined();
  });

  it('refuses a key of the wrong shape before any request goes out', async () => {
    const storage = driverFor();
    const id = randomUUID();
    const bad = ['../etc/passwd', `${id}/../../x`, `/${id}/original`, `${id.toUpperCase()}/original`, `${id}/other.webp`, `${id}/original/`, ''];
    for (const key of bad) {
      await expect(storage.put(key, Buffer.from('x'), 'image/jpeg'), key).rejects.toBeInstanceOf(RangeError);
      await expect(storage.get(key), key).rejects.toBeInstanceOf(RangeError);
      await expect(storage.delete(key), key).rejects.toBeInstanceOf(RangeError);
    }
    expect(fake.requests).toEqual([]);
  });

  it('puts keys under the prefix, adding its missing slash', async () => {
    const storage = driverFor({ prefix: 'gnomon/photos' });
    const keys = newKeys();
    await storage.put(keys.display, Buffer.from('d'), 'image/webp');
    expect([...fake.objects.keys()]).toEqual([`gnomon/photos/${keys.display}`]);
    expect((await bytesOf(await storage.get(keys.display))).toString()).toBe('d');
  });

  it('refuses prefixes that would climb out or make empty folder names, and bad tuning', () => {
    for (const prefix of ['../up', '/abs', 'a//b', 'a/./b', 'sp ace']) {
      expect(() => driverFor({ prefix }), prefix).toThrow(RangeError);
    }
    expect(() => driverFor({ maxAttempts: 0 })).toThrow(RangeError);
    expect(() => driverFor({ idleTimeoutMs: 1.5 })).toThrow(RangeError);
    expect(() => driverFor({ bucket: '' })).toThrow(RangeError);
  });

  it('surfaces a wrong access key id as an S3StorageError, without retrying it', async () => {
    const storage = driverFor({ accessKeyId: 'SOMEONEELSESKEY00001' });
    const failure = await storage.put(newKeys().original, Buffer.from('x'), 'image/jpeg').catch((e: unknown) => e);
    expect(failure).toBeInstanceOf(S3StorageError);
    // Amazon S3 API Reference, "Error responses": InvalidAccessKeyId is 403.
    expect(failure).toMatchObject({ code: 'InvalidAccessKeyId', status: 403 });
    expect(fake.requests).toHaveLength(1);
    expect(fake.objects.size).toBe(0);
  });

  it('surfaces a wrong secret as SignatureDoesNotMatch, on reads too', async () => {
    const storage = driverFor({ secretAccessKey: 'not-the-secret-the-fake-knows-000000000' });
    await expect(storage.put(newKeys().original, Buffer.from('x'), 'image/jpeg')).rejects.toMatchObject({ name: 'S3StorageError', code: 'SignatureDoesNotMatch', status: 403 });
    const read = await storage.get(newKeys().original).catch((e: unknown) => e);
    expect(read).not.toBeInstanceOf(StorageNotFoundError);
    expect(read).toMatchObject({ code: 'SignatureDoesNotMatch' });
    expect(fake.objects.size).toBe(0);
  });

  it('does not mistake a missing bucket for a missing photo', async () => {
    const storage = driverFor({ bucket: 'no-such-bucket-here' });
    const read = await storage.get(newKeys().original).catch((e: unknown) => e);
    expect(read).toBeInstanceOf(S3StorageError);
    expect(read).not.toBeInstanceOf(StorageNotFoundError);
    expect(read).toMatchObject({ code: 'NoSuchBucket', status: 404 });
    await expect(storage.delete(newKeys().original)).rejects.toMatchObject({ code: 'NoSuchBucket' });
  });

  it('retries a 500 InternalError and succeeds on the next attempt', async () => {
    const storage = driverFor();
    const keys = newKeys();
    fake.faults.push({ method: 'PUT', key: keys.original, times: 1, reply: { status: 500, code: 'InternalError' } });
    await storage.put(keys.original, Buffer.from('kept'), 'image/jpeg');
    expect(fake.requests.map((r) => r.status)).toEqual([500, 200]);
    expect(fake.objects.get(keys.original)?.body.toString()).toBe('kept');
  });

  it('gives up on a service that stops answering, after maxAttempts tries of the idle timeout', async () => {
    const storage = driverFor({ idleTimeoutMs: 200, maxAttempts: 2 });
    fake.faults.push({ method: 'PUT', reply: 'stall' });
    const started = Date.now();
    const failure = await storage.put(newKeys().original, Buffer.from('x'), 'image/jpeg').catch((e: unknown) => e);
    expect(failure).toBeInstanceOf(S3StorageError);
    expect(failure).toMatchObject({ code: 'TimeoutError', status: undefined });
    expect(fake.requests).toHaveLength(2);
    // Two 200 ms waits at least, and far from the default 30 s.
    expect(Date.now() - started).toBeGreaterThanOrEqual(400);
    expect(Date.now() - started).toBeLessThan(10_000);
  });
});

describe('choosing the driver from the environment', () => {
  it('defaults to the local folder', () => {
    const env = photoStorageEnvSchema.parse({});
    expect(env).toMatchObject({ PHOTO_STORAGE: 'local', S3_REGION: 'us-east-1' });
    const options = photoStorageOptionsFromEnv(env, '/srv/photos');
    expect(options).toEqual({ driver: 'local', dir: '/srv/photos' });
    expect(createPhotoStorage(options)).toBeInstanceOf(LocalPhotoStorage);
  });

  it('builds the s3 driver, path-style by default when an endpoint is given', () => {
    const base = { PHOTO_STORAGE: 's3', S3_BUCKET: 'photos', S3_ACCESS_KEY_ID: 'id', S3_SECRET_ACCESS_KEY: 'secret' };
    const withEndpoint = photoStorageOptionsFromEnv(photoStorageEnvSchema.parse({ ...base, S3_ENDPOINT: 'http://127.0.0.1:9000' }), '/unused');
    expect(withEndpoint).toEqual({
      driver: 's3',
      s3: { endpoint: 'http://127.0.0.1:9000', region: 'us-east-1', bucket: 'photos', accessKeyId: 'id', secretAccessKey: 'secret', forcePathStyle: true, prefix: undefined },
    });
    const storage = createPhotoStorage(withEndpoint);
    expect(storage).toBeInstanceOf(S3PhotoStorage);
    (storage as S3PhotoStorage).close();
    // Amazon S3 itself (no endpoint) takes virtual-hosted addressing unless told otherwise.
    expect(photoStorageOptionsFromEnv(photoStorageEnvSchema.parse(base), '/unused')).toMatchObject({ s3: { forcePathStyle: false } });
    expect(photoStorageOptionsFromEnv(photoStorageEnvSchema.parse({ ...base, S3_ENDPOINT: 'https://objects.example.net', S3_FORCE_PATH_STYLE: 'false', S3_PREFIX: 'gnomon' }), '/unused'))
      .toMatchObject({ s3: { forcePathStyle: false, prefix: 'gnomon' } });
  });

  it('names each missing variable when s3 is chosen without bucket or keys', () => {
    const result = photoStorageEnvSchema.safeParse({ PHOTO_STORAGE: 's3', S3_ACCESS_KEY_ID: 'id' });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
      ['S3_BUCKET', 'S3_BUCKET is required when PHOTO_STORAGE=s3 (the bucket that holds the photo files)'],
      ['S3_SECRET_ACCESS_KEY', 'S3_SECRET_ACCESS_KEY is required when PHOTO_STORAGE=s3 (the secret that goes with S3_ACCESS_KEY_ID)'],
    ]);
  });

  it('reports the s3 variables alongside other bad variables when spread into a bigger schema', () => {
    // As the server's env schema would use it: other fields, the shape spread in, the check added.
    const schema = z.object({ PORT: z.coerce.number().int(), ...photoStorageEnvShape }).check(photoStorageEnvCheck);
    const result = schema.safeParse({ PORT: 'eighty', PHOTO_STORAGE: 's3', S3_ENDPOINT: 'ftp://objects.example.net' });
    const paths = result.error?.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['PORT', 'S3_ENDPOINT', 'S3_BUCKET', 'S3_ACCESS_KEY_ID', 'S3_SECRET_ACCESS_KEY']));
    expect(result.error?.issues.find((i) => i.path[0] === 'S3_ENDPOINT')?.message).toBe('S3_ENDPOINT must be an http:// or https:// URL');
    expect(schema.safeParse({ PORT: '80', PHOTO_STORAGE: 'disk' }).error?.issues[0]?.message).toBe('PHOTO_STORAGE must be local or s3');
  });
});

describe('PhotoService with S3PhotoStorage', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => {
    await ctx.db.close();
  });

  const sightlines = new SightlineService();
  const limits = { maxPixels: 1e8, perSightline: 20 };

  async function ownedSightline(): Promise<{ owner: UserModel; sightlineId: string }> {
    const owner = await createUser('member', 'Bucket Owner');
    const sightline = await sightlines.create(owner, sightlineInputSchema.parse({
      name: 'Harbour light from the breakwater',
      vantage: { lat: 50.6001, lon: -1.9502, elevationM: 4, cameraHeightM: 1.6 },
      landmark: { lat: 50.6045, lon: -1.9570, baseElevationM: 0, heightM: 30, widthM: 12 },
    }));
    return { owner, sightlineId: sightline.id };
  }

  /** An invented 640 x 360 px test JPEG: a grey field with a darker block. */
  function smallJpeg(): Promise<Buffer> {
    const block = { input: { create: { width: 200, height: 120, channels: 3 as const, background: '#202020' } }, left: 60, top: 40 };
    return sharp({ create: { width: 640, height: 360, channels: 3, background: '#9a9a9a' } }).composite([block]).jpeg({ quality: 85 }).toBuffer();
  }

  it('uploads the original and both renditions as three objects, serves them back and deletes them with the photo', async () => {
    const storage = driverFor({ prefix: 'photos' });
    const service = new PhotoService(ctx.db.sequelize, sightlines, storage, limits);
    const { owner, sightlineId } = await ownedSightline();
    const jpeg = await smallJpeg();

    const photo = await service.add(owner, sightlineId, { buffer: jpeg, originalName: 'breakwater.jpg' });
    const keys = photoStorageKeys(photo.id);
    expect([...fake.objects.keys()].sort()).toEqual([keys.display, keys.original, keys.thumb].map((k) => `photos/${k}`).sort());
    expect(fake.objects.get(`photos/${keys.original}`)).toMatchObject({ contentType: 'image/jpeg' });
    expect(fake.objects.get(`photos/${keys.original}`)?.body.equals(jpeg)).toBe(true);
    expect(fake.objects.get(`photos/${keys.display}`)).toMatchObject({ contentType: 'image/webp' });
    expect(fake.objects.get(`photos/${keys.thumb}`)).toMatchObject({ contentType: 'image/webp' });
    expect(fake.requests.every((r) => r.method === 'PUT' && r.accessKeyId === fake.accessKeyId && r.status === 200)).toBe(true);

    // Read back through the driver: the thumbnail decodes as WebP with the thumbnail's long side.
    const thumb = await service.file(owner, photo.id, 'thumb');
    expect(thumb.contentType).toBe('image/webp');
    const meta = await sharp(await bytesOf(thumb.stream)).metadata();
    expect(meta.format).toBe('webp');
    expect(Math.max(meta.width, meta.height)).toBe(PHOTO_THUMB_LONG_SIDE_PX);
    const original = await service.file(owner, photo.id, 'original');
    expect((await bytesOf(original.stream)).equals(jpeg)).toBe(true);

    await service.remove(owner, photo.id);
    expect(fake.objects.size).toBe(0);
    expect(fake.requests.filter((r) => r.method === 'DELETE').map((r) => r.key).sort()).toEqual([keys.display, keys.original, keys.thumb].map((k) => `photos/${k}`).sort());
    expect(await PhotoModel.count({ where: { sightlineId } })).toBe(0);
  });

  it('sends nothing to the bucket for an upload that is not an image', async () => {
    const service = new PhotoService(ctx.db.sequelize, sightlines, driverFor(), limits);
    const { owner, sightlineId } = await ownedSightline();
    const refused = await service.add(owner, sightlineId, { buffer: Buffer.from('plain text, named .jpg'), originalName: 'notes.jpg' }).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(AppError);
    expect(refused).toMatchObject({ code: 'validation' });
    expect(fake.requests).toEqual([]);
    expect(await PhotoModel.count({ where: { sightlineId } })).toBe(0);
  });

  it('deletes the objects already written when the bucket refuses the last one, leaving no row', async () => {
    const service = new PhotoService(ctx.db.sequelize, sightlines, driverFor(), limits);
    const { owner, sightlineId } = await ownedSightline();
    // The thumbnail is the third file written; the bucket refuses it (403 is not retried).
    fake.faults.push({ method: 'PUT', key: /\/thumb\.webp$/, reply: { status: 403, code: 'AccessDenied' } });
    await expect(service.add(owner, sightlineId, { buffer: await smallJpeg(), originalName: 'a.jpg' })).rejects.toMatchObject({ name: 'S3StorageError', code: 'AccessDenied' });
    expect(fake.requests.filter((r) => r.method === 'PUT').map((r) => r.status)).toEqual([200, 200, 403]);
    expect(fake.requests.filter((r) => r.method === 'DELETE')).toHaveLength(3);
    expect(fake.objects.size).toBe(0);
    expect(await PhotoModel.count({ where: { sightlineId } })).toBe(0);
  });

  it('deletes the written objects again when saving the row fails after them', async () => {
    const owner = await createUser();
    // A sightline check that passes before the files are written and fails inside the transaction.
    const failingSightlines = {
      get: async (_user: unknown, _id: string, _action: string, transaction?: unknown) => {
        if (transaction) throw new Error('database went away');
        return {};
      },
    } as unknown as SightlineService;
    const service = new PhotoService(ctx.db.sequelize, failingSightlines, driverFor(), limits);
    await expect(service.add(owner, randomUUID(), { buffer: await smallJpeg(), originalName: 'a.jpg' })).rejects.toThrow('database went away');
    expect(fake.requests.filter((r) => r.method === 'PUT' && r.status === 200)).toHaveLength(3);
    expect(fake.objects.size).toBe(0);
  });
});
