'use strict';

/**
 * Session notes (SOAP) for finished runs, and the indexes the review desk's filters and sorts use.
 *
 * The review desk lists finished runs only, so its run indexes are partial (WHERE status IN the finished
 * statuses): smaller, and the list's own predicate matches theirs word for word, which is what lets the
 * planner use them. Each ends in (created_at, id), the default order and its tie-break, so a filtered
 * first page is an index range read and a deep page an index-only walk (see review-service.ts).
 */
const FINISHED = "('completed','fell-back','stopped-referred','ended-early','abandoned')";

module.exports = {
  async up(queryInterface, Sequelize) {
    const staff = { type: Sequelize.UUID, allowNull: true, references: { model: 'users', key: 'id' } };

    await queryInterface.createTable('session_notes', {
      id: { type: Sequelize.UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
      clinic_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'clinics', key: 'id' } },
      run_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
      subjective: { type: Sequelize.TEXT, allowNull: false, defaultValue: '' },
      objective: { type: Sequelize.TEXT, allowNull: false, defaultValue: '' },
      assessment: { type: Sequelize.TEXT, allowNull: false, defaultValue: '' },
      plan: { type: Sequelize.TEXT, allowNull: false, defaultValue: '' },
      status: { type: Sequelize.STRING(10), allowNull: false, defaultValue: 'draft' },
      created_by: staff,
      updated_by: staff,
      submitted_by: staff,
      submitted_at: { type: Sequelize.DATE, allowNull: true },
      signed_by: staff,
      signed_at: { type: Sequelize.DATE, allowNull: true },
      sign_off_comment: { type: Sequelize.TEXT, allowNull: true },
      // Bumped by every change, so an audit event names the exact version it concerns.
      version: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 1 },
      created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
      updated_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    });
    await queryInterface.sequelize.query(
      "ALTER TABLE session_notes ADD CONSTRAINT session_notes_status_check CHECK (status IN ('draft','submitted','signed'))",
    );
    // A signed note always says who signed it and when: the lock means something only if that is true.
    await queryInterface.sequelize.query(
      "ALTER TABLE session_notes ADD CONSTRAINT session_notes_signed_check CHECK (status <> 'signed' OR (signed_by IS NOT NULL AND signed_at IS NOT NULL))",
    );
    // One note per run; drafting it twice at once finds the first. The status rides along so "note not
    // signed" is answered per run from the index alone.
    await queryInterface.sequelize.query('CREATE UNIQUE INDEX session_notes_run ON session_notes (run_id) INCLUDE (status)');
    // "Note signed" reads the clinic's signed notes at once, through this.
    await queryInterface.addIndex('session_notes', ['clinic_id', 'status', 'run_id'], { name: 'session_notes_clinic_status' });

    const q = queryInterface.sequelize;
    // Default order (newest first) and the date range. Status rides along (INCLUDE) so the outcome and
    // "needs attention" filters are checked in the index alone, without reading the table.
    await q.query(`CREATE INDEX runs_review_created ON runs (clinic_id, created_at, id) INCLUDE (status) WHERE status IN ${FINISHED}`);
    // Filter by therapist, athlete or phase, ordered by date; phase also serves the sort by phase, and the
    // therapist and athlete ones the sorts by name (each person's runs in date order).
    await q.query(`CREATE INDEX runs_review_therapist ON runs (clinic_id, therapist_id, created_at, id) INCLUDE (status) WHERE status IN ${FINISHED}`);
    await q.query(`CREATE INDEX runs_review_athlete ON runs (clinic_id, athlete_id, created_at, id) INCLUDE (status) WHERE status IN ${FINISHED}`);
    await q.query(`CREATE INDEX runs_review_phase ON runs (clinic_id, phase, created_at, id) INCLUDE (status) WHERE status IN ${FINISHED}`);
    // Outcome filter and sort: the outcome is the finished run's status.
    await q.query(`CREATE INDEX runs_review_status ON runs (clinic_id, status, created_at, id) WHERE status IN ${FINISHED}`);
    // Sorting by athlete or therapist walks the names in order through these, then each one's runs.
    await q.query('CREATE INDEX users_clinic_name ON users (clinic_id, name, id)');
    await q.query('CREATE INDEX athletes_clinic_name_id ON athletes (clinic_id, name, id)');
    /*
     * The log entries that make a run "need attention" beyond its status: a skipped required step, or a
     * completed ice massage outside 5–7 min (300–420 s, common practice; the step kind's bounds in
     * shared/plan/step-kinds.ts). Few entries qualify, so the index is tiny and the attention filter reads
     * all of a clinic's at once. If those bounds ever change, the query stops matching this predicate and
     * is still right, only slower, until a migration recreates the index with the new figures.
     */
    await q.query(
      `CREATE INDEX run_log_entries_attention ON run_log_entries (clinic_id, run_id)
       WHERE (type = 'step-skipped' AND detail IS DISTINCT FROM 'optional step')
          OR (type = 'step-completed' AND kind = 'ice-massage' AND (actual_seconds < 300 OR actual_seconds > 420))`,
    );
  },

  async down(queryInterface) {
    const q = queryInterface.sequelize;
    for (const name of [
      'run_log_entries_attention',
      'athletes_clinic_name_id',
      'users_clinic_name',
      'runs_review_status',
      'runs_review_phase',
      'runs_review_athlete',
      'runs_review_therapist',
      'runs_review_created',
    ]) {
      await q.query(`DROP INDEX IF EXISTS ${name}`);
    }
    await queryInterface.dropTable('session_notes');
  },
};
