/** `npm run dev`: the API with its database, plus Vite's dev server (hot reload) proxying /api to it. */
import { spawn, type ChildProcess } from 'node:child_process';
import { join, resolve } from 'node:path';
import { loadConfig, ConfigError } from './config';
import { PostgresSetupError } from './db/embedded-postgres';
import { printDemoSignIns, startLocal } from './local-runtime';

let vite: ChildProcess | undefined;
try {
  const config = loadConfig();
  const { running } = await startLocal(config, { serveClient: false, onShutdown: () => vite?.kill('SIGTERM') });
  vite = spawn(join(resolve('.'), 'node_modules', '.bin', 'vite'), ['--host', '127.0.0.1'], {
    stdio: 'inherit',
    env: { ...process.env, GNOMON_API_URL: running.url },
  });
  console.log(`API on ${running.url}; open the Vite URL below for hot reload.`);
  printDemoSignIns();
} catch (error) {
  if (error instanceof ConfigError || error instanceof PostgresSetupError) console.error(`\n${error.message}\n`);
  else console.error(error);
  process.exit(1);
}
