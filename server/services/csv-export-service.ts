import { stringify } from 'csv-stringify/sync';
import { DateTime } from 'luxon';
import { QueryTypes } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import { girthDifferenceCm } from '../../shared/clinical/girth';
import type { ReviewFilter } from '../../shared/review/query';
import { Run } from '../models';
import { getClinicSettings } from './clinic-settings-service';
import { findInjury, listMeasurements } from './injury-service';
import { injuryLabelOf, runFilterSql } from './review-service';

/*
 * CSV exports: RFC 4180 (CRLF line ends, fields with commas, quotes or line breaks quoted, quotes doubled),
 * UTF-8 with a byte-order mark so spreadsheet programs read accented names as written. Text that a
 * spreadsheet would run as a formula (=, +, -, @ first) is prefixed with an apostrophe, so an athlete's
 * note can never compute anything on the supervisor's machine (OWASP: CSV injection).
 */

export interface CsvFile {
  filename: string;
  body: string;
}

export const runCsvColumns = [
  'run_id',
  'date',
  'athlete',
  'therapist',
  'injury',
  'phase',
  'outcome',
  'steps_planned',
  'steps_completed',
  'steps_skipped',
  'swelling_checks',
  'ice_massage_seconds',
  'note_status',
  'signed_by',
  'signed_at',
] as const;

export const measurementCsvColumns = [
  'taken_at',
  'girth_injured_cm',
  'girth_other_cm',
  'girth_difference_cm',
  'landmark',
  'distance_cm',
  'knee_flexion_deg',
  'pain_nprs',
  'bruise_length_cm',
  'bruise_width_cm',
  'skinfold_mm',
  'notes',
  'recorded_by',
] as const;

type Cell = string | number | null;

function safeText(value: string | null): string | null {
  if (value === null) return null;
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

function toCsv(columns: readonly string[], rows: Cell[][]): string {
  return stringify(rows, {
    header: true,
    columns: [...columns],
    bom: true,
    record_delimiter: 'windows',
    // A line break inside a field must be quoted whatever the record delimiter is.
    quoted_match: /[\r\n]/,
  });
}

/** Local time in the clinic's zone, as a spreadsheet sorts and reads it. */
function localTime(value: Date | null, timeZone: string): string | null {
  return value ? DateTime.fromJSDate(value).setZone(timeZone).toFormat('yyyy-MM-dd HH:mm') : null;
}

const today = (timeZone: string) => DateTime.now().setZone(timeZone).toFormat('yyyy-MM-dd');

interface RunCsvRecord {
  id: string;
  created_at: Date;
  started_at: Date | null;
  athlete_name: string;
  therapist_name: string;
  region: string;
  side: string;
  phase: string;
  status: string;
  steps_planned: number;
  steps_completed: number;
  steps_skipped: number;
  swelling_checks: number;
  ice_massage_seconds: number;
  note_status: string | null;
  signed_by: string | null;
  signed_at: Date | null;
}

/** Every run matching the filters (not one page), newest first. */
export async function reviewRunsCsv(actor: SessionUser, filter: ReviewFilter): Promise<CsvFile> {
  const [{ where, replacements }, settings] = await Promise.all([runFilterSql(actor, filter), getClinicSettings(actor.clinicId)]);
  const records = await Run.sequelize!.query<RunCsvRecord>(
    `SELECT r.id, r.created_at, r.started_at, a.name AS athlete_name, u.name AS therapist_name, i.region, i.side, r.phase, r.status,
            jsonb_array_length(r.plan -> 'steps')::int AS steps_planned,
            coalesce(s.steps_completed, 0)::int AS steps_completed,
            coalesce(s.steps_skipped, 0)::int AS steps_skipped,
            coalesce(s.swelling_checks, 0)::int AS swelling_checks,
            coalesce(s.ice_massage_seconds, 0)::int AS ice_massage_seconds,
            n.status AS note_status, signer.name AS signed_by, n.signed_at
       FROM runs r
       JOIN athletes a ON a.id = r.athlete_id
       JOIN users u ON u.id = r.therapist_id
       JOIN injuries i ON i.id = r.injury_id
       LEFT JOIN session_notes n ON n.run_id = r.id
       LEFT JOIN users signer ON signer.id = n.signed_by
       LEFT JOIN LATERAL (
         SELECT count(*) FILTER (WHERE e.type = 'step-completed' AND e.step_index IS NOT NULL) AS steps_completed,
                count(*) FILTER (WHERE e.type = 'step-skipped') AS steps_skipped,
                count(*) FILTER (WHERE e.type = 'swelling-check') AS swelling_checks,
                -- Time the ice was on the skin, however the step ended.
                sum(e.actual_seconds) FILTER (WHERE e.kind = 'ice-massage' AND e.type IN ('step-completed', 'step-interrupted', 'step-skipped')) AS ice_massage_seconds
           FROM run_log_entries e
          WHERE e.run_id = r.id
       ) s ON true
      WHERE ${where}
      ORDER BY r.created_at DESC, r.id DESC`,
    { replacements, type: QueryTypes.SELECT },
  );
  const rows: Cell[][] = records.map((r) => [
    r.id,
    localTime(r.started_at ?? r.created_at, settings.timeZone),
    safeText(r.athlete_name),
    safeText(r.therapist_name),
    injuryLabelOf(r.region, r.side),
    r.phase,
    r.status,
    r.steps_planned,
    r.steps_completed,
    r.steps_skipped,
    r.swelling_checks,
    r.ice_massage_seconds,
    r.note_status ?? 'none',
    safeText(r.signed_by),
    localTime(r.signed_at, settings.timeZone),
  ]);
  return { filename: `mendstep-runs-${today(settings.timeZone)}.csv`, body: toCsv(runCsvColumns, rows) };
}

export async function measurementsCsv(actor: SessionUser, injuryId: string): Promise<CsvFile> {
  const injury = await findInjury(actor, injuryId);
  const [measurements, settings] = await Promise.all([listMeasurements(actor, injury.id), getClinicSettings(actor.clinicId)]);
  const rows: Cell[][] = measurements.map((m) => [
    localTime(new Date(m.takenAt), settings.timeZone),
    m.girthInjuredCm,
    m.girthOtherCm,
    girthDifferenceCm(m),
    safeText(m.girthLandmark),
    m.girthDistanceCm,
    m.kneeFlexionDeg,
    m.painNprs,
    m.bruiseLengthCm,
    m.bruiseWidthCm,
    m.skinfoldMm,
    safeText(m.notes),
    safeText(m.recordedByName),
  ]);
  const label = injuryLabelOf(injury.region, injury.side).replace(/[^a-z0-9]+/gi, '-').replace(/^-|-$/g, '').toLowerCase();
  return { filename: `mendstep-measurements-${label}-${injury.id.slice(0, 8)}.csv`, body: toCsv(measurementCsvColumns, rows) };
}
