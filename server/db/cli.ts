/** `npm run db:migrate` / `npm run db:seed` against DATABASE_URL. */
import { loadConfig } from '../config';
import { openDatabase } from './database';
import { seedDemo } from '../seeders/demo';
import { AuthService } from '../services/auth-service';

const command = process.argv[2];
const config = loadConfig();
if (!config.databaseUrl) {
  console.error('Set DATABASE_URL (npm start migrates and seeds the embedded database by itself).');
  process.exit(1);
}
const db = await openDatabase(config.databaseUrl, { migrate: command === 'migrate' || command === 'seed' });
try {
  if (command === 'seed') console.log(`${await seedDemo(new AuthService(config.bcryptRounds), db.sequelize)} demo item(s) created`);
  else if (command === 'migrate') console.log('Migrations applied');
  else { console.error('Usage: cli.ts migrate|seed'); process.exitCode = 1; }
} finally {
  await db.close();
}
