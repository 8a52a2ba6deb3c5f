'use strict';

/**
 * Data rights and e-mail opt-out: when an athlete opted out of e-mails, when (and by whom) their personal data
 * was erased, and the single-use opt-out links every e-mail to an athlete carries (only a hash is stored, as for
 * staff links in auth_tokens; a separate table because those belong to staff accounts, not athletes).
 * See docs/decisions/0090-athlete-export-and-erasure.md and 0091-email-opt-out-links.md.
 */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      await queryInterface.addColumn('athletes', 'email_opted_out_at', { type: Sequelize.DATE, allowNull: true }, { transaction });
      await queryInterface.addColumn('athletes', 'erased_at', { type: Sequelize.DATE, allowNull: true }, { transaction });
      await queryInterface.addColumn(
        'athletes',
        'erased_by',
        { type: Sequelize.UUID, allowNull: true, references: { model: 'users', key: 'id' } },
        { transaction },
      );

      await queryInterface.createTable(
        'email_opt_out_tokens',
        {
          id: { type: Sequelize.UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
          clinic_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'clinics', key: 'id' } },
          athlete_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'athletes', key: 'id' }, onDelete: 'CASCADE' },
          // SHA-256 of the token: the token itself exists only in the e-mail.
          token_hash: { type: Sequelize.STRING(64), allowNull: false, unique: true },
          expires_at: { type: Sequelize.DATE, allowNull: false },
          used_at: { type: Sequelize.DATE, allowNull: true },
          created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
        },
        { transaction },
      );
      await queryInterface.addIndex('email_opt_out_tokens', ['clinic_id', 'athlete_id'], { transaction });
    });
  },

  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      await queryInterface.dropTable('email_opt_out_tokens', { transaction });
      for (const column of ['erased_by', 'erased_at', 'email_opted_out_at']) {
        await queryInterface.removeColumn('athletes', column, { transaction });
      }
    });
  },
};
