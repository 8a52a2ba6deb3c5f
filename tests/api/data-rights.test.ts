import { execFileSync } from 'node:child_process';
import { createHash, randomUUID } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { inflateRawSync } from 'node:zlib';
import { QueryTypes } from 'sequelize';
import sharp from 'sharp';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Athlete, AuditEvent } from '../../server/models';
import { settleBackgroundMail } from '../../server/services/mail-outbox-service';
import { createClinic, createStaff, signedInAgent } from '../support/api-app';
import { buildMailTestApp, waitForMail } from '../support/smtp-harness';

const storageDir = fs.mkdtempSync(path.join(os.tmpdir(), 'mendstep-data-rights-'));
const APP_URL = 'https://mendstep.example.test';
const { app } = buildMailTestApp({ APP_URL, STORAGE_DIR: storageDir });
afterAll(() => fs.rmSync(storageDir, { recursive: true, force: true }));

const sequelize = () => Athlete.sequelize!;
const select = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) => sequelize().query<T>(sql, { replacements, type: QueryTypes.SELECT });
const storedFiles = () => fs.readdirSync(storageDir, { recursive: true, withFileTypes: true }).filter((d) => d.isFile()).length;
const minutesAgo = (m: number) => new Date(Date.now() - m * 60_000).toISOString();
const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };

// An invented person with made-up words for names, so a search of the whole database finds only them.
const tag = randomUUID().replace(/-/g, '').slice(0, 8);
const first = `Zephyrine${tag}`;
const last = `Quillfeather${tag}`;
const name = `${first} ${last}`;
const email = `zq-${tag}@example.test`;

let admin: Awaited<ReturnType<typeof signedInAgent>>;
let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let supervisor: Awaited<ReturnType<typeof signedInAgent>>;
let otherAdmin: Awaited<ReturnType<typeof signedInAgent>>;
let athleteId: string;
let injuryId: string;
let closedInjuryId: string;
let optOutToken: string;

/** The zip's central directory read by hand (APPNOTE.TXT §4.3): each entry's name and bytes, deflated or stored. */
function readZip(zip: Buffer): Map<string, Buffer> {
  let end = zip.length - 22;
  while (end >= 0 && zip.readUInt32LE(end) !== 0x06054b50) end -= 1;
  expect(end).toBeGreaterThanOrEqual(0);
  const count = zip.readUInt16LE(end + 10);
  let at = zip.readUInt32LE(end + 16);
  const entries = new Map<string, Buffer>();
  for (let i = 0; i < count; i += 1) {
    expect(zip.readUInt32LE(at)).toBe(0x02014b50);
    const method = zip.readUInt16LE(at + 10);
    const compressed = zip.readUInt32LE(at + 20);
    const nameLength = zip.readUInt16LE(at + 28);
    const skip = nameLength + zip.readUInt16LE(at + 30) + zip.readUInt16LE(at + 32);
    const local = zip.readUInt32LE(at + 42);
    const entryName = zip.subarray(at + 46, at + 46 + nameLength).toString('utf8');
    const start = local + 30 + zip.readUInt16LE(local + 26) + zip.readUInt16LE(local + 28);
    const data = zip.subarray(start, start + compressed);
    entries.set(entryName, method === 8 ? inflateRawSync(data) : Buffer.from(data));
    at += 46 + skip;
  }
  return entries;
}

/** Every text, JSON and binary column of every table in the database that holds any of the terms. */
async function columnsMentioning(terms: string[]): Promise<string[]> {
  const columns = await select<{ table_name: string; column_name: string; data_type: string }>(
    `SELECT table_name, column_name, data_type FROM information_schema.columns
     WHERE table_schema = 'public' AND data_type IN ('text', 'character varying', 'character', 'json', 'jsonb', 'bytea', 'ARRAY')`,
  );
  const hits: string[] = [];
  for (const { table_name: table, column_name: column, data_type: type } of columns) {
    const conditions = terms.map((_, i) =>
      type === 'bytea' ? `position(convert_to(:t${i}, 'UTF8') in "${column}") > 0` : `CAST("${column}" AS text) ILIKE :p${i}`,
    );
    const replacements = Object.fromEntries(terms.flatMap((term, i) => [[`t${i}`, term], [`p${i}`, `%${term.replace(/[\\%_]/g, (c) => `\\${c}`)}%`]]));
    const [row] = await select<{ found: boolean }>(`SELECT EXISTS (SELECT 1 FROM "${table}" WHERE ${conditions.join(' OR ')}) AS found`, replacements);
    if (row.found) hits.push(`${table}.${column}`);
  }
  return hits.sort();
}

async function counts() {
  const [row] = await select<Record<string, string>>(
    `SELECT (SELECT count(*) FROM injuries WHERE athlete_id = :id) AS injuries,
            (SELECT count(*) FROM measurements m JOIN injuries i ON i.id = m.injury_id WHERE i.athlete_id = :id) AS measurements,
            (SELECT count(*) FROM runs WHERE athlete_id = :id) AS runs,
            (SELECT count(*) FROM run_log_entries e JOIN runs r ON r.id = e.run_id WHERE r.athlete_id = :id) AS log_entries,
            (SELECT count(*) FROM session_notes n JOIN runs r ON r.id = n.run_id WHERE r.athlete_id = :id) AS session_notes,
            (SELECT json_agg(json_build_array(m.girth_injured_cm, m.girth_other_cm, m.knee_flexion_deg, m.pain_nprs) ORDER BY m.id)
               FROM measurements m JOIN injuries i ON i.id = m.injury_id WHERE i.athlete_id = :id) AS figures`,
    { id: athleteId },
  );
  return row;
}

async function log(runId: string, body: object) {
  const res = await therapist.post(`/api/runs/${runId}/log`).set('Idempotency-Key', randomUUID()).send(body);
  expect(res.status).toBe(201);
}

beforeAll(async () => {
  const clinic = await createClinic();
  admin = await signedInAgent(app, (await createStaff(clinic.id, 'admin')).email);
  therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist')).email);
  supervisor = await signedInAgent(app, (await createStaff(clinic.id, 'supervisor')).email);
  otherAdmin = await signedInAgent(app, (await createStaff((await createClinic()).id, 'admin')).email);

  // Everything a clinic records about an athlete over a few visits, with their name in every free-text field.
  const athlete = await therapist.post('/api/athletes').send({
    name,
    yearOfBirth: new Date().getFullYear() - 16,
    sport: 'Hockey',
    position: `Left wing, like every ${last}`,
    email,
    notes: `${first} prefers the morning slot`,
    consentToTreatment: true,
    guardianConsent: { guardianName: `Odalys ${last}` },
  });
  expect(athlete.status).toBe(201);
  athleteId = athlete.body.athlete.id;
  const injury = await therapist.post('/api/injuries').send({
    athleteId,
    region: 'anterior-thigh',
    side: 'left',
    mechanismKind: 'knee-to-thigh',
    mechanism: `Knee from ${first}'s own teammate`,
    injuredAt: minutesAgo(600),
  });
  injuryId = injury.body.injury.id;
  const measurement = await therapist.post(`/api/injuries/${injuryId}/measurements`).send({
    takenAt: minutesAgo(30),
    girthInjuredCm: 52.5,
    girthOtherCm: 50,
    girthLandmark: 'superior pole of the patella',
    girthDistanceCm: 15,
    kneeFlexionDeg: 80,
    painNprs: 6,
    notes: `${first} says it throbs at night`,
  });
  expect(measurement.status).toBe(201);
  const png = await sharp({ create: { width: 2, height: 2, channels: 3, background: '#aa3344' } }).png().toBuffer();
  await therapist.post(`/api/measurements/${measurement.body.measurement.id}/photos`).attach('file', png, `${last}-thigh.png`).expect(201);
  const pdf = Buffer.from('%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[]/Count 0>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n');
  await therapist.post(`/api/athletes/${athleteId}/consent-form`).attach('file', pdf, `${first}-consent.pdf`).expect(201);
  await therapist.put(`/api/injuries/${injuryId}/phase-override`).send({ override: { phase: 'acute', reason: `${first} is still guarding the leg` } }).expect(200);

  // A run that went back to cold: the athlete's home-care plan and the supervisor's alert (which names them).
  const run = (await therapist.post('/api/runs').send({ injuryId, screening: clear })).body.run;
  await log(run.id, { type: 'step-completed', at: minutesAgo(12), seq: 1, stepIndex: 0, kind: 'cold-pack', plannedSeconds: 1200, actualSeconds: 1200 });
  await log(run.id, { type: 'step-skipped', at: minutesAgo(10), seq: 2, stepIndex: 1, kind: 'compression-wrap', reason: `${first} could not bear the wrap` });
  await log(run.id, { type: 'swelling-check', at: minutesAgo(9), seq: 3, detail: 'increased' });
  await log(run.id, { type: 'run-fell-back', at: minutesAgo(8), seq: 4, reason: 'swelling increased' });
  await therapist.put(`/api/runs/${run.id}/note`).send({
    subjective: `${first} reports throbbing`,
    objective: `Girth up on ${last}'s left thigh`,
    assessment: 'Acute contusion',
    plan: `Ice at home; ${first} to call if worse`,
  }).expect(200);
  await therapist.post(`/api/runs/${run.id}/note/submit`).expect(200);
  await supervisor.post(`/api/runs/${run.id}/sign-off`).send({ comment: `Agreed; call ${first} tomorrow` }).expect(200);

  // An earlier episode, closed with a reason although a criterion was unmet.
  const earlier = await therapist.post('/api/injuries').send({ athleteId, region: 'calf', side: 'right', mechanismKind: 'ball', injuredAt: minutesAgo(60 * 24 * 40) });
  closedInjuryId = earlier.body.injury.id;
  await therapist.post(`/api/injuries/${closedInjuryId}/close`).send({ reason: `${first} moved to another club` }).expect(200);

  const [message] = await waitForMail(email);
  optOutToken = /\/opt-out\?token=([A-Za-z0-9_-]{43})/.exec(message.text ?? '')![1];
  await settleBackgroundMail();
});

describe('finding an athlete for a data request', () => {
  it('an admin finds the athlete by part of the name, with how much is held on them', async () => {
    const res = await admin.get(`/api/data-rights/athletes?q=${encodeURIComponent(first.toLowerCase())}`);
    expect(res.status).toBe(200);
    expect(res.body.items).toEqual([
      {
        id: athleteId,
        name,
        yearOfBirth: new Date().getFullYear() - 16,
        erasedAt: null,
        emailOptedOutAt: null,
        counts: { injuries: 2, measurements: 1, runs: 1, sessionNotes: 1, files: 2, emails: 1 },
      },
    ]);
  });

  it('is for admins of the same clinic only', async () => {
    expect((await therapist.get(`/api/data-rights/athletes?q=${first}`)).status).toBe(403);
    expect((await otherAdmin.get(`/api/data-rights/athletes?q=${first}`)).body.items).toEqual([]);
    expect((await admin.get(`/api/data-rights/athletes?q=${'x'.repeat(121)}`)).body.error.fields.q).toBeTruthy();
  });
});

describe('exporting an athlete’s data', () => {
  let zip: Buffer;
  let entries: Map<string, Buffer>;

  beforeAll(async () => {
    const res = await admin
      .get(`/api/athletes/${athleteId}/export`)
      .buffer(true)
      .parse((response, done) => {
        const chunks: Buffer[] = [];
        response.on('data', (chunk: Buffer) => chunks.push(chunk));
        response.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/zip');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?mendstep-athlete-[0-9a-f]{8}-\d{4}-\d{2}-\d{2}\.zip"?$/);
    zip = res.body as Buffer;
    entries = readZip(zip);
  });

  it('is a valid zip (checked by Info-ZIP’s unzip where it is installed)', () => {
    let unzip = true;
    try {
      execFileSync('unzip', ['-v'], { stdio: 'ignore' });
    } catch {
      unzip = false;
    }
    if (!unzip) return;
    const file = path.join(storageDir, 'export.zip');
    fs.writeFileSync(file, zip);
    expect(execFileSync('unzip', ['-tq', file]).toString()).toMatch(/No errors detected/);
    expect(execFileSync('unzip', ['-Z1', file]).toString().trim().split('\n').sort()).toEqual([...entries.keys()].sort());
    fs.rmSync(file);
  });

  it('holds every record of the athlete in athlete.json and in a CSV file per table', async () => {
    const json = JSON.parse(entries.get('athlete.json')!.toString('utf8'));
    expect(json.athlete).toMatchObject({ id: athleteId, name, email, notes: `${first} prefers the morning slot`, guardianName: `Odalys ${last}` });

    // What the database holds on the athlete, read here on its own, table by table.
    const ids = async (sql: string) => (await select<{ id: string }>(sql, { id: athleteId, email })).map((r) => String(r.id)).sort();
    const held = {
      injuries: await ids('SELECT id FROM injuries WHERE athlete_id = :id'),
      measurements: await ids('SELECT m.id FROM measurements m JOIN injuries i ON i.id = m.injury_id WHERE i.athlete_id = :id'),
      runs: await ids('SELECT id FROM runs WHERE athlete_id = :id'),
      logEntries: await ids('SELECT e.id FROM run_log_entries e JOIN runs r ON r.id = e.run_id WHERE r.athlete_id = :id'),
      sessionNotes: await ids('SELECT n.id FROM session_notes n JOIN runs r ON r.id = n.run_id WHERE r.athlete_id = :id'),
      uploads: await ids('SELECT id FROM uploads WHERE athlete_id = :id'),
      emails: await ids('SELECT id FROM outbound_emails WHERE to_address = :email'),
      auditEvents: await ids(
        // The export's own event is written as it goes out, so it is not in the file.
        `SELECT a.id FROM audit_events a WHERE a.action <> 'athlete.exported' AND ((a.record_type = 'athlete' AND a.record_id = CAST(:id AS text))
           OR (a.record_type = 'injury' AND a.record_id IN (SELECT CAST(id AS text) FROM injuries WHERE athlete_id = :id))
           OR (a.record_type = 'run' AND a.record_id IN (SELECT CAST(id AS text) FROM runs WHERE athlete_id = :id))
           OR (a.record_type = 'upload' AND a.record_id IN (SELECT CAST(id AS text) FROM uploads WHERE athlete_id = :id))
           OR (a.record_type = 'measurement' AND a.record_id IN (SELECT CAST(m.id AS text) FROM measurements m JOIN injuries i ON i.id = m.injury_id WHERE i.athlete_id = :id))
           OR (a.record_type = 'session-note' AND a.record_id IN (SELECT CAST(n.id AS text) FROM session_notes n JOIN runs r ON r.id = n.run_id WHERE r.athlete_id = :id)))`,
      ),
    };
    expect(held.injuries).toHaveLength(2);
    expect(held.logEntries).toHaveLength(4);
    expect(held.uploads).toHaveLength(2);
    expect(held.emails).toHaveLength(1);
    expect(held.auditEvents.length).toBeGreaterThan(10);

    const idsIn = (rows: { id: string | number }[]) => rows.map((r) => String(r.id)).sort();
    expect(idsIn(json.injuries)).toEqual(held.injuries);
    expect(idsIn(json.measurements)).toEqual(held.measurements);
    expect(idsIn(json.runs)).toEqual(held.runs);
    expect(idsIn(json.runs.flatMap((r: { logEntries: { id: string }[] }) => r.logEntries))).toEqual(held.logEntries);
    expect(idsIn(json.sessionNotes)).toEqual(held.sessionNotes);
    expect(idsIn(json.uploads)).toEqual(held.uploads);
    expect(idsIn(json.emails)).toEqual(held.emails);
    expect(idsIn(json.auditEvents)).toEqual(held.auditEvents);
    // Runs come with their plans, notes with their text, e-mails with what was said.
    expect(json.runs[0].plan.steps.length).toBeGreaterThan(0);
    expect(json.sessionNotes[0].subjective).toBe(`${first} reports throbbing`);
    expect(json.emails[0].text).toContain(`Hello ${first}`);

    const csv = (table: string) => entries.get(`csv/${table}.csv`)!.toString('utf8');
    const tables: [string, string[]][] = [
      ['athlete', [athleteId]],
      ['injuries', held.injuries],
      ['measurements', held.measurements],
      ['runs', held.runs],
      ['run-log-entries', held.logEntries],
      ['session-notes', held.sessionNotes],
      ['uploads', held.uploads],
      ['emails', held.emails],
      ['audit-events', held.auditEvents],
    ];
    for (const [table, tableIds] of tables) {
      const text = csv(table);
      expect(text.startsWith('\uFEFFid,'), `${table}.csv starts with its header`).toBe(true);
      for (const id of tableIds) expect(text, `${table}.csv holds ${id}`).toMatch(new RegExp(`(^|\\r\\n)"?${id}"?,`));
    }
  });

  it('holds the uploaded files themselves, byte for byte', async () => {
    const json = JSON.parse(entries.get('athlete.json')!.toString('utf8'));
    const stored = await select<{ id: string; sha256: string }>('SELECT id, sha256 FROM uploads WHERE athlete_id = :id', { id: athleteId });
    for (const upload of stored) {
      const listed = json.uploads.find((u: { id: string }) => u.id === upload.id);
      expect(listed.file).toMatch(new RegExp(`^files/${upload.id}-`));
      expect(createHash('sha256').update(entries.get(listed.file)!).digest('hex')).toBe(upload.sha256);
    }
    expect(json.uploads.map((u: { originalName: string }) => u.originalName).sort()).toEqual([`${first}-consent.pdf`, `${last}-thigh.png`].sort());
  });

  it('is recorded on the audit trail, and is for admins of the athlete’s clinic only', async () => {
    const event = await AuditEvent.findOne({ where: { action: 'athlete.exported', recordId: athleteId } });
    expect(event?.userId).toBe(admin.user.id);
    expect(event?.detail).toMatchObject({ injuries: 2, runs: 1, files: 2, emails: 1 });
    expect((await therapist.get(`/api/athletes/${athleteId}/export`)).status).toBe(403);
    expect((await otherAdmin.get(`/api/athletes/${athleteId}/export`)).status).toBe(404);
  });
});

describe('erasing an athlete’s personal data', () => {
  let before: Awaited<ReturnType<typeof counts>>;

  it('is refused when the typed name does not match, for non-admins, and while a run is in progress; nothing changes', async () => {
    expect((await therapist.post(`/api/athletes/${athleteId}/erase`).send({ confirmName: name })).status).toBe(403);
    expect((await otherAdmin.post(`/api/athletes/${athleteId}/erase`).send({ confirmName: name })).status).toBe(404);
    const wrong = await admin.post(`/api/athletes/${athleteId}/erase`).send({ confirmName: first });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.confirmName).toMatch(/does not match/);
    const missing = await admin.post(`/api/athletes/${athleteId}/erase`).send({});
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.confirmName).toBeTruthy();

    const run = (await therapist.post('/api/runs').send({ injuryId, screening: clear })).body.run;
    const busy = await admin.post(`/api/athletes/${athleteId}/erase`).send({ confirmName: name });
    expect(busy.status).toBe(409);
    expect(busy.body.error.code).toBe('run_active');
    await log(run.id, { type: 'step-skipped', at: minutesAgo(1), seq: 1, stepIndex: 0, kind: 'cold-pack', reason: `${first} was late` });
    await log(run.id, { type: 'run-ended-early', at: minutesAgo(0), seq: 2, reason: `${first} had to leave for the bus` });
    expect((await Athlete.findByPk(athleteId))!.name).toBe(name);
    expect(storedFiles()).toBe(2);
  });

  it('leaves none of their personal fields anywhere in the database, deletes their files, and keeps the clinical counts', async () => {
    await settleBackgroundMail();
    before = await counts();
    const mentioned = await columnsMentioning([first, last, email]);
    // The search reaches every place the athlete was written down (it would find a leftover).
    for (const column of [
      'athletes.name',
      'athletes.email',
      'athletes.notes',
      'athletes.position',
      'athletes.guardian_name',
      'injuries.mechanism',
      'injuries.phase_override',
      'injuries.closure',
      'measurements.notes',
      'run_log_entries.reason',
      'session_notes.subjective',
      'session_notes.sign_off_comment',
      'uploads.original_name',
      'outbound_emails.to_address',
      'outbound_emails.subject',
      'outbound_emails.text',
      'mailbox_messages.raw',
      'audit_events.detail',
    ]) {
      expect(mentioned).toContain(column);
    }

    const res = await admin.post(`/api/athletes/${athleteId}/erase`).send({ confirmName: `  ${name.toUpperCase()} ` });
    expect(res.status).toBe(200);
    expect(res.body.athlete).toMatchObject({ id: athleteId, name: `Erased athlete ${athleteId.slice(0, 8)}` });
    expect(res.body.removed).toMatchObject({ files: 2, optOutLinks: 1 });
    expect(res.body.removed.redactedEmails).toBeGreaterThanOrEqual(2);
    expect(res.body.closedInjuries).toBe(1);

    expect(await columnsMentioning([first, last, email])).toEqual([]);
    expect(storedFiles()).toBe(0);
    const after = await counts();
    expect(after).toEqual(before);
    expect(Number(after.log_entries)).toBe(6);

    const row = (await Athlete.findByPk(athleteId))!;
    expect(row).toMatchObject({ email: null, notes: null, position: null, guardianName: null, consentToTreatment: true, sport: 'Hockey' });
    expect(row.erasedAt).toBeInstanceOf(Date);
    const event = await AuditEvent.findOne({ where: { action: 'athlete.erased', recordId: athleteId } });
    expect(event?.userId).toBe(admin.user.id);
    expect(event?.detail).toMatchObject({ consent: { toTreatment: true, guardian: true }, kept: { injuries: 2, runs: 2, logEntries: 6 } });
  });

  it('afterwards nothing new can be recorded or sent for them, and a second erasure is refused', async () => {
    const newInjury = await therapist.post('/api/injuries').send({ athleteId, region: 'calf', side: 'left', mechanismKind: 'ball', injuredAt: minutesAgo(30) });
    expect(newInjury.status).toBe(409);
    expect(newInjury.body.error.code).toBe('athlete_erased');
    expect((await therapist.post('/api/runs').send({ injuryId, screening: clear })).status).toBe(409);
    expect((await therapist.patch(`/api/athletes/${athleteId}`).send({ email: 'back@example.test' })).body.error.code).toBe('athlete_erased');
    const measurement = await therapist.post(`/api/injuries/${injuryId}/measurements`).send({ takenAt: minutesAgo(1), painNprs: 2 });
    expect(measurement.body.error.code).toBe('athlete_erased');

    const anyone = request.agent(app);
    const csrf = (await anyone.get('/api/auth/csrf')).body.token as string;
    expect((await anyone.post('/api/opt-out/check').set('X-CSRF-Token', csrf).send({ token: optOutToken })).status).toBe(400);

    const register = (await therapist.get('/api/athletes?pageSize=100')).body.items as { id: string }[];
    expect(register.map((a) => a.id)).not.toContain(athleteId);
    const search = (await admin.get(`/api/data-rights/athletes?q=${encodeURIComponent('Erased athlete ' + athleteId.slice(0, 8))}`)).body.items;
    expect(search).toHaveLength(1);
    expect(search[0].erasedAt).toBeTruthy();
    expect(search[0].counts).toMatchObject({ injuries: 2, runs: 2, measurements: 1, files: 0 });

    expect((await admin.post(`/api/athletes/${athleteId}/erase`).send({ confirmName: `Erased athlete ${athleteId.slice(0, 8)}` })).status).toBe(409);
  });
});
