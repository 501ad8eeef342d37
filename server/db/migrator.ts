import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';
import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';

const migrationsDir = join(dirname(fileURLToPath(import.meta.url)), '..', 'migrations');

/** What every migration file exports. */
export interface Migration {
  up(context: { queryInterface: QueryInterface; sequelize: Sequelize }): Promise<void>;
  down(context: { queryInterface: QueryInterface; sequelize: Sequelize }): Promise<void>;
}

/** The migrator over server/migrations/*.ts, recording applied files in table `schema_migrations`. */
export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: {
      glob: ['*.ts', { cwd: migrationsDir, ignore: ['*.d.ts'] }],
      resolve: ({ name, path }) => ({
        name,
        up: async ({ context }) => ((await import(path!)) as Migration).up(context),
        down: async ({ context }) => ((await import(path!)) as Migration).down(context),
      }),
    },
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Applies every pending migration; returns the names applied. */
export async function migrate(sequelize: Sequelize): Promise<string[]> {
  const applied = await createMigrator(sequelize).up();
  return applied.map((m) => m.name);
}
