import { randomUUID } from 'node:crypto';
import { inject } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import { createApp, type AppOptions } from '../../server/app';
import { loadConfig, type Config } from '../../server/config';
import { openDatabase, type Database } from '../../server/db/database';
import { UserModel } from '../../server/models/user';
import { AuthService } from '../../server/services/auth-service';

export const TEST_JWT_SECRET = 'test-secret-that-is-long-enough-for-hs256-000';
export const TEST_PASSWORD = 'correct-horse-battery';

export interface TestContext {
  app: Express;
  db: Database;
  config: Config;
}

/** The real app with test settings; a low bcrypt cost keeps the suite quick. */
export function createTestApp(
  db: Database,
  env: Record<string, string> = {},
  options: Partial<Omit<AppOptions, 'config' | 'sequelize' | 'jwtSecret'>> = {},
): { app: Express; config: Config } {
  const config = loadConfig({ NODE_ENV: 'test', BCRYPT_ROUNDS: '4', ...env });
  return { app: createApp({ ...options, config, sequelize: db.sequelize, jwtSecret: TEST_JWT_SECRET }), config };
}

/**
 * The real app on the test database. Sequelize models are bound to one connection per process,
 * so open one context per test file and build further apps with createTestApp.
 */
export async function createTestContext(env: Record<string, string> = {}): Promise<TestContext> {
  const db = await openDatabase(inject('databaseUrl'), { migrate: false });
  return { ...createTestApp(db, env), db };
}

/** A unique e-mail, so test files never collide on the shared database. */
export function uniqueEmail(label = 'user'): string {
  return `${label}-${randomUUID().slice(0, 8)}@example.test`;
}

/** Creates an account directly in the database. */
export async function createUser(role: 'admin' | 'member' = 'member', name = 'Test Person'): Promise<UserModel> {
  const passwordHash = await new AuthService(4).hashPassword(TEST_PASSWORD);
  return UserModel.create({ name, email: uniqueEmail(role), passwordHash, role });
}

/** A supertest agent signed in as the user (the session cookie kept between calls). */
export async function signedInAgent(app: Express, user: UserModel) {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/login').send({ email: user.email, password: TEST_PASSWORD });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}
