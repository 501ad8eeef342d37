/** `npm start`: the one-command local start (see server/local-runtime.ts). */
import { loadConfig, ConfigError } from './config';
import { PostgresSetupError } from './db/embedded-postgres';
import { printDemoSignIns, startLocal } from './local-runtime';

try {
  const { running } = await startLocal(loadConfig(), { serveClient: true });
  console.log(`\nGnomon is running at ${running.url}\n`);
  printDemoSignIns();
  console.log('\nPress Ctrl-C to stop the app and its database.');
} catch (error) {
  if (error instanceof ConfigError || error instanceof PostgresSetupError) console.error(`\n${error.message}\n`);
  else console.error(error);
  process.exit(1);
}
