import { DataTypes } from 'sequelize';
import type { Migration } from '../db/migrator';

export const up: Migration['up'] = async ({ queryInterface, sequelize }) => {
  await sequelize.query(`CREATE TYPE user_role AS ENUM ('admin', 'member')`);
  await queryInterface.createTable('users', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: sequelize.literal('gen_random_uuid()') },
    name: { type: DataTypes.STRING(100), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    role: { type: 'user_role', allowNull: false, defaultValue: 'member' },
    disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal('now()') },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal('now()') },
  });
  // E-mails are stored lower-case; the unique index is on lower() as a second guard.
  await sequelize.query('CREATE UNIQUE INDEX users_email_unique ON users (lower(email))');
  await sequelize.query(`ALTER TABLE users ADD CONSTRAINT users_email_lower CHECK (email = lower(email))`);
};

export const down: Migration['down'] = async ({ queryInterface, sequelize }) => {
  await queryInterface.dropTable('users');
  await sequelize.query('DROP TYPE IF EXISTS user_role');
};
