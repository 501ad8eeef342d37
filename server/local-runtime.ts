/**
 * The local runtime behind `npm start` and `npm run dev`: PostgreSQL from Debian's packages on
 * loopback (unless DATABASE_URL is set), migrations, demo data, the app server, and (unless
 * SMTP_URL is set) the local SMTP fake that keeps every watch e-mail in the outbox, and (unless
 * FORECAST_BASE_URL is set) a local fake of the forecast service.
 */
import { join, resolve } from 'node:path';
import type { Config } from './config';
import { EmbeddedPostgres } from './db/embedded-postgres';
import { buildClient, isClientBuildStale } from './client-build';
import { installProcessHandlers, startServer, type RunningServer } from './index';
import { loadOrCreateJwtSecret } from './secrets';
import { seedDemo, demoAccounts, DEMO_PASSWORD } from './seeders/demo';
import { AuthService } from './services/auth-service';
import { createPhotoStorage } from './storage';
import { startFakeForecastServer, type FakeForecastServer } from './forecast/fake-forecast-server';

export interface LocalRuntime {
  running: RunningServer;
  shutdown(): Promise<void>;
}

/** Starts database and app; `serveClient` builds the client when stale and serves it. */
export async function startLocal(config: Config, options: { serveClient: boolean; onShutdown?: () => void }): Promise<LocalRuntime> {
  const root = resolve('.');
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

  let clientDir: string | undefined;
  if (options.serveClient) {
    clientDir = join(root, 'dist');
    if (isClientBuildStale(root, clientDir)) {
      console.log('Building the client...');
      buildClient(root, clientDir);
    }
  }

  let running: RunningServer | undefined;
  let forecastFake: FakeForecastServer | undefined;
  const shutdown = async () => {
    options.onShutdown?.();
    await running?.close();
    await forecastFake?.close();
    await embedded?.stop();
  };
  installProcessHandlers(shutdown);
  try {
    // Without FORECAST_BASE_URL the sky outlook comes from a local fake with invented skies.
    let runConfig = config;
    if (!config.forecastBaseUrl) {
      forecastFake = await startFakeForecastServer({ port: config.forecastFakePort });
      runConfig = { ...config, forecastBaseUrl: forecastFake.url };
      console.log(`Forecast: local fake on ${forecastFake.url} with invented skies (set FORECAST_BASE_URL for a real forecast)`);
    }
    // Without SMTP_URL the watch e-mails go to the local SMTP fake and are read in the Outbox.
    running = await startServer({ config: runConfig, databaseUrl, jwtSecret, clientDir, smtpFake: true });
    if (running.smtpFake) {
      console.log(`Mail: local SMTP fake on 127.0.0.1:${running.smtpFake.port}; watch e-mails are stored in the Outbox (admins), never delivered`);
    } else if (running.config.smtpUrl) {
      console.log(`Mail: watch e-mails go to the SMTP server ${new URL(running.config.smtpUrl).host}`);
    }
    const created = await seedDemo(new AuthService(config.bcryptRounds), running.database.sequelize, { photoStorage: createPhotoStorage(config.photoStorage) });
    if (created) console.log(`Demo data: ${created} account(s) and sightline(s) created`);
  } catch (error) {
    await shutdown().catch(() => undefined);
    throw error;
  }
  return { running, shutdown };
}

/** The demo sign-ins, printed after start. */
export function printDemoSignIns(): void {
  console.log(`Demo sign-ins (password "${DEMO_PASSWORD}"):`);
  for (const a of demoAccounts) console.log(`  ${a.email.padEnd(28)} ${a.role.padEnd(7)} (${a.name})`);
}
