'use strict';

/**
 * Demo athletes of the invented club, with injuries in every phase and a few weeks of measurements.
 * Times are relative to the first seeding, so a fresh demo shows each phase. Idempotent (fixed ids).
 */
const CLUB = '0a000000-0000-4000-8000-000000000001';
const OTHER = '0a000000-0000-4000-8000-000000000002';
const THERAPIST = '0b000000-0000-4000-8000-000000000001';
const OTHER_THERAPIST = '0b000000-0000-4000-8000-000000000004';

const athletes = [
  { id: '0c000000-0000-4000-8000-000000000001', clinic: CLUB, name: 'Callum Fenwright', year: 1998, sport: 'Football', position: 'Centre-back', email: 'callum.fenwright@example.org', consent: true },
  { id: '0c000000-0000-4000-8000-000000000002', clinic: CLUB, name: 'Idris Mallory', year: 2001, sport: 'Football', position: 'Striker', email: 'idris.mallory@example.org', consent: true },
  { id: '0c000000-0000-4000-8000-000000000003', clinic: CLUB, name: 'Noor Haverstock', year: 1996, sport: 'Football', position: 'Midfielder', email: 'noor.haverstock@example.org', consent: true },
  { id: '0c000000-0000-4000-8000-000000000004', clinic: CLUB, name: 'Ellis Brandvold', year: 2003, sport: 'Football', position: 'Goalkeeper', email: null, consent: true },
  { id: '0c000000-0000-4000-8000-000000000005', clinic: CLUB, name: 'Sami Okonkwo-Lind', year: 2000, sport: 'Football', position: 'Full-back', email: 'sami.ol@example.org', consent: false },
  { id: '0c000000-0000-4000-8000-000000000006', clinic: CLUB, name: 'Ffion Castellane', year: 1999, sport: 'Football', position: 'Winger', email: 'ffion.c@example.org', consent: true },
  { id: '0c000000-0000-4000-8000-000000000007', clinic: OTHER, name: 'Bryn Talloway', year: 1994, sport: 'Hurling', position: 'Half-back', email: null, consent: true },
];

const H = 3_600_000;
const D = 24 * H;

// [id, athlete, clinic, region, side, mechanismKind, mechanism, injured (ms ago), haematoma, prevQuad, effusion]
const injuries = [
  ['0d000000-0000-4000-8000-000000000001', 0, CLUB, 'anterior-thigh', 'left', 'knee-to-thigh', 'Opponent’s knee into the front of the thigh in an aerial challenge', 20 * H, 'intramuscular', false, false],
  ['0d000000-0000-4000-8000-000000000002', 1, CLUB, 'calf', 'right', 'collision', 'Studs to the calf in a sliding tackle', 10 * D, 'intermuscular', false, false],
  ['0d000000-0000-4000-8000-000000000003', 2, CLUB, 'anterior-thigh', 'right', 'knee-to-thigh', 'Dead leg from a knee in training', 27 * D, 'intramuscular', true, false],
  ['0d000000-0000-4000-8000-000000000004', 3, CLUB, 'upper-arm-front', 'left', 'ball', 'Struck by a driven shot at close range', 3 * D, 'not-known', false, false],
  ['0d000000-0000-4000-8000-000000000005', 4, CLUB, 'lateral-thigh', 'left', 'fall', 'Landed on the side of the thigh on a hard pitch', 15 * D, 'intermuscular', false, false],
  ['0d000000-0000-4000-8000-000000000006', 6, OTHER, 'calf', 'left', 'stick-or-bat', 'Hurley to the calf', 2 * D, 'not-known', false, false],
];

// [injury index, ms after injury, girth injured, girth other, flexion, pain, bruise L, bruise W, skinfold]
const measurements = [
  [0, 2 * H, 51.5, 49.0, 75, 6, 9, 6, 12],
  [0, 18 * H, 52.0, 49.0, 80, 5, 10, 6, null],
  [1, 1 * D, 38.5, 36.5, null, 5, 6, 4, 8],
  [1, 4 * D, 38.0, 36.5, null, 4, 7, 5, null],
  [1, 8 * D, 37.2, 36.5, null, 2, 6, 4, null],
  [2, 16 * H, 55.0, 52.0, 60, 7, 12, 8, 18],
  [2, 3 * D, 55.5, 52.0, 70, 6, 13, 8, null],
  [2, 8 * D, 54.2, 52.0, 95, 4, 11, 7, null],
  [2, 15 * D, 53.1, 52.0, 115, 2, 8, 5, null],
  [2, 24 * D, 52.5, 52.0, 132, 1, 4, 3, null],
  [3, 6 * H, 29.0, 28.0, null, 4, 5, 4, null],
  [3, 2 * D, 28.7, 28.0, null, 3, 5, 4, null],
  [4, 1 * D, 50.0, 48.5, 110, 4, 8, 5, 15],
  [4, 7 * D, 49.4, 48.5, 125, 3, 7, 4, null],
  [4, 13 * D, 48.9, 48.5, 135, 1, 4, 3, null],
  [5, 4 * H, 37.5, 36.0, null, 5, 5, 3, null],
];

const landmarkFor = {
  'anterior-thigh': ['superior pole of patella', 15],
  'lateral-thigh': ['superior pole of patella', 15],
  calf: ['tibial tuberosity', 12],
  'upper-arm-front': ['lateral epicondyle of humerus', 10],
};

module.exports = {
  async up(queryInterface) {
    if (process.env.NODE_ENV === 'production') return;
    const q = queryInterface.sequelize;
    const now = Date.now();
    for (const a of athletes) {
      const recorder = a.clinic === CLUB ? THERAPIST : OTHER_THERAPIST;
      await q.query(
        `INSERT INTO athletes (id, clinic_id, name, year_of_birth, sport, position, email, consent_to_treatment, consent_recorded_by, consent_recorded_at)
         VALUES (:id, :clinic, :name, :year, :sport, :position, :email, :consent, :by, :at) ON CONFLICT (id) DO NOTHING`,
        { replacements: { ...a, by: a.consent ? recorder : null, at: a.consent ? new Date(now - 40 * D) : null } },
      );
    }
    for (const [id, athlete, clinic, region, side, kind, mechanism, ago, haematoma, prevQuad, effusion] of injuries) {
      await q.query(
        `INSERT INTO injuries (id, clinic_id, athlete_id, region, side, mechanism_kind, mechanism, injured_at, haematoma_type,
           previous_quadriceps_injury, knee_effusion, treatment_started_at, created_by)
         VALUES (:id, :clinic, :athlete, :region, :side, :kind, :mechanism, :injuredAt, :haematoma, :prevQuad, :effusion, :treatment, :by)
         ON CONFLICT (id) DO NOTHING`,
        {
          replacements: {
            id, clinic, athlete: athletes[athlete].id, region, side, kind, mechanism,
            injuredAt: new Date(now - ago), haematoma, prevQuad, effusion,
            treatment: new Date(now - ago + 2 * H),
            by: clinic === CLUB ? THERAPIST : OTHER_THERAPIST,
          },
        },
      );
    }
    for (const [n, [injuryIndex, after, gi, go, flex, pain, bl, bw, skin]] of measurements.entries()) {
      const injury = injuries[injuryIndex];
      const [landmark, distance] = landmarkFor[injury[3]] ?? ['joint line', 10];
      const id = `0e000000-0000-4000-8000-${String(n + 1).padStart(12, '0')}`;
      await q.query(
        `INSERT INTO measurements (id, clinic_id, injury_id, taken_at, girth_injured_cm, girth_other_cm, girth_landmark, girth_distance_cm,
           knee_flexion_deg, pain_nprs, bruise_length_cm, bruise_width_cm, skinfold_mm, recorded_by)
         VALUES (:id, :clinic, :injury, :takenAt, :gi, :go, :landmark, :distance, :flex, :pain, :bl, :bw, :skin, :by)
         ON CONFLICT (id) DO NOTHING`,
        {
          replacements: {
            id, clinic: injury[2], injury: injury[0], takenAt: new Date(now - injury[7] + after),
            gi, go, landmark, distance, flex, pain, bl, bw, skin,
            by: injury[2] === CLUB ? THERAPIST : OTHER_THERAPIST,
          },
        },
      );
    }
  },

  async down(queryInterface) {
    const q = queryInterface.sequelize;
    await q.query(`DELETE FROM measurements WHERE id::text LIKE '0e000000-%'`);
    await q.query(`DELETE FROM injuries WHERE id::text LIKE '0d000000-%'`);
    await q.query(`DELETE FROM athletes WHERE id::text LIKE '0c000000-%'`);
  },
};
