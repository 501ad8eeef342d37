import { DataTypes } from 'sequelize';
import type { Migration } from '../db/migrator';

/**
 * Crews: the people a sightline's owner shares it with (editor or viewer), the e-mail invites that
 * bring them in, outings on a lineup night and the crew's answers to them.
 */
export const up: Migration['up'] = async ({ queryInterface, sequelize }) => {
  const now = { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal('now()') };
  const sightline = { type: DataTypes.UUID, allowNull: false, references: { model: 'sightlines', key: 'id' }, onDelete: 'CASCADE' };
  const user = (allowNull: boolean, onDelete: 'CASCADE' | 'SET NULL') => ({ type: DataTypes.UUID, allowNull, references: { model: 'users', key: 'id' }, onDelete });

  await queryInterface.createTable('crew_members', {
    sightline_id: { ...sightline, primaryKey: true },
    user_id: { ...user(false, 'CASCADE'), primaryKey: true },
    role: { type: DataTypes.STRING(10), allowNull: false },
    created_at: now,
    updated_at: now,
  });
  await sequelize.query(`ALTER TABLE crew_members ADD CONSTRAINT crew_members_role CHECK (role IN ('editor', 'viewer'))`);
  await queryInterface.addIndex('crew_members', ['user_id']);

  await queryInterface.createTable('crew_invites', {
    id: { type: DataTypes.UUID, primaryKey: true },
    sightline_id: sightline,
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.STRING(10), allowNull: false },
    invited_by: user(true, 'SET NULL'),
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    accepted_by: user(true, 'SET NULL'),
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
  });
  await sequelize.query(`
    ALTER TABLE crew_invites
      ADD CONSTRAINT crew_invites_role CHECK (role IN ('editor', 'viewer')),
      ADD CONSTRAINT crew_invites_email_lower CHECK (email = lower(email) AND length(email) BETWEEN 3 AND 254),
      ADD CONSTRAINT crew_invites_one_outcome CHECK (accepted_at IS NULL OR revoked_at IS NULL),
      ADD CONSTRAINT crew_invites_accepted_by CHECK (accepted_by IS NULL OR accepted_at IS NOT NULL)
  `);
  // One open invite per address and sightline (a new invite replaces the old one).
  await sequelize.query(`CREATE UNIQUE INDEX crew_invites_one_open ON crew_invites (sightline_id, email) WHERE accepted_at IS NULL AND revoked_at IS NULL`);

  await queryInterface.createTable('outings', {
    id: { type: DataTypes.UUID, primaryKey: true },
    sightline_id: sightline,
    created_by: user(true, 'SET NULL'),
    /** The night, by the local date of its evening in the site's zone. */
    night: { type: DataTypes.DATEONLY, allowNull: false },
    lineup_start: { type: DataTypes.DATE, allowNull: true },
    lineup_end: { type: DataTypes.DATE, allowNull: true },
    lineup_peak: { type: DataTypes.DATE, allowNull: true },
    meeting_lat: { type: DataTypes.DOUBLE, allowNull: false },
    meeting_lon: { type: DataTypes.DOUBLE, allowNull: false },
    meeting_at: { type: DataTypes.DATE, allowNull: false },
    meeting_note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    gear_notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    created_at: now,
    updated_at: now,
  });
  await sequelize.query(`
    ALTER TABLE outings
      ADD CONSTRAINT outings_meeting_lat CHECK (meeting_lat BETWEEN -90 AND 90),
      ADD CONSTRAINT outings_meeting_lon CHECK (meeting_lon BETWEEN -180 AND 180),
      ADD CONSTRAINT outings_gear_notes CHECK (length(gear_notes) <= 5000),
      ADD CONSTRAINT outings_lineup CHECK (
        (lineup_start IS NULL AND lineup_end IS NULL AND lineup_peak IS NULL)
        OR (lineup_start IS NOT NULL AND lineup_end IS NOT NULL AND lineup_peak IS NOT NULL AND lineup_start < lineup_end))
  `);
  await queryInterface.addIndex('outings', ['sightline_id', 'night']);

  await queryInterface.createTable('outing_responses', {
    outing_id: { type: DataTypes.UUID, allowNull: false, primaryKey: true, references: { model: 'outings', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { ...user(false, 'CASCADE'), primaryKey: true },
    answer: { type: DataTypes.STRING(10), allowNull: false },
    note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    updated_at: now,
  });
  await sequelize.query(`ALTER TABLE outing_responses ADD CONSTRAINT outing_responses_answer CHECK (answer IN ('going', 'maybe', 'not-going'))`);
};

export const down: Migration['down'] = async ({ queryInterface }) => {
  await queryInterface.dropTable('outing_responses');
  await queryInterface.dropTable('outings');
  await queryInterface.dropTable('crew_invites');
  await queryInterface.dropTable('crew_members');
};
