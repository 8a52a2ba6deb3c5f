'use strict';

/**
 * E-mail and uploads: the outbox every message waits in until an SMTP server accepts it, the local fake
 * server's mailbox (outside production only), single-use account tokens (invitations, password resets) and
 * uploaded files (bruise photos, signed consent forms).
 */
module.exports = {
  async up(queryInterface, Sequelize) {
    const id = { type: Sequelize.UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
    const clinic = { type: Sequelize.UUID, allowNull: false, references: { model: 'clinics', key: 'id' } };
    const createdAt = { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') };

    await queryInterface.createTable('outbound_emails', {
      id,
      clinic_id: clinic,
      kind: { type: Sequelize.STRING(40), allowNull: false },
      // The same cause (a run's home-care plan, one supervisor's alert for a run) is queued once.
      dedupe_key: { type: Sequelize.STRING(200), allowNull: true, unique: true },
      to_address: { type: Sequelize.STRING(254), allowNull: false },
      subject: { type: Sequelize.STRING(300), allowNull: false },
      text: { type: Sequelize.TEXT, allowNull: false },
      html: { type: Sequelize.TEXT, allowNull: true },
      // [{ filename, contentType, contentBase64 }]: small (an .ics), so kept with the row.
      attachments: { type: Sequelize.JSONB, allowNull: false, defaultValue: [] },
      message_id: { type: Sequelize.STRING(300), allowNull: false },
      status: { type: Sequelize.STRING(24), allowNull: false, defaultValue: 'pending' },
      attempts: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
      next_attempt_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
      // A message that would mislead once stale (today's cold schedule, an expired link) is not sent after this.
      discard_after: { type: Sequelize.DATE, allowNull: true },
      last_error: { type: Sequelize.TEXT, allowNull: true },
      sent_at: { type: Sequelize.DATE, allowNull: true },
      created_at: createdAt,
      updated_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    });
    await queryInterface.sequelize.query(
      "ALTER TABLE outbound_emails ADD CONSTRAINT outbound_emails_status_check CHECK (status IN ('pending', 'sent', 'failed-permanently'))",
    );
    await queryInterface.sequelize.query(
      "CREATE INDEX outbound_emails_due ON outbound_emails (next_attempt_at) WHERE status = 'pending'",
    );
    await queryInterface.addIndex('outbound_emails', ['clinic_id', 'created_at']);
    await queryInterface.addIndex('outbound_emails', ['message_id']);

    await queryInterface.createTable('mailbox_messages', {
      id,
      // Known when the message came from our own outbox (matched by Message-ID); the mailbox shows a clinic's own.
      clinic_id: { type: Sequelize.UUID, allowNull: true, references: { model: 'clinics', key: 'id' }, onDelete: 'CASCADE' },
      message_id: { type: Sequelize.STRING(300), allowNull: true },
      envelope_from: { type: Sequelize.STRING(254), allowNull: true },
      recipients: { type: Sequelize.JSONB, allowNull: false, defaultValue: [] },
      subject: { type: Sequelize.STRING(500), allowNull: true },
      raw: { type: Sequelize.BLOB, allowNull: false },
      byte_size: { type: Sequelize.INTEGER, allowNull: false },
      received_at: createdAt,
    });
    await queryInterface.addIndex('mailbox_messages', ['clinic_id', 'received_at']);
    await queryInterface.addIndex('mailbox_messages', ['message_id']);

    await queryInterface.createTable('auth_tokens', {
      id,
      clinic_id: clinic,
      user_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      purpose: { type: Sequelize.STRING(20), allowNull: false },
      // SHA-256 of the token: the token itself exists only in the e-mail.
      token_hash: { type: Sequelize.STRING(64), allowNull: false, unique: true },
      expires_at: { type: Sequelize.DATE, allowNull: false },
      used_at: { type: Sequelize.DATE, allowNull: true },
      created_by: { type: Sequelize.UUID, allowNull: true, references: { model: 'users', key: 'id' } },
      created_at: createdAt,
    });
    await queryInterface.sequelize.query(
      "ALTER TABLE auth_tokens ADD CONSTRAINT auth_tokens_purpose_check CHECK (purpose IN ('invitation', 'password-reset'))",
    );
    await queryInterface.addIndex('auth_tokens', ['clinic_id', 'user_id', 'purpose']);

    await queryInterface.createTable('uploads', {
      id,
      clinic_id: clinic,
      kind: { type: Sequelize.STRING(24), allowNull: false },
      measurement_id: { type: Sequelize.UUID, allowNull: true, references: { model: 'measurements', key: 'id' } },
      injury_id: { type: Sequelize.UUID, allowNull: true, references: { model: 'injuries', key: 'id' } },
      athlete_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'athletes', key: 'id' } },
      storage_key: { type: Sequelize.STRING(300), allowNull: false, unique: true },
      content_type: { type: Sequelize.STRING(100), allowNull: false },
      byte_size: { type: Sequelize.INTEGER, allowNull: false },
      sha256: { type: Sequelize.STRING(64), allowNull: false },
      original_name: { type: Sequelize.STRING(255), allowNull: true },
      uploaded_by: { type: Sequelize.UUID, allowNull: true, references: { model: 'users', key: 'id' } },
      created_at: createdAt,
    });
    await queryInterface.sequelize.query(`
      ALTER TABLE uploads ADD CONSTRAINT uploads_kind_check CHECK (
        (kind = 'measurement-photo' AND measurement_id IS NOT NULL AND injury_id IS NOT NULL)
        OR (kind = 'consent-form' AND measurement_id IS NULL))`);
    await queryInterface.addIndex('uploads', ['clinic_id', 'injury_id']);
    await queryInterface.addIndex('uploads', ['clinic_id', 'athlete_id', 'kind']);
    await queryInterface.addIndex('uploads', ['measurement_id']);
  },

  async down(queryInterface) {
    await queryInterface.dropTable('uploads');
    await queryInterface.dropTable('auth_tokens');
    await queryInterface.dropTable('mailbox_messages');
    await queryInterface.dropTable('outbound_emails');
  },
};
