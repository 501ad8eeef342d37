import type { Server } from 'node:http';
import type { Express } from 'express';
import { pathToFileURL } from 'node:url';
import { resolve } from 'node:path';
import { createApp, watchSchedulerOf } from './app';
import { loadConfig, ConfigError, type Config } from './config';
import { openDatabase, type Database } from './db/database';
import { SmtpFake } from './mail/smtp-fake';

export interface RunningServer {
  url: string;
  server: Server;
  database: Database;
  /** The Express app being served. */
  app: Express;
  /** The config the app runs with (SMTP_URL points at the local fake when it runs). */
  config: Config;
  /** The local SMTP fake, when this start runs it. */
  smtpFake?: SmtpFake;
  close(): Promise<void>;
}

export interface StartOptions {
  config: Config;
  databaseUrl: string;
  jwtSecret: string;
  clientDir?: string;
  /** Without SMTP_URL, run the local SMTP fake on 127.0.0.1:SMTP_FAKE_PORT and send watch e-mails there. */
  smtpFake?: boolean;
}

/** Starts the SMTP fake, with a clear message when its port is taken. */
async function startSmtpFake(port: number): Promise<SmtpFake> {
  const fake = new SmtpFake({ port });
  try {
    await fake.start();
  } catch (error) {
    const code = (error as { code?: string }).code;
    throw new ConfigError(code === 'EADDRINUSE'
      ? `The local SMTP fake cannot listen on 127.0.0.1:${port}: the port is in use. Set SMTP_FAKE_PORT to a free port (or SMTP_URL to a real mail server).`
      : `The local SMTP fake could not start on 127.0.0.1:${port}: ${(error as Error).message}`);
  }
  return fake;
}

/**
 * Connects to the database (migrating it), then serves API + client on config.host:config.port;
 * starts the watch scheduler when watches are on and there is a mail server to send to.
 */
export async function startServer({ config: given, databaseUrl, jwtSecret, clientDir, smtpFake: wantFake }: StartOptions): Promise<RunningServer> {
  const database = await openDatabase(databaseUrl);
  let config = given;
  let smtpFake: SmtpFake | undefined;
  let app: ReturnType<typeof createApp> | undefined;
  let server: Server | undefined;
  try {
    if (wantFake && !config.smtpUrl) {
      smtpFake = await startSmtpFake(config.smtpFakePort);
      config = { ...config, smtpUrl: smtpFake.url };
    }
    app = createApp({ config, sequelize: database.sequelize, jwtSecret, clientDir });
    const application = app;
    server = await new Promise<Server>((resolveServer, reject) => {
      const s = application.listen(config.port, config.host, () => resolveServer(s));
      s.on('error', reject);
    });
    if (config.watchesEnabled && config.smtpUrl) await watchSchedulerOf(app).start();
    else if (config.watchesEnabled) console.warn('Watch e-mails are off: set SMTP_URL to a mail server (npm start runs a local fake when it is unset).');
  } catch (error) {
    server?.close();
    await (app?.locals.shutdown as (() => Promise<void>) | undefined)?.().catch(() => undefined);
    await smtpFake?.stop().catch(() => undefined);
    await database.close().catch(() => undefined);
    throw error;
  }
  const started = app;
  const listening = server;
  const address = listening.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  let closing: Promise<void> | undefined;
  return {
    url: `http://${config.host}:${port}`,
    server: listening,
    app: started,
    database,
    config,
    smtpFake,
    close() {
      closing ??= (async () => {
        await new Promise<void>((r) => { listening.close(() => r()); listening.closeAllConnections(); });
        // Stops the watch scheduler (running sends get a few seconds), the mailer and the engine pool.
        await (started.locals.shutdown as (() => Promise<void>) | undefined)?.();
        await smtpFake?.stop();
        await database.close();
      })();
      return closing;
    },
  };
}

/** Stops cleanly on SIGINT/SIGTERM and logs what would otherwise vanish. */
export function installProcessHandlers(shutdown: () => Promise<void>): void {
  let stopping = false;
  const onSignal = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`\n${signal} received: stopping...`);
    shutdown().then(() => process.exit(0), (error) => { console.error(error); process.exit(1); });
  };
  process.on('SIGINT', () => onSignal('SIGINT'));
  process.on('SIGTERM', () => onSignal('SIGTERM'));
  process.on('unhandledRejection', (reason) => { console.error('Unhandled rejection:', reason); });
}

// `npm run serve`: a deployment against an external database (DATABASE_URL and JWT_SECRET required).
if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  try {
    const config = loadConfig();
    if (!config.databaseUrl) throw new ConfigError('DATABASE_URL is required for `npm run serve` (use `npm start` for the embedded database)');
    if (!config.jwtSecret) throw new ConfigError('JWT_SECRET is required for `npm run serve`');
    const running = await startServer({ config, databaseUrl: config.databaseUrl, jwtSecret: config.jwtSecret, clientDir: resolve('dist') });
    console.log(`Gnomon listening on ${running.url}`);
    installProcessHandlers(() => running.close());
  } catch (error) {
    console.error(error instanceof ConfigError ? error.message : error);
    process.exit(1);
  }
}
