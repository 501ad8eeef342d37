import type { Sequelize } from 'sequelize';
import { createSequelize } from './sequelize';
import { migrate } from './migrator';
import { initModels, type Models } from '../models';

export interface Database {
  sequelize: Sequelize;
  models: Models;
  close(): Promise<void>;
}

// Any fixed 64-bit key: app copies starting together take turns at migrating.
const MIGRATION_LOCK_KEY = 7_402_611_905;

/** Connects, registers the models, and (unless told not to) applies pending migrations under a lock. */
export async function openDatabase(url: string, options: { migrate?: boolean; logSql?: boolean } = {}): Promise<Database> {
  const sequelize = createSequelize(url, { logSql: options.logSql });
  await sequelize.authenticate();
  if (options.migrate ?? true) {
    await sequelize.transaction(async (t) => {
      await sequelize.query(`SELECT pg_advisory_xact_lock(${MIGRATION_LOCK_KEY})`, { transaction: t });
      // The migrations run on their own connections; the lock holds until this transaction ends.
      await migrate(sequelize);
    });
  }
  const models = initModels(sequelize);
  return { sequelize, models, close: () => sequelize.close() };
}
