'use strict';

/** Athletes, their injuries and the measurements taken over time; every row scoped to a clinic. */
module.exports = {
  async up(queryInterface, Sequelize) {
    const id = { type: Sequelize.UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
    const clinic = { type: Sequelize.UUID, allowNull: false, references: { model: 'clinics', key: 'id' } };
    const staff = { type: Sequelize.UUID, allowNull: true, references: { model: 'users', key: 'id' } };
    const timestamps = {
      created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
      updated_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    };

    await queryInterface.createTable('athletes', {
      id,
      clinic_id: clinic,
      name: { type: Sequelize.STRING(120), allowNull: false },
      year_of_birth: { type: Sequelize.INTEGER, allowNull: false },
      sport: { type: Sequelize.STRING(80), allowNull: false },
      position: { type: Sequelize.STRING(80), allowNull: true },
      email: { type: Sequelize.STRING(254), allowNull: true },
      consent_to_treatment: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: false },
      consent_recorded_by: staff,
      consent_recorded_at: { type: Sequelize.DATE, allowNull: true },
      notes: { type: Sequelize.TEXT, allowNull: true },
      ...timestamps,
    });
    await queryInterface.sequelize.query('CREATE INDEX athletes_clinic_name ON athletes (clinic_id, lower(name))');
    await queryInterface.addIndex('athletes', ['clinic_id', 'created_at']);

    await queryInterface.createTable('injuries', {
      id,
      clinic_id: clinic,
      athlete_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'athletes', key: 'id' }, onDelete: 'CASCADE' },
      region: { type: Sequelize.STRING(40), allowNull: false },
      side: { type: Sequelize.STRING(5), allowNull: false },
      mechanism_kind: { type: Sequelize.STRING(20), allowNull: false },
      mechanism: { type: Sequelize.STRING(500), allowNull: true },
      injured_at: { type: Sequelize.DATE, allowNull: false },
      haematoma_type: { type: Sequelize.STRING(20), allowNull: false, defaultValue: 'not-known' },
      previous_quadriceps_injury: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: false },
      knee_effusion: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: false },
      treatment_started_at: { type: Sequelize.DATE, allowNull: true },
      status: { type: Sequelize.STRING(10), allowNull: false, defaultValue: 'open' },
      closed_at: { type: Sequelize.DATE, allowNull: true },
      // { phase, reason, by, at } while a therapist's override stands.
      phase_override: { type: Sequelize.JSONB, allowNull: true },
      created_by: staff,
      ...timestamps,
    });
    await queryInterface.sequelize.query(
      "ALTER TABLE injuries ADD CONSTRAINT injuries_status_check CHECK (status IN ('open', 'closed'))",
    );
    await queryInterface.addIndex('injuries', ['clinic_id', 'status', 'injured_at']);
    await queryInterface.addIndex('injuries', ['athlete_id']);

    await queryInterface.createTable('measurements', {
      id,
      clinic_id: clinic,
      injury_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'injuries', key: 'id' }, onDelete: 'CASCADE' },
      taken_at: { type: Sequelize.DATE, allowNull: false },
      girth_injured_cm: { type: Sequelize.DOUBLE, allowNull: true },
      girth_other_cm: { type: Sequelize.DOUBLE, allowNull: true },
      girth_landmark: { type: Sequelize.STRING(120), allowNull: true },
      girth_distance_cm: { type: Sequelize.DOUBLE, allowNull: true },
      knee_flexion_deg: { type: Sequelize.INTEGER, allowNull: true },
      pain_nprs: { type: Sequelize.INTEGER, allowNull: true },
      bruise_length_cm: { type: Sequelize.DOUBLE, allowNull: true },
      bruise_width_cm: { type: Sequelize.DOUBLE, allowNull: true },
      skinfold_mm: { type: Sequelize.DOUBLE, allowNull: true },
      notes: { type: Sequelize.TEXT, allowNull: true },
      recorded_by: staff,
      ...timestamps,
    });
    await queryInterface.addIndex('measurements', ['injury_id', 'taken_at']);
    await queryInterface.addIndex('measurements', ['clinic_id']);
  },

  async down(queryInterface) {
    await queryInterface.dropTable('measurements');
    await queryInterface.dropTable('injuries');
    await queryInterface.dropTable('athletes');
  },
};
