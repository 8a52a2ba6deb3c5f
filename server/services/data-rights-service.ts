import { once } from 'node:events';
import type { Writable } from 'node:stream';
import { ZipArchive } from 'archiver';
import { stringify } from 'csv-stringify/sync';
import { DateTime } from 'luxon';
import { col, fn, Op, QueryTypes, where as sqlWhere, type Model, type ModelStatic, type Transaction, type WhereOptions } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import {
  confirmNameMismatch,
  exportTables,
  sameName,
  type DataRightsAthlete,
  type DataRightsSearch,
  type EraseAthleteInput,
  type ErasureResult,
  type ExportTable,
} from '../../shared/data-rights/data-rights';
import { activeStatuses } from '../../shared/runs/responses';
import { AppError } from '../errors';
import { Athlete, AuditEvent, Clinic, Injury, Measurement, OutboundEmail, Run, RunLogEntry, SessionNote, Upload, User } from '../models';
import { StoredFileMissing, type FileStorage } from '../storage';
import { recordAudit } from './audit-service';
import { getClinicSettings } from './clinic-settings-service';

/**
 * An athlete's data rights, for admins (docs/decisions/0090-athlete-export-and-erasure.md): everything Mendstep
 * holds on one athlete as a zip (JSON, a CSV per table, the uploaded files), and erasure of their personal data
 * while the clinical counts stay for the clinic's figures.
 */

/** What erased free text reads as, where a column cannot be emptied (a reason the screens expect to find). */
export const ERASED_TEXT = '(erased)';
const cancelledBecauseErased = "Not sent: the athlete's personal data was erased.";
const erasedSubject = "(erased with the athlete's data)";
// Free text people typed, wherever it sits in an audit event's detail.
const freeTextAuditKeys = new Set(['reason', 'comment']);

const shortId = (id: string) => id.slice(0, 8);
export const erasedName = (id: string) => `Erased athlete ${shortId(id)}`;

function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

// ---------------------------------------------------------------------------------------------------------------
// Search

interface SearchRow {
  id: string;
  name: string;
  year_of_birth: number;
  erased_at: Date | null;
  email_opted_out_at: Date | null;
  injuries: string;
  measurements: string;
  runs: string;
  session_notes: string;
  files: string;
  emails: string;
}

const countsSql = `
  (SELECT count(*) FROM injuries i WHERE i.clinic_id = a.clinic_id AND i.athlete_id = a.id) AS injuries,
  (SELECT count(*) FROM measurements m JOIN injuries i ON i.id = m.injury_id WHERE i.clinic_id = a.clinic_id AND i.athlete_id = a.id) AS measurements,
  (SELECT count(*) FROM runs r WHERE r.clinic_id = a.clinic_id AND r.athlete_id = a.id) AS runs,
  (SELECT count(*) FROM session_notes n JOIN runs r ON r.id = n.run_id WHERE r.clinic_id = a.clinic_id AND r.athlete_id = a.id) AS session_notes,
  (SELECT count(*) FROM uploads u WHERE u.clinic_id = a.clinic_id AND u.athlete_id = a.id) AS files,
  (SELECT count(*) FROM outbound_emails e WHERE e.clinic_id = a.clinic_id AND e.kind = 'home-care'
     AND e.dedupe_key IN (SELECT 'home-care:' || r.id FROM runs r WHERE r.clinic_id = a.clinic_id AND r.athlete_id = a.id)) AS emails`;

function toDataRightsAthlete(row: SearchRow): DataRightsAthlete {
  return {
    id: row.id,
    name: row.name,
    yearOfBirth: row.year_of_birth,
    erasedAt: row.erased_at?.toISOString() ?? null,
    emailOptedOutAt: row.email_opted_out_at?.toISOString() ?? null,
    counts: {
      injuries: Number(row.injuries),
      measurements: Number(row.measurements),
      runs: Number(row.runs),
      sessionNotes: Number(row.session_notes),
      files: Number(row.files),
      emails: Number(row.emails),
    },
  };
}

/** Athletes of the admin's clinic by part of their name, with how much is held on each; erased ones are marked. */
export async function searchDataRightsAthletes(actor: SessionUser, query: DataRightsSearch): Promise<DataRightsAthlete[]> {
  const rows = await Athlete.sequelize!.query<SearchRow>(
    `SELECT a.id, a.name, a.year_of_birth, a.erased_at, a.email_opted_out_at, ${countsSql}
     FROM athletes a
     WHERE a.clinic_id = :clinicId ${query.q ? 'AND a.name ILIKE :pattern' : ''}
     ORDER BY a.erased_at IS NOT NULL, lower(a.name), a.id
     LIMIT 25`,
    { replacements: { clinicId: actor.clinicId, pattern: `%${escapeLike(query.q ?? '')}%` }, type: QueryTypes.SELECT },
  );
  return rows.map(toDataRightsAthlete);
}

async function dataRightsAthlete(clinicId: string, athleteId: string, transaction?: Transaction): Promise<DataRightsAthlete> {
  const [row] = await Athlete.sequelize!.query<SearchRow>(
    `SELECT a.id, a.name, a.year_of_birth, a.erased_at, a.email_opted_out_at, ${countsSql} FROM athletes a WHERE a.clinic_id = :clinicId AND a.id = :athleteId`,
    { replacements: { clinicId, athleteId }, type: QueryTypes.SELECT, transaction },
  );
  if (!row) throw AppError.notFound('Athlete');
  return toDataRightsAthlete(row);
}

// ---------------------------------------------------------------------------------------------------------------
// What is held on one athlete

interface AthleteRecords {
  athlete: Athlete;
  injuries: Injury[];
  measurements: Measurement[];
  runs: Run[];
  logEntries: RunLogEntry[];
  sessionNotes: SessionNote[];
  uploads: Upload[];
  emails: OutboundEmail[];
  auditEvents: AuditEvent[];
}

/** The home-care messages to the athlete: found through their runs, and by their current address as well. */
function homeCareWhere(clinicId: string, runIds: string[], email: string | null): WhereOptions<OutboundEmail> {
  return {
    clinicId,
    kind: 'home-care',
    [Op.or]: [{ dedupeKey: { [Op.in]: runIds.map((id) => `home-care:${id}`) } }, ...(email ? [sqlWhere(fn('lower', col('to_address')), email.toLowerCase())] : [])],
  };
}

async function collectRecords(clinicId: string, athlete: Athlete, transaction?: Transaction): Promise<AthleteRecords> {
  // One after another: inside a transaction they share one connection.
  const athleteId = athlete.id;
  const injuries = await Injury.findAll({ where: { clinicId, athleteId }, order: [['injuredAt', 'ASC'], ['id', 'ASC']], transaction });
  const runs = await Run.findAll({ where: { clinicId, athleteId }, order: [['createdAt', 'ASC'], ['id', 'ASC']], transaction });
  const uploads = await Upload.findAll({ where: { clinicId, athleteId }, order: [['createdAt', 'ASC'], ['id', 'ASC']], transaction });
  const injuryIds = injuries.map((i) => i.id);
  const runIds = runs.map((r) => r.id);
  const measurements = await Measurement.findAll({ where: { clinicId, injuryId: { [Op.in]: injuryIds } }, order: [['takenAt', 'ASC'], ['id', 'ASC']], transaction });
  const logEntries = await RunLogEntry.findAll({
    where: { clinicId, runId: { [Op.in]: runIds } },
    order: [['runId', 'ASC'], ['seq', 'ASC'], ['at', 'ASC'], ['id', 'ASC']],
    transaction,
  });
  const sessionNotes = await SessionNote.findAll({ where: { clinicId, runId: { [Op.in]: runIds } }, order: [['createdAt', 'ASC']], transaction });
  const emails = await OutboundEmail.findAll({ where: homeCareWhere(clinicId, runIds, athlete.email), order: [['createdAt', 'ASC']], transaction });
  const about: [string, string[]][] = [
    ['athlete', [athleteId]],
    ['injury', injuryIds],
    ['measurement', measurements.map((m) => m.id)],
    ['run', runIds],
    ['session-note', sessionNotes.map((n) => n.id)],
    ['upload', uploads.map((u) => u.id)],
  ];
  const auditEvents = await AuditEvent.findAll({
    where: { clinicId, [Op.or]: about.filter(([, ids]) => ids.length).map(([recordType, ids]) => ({ recordType, recordId: { [Op.in]: ids } })) },
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
    transaction,
  });
  return { athlete, injuries, measurements, runs, logEntries, sessionNotes, uploads, emails, auditEvents };
}

// ---------------------------------------------------------------------------------------------------------------
// Export

type Plain = Record<string, unknown>;

const plain = (row: Model) => row.get({ plain: true }) as Plain;

function without(row: Plain, keys: string[]): Plain {
  return Object.fromEntries(Object.entries(row).filter(([key]) => !keys.includes(key)));
}

function emailRecord(email: OutboundEmail): Plain {
  return {
    id: email.id,
    kind: email.kind,
    toAddress: email.toAddress,
    subject: email.subject,
    text: email.text,
    html: email.html,
    attachments: email.attachments.map((a) => a.filename),
    status: email.status,
    attempts: email.attempts,
    lastError: email.lastError,
    createdAt: email.createdAt,
    sentAt: email.sentAt,
  };
}

/** A file name safe inside a zip on any system: no folders, no control or reserved characters. */
function zipFileName(upload: Upload): string {
  const extension = { 'application/pdf': 'pdf', 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' }[upload.contentType] ?? 'bin';
  const original = (upload.originalName ?? '').replace(/[\u0000-\u001f\u007f<>:"/\\|?*]/g, '').trim().slice(0, 120);
  return `files/${upload.id}-${original || `${upload.kind}.${extension}`}`;
}

// Text a spreadsheet would run as a formula gets an apostrophe first (OWASP: CSV injection), as in csv-export-service.
function csvCell(value: unknown): string | number | boolean | null {
  if (value === null || value === undefined) return null;
  if (value instanceof Date) return value.toISOString();
  if (typeof value === 'number' || typeof value === 'boolean') return value;
  const text = typeof value === 'string' ? value : JSON.stringify(value);
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** RFC 4180 with a byte-order mark, like the clinic's other CSV exports; nested values (plans, details) as JSON. */
function toCsv(columns: string[], rows: Plain[]): string {
  return stringify(
    rows.map((row) => columns.map((column) => csvCell(row[column]))),
    { header: true, columns, bom: true, record_delimiter: 'windows', quoted_match: /[\r\n]/ },
  );
}

const columnsOf = (model: ModelStatic<Model>, drop: string[] = []) => Object.keys(model.getAttributes()).filter((key) => !drop.includes(key));

const exportReadme = (clinicName: string, exportedAt: string) =>
  [
    `Everything ${clinicName} holds on one athlete in Mendstep, exported ${exportedAt}.`,
    '',
    'athlete.json   every record below in one file: the athlete, injuries, measurements, runs with their plans and',
    '               step logs, session notes, uploaded files (details), e-mails sent to the athlete, and the audit',
    '               trail of changes to these records, with the names of the staff who appear in them',
    'csv/           the same records, one CSV file per table (UTF-8, comma-separated; nested values as JSON)',
    'files/         the uploaded files themselves (bruise photos, signed consent forms)',
    '',
    'Times are UTC (ISO 8601). Treat this file as confidential health information.',
    '',
  ].join('\r\n');

export interface AthleteExport {
  filename: string;
  /** Writes the zip to the response; the files are read from storage one at a time. */
  writeTo(out: Writable): Promise<void>;
}

export async function exportAthlete(actor: SessionUser, storage: FileStorage, athleteId: string): Promise<AthleteExport> {
  const athlete = await Athlete.findOne({ where: { id: athleteId, clinicId: actor.clinicId } });
  if (!athlete) throw AppError.notFound('Athlete');
  const records = await collectRecords(actor.clinicId, athlete);
  const [clinic, settings] = await Promise.all([Clinic.findByPk(actor.clinicId, { attributes: ['name'] }), getClinicSettings(actor.clinicId)]);
  const staffIds = new Set<string>();
  const note = (id: unknown) => typeof id === 'string' && staffIds.add(id);
  for (const row of [athlete, ...records.injuries, ...records.measurements, ...records.runs, ...records.logEntries, ...records.sessionNotes, ...records.uploads, ...records.auditEvents]) {
    const values = plain(row);
    for (const key of ['consentRecordedBy', 'guardianConsentRecordedBy', 'erasedBy', 'createdBy', 'updatedBy', 'recordedBy', 'therapistId', 'uploadedBy', 'submittedBy', 'signedBy', 'userId', 'recheckSetBy']) note(values[key]);
  }
  const staff = await User.findAll({ where: { id: { [Op.in]: [...staffIds] }, clinicId: actor.clinicId }, attributes: ['id', 'name', 'role'], order: [['name', 'ASC']] });

  const exportedAt = new Date();
  const tables: Record<ExportTable, { columns: string[]; rows: Plain[] }> = {
    athlete: { columns: columnsOf(Athlete), rows: [plain(athlete)] },
    injuries: { columns: columnsOf(Injury), rows: records.injuries.map(plain) },
    measurements: { columns: columnsOf(Measurement), rows: records.measurements.map(plain) },
    runs: { columns: columnsOf(Run), rows: records.runs.map(plain) },
    'run-log-entries': { columns: columnsOf(RunLogEntry, ['bodyHash']), rows: records.logEntries.map((e) => without(plain(e), ['bodyHash'])) },
    'session-notes': { columns: columnsOf(SessionNote), rows: records.sessionNotes.map(plain) },
    // The storage key is where the bytes sit inside our storage: the zip has the file itself instead.
    uploads: {
      columns: [...columnsOf(Upload, ['storageKey']), 'file'],
      rows: records.uploads.map((u) => ({ ...without(plain(u), ['storageKey']), file: zipFileName(u) })),
    },
    emails: { columns: ['id', 'kind', 'toAddress', 'subject', 'text', 'attachments', 'status', 'attempts', 'lastError', 'createdAt', 'sentAt'], rows: records.emails.map(emailRecord) },
    'audit-events': { columns: columnsOf(AuditEvent), rows: records.auditEvents.map(plain) },
  };

  await recordAudit(actor, 'athlete.exported', { type: 'athlete', id: athlete.id }, {
    injuries: records.injuries.length,
    measurements: records.measurements.length,
    runs: records.runs.length,
    files: records.uploads.length,
    emails: records.emails.length,
  });

  const day = DateTime.fromJSDate(exportedAt).setZone(settings.timeZone).toFormat('yyyy-MM-dd');
  return {
    filename: `mendstep-athlete-${shortId(athlete.id)}-${day}.zip`,
    async writeTo(out: Writable) {
      const zip = new ZipArchive({ zlib: { level: 6 } });
      const failed = new Promise<never>((_resolve, reject) => zip.on('error', reject));
      failed.catch(() => undefined);
      zip.pipe(out);
      // Files first, one at a time: each storage stream is opened only when the zip is ready for it.
      const missing: string[] = [];
      for (const upload of records.uploads) {
        let body;
        try {
          body = await storage.get(upload.storageKey);
        } catch (error) {
          if (!(error instanceof StoredFileMissing)) throw error;
          missing.push(upload.id);
          continue;
        }
        zip.append(body, { name: zipFileName(upload), date: upload.createdAt });
        await Promise.race([once(zip, 'entry'), failed]);
      }
      const uploads = tables.uploads.rows.map((row) => (missing.includes(row.id as string) ? { ...row, file: null, fileMissing: true } : row));
      const document = {
        format: 'mendstep-athlete-export',
        version: 1,
        exportedAt: exportedAt.toISOString(),
        exportedBy: { id: actor.id, name: actor.name },
        clinic: { id: actor.clinicId, name: clinic?.name ?? null, timeZone: settings.timeZone },
        athlete: tables.athlete.rows[0],
        injuries: tables.injuries.rows,
        measurements: tables.measurements.rows,
        // Each run with its plan (in the row) and its step log, as the review desk reads it.
        runs: tables.runs.rows.map((run) => ({ ...run, logEntries: tables['run-log-entries'].rows.filter((entry) => entry.runId === run.id) })),
        sessionNotes: tables['session-notes'].rows,
        uploads,
        emails: tables.emails.rows,
        auditEvents: tables['audit-events'].rows,
        staff: staff.map((s) => ({ id: s.id, name: s.name, role: s.role })),
      };
      zip.append(JSON.stringify(document, null, 2), { name: 'athlete.json', date: exportedAt });
      for (const table of exportTables) {
        const { columns, rows } = tables[table];
        zip.append(toCsv(columns, table === 'uploads' ? uploads : rows), { name: `csv/${table}.csv`, date: exportedAt });
      }
      zip.append(exportReadme(clinic?.name ?? 'the clinic', exportedAt.toISOString()), { name: 'README.txt', date: exportedAt });
      await Promise.race([zip.finalize(), failed]);
    },
  };
}

// ---------------------------------------------------------------------------------------------------------------
// Erasure

/** Free text in an audit event's detail, at any depth, replaced; everything else (ids, counts, phases) kept. */
function withoutFreeText(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(withoutFreeText);
  if (value && typeof value === 'object') {
    return Object.fromEntries(
      Object.entries(value).map(([key, inner]) => [key, freeTextAuditKeys.has(key) && typeof inner === 'string' ? ERASED_TEXT : withoutFreeText(inner)]),
    );
  }
  return value;
}

/**
 * Erases an athlete's personal data at their request. Personal fields and free text go, files are deleted, queued
 * e-mails are cancelled and sent ones lose their wording; injuries, measurements' numbers, runs and their logs stay
 * for the clinic's figures. Open injuries are closed so the athlete drops off the day's lists. One transaction;
 * the stored files are deleted inside it, so a failure leaves the rows (and a second attempt finishes the work)
 * rather than rows pointing at nothing or bytes that no row names.
 */
export async function eraseAthlete(actor: SessionUser, storage: FileStorage, athleteId: string, input: EraseAthleteInput): Promise<ErasureResult> {
  const sequelize = Athlete.sequelize!;
  const outcome = await sequelize.transaction(async (transaction) => {
    const athlete = await Athlete.findOne({ where: { id: athleteId, clinicId: actor.clinicId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!athlete) throw AppError.notFound('Athlete');
    if (athlete.erasedAt) throw AppError.conflict("This athlete's personal data has already been erased.", 'already_erased');
    if (!sameName(input.confirmName, athlete.name)) throw AppError.badRequest(confirmNameMismatch, { confirmName: confirmNameMismatch });
    const active = await Run.findOne({ where: { clinicId: actor.clinicId, athleteId, status: { [Op.in]: [...activeStatuses] } }, transaction });
    if (active) {
      throw AppError.conflict('A run is in progress for this athlete: finish or end it before erasing their data.', 'run_active', { runId: active.id });
    }

    const records = await collectRecords(actor.clinicId, athlete, transaction);
    const clinicId = actor.clinicId;
    const runIds = records.runs.map((r) => r.id);
    const injuryIds = records.injuries.map((i) => i.id);
    const replacements = { clinicId, athleteId, runIds: runIds.length ? runIds : [null], injuryIds: injuryIds.length ? injuryIds : [null] };
    const run = (sql: string, extra: Record<string, unknown> = {}) =>
      sequelize.query(sql, { replacements: { ...replacements, ...extra }, transaction, type: QueryTypes.UPDATE }).then(([, affected]) => Number(affected ?? 0));

    const consent = { toTreatment: athlete.consentToTreatment, guardian: Boolean(athlete.guardianName && athlete.guardianConsentRecordedAt) };
    const email = athlete.email;
    await athlete.update(
      {
        name: erasedName(athlete.id),
        email: null,
        position: null,
        notes: null,
        consentRecordedBy: null,
        consentRecordedAt: null,
        guardianName: null,
        guardianConsentRecordedBy: null,
        guardianConsentRecordedAt: null,
        erasedAt: new Date(),
        erasedBy: actor.id,
      },
      { transaction },
    );

    // Injuries: the free-text mechanism and the reasons typed for an override or a closing go; open ones close.
    await run(`UPDATE injuries SET mechanism = NULL, updated_at = now() WHERE clinic_id = :clinicId AND athlete_id = :athleteId`);
    await run(
      `UPDATE injuries SET phase_override = jsonb_set(phase_override, '{reason}', to_jsonb(CAST(:erased AS text)))
       WHERE clinic_id = :clinicId AND athlete_id = :athleteId AND phase_override ? 'reason'`,
      { erased: ERASED_TEXT },
    );
    await run(
      `UPDATE injuries SET closure = jsonb_set(closure, '{reason}', to_jsonb(CAST(:erased AS text)))
       WHERE clinic_id = :clinicId AND athlete_id = :athleteId AND closure->>'reason' IS NOT NULL`,
      { erased: ERASED_TEXT },
    );
    const closedInjuries = await run(
      `UPDATE injuries SET status = 'closed', closed_at = now(), next_recheck_at = NULL, recheck_set_by = NULL, updated_at = now(),
         closure = jsonb_build_object('closedBy', CAST(:actorId AS text), 'allMet', false, 'criteria', '[]'::jsonb, 'measurement', NULL,
                                      'reason', CAST(:closeReason AS text))
       WHERE clinic_id = :clinicId AND athlete_id = :athleteId AND status = 'open'`,
      { actorId: actor.id, closeReason: "Closed when the athlete's personal data was erased; no return-to-activity check." },
    );
    await run(`UPDATE measurements SET notes = NULL, updated_at = now() WHERE clinic_id = :clinicId AND injury_id IN (:injuryIds) AND notes IS NOT NULL`);
    // Skip and end-early reasons are typed by the therapist; the entries and their timings stay.
    await run(
      `UPDATE run_log_entries SET reason = :erased WHERE clinic_id = :clinicId AND run_id IN (:runIds)
         AND type IN ('step-skipped', 'run-ended-early') AND reason IS NOT NULL`,
      { erased: ERASED_TEXT },
    );
    await run(
      `UPDATE session_notes SET subjective = '', objective = '', assessment = '', plan = '', sign_off_comment = NULL, updated_at = now()
       WHERE clinic_id = :clinicId AND run_id IN (:runIds)`,
    );

    // E-mails to the athlete, and the supervisors' alerts about their runs (which name them): queued ones are
    // cancelled, all lose their wording, and the local mailbox's copies (outside production) are deleted.
    const linked = await sequelize.query<{ id: string; message_id: string; kind: string }>(
      `SELECT id, message_id, kind FROM outbound_emails
       WHERE clinic_id = :clinicId AND (
         (kind = 'home-care' AND (dedupe_key IN (SELECT 'home-care:' || CAST(id AS text) FROM runs WHERE clinic_id = :clinicId AND athlete_id = :athleteId)
                                  OR lower(to_address) = lower(CAST(:email AS text))))
         OR (kind = 'run-alert' AND split_part(dedupe_key, ':', 2) IN (SELECT CAST(id AS text) FROM runs WHERE clinic_id = :clinicId AND athlete_id = :athleteId)))
       FOR UPDATE`,
      { replacements: { ...replacements, email }, type: QueryTypes.SELECT, transaction },
    );
    const linkedIds = linked.length ? linked.map((m) => m.id) : [null];
    const cancelledEmails = await run(
      `UPDATE outbound_emails SET status = 'failed-permanently', last_error = :reason, updated_at = now() WHERE id IN (:linkedIds) AND status = 'pending'`,
      { linkedIds, reason: cancelledBecauseErased },
    );
    const redactedEmails = await run(
      `UPDATE outbound_emails SET subject = :subject, text = :subject, html = NULL, attachments = '[]'::jsonb,
         to_address = CASE WHEN kind = 'home-care' THEN :erasedAddress ELSE to_address END, updated_at = now()
       WHERE id IN (:linkedIds)`,
      { linkedIds, subject: erasedSubject, erasedAddress: `erased-${shortId(athlete.id)}@erased.invalid` },
    );
    const mailboxDeleted = await sequelize.query(
      `DELETE FROM mailbox_messages WHERE (clinic_id = :clinicId OR clinic_id IS NULL)
         AND (message_id IN (:messageIds) OR (CAST(:email AS text) IS NOT NULL AND recipients @> jsonb_build_array(lower(CAST(:email AS text)))))`,
      { replacements: { clinicId, email, messageIds: linked.length ? linked.map((m) => m.message_id) : [null] }, type: QueryTypes.BULKDELETE, transaction },
    );
    const optOutDeleted = await sequelize.query('DELETE FROM email_opt_out_tokens WHERE athlete_id = :athleteId', {
      replacements,
      type: QueryTypes.BULKDELETE,
      transaction,
    });

    for (const event of records.auditEvents) {
      const cleaned = withoutFreeText(event.detail) as Record<string, unknown>;
      if (JSON.stringify(cleaned) !== JSON.stringify(event.detail)) await event.update({ detail: cleaned }, { transaction });
    }

    // Bytes last: after this point only the commit remains.
    await Upload.destroy({ where: { clinicId, athleteId }, transaction });
    for (const upload of records.uploads) await storage.delete(upload.storageKey);

    const removed = {
      files: records.uploads.length,
      cancelledEmails,
      redactedEmails,
      mailboxCopies: Number(mailboxDeleted ?? 0),
      optOutLinks: Number(optOutDeleted ?? 0),
    };
    // The request itself, with who and when (the event's user and time); no personal data in it.
    await recordAudit(
      actor,
      'athlete.erased',
      { type: 'athlete', id: athlete.id },
      {
        erasedName: athlete.name,
        kept: {
          injuries: records.injuries.length,
          measurements: records.measurements.length,
          runs: records.runs.length,
          logEntries: records.logEntries.length,
          sessionNotes: records.sessionNotes.length,
        },
        removed,
        closedInjuries,
        consent,
      },
      transaction,
    );
    return { removed, closedInjuries };
  });
  return { athlete: await dataRightsAthlete(actor.clinicId, athleteId), ...outcome };
}
