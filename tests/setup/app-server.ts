/**
 * Vitest global setup for the browser tests: checks chromium, builds the client, and serves the
 * real app (API + built client) on 127.0.0.1 with the demo data, on the test database, with the
 * local SMTP fake and the local forecast fake (invented skies), as `npm start` runs them.
 */
import { mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { TestProject } from 'vitest/node';
import { buildClient } from '../../server/client-build';
import { startFakeForecastServer } from '../../server/forecast/fake-forecast-server';
import { loadConfig } from '../../server/config';
import { startServer, type RunningServer } from '../../server/index';
import { seedDemo } from '../../server/seeders/demo';
import { AuthService } from '../../server/services/auth-service';
import { ensureChromium } from './chromium';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    artifactsDir: string;
    /** The local SMTP fake of the served app (mail sent here shows in the Outbox). */
    smtpUrl: string;
    /** The local forecast fake behind the sky outlook (POST /__fake/mode and /__fake/sky steer it). */
    forecastUrl: string;
  }
}

export default async function setup(project: TestProject) {
  ensureChromium();
  const root = resolve('.');
  const artifactsDir = join(root, 'tests', 'output');
  const clientDir = join(artifactsDir, 'client');
  mkdirSync(join(artifactsDir, 'screenshots'), { recursive: true });
  buildClient(root, clientDir, { quiet: true });

  const databaseUrl = process.env.GNOMON_TEST_DATABASE_URL;
  if (!databaseUrl) throw new Error('tests/setup/database.ts must run before app-server.ts');
  // The forecast fake and the SMTP fake on free ports, as `npm start` runs them; the watch scheduler stays off (NODE_ENV=test).
  const forecast = await startFakeForecastServer({ httpControls: true });
  const config = loadConfig({ NODE_ENV: 'test', PORT: '0', BCRYPT_ROUNDS: '4', SMTP_FAKE_PORT: '0', FORECAST_BASE_URL: forecast.url });
  let running: RunningServer;
  try {
    running = await startServer({ config, databaseUrl, jwtSecret: 'e2e-secret-long-enough-for-hs256-signing', clientDir, smtpFake: true });
  } catch (error) {
    await forecast.close();
    throw error;
  }
  await seedDemo(new AuthService(4), running.database.sequelize);
  project.provide('baseUrl', running.url);
  project.provide('artifactsDir', artifactsDir);
  project.provide('smtpUrl', running.config.smtpUrl!);
  project.provide('forecastUrl', forecast.url);
  return async () => {
    await running.close();
    await forecast.close();
  };
}
