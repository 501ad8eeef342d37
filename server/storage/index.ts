import { z } from 'zod';
import { LocalPhotoStorage } from './local-storage';
import type { PhotoStorage } from './photo-storage';
import { S3PhotoStorage, type S3PhotoStorageOptions } from './s3-storage';

export type { PhotoStorage } from './photo-storage';
export { StorageNotFoundError, assertStorageKey, photoStorageKeys } from './photo-storage';
export { LocalPhotoStorage } from './local-storage';
export { S3PhotoStorage, S3StorageError, S3_STORAGE_DEFAULTS, type S3PhotoStorageOptions } from './s3-storage';

/** Which photo storage driver to build, with its settings (already checked; nothing is read from the environment here). */
export type PhotoStorageOptions =
  | { driver: 'local'; /** Folder that holds the photo files. */ dir: string }
  | { driver: 's3'; s3: S3PhotoStorageOptions };

/** Builds the configured driver: a local folder (the default) or an S3-compatible bucket. */
export function createPhotoStorage(options: PhotoStorageOptions): PhotoStorage {
  switch (options.driver) {
    case 'local': return new LocalPhotoStorage(options.dir);
    case 's3': return new S3PhotoStorage(options.s3);
    default: {
      const unknown: never = options;
      throw new RangeError(`Unknown photo storage driver: ${JSON.stringify((unknown as { driver?: unknown }).driver)}`);
    }
  }
}

const booleanFromEnv = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

/**
 * The photo storage variables, as zod fields to spread into the server's env schema:
 * PHOTO_STORAGE (local | s3, default local), S3_ENDPOINT (http(s) URL, omitted for Amazon S3),
 * S3_REGION (default us-east-1), S3_BUCKET, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY,
 * S3_FORCE_PATH_STYLE (default: true when S3_ENDPOINT is set) and S3_PREFIX (folder in the bucket).
 * Pair with photoStorageEnvCheck, which requires the bucket and keys once s3 is chosen.
 */
export const photoStorageEnvShape = {
  PHOTO_STORAGE: z.enum(['local', 's3'], { error: 'PHOTO_STORAGE must be local or s3' }).default('local'),
  S3_ENDPOINT: z.url({ protocol: /^https?$/, error: 'S3_ENDPOINT must be an http:// or https:// URL' }).optional(),
  S3_REGION: z.string().regex(/^\S+$/, 'S3_REGION must be one word, e.g. us-east-1').default('us-east-1'),
  S3_BUCKET: z.string().min(1).max(255).regex(/^[^/\s]+$/, 'S3_BUCKET is a bucket name, without / or spaces').optional(),
  S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  S3_FORCE_PATH_STYLE: booleanFromEnv.optional(),
  S3_PREFIX: z.string().min(1).optional(),
};

/** Variables the s3 driver cannot do without, with what each one is for. */
const REQUIRED_FOR_S3 = {
  S3_BUCKET: 'the bucket that holds the photo files',
  S3_ACCESS_KEY_ID: 'the access key id requests are signed with',
  S3_SECRET_ACCESS_KEY: 'the secret that goes with S3_ACCESS_KEY_ID',
} as const;

/**
 * The cross-field rule, as a zod check for an object schema that holds photoStorageEnvShape:
 * with PHOTO_STORAGE=s3, S3_BUCKET, S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY must be set. It runs
 * even when other variables failed, so every missing one is reported at once.
 */
export const photoStorageEnvCheck = z.superRefine<Record<string, unknown>>((env, ctx) => {
  if (env.PHOTO_STORAGE !== 's3') return;
  for (const [name, purpose] of Object.entries(REQUIRED_FOR_S3)) {
    if (env[name] === undefined) {
      ctx.addIssue({ code: 'custom', path: [name], message: `${name} is required when PHOTO_STORAGE=s3 (${purpose})` });
    }
  }
}, { when: () => true });

/** The photo storage variables on their own, parsed and checked (for tests and tools). */
export const photoStorageEnvSchema = z.object(photoStorageEnvShape).check(photoStorageEnvCheck);

/** The parsed photo storage variables. */
export type PhotoStorageEnv = z.infer<typeof photoStorageEnvSchema>;

/**
 * Driver options from the parsed variables; localDir is the folder for the local driver (the
 * server's PHOTO_DIR). Throws RangeError when s3 is chosen without its bucket or keys, which the
 * schema's check has already reported.
 */
export function photoStorageOptionsFromEnv(env: PhotoStorageEnv, localDir: string): PhotoStorageOptions {
  if (env.PHOTO_STORAGE === 'local') return { driver: 'local', dir: localDir };
  const { S3_BUCKET: bucket, S3_ACCESS_KEY_ID: accessKeyId, S3_SECRET_ACCESS_KEY: secretAccessKey } = env;
  if (!bucket || !accessKeyId || !secretAccessKey) {
    throw new RangeError('PHOTO_STORAGE=s3 needs S3_BUCKET, S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY');
  }
  return {
    driver: 's3',
    s3: {
      endpoint: env.S3_ENDPOINT,
      region: env.S3_REGION,
      bucket,
      accessKeyId,
      secretAccessKey,
      // Self-hosted services are usually reached by address, where a bucket host name cannot resolve.
      forcePathStyle: env.S3_FORCE_PATH_STYLE ?? env.S3_ENDPOINT !== undefined,
      prefix: env.S3_PREFIX,
    },
  };
}
