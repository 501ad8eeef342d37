import { join } from 'node:path';
import { z } from 'zod';

const booleanFromEnv = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().min(1).default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  DATABASE_URL: z.url({ error: 'DATABASE_URL must be a postgres:// URL' }).optional(),
  GNOMON_PG_PORT: z.coerce.number().int().min(1024).max(65535).default(54329),
  GNOMON_DATA_DIR: z.string().min(1).default('.data'),
  JWT_SECRET: z.string().min(32, 'JWT_SECRET must be at least 32 characters').optional(),
  JWT_TTL_HOURS: z.coerce.number().int().min(1).max(24 * 90).default(24 * 14),
  COOKIE_SECURE: booleanFromEnv.optional(),
  LOGIN_MAX_FAILURES: z.coerce.number().int().min(1).max(1000).default(10),
  LOGIN_WINDOW_MINUTES: z.coerce.number().int().min(1).max(24 * 60).default(15),
  BCRYPT_ROUNDS: z.coerce.number().int().min(4).max(15).default(11),
  LOG_REQUESTS: booleanFromEnv.default(false),
  PHOTO_DIR: z.string().min(1).optional(),
  PHOTO_MAX_BYTES: z.coerce.number().int().min(1024).max(500 * 1024 * 1024).default(30 * 1024 * 1024),
  PHOTO_MAX_PIXELS: z.coerce.number().int().min(1).max(1_000_000_000).default(100_000_000),
  PHOTOS_PER_SIGHTLINE: z.coerce.number().int().min(1).max(1000).default(20),
});

export type Env = z.infer<typeof envSchema>;

/** Everything the server needs, parsed and checked once at start-up. */
export interface Config {
  nodeEnv: Env['NODE_ENV'];
  host: string;
  port: number;
  /** Set when an external PostgreSQL is used; the embedded one otherwise. */
  databaseUrl?: string;
  embeddedPgPort: number;
  dataDir: string;
  jwtSecret?: string;
  jwtTtlHours: number;
  /** Cookies carry Secure; undefined means "when the request came over https". */
  cookieSecure?: boolean;
  loginMaxFailures: number;
  loginWindowMinutes: number;
  bcryptRounds: number;
  logRequests: boolean;
  /** Folder of the local photo storage driver (default: <dataDir>/photos). */
  photoDir: string;
  /** Largest accepted upload, bytes (default 30 MiB). */
  photoMaxBytes: number;
  /** Largest accepted image, width x height in pixels (default 100 000 000): refuses decompression bombs. */
  photoMaxPixels: number;
  /** Most reference photos one sightline may hold (default 20). */
  photosPerSightline: number;
}

export class ConfigError extends Error {
  override name = 'ConfigError';
}

/**
 * Parses the environment into a Config. Throws ConfigError with one line per bad variable, so that
 * start-up stops with a clear message.
 */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const present = Object.fromEntries(Object.entries(env).filter(([, v]) => v !== undefined && v !== ''));
  const parsed = envSchema.safeParse(present);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new ConfigError(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  return {
    nodeEnv: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    databaseUrl: e.DATABASE_URL,
    embeddedPgPort: e.GNOMON_PG_PORT,
    dataDir: e.GNOMON_DATA_DIR,
    jwtSecret: e.JWT_SECRET,
    jwtTtlHours: e.JWT_TTL_HOURS,
    cookieSecure: e.COOKIE_SECURE,
    loginMaxFailures: e.LOGIN_MAX_FAILURES,
    loginWindowMinutes: e.LOGIN_WINDOW_MINUTES,
    bcryptRounds: e.BCRYPT_ROUNDS,
    logRequests: e.LOG_REQUESTS,
    photoDir: e.PHOTO_DIR ?? join(e.GNOMON_DATA_DIR, 'photos'),
    photoMaxBytes: e.PHOTO_MAX_BYTES,
    photoMaxPixels: e.PHOTO_MAX_PIXELS,
    photosPerSightline: e.PHOTOS_PER_SIGHTLINE,
  };
}
