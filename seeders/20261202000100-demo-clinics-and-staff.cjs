'use strict';

/**
 * Demo data: an invented club's treatment room and a second, unrelated clinic.
 * Idempotent: inserts only the rows that are missing. Never runs in production.
 */
const bcrypt = require('bcrypt');

const DEMO_PASSWORD = 'demo-table-2026';

const clinics = [
  { id: '0a000000-0000-4000-8000-000000000001', name: 'Cresswater Wanderers — Treatment Room', timeZone: 'Europe/London' },
  { id: '0a000000-0000-4000-8000-000000000002', name: 'Brindle Cove Sports Clinic', timeZone: 'Europe/Dublin' },
];

const staff = [
  { id: '0b000000-0000-4000-8000-000000000001', clinic: 0, email: 'therapist@mendstep.test', name: 'Tamsin Ruel', role: 'therapist' },
  { id: '0b000000-0000-4000-8000-000000000002', clinic: 0, email: 'supervisor@mendstep.test', name: 'Owen Halloway', role: 'supervisor' },
  { id: '0b000000-0000-4000-8000-000000000003', clinic: 0, email: 'admin@mendstep.test', name: 'Priya Castell', role: 'admin' },
  { id: '0b000000-0000-4000-8000-000000000004', clinic: 1, email: 'therapist@other.mendstep.test', name: 'Jonah Pike', role: 'therapist' },
];

module.exports = {
  async up(queryInterface) {
    if (process.env.NODE_ENV === 'production') return;
    const q = queryInterface.sequelize;
    for (const clinic of clinics) {
      await q.query(
        `INSERT INTO clinics (id, name, settings) VALUES (:id, :name, :settings::jsonb) ON CONFLICT (id) DO NOTHING`,
        { replacements: { id: clinic.id, name: clinic.name, settings: JSON.stringify({ timeZone: clinic.timeZone }) } },
      );
    }
    // One hash for every demo account: bcrypt at cost 12 takes a noticeable fraction of a second.
    const passwordHash = await bcrypt.hash(DEMO_PASSWORD, 12);
    for (const person of staff) {
      await q.query(
        `INSERT INTO users (id, clinic_id, email, name, role, password_hash, active)
         VALUES (:id, :clinicId, :email, :name, :role, :passwordHash, true)
         ON CONFLICT DO NOTHING`,
        {
          replacements: {
            id: person.id,
            clinicId: clinics[person.clinic].id,
            email: person.email,
            name: person.name,
            role: person.role,
            passwordHash,
          },
        },
      );
    }
  },

  async down(queryInterface) {
    await queryInterface.sequelize.query(`DELETE FROM users WHERE id IN (:ids)`, { replacements: { ids: staff.map((s) => s.id) } });
    await queryInterface.sequelize.query(`DELETE FROM clinics WHERE id IN (:ids)`, { replacements: { ids: clinics.map((c) => c.id) } });
  },
};
