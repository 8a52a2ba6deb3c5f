'use strict';

/**
 * A few weeks of invented runs for the demo club, so the review desk has something to review on first start:
 * completed runs, fall backs to cold, a red-flag stop, an early end, a skipped required step, an ice massage
 * over 7 minutes, and session notes signed, submitted and waiting, or still drafts.
 *
 * Plans and notes come from the product's own code (shared/plan/build-plan.ts and shared/notes/draft-note.ts,
 * loaded through tsx), so the demo shows exactly what the product would have written. Every run is finished:
 * none is left active on an open injury, so table mode can start a new one anywhere. Run times are offsets
 * from each injury's stored time, so a later first seeding still places them after the injury and before now.
 * Idempotent: fixed ids, ON CONFLICT DO NOTHING.
 */
const path = require('node:path');
const { createHash } = require('node:crypto');

const CLUB = '0a000000-0000-4000-8000-000000000001';
const TAMSIN = '0b000000-0000-4000-8000-000000000001'; // therapist
const OWEN = '0b000000-0000-4000-8000-000000000002'; // supervisor, who also treats
const H = 3_600_000;
const D = 24 * H;

const injuryIds = {
  callum: '0d000000-0000-4000-8000-000000000001', // anterior thigh, acute
  idris: '0d000000-0000-4000-8000-000000000002', // calf, 10 days
  noor: '0d000000-0000-4000-8000-000000000003', // anterior thigh, 27 days
  ellis: '0d000000-0000-4000-8000-000000000004', // upper arm, 3 days
  ffion: '54000000-0000-4000-8000-000000000001', // posterior thigh, healed and closed (added here)
};

// Ffion's earlier contusion, treated through all three phases and closed: the oldest weeks of runs.
const ffionInjury = {
  id: injuryIds.ffion,
  athlete: '0c000000-0000-4000-8000-000000000006',
  region: 'posterior-thigh',
  side: 'right',
  mechanismKind: 'knee-to-thigh',
  mechanism: 'Knee into the back of the thigh in a goalmouth scramble',
  ago: 38 * D,
  closedAgo: 9 * D,
};
// [ms after injury, girth injured, girth other, flexion, pain, bruise L, bruise W, skinfold, notes]
const ffionMeasurements = [
  [3 * H, 54.0, 51.5, 105, 6, 10, 7, 14, 'Sharp pain on the first steps; limping'],
  [8 * D, 53.0, 51.5, 120, 3, 8, 5, null, null],
  [16 * D, 52.2, 51.5, 132, 2, 5, 3, null, 'Back to light jogging without pain'],
  [26 * D, 51.7, 51.5, 140, 0, null, null, null, 'Full range, pain free: ready to close'],
];

/*
 * The runs: injury, therapist, time after the injury, and what happened at the table. `note` is the session
 * note's state: null (nobody has opened it yet), 'draft', 'submitted' (waiting for sign-off) or 'signed'.
 */
const runs = [
  // Ffion: posterior thigh, weeks ago, through to full function.
  { n: 1, injury: 'ffion', by: TAMSIN, after: 1 * D + 2 * H, note: 'signed', comment: 'Cold and wrap as planned. Good.' },
  { n: 2, injury: 'ffion', by: TAMSIN, after: 4 * D + 1 * H, note: 'signed', comment: null },
  { n: 3, injury: 'ffion', by: OWEN, after: 9 * D + 3 * H, note: 'signed', comment: 'Reviewed with Tamsin.' },
  { n: 4, injury: 'ffion', by: TAMSIN, after: 13 * D + 2 * H, note: 'signed', comment: null, skip: { 5: 'Area not sore after the session' } },
  { n: 5, injury: 'ffion', by: TAMSIN, after: 17 * D + 4 * H, note: 'signed', comment: 'Ice massage time spot on.' },
  { n: 6, injury: 'ffion', by: TAMSIN, after: 23 * D + 2 * H, note: 'signed', comment: null, skip: { 7: 'Not sore after the deep work' } },
  { n: 7, injury: 'ffion', by: TAMSIN, after: 27 * D + 2 * H, note: 'signed', comment: 'Ready to close the injury.', skip: { 7: 'Not sore after the deep work' } },
  // Noor: anterior thigh, four weeks.
  { n: 8, injury: 'noor', by: TAMSIN, after: 1 * D, note: 'signed', comment: null },
  { n: 9, injury: 'noor', by: TAMSIN, after: 3 * D + 2 * H, note: 'signed', comment: null, swellingIncreasedInAcute: true },
  { n: 10, injury: 'noor', by: TAMSIN, after: 8 * D + 1 * H, note: 'signed', comment: 'Pain settling; keep the range work gentle.' },
  { n: 11, injury: 'noor', by: TAMSIN, after: 11 * D + 2 * H, note: 'signed', comment: 'Right call to go back to cold.', fallBack: { index: 1, afterSeconds: 140 } },
  { n: 12, injury: 'noor', by: OWEN, after: 14 * D + 3 * H, note: 'signed', comment: null },
  { n: 13, injury: 'noor', by: TAMSIN, after: 18 * D + 2 * H, note: 'submitted', actual: { 0: 450 } },
  { n: 14, injury: 'noor', by: TAMSIN, after: 22 * D + 1 * H, note: 'submitted', skip: { 7: 'Not sore after the deep work' } },
  { n: 15, injury: 'noor', by: TAMSIN, after: 25 * D + 3 * H, note: 'draft', skip: { 7: 'Not sore after the deep work' } },
  // Idris: calf, ten days.
  { n: 16, injury: 'idris', by: TAMSIN, after: 1 * D + 1 * H, note: 'signed', comment: null },
  { n: 17, injury: 'idris', by: TAMSIN, after: 4 * D + 2 * H, note: 'signed', comment: 'Fine to stop; repeat next day.', endEarly: { index: 1, afterSeconds: 60, reason: 'Athlete called to the team bus' } },
  { n: 18, injury: 'idris', by: TAMSIN, after: 7 * D + 2 * H, note: 'submitted', fallBack: { index: 0, afterSeconds: 200 } },
  { n: 19, injury: 'idris', by: TAMSIN, after: 9 * D + 3 * H, note: 'submitted', skip: { 1: 'Too tender for strokes today' } },
  // Ellis: upper arm, three days.
  { n: 20, injury: 'ellis', by: TAMSIN, after: 8 * H, note: 'submitted' },
  { n: 21, injury: 'ellis', by: OWEN, after: 2 * D + 1 * H, note: 'draft', redFlag: { index: 0, afterSeconds: 420, flag: 'numbness-or-cold-pale-limb' } },
  // Callum: anterior thigh, today; the note not opened yet.
  { n: 22, injury: 'callum', by: TAMSIN, after: 16 * H, note: null },
];

const id = (prefix, n) => `${prefix}-0000-4000-8000-${String(n).padStart(12, '0')}`;
const runId = (n) => id('51000000', n);
const noteId = (n) => id('52000000', n);
const entryKey = (run, seq) => `53000000-0000-4000-8000-${String(run).padStart(6, '0')}${String(seq).padStart(6, '0')}`;

/** The server's idempotency hash (run-service hashEntry): sorted keys, undefined left out. */
function hashEntry(entry) {
  const canonical = JSON.stringify(
    Object.fromEntries(Object.entries(entry).filter(([, v]) => v !== undefined).sort(([a], [b]) => a.localeCompare(b))),
  );
  return createHash('sha256').update(canonical).digest('hex');
}

/** What table mode would have logged for this script, step by step (machines/treatment-run.ts). */
function simulate(plan, startMs, script, labels) {
  const entries = [];
  let cursor = startMs;
  const iso = () => new Date(cursor).toISOString();
  const push = (entry) => entries.push({ seq: entries.length + 1, ...entry });
  const stepEntry = (type, step, extra) => ({ type, stepIndex: step.index, kind: step.kind, plannedSeconds: step.seconds, at: iso(), ...extra });

  for (const step of plan.steps) {
    const stop = [script.fallBack, script.redFlag, script.endEarly].find((s) => s && s.index === step.index);
    if (stop) {
      cursor += stop.afterSeconds * 1000;
      if (script.fallBack === stop) {
        push(stepEntry('step-interrupted', step, { actualSeconds: stop.afterSeconds, reason: 'swelling increased' }));
        push({ type: 'swelling-check', stepIndex: step.index, kind: step.kind, at: iso(), detail: 'increased' });
        // After ice the skin rests for the clinic's interval before a fresh cold pack (decisions.md).
        if (labels.cold[step.kind] && plan.minColdIntervalSeconds > 0) {
          cursor += plan.minColdIntervalSeconds * 1000;
          push({ type: 'step-completed', kind: 'rest-recheck', plannedSeconds: plan.minColdIntervalSeconds, actualSeconds: plan.minColdIntervalSeconds, at: iso(), detail: 'back to cold' });
        }
        const cold = plan.steps.find((s) => s.kind === 'cold-pack')?.seconds ?? 1200;
        cursor += cold * 1000;
        push({ type: 'step-completed', kind: 'cold-pack', plannedSeconds: cold, actualSeconds: cold, at: iso(), detail: 'back to cold' });
        const wrap = plan.steps.find((s) => s.kind === 'compression-wrap')?.seconds ?? 180;
        cursor += (wrap - 15) * 1000;
        push({ type: 'step-completed', kind: 'compression-wrap', plannedSeconds: wrap, actualSeconds: wrap - 15, at: iso(), detail: 'back to cold' });
        push({ type: 'run-fell-back', at: iso(), reason: 'swelling increased', detail: `back to cold after ${labels.label[step.kind].toLowerCase()}` });
        return { entries, status: 'fell-back', outcome: 'fell-back', redFlags: null };
      }
      if (script.redFlag === stop) {
        const label = labels.redFlag(stop.flag);
        push(stepEntry('step-interrupted', step, { actualSeconds: stop.afterSeconds, reason: `red flag: ${label}` }));
        push({ type: 'red-flag', stepIndex: step.index, kind: step.kind, at: iso(), reason: stop.flag, detail: label });
        return { entries, status: 'stopped-referred', outcome: 'stopped-referred', redFlags: [stop.flag] };
      }
      push(stepEntry('step-interrupted', step, { actualSeconds: stop.afterSeconds, reason: stop.reason }));
      push({ type: 'run-ended-early', at: iso(), reason: stop.reason });
      return { entries, status: 'ended-early', outcome: 'ended-early', redFlags: null };
    }
    const skipReason = script.skip?.[step.index];
    if (skipReason) {
      push(stepEntry('step-skipped', step, { actualSeconds: 0, reason: skipReason, detail: step.optional ? 'optional step' : 'required step' }));
      continue;
    }
    // Confirm steps end when the therapist taps: usually a little before their guide time.
    const actual = script.actual?.[step.index] ?? (step.needsConfirm ? step.seconds - 20 : step.seconds);
    if (step.kind === 'rest-recheck' && script.swellingIncreasedInAcute && plan.phase === 'acute') {
      // Acute: the plan is already cold and compression, so table mode logs the finding and carries on.
      push({ type: 'swelling-check', stepIndex: step.index, kind: step.kind, at: new Date(cursor + (actual - 30) * 1000).toISOString(), detail: 'increased' });
    }
    cursor += actual * 1000;
    push(stepEntry('step-completed', step, { actualSeconds: actual }));
    if (step.kind === 'rest-recheck') {
      push({ type: 'swelling-check', stepIndex: step.index, kind: step.kind, at: iso(), detail: 'not increased' });
    }
  }
  push({ type: 'run-completed', at: iso() });
  return { entries, status: 'completed', outcome: 'completed', redFlags: null };
}

/**
 * The run's start: its day after the injury, at a plausible hour of the clinic's working day (09:00–16:59
 * local), unless that would fall before the injury was first treated or too close to now.
 */
function workingHour(injuredAt, after, n, timeZone) {
  const { DateTime } = require('luxon');
  const raw = injuredAt + after;
  const local = DateTime.fromMillis(raw, { zone: timeZone }).set({ hour: 9 + (n % 8), minute: (n * 17) % 60, second: 0, millisecond: 0 });
  const snapped = local.toMillis();
  return snapped >= injuredAt + 2 * H && snapped <= Date.now() - 2 * H ? snapped : raw;
}

function phaseForDay(days) {
  // Kannus 2000 day bands, as shared/clinical/phase.ts applies them when no override or swelling changes them.
  return days < 7 ? 'acute' : days < 21 ? 'proliferative' : 'remodelling';
}

module.exports = {
  async up(queryInterface) {
    if (process.env.NODE_ENV === 'production') return;
    const q = queryInterface.sequelize;
    // The product's own TypeScript, loaded the way the dev server loads it.
    const tsx = require('tsx/cjs/api');
    const load = (file) => tsx.require(path.join(__dirname, '..', 'shared', file), __filename);
    const { buildPlan } = load('plan/build-plan.ts');
    const { defaultSequences } = load('plan/sequence.ts');
    const { stepKindInfo } = load('plan/step-kinds.ts');
    const { padSize } = load('clinical/pad-size.ts');
    const { assessInjury } = load('clinical/assess-injury.ts');
    const { bodyRegionById } = load('records/body-map.ts');
    const { redFlagLabel } = load('runs/screening.ts');
    const { clinicSettingsSchema } = load('clinic/settings.ts');
    const { draftSessionNote } = load('notes/draft-note.ts');

    const [[clinic]] = await q.query('SELECT settings FROM clinics WHERE id = :id', { replacements: { id: CLUB } });
    if (!clinic) return;
    const settings = clinicSettingsSchema.parse(clinic.settings ?? {});

    await q.query(
      `INSERT INTO injuries (id, clinic_id, athlete_id, region, side, mechanism_kind, mechanism, injured_at, haematoma_type, treatment_started_at, status, closed_at, created_by)
       VALUES (:id, :clinic, :athlete, :region, :side, :kind, :mechanism, :injuredAt, 'intermuscular', :treatment, 'closed', :closedAt, :by)
       ON CONFLICT (id) DO NOTHING`,
      {
        replacements: {
          ...ffionInjury,
          clinic: CLUB,
          kind: ffionInjury.mechanismKind,
          injuredAt: new Date(Date.now() - ffionInjury.ago),
          treatment: new Date(Date.now() - ffionInjury.ago + 2 * H),
          closedAt: new Date(Date.now() - ffionInjury.closedAgo),
          by: TAMSIN,
        },
      },
    );
    const [[ffionStored]] = await q.query('SELECT injured_at FROM injuries WHERE id = :id', { replacements: { id: injuryIds.ffion } });
    for (const [n, [after, gi, go, flex, pain, bl, bw, skin, notes]] of ffionMeasurements.entries()) {
      await q.query(
        `INSERT INTO measurements (id, clinic_id, injury_id, taken_at, girth_injured_cm, girth_other_cm, girth_landmark, girth_distance_cm,
           knee_flexion_deg, pain_nprs, bruise_length_cm, bruise_width_cm, skinfold_mm, notes, recorded_by)
         VALUES (:id, :clinic, :injury, :takenAt, :gi, :go, 'popliteal crease', 20, :flex, :pain, :bl, :bw, :skin, :notes, :by)
         ON CONFLICT (id) DO NOTHING`,
        {
          replacements: {
            id: id('55000000', n + 1), clinic: CLUB, injury: injuryIds.ffion,
            takenAt: new Date(new Date(ffionStored.injured_at).getTime() + after),
            gi, go, flex, pain, bl, bw, skin, notes, by: TAMSIN,
          },
        },
      );
    }

    // The clinic's first version of each sequence, as the product creates it on first use.
    const sequenceIds = {};
    for (const phase of ['acute', 'proliferative', 'remodelling']) {
      await q.query(
        `INSERT INTO sequences (clinic_id, phase, version, steps) VALUES (:clinic, :phase, 1, :steps::jsonb) ON CONFLICT DO NOTHING`,
        { replacements: { clinic: CLUB, phase, steps: JSON.stringify(defaultSequences[phase].steps) } },
      );
      const [[row]] = await q.query('SELECT id FROM sequences WHERE clinic_id = :clinic AND phase = :phase AND version = 1', { replacements: { clinic: CLUB, phase } });
      sequenceIds[phase] = row.id;
    }

    const labels = {
      label: Object.fromEntries(Object.entries(stepKindInfo).map(([kind, info]) => [kind, info.label])),
      cold: Object.fromEntries(Object.entries(stepKindInfo).map(([kind, info]) => [kind, info.cold])),
      redFlag: redFlagLabel,
    };
    const injuries = {};
    for (const [key, injuryId] of Object.entries(injuryIds)) {
      const [[row]] = await q.query(
        `SELECT i.*, a.sport FROM injuries i JOIN athletes a ON a.id = i.athlete_id WHERE i.id = :id AND i.clinic_id = :clinic`,
        { replacements: { id: injuryId, clinic: CLUB } },
      );
      if (!row) continue;
      const [measurements] = await q.query('SELECT * FROM measurements WHERE injury_id = :id ORDER BY taken_at', { replacements: { id: injuryId } });
      injuries[key] = { row, measurements };
    }

    const screening = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };
    for (const script of runs) {
      const injury = injuries[script.injury];
      if (!injury) continue;
      const injuredAt = new Date(injury.row.injured_at).getTime();
      const startMs = workingHour(injuredAt, script.after, script.n, settings.timeZone);
      if (startMs > Date.now() - H) continue;
      const phase = phaseForDay(Math.floor(script.after / D));
      const measured = injury.measurements.filter((m) => new Date(m.taken_at).getTime() <= startMs);
      const bruise = [...measured].reverse().find((m) => m.bruise_length_cm !== null && m.bruise_width_cm !== null);
      const pad = bruise ? padSize({ bruiseLengthCm: bruise.bruise_length_cm, bruiseWidthCm: bruise.bruise_width_cm }) : null;
      const plan = buildPlan({
        phase,
        sequence: defaultSequences[phase],
        tolerance: 'usual',
        padSize: pad ? { minLengthCm: pad.length.minCm, maxLengthCm: pad.length.maxCm, minWidthCm: pad.width.minCm, maxWidthCm: pad.width.maxCm } : null,
        coldContraindicated: false,
        suspectedMyositis: false,
        minColdIntervalSeconds: settings.minColdIntervalMinutes * 60,
      });
      const result = simulate(plan, startMs, script, labels);
      const createdAt = new Date(startMs - 4 * 60_000);
      const endedAt = new Date(result.entries.at(-1).at);
      const run = {
        id: runId(script.n),
        clinic: CLUB,
        injury: injury.row.id,
        athlete: injury.row.athlete_id,
        therapist: script.by,
        phase,
        status: result.status,
        outcome: result.outcome,
        plan: JSON.stringify(plan),
        sequenceId: sequenceIds[phase],
        screening: JSON.stringify(screening),
        redFlags: result.redFlags ? JSON.stringify(result.redFlags) : null,
        // As the server sets it: the time of the first entry.
        startedAt: new Date(result.entries[0].at),
        endedAt,
        createdAt,
      };
      await q.query(
        `INSERT INTO runs (id, clinic_id, injury_id, athlete_id, therapist_id, phase, status, outcome, plan, sequence_id, sequence_version,
           screening, red_flags, started_at, ended_at, last_activity_at, created_at, updated_at)
         VALUES (:id, :clinic, :injury, :athlete, :therapist, :phase, :status, :outcome, :plan::jsonb, :sequenceId, 1,
           :screening::jsonb, :redFlags::jsonb, :startedAt, :endedAt, :endedAt, :createdAt, :endedAt)
         ON CONFLICT (id) DO NOTHING`,
        { replacements: run },
      );
      for (const entry of result.entries) {
        await q.query(
          `INSERT INTO run_log_entries (clinic_id, run_id, idempotency_key, body_hash, seq, type, step_index, kind, planned_seconds, actual_seconds,
             at, reason, detail, recorded_by, created_at)
           VALUES (:clinic, :run, :key, :hash, :seq, :type, :stepIndex, :kind, :planned, :actual, :at, :reason, :detail, :by, :at)
           ON CONFLICT (run_id, idempotency_key) DO NOTHING`,
          {
            replacements: {
              clinic: CLUB, run: run.id, key: entryKey(script.n, entry.seq), hash: hashEntry(entry),
              seq: entry.seq, type: entry.type, stepIndex: entry.stepIndex ?? null, kind: entry.kind ?? null,
              planned: entry.plannedSeconds ?? null, actual: entry.actualSeconds ?? null, at: entry.at,
              reason: entry.reason ?? null, detail: entry.detail ?? null, by: script.by,
            },
          },
        );
      }

      if (!script.note) continue;
      // The note as Mendstep would have drafted it right after the run, from the records as they stood then.
      const upToEnd = injury.measurements.filter((m) => new Date(m.taken_at).getTime() <= endedAt.getTime());
      const toMeasurement = (m) => ({
        takenAt: new Date(m.taken_at).toISOString(),
        girthInjuredCm: m.girth_injured_cm, girthOtherCm: m.girth_other_cm, girthLandmark: m.girth_landmark, girthDistanceCm: m.girth_distance_cm,
        kneeFlexionDeg: m.knee_flexion_deg, painNprs: m.pain_nprs, bruiseLengthCm: m.bruise_length_cm, bruiseWidthCm: m.bruise_width_cm,
        skinfoldMm: m.skinfold_mm, notes: m.notes,
      });
      const assessment = assessInjury({
        injury: {
          region: injury.row.region,
          injuredAt: new Date(injuredAt).toISOString(),
          previousQuadricepsInjury: injury.row.previous_quadriceps_injury,
          kneeEffusion: injury.row.knee_effusion,
          treatmentStartedAt: injury.row.treatment_started_at ? new Date(injury.row.treatment_started_at).toISOString() : null,
          phaseOverride: null,
        },
        athleteSport: injury.row.sport,
        measurements: upToEnd.map(toMeasurement),
        settings,
        now: endedAt.toISOString(),
      });
      const draft = draftSessionNote({
        run: {
          phase, status: run.status, outcome: run.outcome, plan, screening,
          startedAt: run.startedAt.toISOString(), endedAt: endedAt.toISOString(), createdAt: createdAt.toISOString(),
          sequenceVersion: 1, redFlags: result.redFlags,
        },
        entries: result.entries.map((e) => ({
          seq: e.seq, type: e.type, stepIndex: e.stepIndex ?? null, kind: e.kind ?? null, plannedSeconds: e.plannedSeconds ?? null,
          actualSeconds: e.actualSeconds ?? null, at: e.at, reason: e.reason ?? null, detail: e.detail ?? null,
        })),
        injury: {
          region: injury.row.region,
          regionLabel: bodyRegionById(injury.row.region)?.label ?? injury.row.region,
          side: injury.row.side,
          injuredAt: new Date(injuredAt).toISOString(),
          mechanism: injury.row.mechanism,
          phase: assessment.phase,
          phaseReason: assessment.phaseReason,
          severity: assessment.severity,
          risks: assessment.risks,
          assessment,
        },
        measurements: injury.measurements.map(toMeasurement),
        settings: { timeZone: settings.timeZone, coldProtocol: settings.coldProtocol, swellingThresholdCm: settings.swellingThresholdCm },
      });
      const submittedAt = script.note === 'draft' ? null : new Date(endedAt.getTime() + 40 * 60_000);
      const signedAt = script.note === 'signed' ? new Date(Math.min(endedAt.getTime() + 20 * H, Date.now() - H)) : null;
      await q.query(
        `INSERT INTO session_notes (id, clinic_id, run_id, subjective, objective, assessment, plan, status, created_by, updated_by,
           submitted_by, submitted_at, signed_by, signed_at, sign_off_comment, version, created_at, updated_at)
         VALUES (:id, :clinic, :run, :subjective, :objective, :assessment, :plan, :status, :by, :updatedBy,
           :submittedBy, :submittedAt, :signedBy, :signedAt, :comment, :version, :createdAt, :updatedAt)
         ON CONFLICT (run_id) DO NOTHING`,
        {
          replacements: {
            id: noteId(script.n), clinic: CLUB, run: run.id, ...draft, status: script.note,
            by: script.by, updatedBy: script.note === 'signed' ? OWEN : script.by,
            submittedBy: submittedAt ? script.by : null, submittedAt,
            signedBy: signedAt ? OWEN : null, signedAt, comment: signedAt ? (script.comment ?? null) : null,
            version: { draft: 1, submitted: 2, signed: 3 }[script.note],
            createdAt: new Date(endedAt.getTime() + 5 * 60_000),
            updatedAt: signedAt ?? submittedAt ?? new Date(endedAt.getTime() + 5 * 60_000),
          },
        },
      );
    }
  },

  async down(queryInterface) {
    const q = queryInterface.sequelize;
    await q.query(`DELETE FROM session_notes WHERE id::text LIKE '52000000-%'`);
    await q.query(`DELETE FROM runs WHERE id::text LIKE '51000000-%'`);
    await q.query(`DELETE FROM measurements WHERE id::text LIKE '55000000-%'`);
    await q.query(`DELETE FROM injuries WHERE id::text LIKE '54000000-%'`);
  },
};
