import { Sequelize } from 'sequelize';
import pg from 'pg';

// Return BIGINT counts as numbers and keep DATE columns as Dates (pg's default for timestamptz).
pg.types.setTypeParser(pg.types.builtins.INT8, (v: string) => Number(v));

/** A Sequelize instance on the given PostgreSQL URL, quiet unless asked to log SQL. */
export function createSequelize(databaseUrl: string, options: { logSql?: boolean } = {}): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: options.logSql ? (sql) => console.log(sql) : false,
    pool: { max: 10, min: 0, idle: 10_000 },
    define: { underscored: true },
  });
}
