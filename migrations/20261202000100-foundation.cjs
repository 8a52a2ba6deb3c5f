'use strict';

/** Clinics, staff, the session store's table and the audit trail. */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.sequelize.query('CREATE EXTENSION IF NOT EXISTS pgcrypto');

    await queryInterface.createTable('clinics', {
      id: { type: Sequelize.UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
      name: { type: Sequelize.STRING(160), allowNull: false },
      settings: { type: Sequelize.JSONB, allowNull: false, defaultValue: {} },
      created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
      updated_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    });

    await queryInterface.createTable('users', {
      id: { type: Sequelize.UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
      clinic_id: {
        type: Sequelize.UUID,
        allowNull: false,
        references: { model: 'clinics', key: 'id' },
        onDelete: 'RESTRICT',
      },
      email: { type: Sequelize.STRING(254), allowNull: false },
      name: { type: Sequelize.STRING(120), allowNull: false },
      role: { type: Sequelize.STRING(20), allowNull: false },
      password_hash: { type: Sequelize.STRING(100), allowNull: true },
      active: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: true },
      created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
      updated_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    });
    await queryInterface.sequelize.query(
      "ALTER TABLE users ADD CONSTRAINT users_role_check CHECK (role IN ('therapist', 'supervisor', 'admin'))",
    );
    // E-mail addresses are unique whatever their case.
    await queryInterface.sequelize.query('CREATE UNIQUE INDEX users_email_unique ON users (lower(email))');
    await queryInterface.addIndex('users', ['clinic_id']);

    // The table connect-pg-simple expects (its own table.sql).
    await queryInterface.sequelize.query(`
      CREATE TABLE "session" (
        "sid" varchar NOT NULL COLLATE "default" PRIMARY KEY,
        "sess" json NOT NULL,
        "expire" timestamp(6) NOT NULL
      )`);
    await queryInterface.sequelize.query('CREATE INDEX "IDX_session_expire" ON "session" ("expire")');

    await queryInterface.createTable('audit_events', {
      id: { type: Sequelize.BIGINT, primaryKey: true, autoIncrement: true },
      clinic_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'clinics', key: 'id' } },
      user_id: { type: Sequelize.UUID, allowNull: true, references: { model: 'users', key: 'id' } },
      action: { type: Sequelize.STRING(80), allowNull: false },
      record_type: { type: Sequelize.STRING(40), allowNull: false },
      record_id: { type: Sequelize.STRING(64), allowNull: true },
      detail: { type: Sequelize.JSONB, allowNull: false, defaultValue: {} },
      created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    });
    await queryInterface.addIndex('audit_events', ['clinic_id', 'created_at']);
    await queryInterface.addIndex('audit_events', ['record_type', 'record_id']);
  },

  async down(queryInterface) {
    await queryInterface.dropTable('audit_events');
    await queryInterface.dropTable('session');
    await queryInterface.dropTable('users');
    await queryInterface.dropTable('clinics');
  },
};
