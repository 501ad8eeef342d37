import type { Server } from 'node:http';
import { pathToFileURL } from 'node:url';
import { resolve } from 'node:path';
import { createApp } from './app';
import { loadConfig, ConfigError, type Config } from './config';
import { openDatabase, type Database } from './db/database';

export interface RunningServer {
  url: string;
  server: Server;
  database: Database;
  close(): Promise<void>;
}

export interface StartOptions {
  config: Config;
  databaseUrl: string;
  jwtSecret: string;
  clientDir?: string;
}

/** Connects to the database (migrating it), then serves API + client on config.host:config.port. */
export async function startServer({ config, databaseUrl, jwtSecret, clientDir }: StartOptions): Promise<RunningServer> {
  const database = await openDatabase(databaseUrl);
  const app = createApp({ config, sequelize: database.sequelize, jwtSecret, clientDir });
  const server = await new Promise<Server>((resolveServer, reject) => {
    const s = app.listen(config.port, config.host, () => resolveServer(s));
    s.on('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  let closing: Promise<void> | undefined;
  return {
    url: `http://${config.host}:${port}`,
    server,
    database,
    close() {
      closing ??= (async () => {
        await new Promise<void>((r) => { server.close(() => r()); server.closeAllConnections(); });
        await (app.locals.shutdown as (() => Promise<void>) | undefined)?.();
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
