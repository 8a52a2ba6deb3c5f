'use strict';

/**
 * Clinic operations: the next re-check of an injury, its closure with the return-to-activity check, the link
 * from a re-injury to the earlier episode, a guardian's consent for athletes under 18, and indexes for the
 * audit viewer's filters.
 */
module.exports = {
  async up(queryInterface, Sequelize) {
    const staff = { type: Sequelize.UUID, allowNull: true, references: { model: 'users', key: 'id' } };

    await queryInterface.sequelize.transaction(async (transaction) => {
      await queryInterface.addColumn('injuries', 'next_recheck_at', { type: Sequelize.DATE, allowNull: true }, { transaction });
      // Null while the time is Mendstep's suggestion after a run; the therapist's id once they move it.
      await queryInterface.addColumn('injuries', 'recheck_set_by', staff, { transaction });
      await queryInterface.addColumn(
        'injuries',
        'reinjury_of_id',
        { type: Sequelize.UUID, allowNull: true, references: { model: 'injuries', key: 'id' }, onDelete: 'SET NULL' },
        { transaction },
      );
      // { closedBy, criteria, allMet, measurement, reason }: an injury closes once; a re-injury is a new injury.
      await queryInterface.addColumn('injuries', 'closure', { type: Sequelize.JSONB, allowNull: true }, { transaction });
      await queryInterface.addIndex('injuries', ['clinic_id', 'status', 'next_recheck_at'], { transaction });
      await queryInterface.addIndex('injuries', ['reinjury_of_id'], { transaction });

      await queryInterface.addColumn('athletes', 'guardian_name', { type: Sequelize.STRING(120), allowNull: true }, { transaction });
      await queryInterface.addColumn('athletes', 'guardian_consent_recorded_by', staff, { transaction });
      await queryInterface.addColumn('athletes', 'guardian_consent_recorded_at', { type: Sequelize.DATE, allowNull: true }, { transaction });

      await queryInterface.addIndex('audit_events', ['clinic_id', 'user_id', 'created_at'], { transaction });
      await queryInterface.addIndex('audit_events', ['clinic_id', 'record_type', 'created_at'], { transaction });
    });
  },

  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      await queryInterface.removeIndex('audit_events', ['clinic_id', 'record_type', 'created_at'], { transaction });
      await queryInterface.removeIndex('audit_events', ['clinic_id', 'user_id', 'created_at'], { transaction });
      for (const column of ['guardian_consent_recorded_at', 'guardian_consent_recorded_by', 'guardian_name']) {
        await queryInterface.removeColumn('athletes', column, { transaction });
      }
      for (const column of ['closure', 'reinjury_of_id', 'recheck_set_by', 'next_recheck_at']) {
        await queryInterface.removeColumn('injuries', column, { transaction });
      }
    });
  },
};
