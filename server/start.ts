/**
 * `npm start`: the one-command local start. Runs PostgreSQL from Debian's packages on loopback
 * (unless DATABASE_URL is set), migrates, seeds the demo, builds the client when stale, and serves.
 */
import { join, resolve } from 'node:path';
import { loadConfig, ConfigError } from './config';
import { EmbeddedPostgres, PostgresSetupError } from './db/embedded-postgres';
import { buildClient, isClientBuildStale } from './client-build';
import { installProcessHandlers, startServer } from './index';
import { loadOrCreateJwtSecret } from './secrets';
import { seedDemo, demoAccounts, DEMO_PASSWORD } from './seeders/demo';
import { AuthService } from './services/auth-service';

const root = resolve('.');

async function main(): Promise<void> {
  const config = loadConfig();
  const dataDir = resolve(config.dataDir);
  let embedded: EmbeddedPostgres | undefined;
  let databaseUrl = config.databaseUrl;
  if (!databaseUrl) {
    embedded = new EmbeddedPostgres({ dataDir: join(dataDir, 'pg'), socketDir: join(dataDir, 'pg-run'), port: config.embeddedPgPort });
    await embedded.start();
    await embedded.ensureDatabase('gnomon');
    databaseUrl = embedded.url('gnomon');
    console.log(`PostgreSQL on 127.0.0.1:${config.embeddedPgPort} (data in ${join(dataDir, 'pg')})`);
  }
  const jwtSecret = config.jwtSecret ?? loadOrCreateJwtSecret(dataDir);

  const clientDir = join(root, 'dist');
  if (isClientBuildStale(root, clientDir)) {
    console.log('Building the client...');
    buildClient(root, clientDir);
  }

  let running: Awaited<ReturnType<typeof startServer>> | undefined;
  const shutdown = async () => {
    await running?.close();
    await embedded?.stop();
  };
  installProcessHandlers(shutdown);
  try {
    running = await startServer({ config, databaseUrl, jwtSecret, clientDir });
    const created = await seedDemo(new AuthService(config.bcryptRounds));
    if (created) console.log(`Demo data: ${created} account(s) created`);
  } catch (error) {
    await shutdown().catch(() => undefined);
    throw error;
  }

  console.log(`\nGnomon is running at ${running.url}\n`);
  console.log(`Demo sign-ins (password "${DEMO_PASSWORD}"):`);
  for (const a of demoAccounts) console.log(`  ${a.email.padEnd(28)} ${a.role}  (${a.name})`);
  console.log('\nPress Ctrl-C to stop the app and its database.');
}

main().catch((error: unknown) => {
  if (error instanceof ConfigError || error instanceof PostgresSetupError) console.error(`\n${error.message}\n`);
  else console.error(error);
  process.exit(1);
});
