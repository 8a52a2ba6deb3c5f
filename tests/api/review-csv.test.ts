import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
type Agent = Awaited<ReturnType<typeof signedInAgent>>;

let therapist: Agent;
let supervisor: Agent;
let otherTherapist: Agent;
let runId: string;
let plainRunId: string;
let injuryId: string;

const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };
const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();
// Comma, double quotes and an accent: each needs RFC 4180 quoting or UTF-8 to survive the round trip.
const trickyName = 'Zoë "Zed" Marsh, Jr.';

/**
 * A small reader for RFC 4180 (Shafranovich, Common Format and MIME Type for CSV Files, IETF 2005): records
 * end in CRLF; a field with a comma, a double quote or a line break is enclosed in double quotes; a double
 * quote inside such a field is written twice.
 */
function parseRfc4180(text: string): string[][] {
  const records: string[][] = [];
  let record: string[] = [];
  let field = '';
  let i = 0;
  let quoted = false;
  while (i < text.length) {
    const c = text[i];
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i += 2;
      } else if (c === '"') {
        quoted = false;
        i += 1;
      } else {
        field += c;
        i += 1;
      }
    } else if (c === '"' && field === '') {
      quoted = true;
      i += 1;
    } else if (c === ',') {
      record.push(field);
      field = '';
      i += 1;
    } else if (c === '\r' && text[i + 1] === '\n') {
      record.push(field);
      records.push(record);
      record = [];
      field = '';
      i += 2;
    } else {
      // RFC 4180 allows no bare line breaks or quotes outside quoted fields.
      if (c === '\n' || c === '\r' || c === '"') throw new Error(`unquoted ${JSON.stringify(c)} at ${i}`);
      field += c;
      i += 1;
    }
  }
  if (quoted) throw new Error('unterminated quoted field');
  if (field !== '' || record.length) throw new Error('the last record does not end in CRLF');
  return records;
}

/** supertest buffers text/csv as text; the BOM is kept as U+FEFF. */
const csvText = (res: { text: string }) => res.text;

beforeAll(async () => {
  const clinic = await createClinic();
  const other = await createClinic();
  therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist', { name: 'Pádraig Ó Sé' })).email);
  supervisor = await signedInAgent(app, (await createStaff(clinic.id, 'supervisor', { name: 'Orla Penhale' })).email);
  otherTherapist = await signedInAgent(app, (await createStaff(other.id, 'therapist')).email);

  const athlete = (await therapist.post('/api/athletes').send({ consentToTreatment: true, name: trickyName, yearOfBirth: 1997, sport: 'Hockey' })).body.athlete;
  const injury = (await therapist.post('/api/injuries').send({ athleteId: athlete.id, region: 'calf', side: 'right', mechanismKind: 'ball', injuredAt: hoursAgo(240) })).body.injury;
  injuryId = injury.id;
  await therapist.post(`/api/injuries/${injury.id}/measurements`).send({
    takenAt: hoursAgo(200),
    girthInjuredCm: 38.5,
    girthOtherCm: 36.5,
    girthLandmark: 'tibial tuberosity',
    girthDistanceCm: 12,
    painNprs: 5,
    bruiseLengthCm: 6,
    bruiseWidthCm: 4,
    skinfoldMm: 8,
    notes: 'Said "it\'s tight", worse on stairs,\nbetter after icing',
  });
  await therapist.post(`/api/injuries/${injury.id}/measurements`).send({ takenAt: hoursAgo(5), painNprs: 2, notes: '=SUM(A1:A9)' });

  const run = (await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear })).body.run;
  runId = run.id;
  const t0 = Date.now() - 3 * 3_600_000;
  const at = (m: number) => new Date(t0 + m * 60_000).toISOString();
  const entries = [
    { type: 'step-completed', stepIndex: 0, kind: 'ice-massage', plannedSeconds: 360, actualSeconds: 365, at: at(6) },
    { type: 'step-skipped', stepIndex: 1, kind: 'light-strokes', plannedSeconds: 300, actualSeconds: 10, reason: 'too tender', detail: 'required step', at: at(7) },
    { type: 'step-completed', stepIndex: 2, kind: 'passive-movement', plannedSeconds: 180, actualSeconds: 180, at: at(10) },
    { type: 'step-completed', stepIndex: 3, kind: 'active-movement', plannedSeconds: 180, actualSeconds: 180, at: at(13) },
    { type: 'step-completed', stepIndex: 4, kind: 'rest-recheck', plannedSeconds: 120, actualSeconds: 120, at: at(15) },
    { type: 'swelling-check', stepIndex: 4, kind: 'rest-recheck', detail: 'not increased', at: at(15) },
    { type: 'step-completed', stepIndex: 5, kind: 'ice-massage', plannedSeconds: 360, actualSeconds: 300, at: at(20) },
    { type: 'run-completed', at: at(20) },
  ];
  for (const [i, entry] of entries.entries()) {
    expect((await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send({ seq: i + 1, ...entry })).status).toBe(201);
  }
  await therapist.get(`/api/runs/${run.id}/note`);
  await therapist.post(`/api/runs/${run.id}/note/submit`);
  expect((await supervisor.post(`/api/runs/${run.id}/sign-off`).send({ comment: 'ok' })).status).toBe(200);

  // A second athlete's run stopped at the screening, to check the filters reach the export.
  const plain = (await therapist.post('/api/athletes').send({ consentToTreatment: true, name: 'Ivo Lind', yearOfBirth: 2001, sport: 'Hockey' })).body.athlete;
  const plainInjury = (await therapist.post('/api/injuries').send({ athleteId: plain.id, region: 'calf', side: 'left', mechanismKind: 'ball', injuredAt: hoursAgo(30) })).body.injury;
  plainRunId = (await therapist.post('/api/runs').send({ injuryId: plainInjury.id, screening: { ...clear, redFlags: ['suspected-fracture'] } })).body.run.id;
});

describe('the runs CSV', () => {
  it('is a UTF-8 attachment with a BOM, the agreed columns and every matching run', async () => {
    const res = await supervisor.get('/api/review/runs.csv');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="mendstep-runs-\d{4}-\d{2}-\d{2}\.csv"$/);
    const text = csvText(res);
    expect(text.charCodeAt(0)).toBe(0xfeff);
    const [header, ...rows] = parseRfc4180(text.slice(1));
    expect(header).toEqual([
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
    ]);
    expect(rows.map((r) => r[0])).toEqual([plainRunId, runId]);
    const row = Object.fromEntries(header.map((column, i) => [column, rows[1][i]]));
    expect(row).toMatchObject({
      athlete: trickyName,
      therapist: 'Pádraig Ó Sé',
      injury: 'calf, right',
      phase: 'proliferative',
      outcome: 'completed',
      steps_planned: '6',
      steps_completed: '5',
      steps_skipped: '1',
      swelling_checks: '1',
      ice_massage_seconds: String(365 + 300),
      note_status: 'signed',
      signed_by: 'Orla Penhale',
    });
    expect(row.date).toMatch(/^\d{4}-\d{2}-\d{2} \d{2}:\d{2}$/);
    expect(row.signed_at).toMatch(/^\d{4}-\d{2}-\d{2} \d{2}:\d{2}$/);
    // The raw text shows the quoting itself: the field enclosed, its quotes doubled.
    expect(text).toContain('"Zoë ""Zed"" Marsh, Jr."');
    const referred = Object.fromEntries(header.map((column, i) => [column, rows[0][i]]));
    expect(referred).toMatchObject({ athlete: 'Ivo Lind', outcome: 'stopped-referred', steps_completed: '0', note_status: 'none', signed_by: '', signed_at: '' });
  });

  it('takes the same filters as the list', async () => {
    const [, ...signed] = parseRfc4180(csvText(await supervisor.get('/api/review/runs.csv?noteSigned=true')).slice(1));
    expect(signed.map((r) => r[0])).toEqual([runId]);
    const [, ...referred] = parseRfc4180(csvText(await supervisor.get('/api/review/runs.csv?outcome=stopped-referred&attention=true')).slice(1));
    expect(referred.map((r) => r[0])).toEqual([plainRunId]);
    const bad = await supervisor.get('/api/review/runs.csv?outcome=nope');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('outcome');
  });
});

describe('the measurements CSV', () => {
  it('lists an injury’s measurements with the agreed columns, quoting and formula guard', async () => {
    const res = await therapist.get(`/api/injuries/${injuryId}/measurements.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="mendstep-measurements-calf-right-[0-9a-f]{8}\.csv"$/);
    const text = csvText(res);
    expect(text.charCodeAt(0)).toBe(0xfeff);
    const [header, first, second, ...rest] = parseRfc4180(text.slice(1));
    expect(rest).toEqual([]);
    expect(header).toEqual([
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
    ]);
    const row = Object.fromEntries(header.map((column, i) => [column, first[i]]));
    expect(row).toMatchObject({
      girth_injured_cm: '38.5',
      girth_other_cm: '36.5',
      girth_difference_cm: '2',
      landmark: 'tibial tuberosity',
      distance_cm: '12',
      knee_flexion_deg: '',
      pain_nprs: '5',
      bruise_length_cm: '6',
      bruise_width_cm: '4',
      skinfold_mm: '8',
      notes: 'Said "it\'s tight", worse on stairs,\nbetter after icing',
      recorded_by: 'Pádraig Ó Sé',
    });
    // A note that a spreadsheet would run as a formula stays text (OWASP: CSV injection).
    expect(second[header.indexOf('notes')]).toBe("'=SUM(A1:A9)");
  });

  it('is for therapists and supervisors of the clinic only', async () => {
    expect((await supervisor.get(`/api/injuries/${injuryId}/measurements.csv`)).status).toBe(200);
    expect((await otherTherapist.get(`/api/injuries/${injuryId}/measurements.csv`)).status).toBe(404);
  });
});
