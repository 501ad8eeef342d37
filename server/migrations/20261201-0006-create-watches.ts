import { DataTypes } from 'sequelize';
import type { Migration } from '../db/migrator';

/**
 * Watches on sightlines, the e-mails they send (one per watch, lineup and lead time), the outbox
 * of the local SMTP fake, and each user's secret calendar feed.
 */
export const up: Migration['up'] = async ({ queryInterface, sequelize }) => {
  const now = sequelize.literal('now()');
  await queryInterface.createTable('watches', {
    id: { type: DataTypes.UUID, primaryKey: true },
    owner_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    sightline_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sightlines', key: 'id' }, onDelete: 'CASCADE' },
    target: { type: DataTypes.JSONB, allowNull: false },
    min_score: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0.3 },
    min_duration_min: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 5 },
    reachable_only: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    weekdays: { type: DataTypes.ARRAY(DataTypes.SMALLINT), allowNull: false, defaultValue: [1, 2, 3, 4, 5, 6, 7] },
    lead_days: { type: DataTypes.ARRAY(DataTypes.SMALLINT), allowNull: false, defaultValue: [3, 0] },
    paused: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await sequelize.query(`
    ALTER TABLE watches
      ADD CONSTRAINT watches_target CHECK (
        jsonb_typeof(target) = 'object'
        AND (target ? 'id' OR (target ? 'raHours' AND target ? 'decDeg' AND target ? 'name'))),
      ADD CONSTRAINT watches_min_score CHECK (min_score BETWEEN 0 AND 1),
      ADD CONSTRAINT watches_min_duration CHECK (min_duration_min BETWEEN 0 AND 1440),
      ADD CONSTRAINT watches_weekdays CHECK (
        cardinality(weekdays) BETWEEN 1 AND 7 AND weekdays <@ ARRAY[1, 2, 3, 4, 5, 6, 7]::smallint[]),
      ADD CONSTRAINT watches_lead_days CHECK (
        cardinality(lead_days) BETWEEN 1 AND 4 AND 0 <= ALL (lead_days) AND 30 >= ALL (lead_days))
  `);
  await queryInterface.addIndex('watches', ['owner_id']);
  await queryInterface.addIndex('watches', ['sightline_id']);
  await queryInterface.addIndex('watches', ['paused'], { where: { paused: false }, name: 'watches_active' });

  await queryInterface.createTable('watch_deliveries', {
    id: { type: DataTypes.UUID, primaryKey: true },
    watch_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'watches', key: 'id' }, onDelete: 'CASCADE' },
    lineup_start: { type: DataTypes.DATE, allowNull: false },
    lead_days: { type: DataTypes.SMALLINT, allowNull: false },
    status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'pending' },
    /** The lineup, its site's zone and target as found by the scan: what the e-mail shows. */
    snapshot: { type: DataTypes.JSONB, allowNull: false },
    message_id: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    claimed_at: { type: DataTypes.DATE, allowNull: true },
    claim_token: { type: DataTypes.UUID, allowNull: true },
    recipient: { type: DataTypes.STRING(254), allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    last_error: { type: DataTypes.TEXT, allowNull: true },
    unsubscribe_used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await queryInterface.addConstraint('watch_deliveries', {
    type: 'unique', fields: ['watch_id', 'lineup_start', 'lead_days'], name: 'watch_deliveries_once',
  });
  await sequelize.query(`
    ALTER TABLE watch_deliveries
      ADD CONSTRAINT watch_deliveries_status CHECK (status IN ('pending', 'sending', 'sent', 'failed', 'skipped')),
      ADD CONSTRAINT watch_deliveries_lead_days CHECK (lead_days BETWEEN 0 AND 30),
      ADD CONSTRAINT watch_deliveries_attempts CHECK (attempts >= 0),
      ADD CONSTRAINT watch_deliveries_snapshot CHECK (jsonb_typeof(snapshot) = 'object'),
      ADD CONSTRAINT watch_deliveries_sent CHECK (status <> 'sent' OR (sent_at IS NOT NULL AND recipient IS NOT NULL)),
      ADD CONSTRAINT watch_deliveries_claimed CHECK (status <> 'sending' OR (claimed_at IS NOT NULL AND claim_token IS NOT NULL))
  `);
  await queryInterface.addIndex('watch_deliveries', ['status', 'updated_at'], {
    where: { status: ['pending', 'sending'] }, name: 'watch_deliveries_open',
  });

  await queryInterface.createTable('outbox_messages', {
    id: { type: DataTypes.UUID, primaryKey: true },
    message_id: { type: DataTypes.STRING(998), allowNull: true },
    envelope_from: { type: DataTypes.STRING(320), allowNull: false },
    envelope_to: { type: DataTypes.ARRAY(DataTypes.STRING(320)), allowNull: false },
    subject: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    raw: { type: DataTypes.BLOB, allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    received_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await sequelize.query(`
    ALTER TABLE outbox_messages
      ADD CONSTRAINT outbox_messages_recipients CHECK (cardinality(envelope_to) >= 1),
      ADD CONSTRAINT outbox_messages_size CHECK (size_bytes >= 0 AND size_bytes = octet_length(raw))
  `);
  await queryInterface.addIndex('outbox_messages', ['received_at']);
  await queryInterface.addIndex('outbox_messages', ['message_id']);

  await queryInterface.createTable('calendar_feeds', {
    user_id: { type: DataTypes.UUID, primaryKey: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    secret: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await sequelize.query(`ALTER TABLE calendar_feeds ADD CONSTRAINT calendar_feeds_secret CHECK (secret ~ '^[A-Za-z0-9_-]{32,64}$')`);
};

export const down: Migration['down'] = async ({ queryInterface }) => {
  await queryInterface.dropTable('calendar_feeds');
  await queryInterface.dropTable('outbox_messages');
  await queryInterface.dropTable('watch_deliveries');
  await queryInterface.dropTable('watches');
};
