'use strict';

/** Clinic sequences (versioned), runs with the plan snapshot they ran, and each run's step log. */
module.exports = {
  async up(queryInterface, Sequelize) {
    const id = { type: Sequelize.UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
    const clinic = { type: Sequelize.UUID, allowNull: false, references: { model: 'clinics', key: 'id' } };

    await queryInterface.createTable('sequences', {
      id,
      clinic_id: clinic,
      phase: { type: Sequelize.STRING(20), allowNull: false },
      version: { type: Sequelize.INTEGER, allowNull: false },
      steps: { type: Sequelize.JSONB, allowNull: false },
      created_by: { type: Sequelize.UUID, allowNull: true, references: { model: 'users', key: 'id' } },
      created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    });
    await queryInterface.addIndex('sequences', ['clinic_id', 'phase', 'version'], { unique: true, name: 'sequences_clinic_phase_version' });

    await queryInterface.createTable('runs', {
      id,
      clinic_id: clinic,
      injury_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'injuries', key: 'id' }, onDelete: 'CASCADE' },
      athlete_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'athletes', key: 'id' }, onDelete: 'CASCADE' },
      therapist_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'users', key: 'id' } },
      phase: { type: Sequelize.STRING(20), allowNull: false },
      status: { type: Sequelize.STRING(20), allowNull: false },
      outcome: { type: Sequelize.STRING(24), allowNull: true },
      plan: { type: Sequelize.JSONB, allowNull: false },
      sequence_id: { type: Sequelize.UUID, allowNull: true, references: { model: 'sequences', key: 'id' } },
      sequence_version: { type: Sequelize.INTEGER, allowNull: true },
      screening: { type: Sequelize.JSONB, allowNull: true },
      red_flags: { type: Sequelize.JSONB, allowNull: true },
      started_at: { type: Sequelize.DATE, allowNull: true },
      ended_at: { type: Sequelize.DATE, allowNull: true },
      last_activity_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
      created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
      updated_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    });
    await queryInterface.sequelize.query(
      "ALTER TABLE runs ADD CONSTRAINT runs_status_check CHECK (status IN ('screening','ready','running','completed','fell-back','stopped-referred','ended-early','abandoned'))",
    );
    // One active run per injury (decisions): a second start finds the first.
    await queryInterface.sequelize.query(
      "CREATE UNIQUE INDEX runs_one_active_per_injury ON runs (injury_id) WHERE status IN ('screening','ready','running')",
    );
    await queryInterface.addIndex('runs', ['clinic_id', 'created_at']);
    await queryInterface.addIndex('runs', ['clinic_id', 'status', 'created_at']);
    await queryInterface.addIndex('runs', ['injury_id', 'created_at']);

    await queryInterface.createTable('run_log_entries', {
      id: { type: Sequelize.BIGINT, primaryKey: true, autoIncrement: true },
      clinic_id: clinic,
      run_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
      idempotency_key: { type: Sequelize.UUID, allowNull: false },
      body_hash: { type: Sequelize.STRING(64), allowNull: false },
      seq: { type: Sequelize.INTEGER, allowNull: true },
      type: { type: Sequelize.STRING(24), allowNull: false },
      step_index: { type: Sequelize.INTEGER, allowNull: true },
      kind: { type: Sequelize.STRING(32), allowNull: true },
      planned_seconds: { type: Sequelize.INTEGER, allowNull: true },
      actual_seconds: { type: Sequelize.INTEGER, allowNull: true },
      at: { type: Sequelize.DATE, allowNull: false },
      reason: { type: Sequelize.STRING(500), allowNull: true },
      detail: { type: Sequelize.STRING(500), allowNull: true },
      recorded_by: { type: Sequelize.UUID, allowNull: true, references: { model: 'users', key: 'id' } },
      created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    });
    // The same entry sent twice (a retry) is stored once: the key settles races between retries.
    await queryInterface.addIndex('run_log_entries', ['run_id', 'idempotency_key'], { unique: true, name: 'run_log_entries_run_key' });
    await queryInterface.addIndex('run_log_entries', ['run_id', 'seq', 'at']);
  },

  async down(queryInterface) {
    await queryInterface.dropTable('run_log_entries');
    await queryInterface.dropTable('runs');
    await queryInterface.dropTable('sequences');
  },
};
