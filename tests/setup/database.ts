/**
 * Vitest global setup: a throwaway PostgreSQL on loopback (random free port, temp folder, fsync off),
 * migrated once, stopped and deleted afterwards, also when tests fail.
 */
import { mkdtempSync, chmodSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';
import { EmbeddedPostgres, findFreePort } from '../../server/db/embedded-postgres';
import { openDatabase } from '../../server/db/database';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

export default async function setup(project: TestProject) {
  const root = mkdtempSync(join(tmpdir(), 'gnomon-test-pg-'));
  chmodSync(root, 0o755);
  const server = new EmbeddedPostgres({
    dataDir: join(root, 'data'),
    socketDir: join(root, 'run'),
    port: await findFreePort(),
    ephemeral: true,
    log: () => undefined,
  });
  const teardown = async () => {
    await server.stop().catch((error) => console.error('Stopping the test database failed:', error));
    rmSync(root, { recursive: true, force: true });
  };
  try {
    await server.start();
    await server.ensureDatabase('gnomon_test');
    const url = server.url('gnomon_test');
    const db = await openDatabase(url);
    await db.close();
    project.provide('databaseUrl', url);
    process.env.GNOMON_TEST_DATABASE_URL = url;
  } catch (error) {
    await teardown();
    throw error;
  }
  return teardown;
}
