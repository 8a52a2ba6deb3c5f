import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/models';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
type Agent = Awaited<ReturnType<typeof signedInAgent>>;

let therapist: Agent;
let supervisor: Agent;
let admin: Agent;
let otherSupervisor: Agent;
let otherTherapist: Agent;

const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };
const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();

beforeAll(async () => {
  const clinic = await createClinic();
  const other = await createClinic();
  therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist', { name: 'Tess Marlow' })).email);
  supervisor = await signedInAgent(app, (await createStaff(clinic.id, 'supervisor', { name: 'Orla Penhale' })).email);
  admin = await signedInAgent(app, (await createStaff(clinic.id, 'admin')).email);
  otherSupervisor = await signedInAgent(app, (await createStaff(other.id, 'supervisor')).email);
  otherTherapist = await signedInAgent(app, (await createStaff(other.id, 'therapist')).email);
});

/** An acute thigh contusion treated to the end of its plan. */
async function completedAcuteRun(finish = true) {
  const athlete = (await therapist.post('/api/athletes').send({ consentToTreatment: true, name: 'Rhys Calloway', yearOfBirth: 2000, sport: 'Football' })).body.athlete;
  const injury = (
    await therapist.post('/api/injuries').send({ athleteId: athlete.id, region: 'anterior-thigh', side: 'right', mechanismKind: 'knee-to-thigh', injuredAt: hoursAgo(20) })
  ).body.injury;
  await therapist.post(`/api/injuries/${injury.id}/measurements`).send({
    takenAt: hoursAgo(3),
    painNprs: 4,
    kneeFlexionDeg: 80,
    girthInjuredCm: 52,
    girthOtherCm: 49,
    girthLandmark: 'superior pole of patella',
    girthDistanceCm: 15,
  });
  const run = (await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear })).body.run;
  if (!finish) return run;
  const t0 = Date.now() - 2 * 3_600_000;
  const at = (m: number) => new Date(t0 + m * 60_000).toISOString();
  const entries = [
    { type: 'step-completed', stepIndex: 0, kind: 'cold-pack', plannedSeconds: 1200, actualSeconds: 1200, at: at(20) },
    { type: 'step-completed', stepIndex: 1, kind: 'compression-wrap', plannedSeconds: 180, actualSeconds: 160, at: at(23) },
    { type: 'step-completed', stepIndex: 2, kind: 'rest-recheck', plannedSeconds: 300, actualSeconds: 300, at: at(28) },
    { type: 'swelling-check', stepIndex: 2, kind: 'rest-recheck', detail: 'not increased', at: at(28) },
    { type: 'run-completed', at: at(28) },
  ];
  for (const [i, entry] of entries.entries()) {
    expect((await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send({ seq: i + 1, ...entry })).status).toBe(201);
  }
  return run;
}

const sections = { subjective: 'Reports less pain today.', objective: 'Girth 52.0 / 49.0 cm.', assessment: 'Acute, moderate.', plan: 'Cold 20 min each hour.' };

describe('the session note lifecycle', () => {
  it('draft → edit → submit → sign-off locks → edit refused → reopen with a reason → edit again, each an audit event', async () => {
    const run = await completedAcuteRun();

    // Drafted by Mendstep from the run, the injury and the measurements.
    const drafted = await therapist.get(`/api/runs/${run.id}/note`);
    expect(drafted.status).toBe(200);
    const note = drafted.body.note;
    expect(note).toMatchObject({ runId: run.id, status: 'draft', locked: false, signedAt: null, submittedAt: null });
    expect(note.subjective).toContain('Pain 4/10 (NPRS) at the last measurement');
    expect(note.objective).toContain('- Cold pack: 20 min (planned 20 min), completed.');
    // Ryan et al. 1991: 80° of active knee flexion is a moderate contusion.
    expect(note.assessment).toContain('Severity: moderate');
    expect(note.plan).toContain('20 minutes');
    // Asking again finds the same note; nothing is drafted twice.
    expect((await supervisor.get(`/api/runs/${run.id}/note`)).body.note.id).toBe(note.id);

    const edited = await therapist.put(`/api/runs/${run.id}/note`).send(sections);
    expect(edited.status).toBe(200);
    expect(edited.body.note).toMatchObject({ ...sections, status: 'draft' });

    const refusedEarly = await supervisor.post(`/api/runs/${run.id}/sign-off`).send({ comment: 'Fine' });
    expect(refusedEarly.status).toBe(409);
    expect(refusedEarly.body.error.message).toMatch(/submit/i);

    const submitted = await therapist.post(`/api/runs/${run.id}/note/submit`);
    expect(submitted.status).toBe(200);
    expect(submitted.body.note).toMatchObject({ status: 'submitted', submittedByName: 'Tess Marlow', locked: false });
    expect(submitted.body.note.submittedAt).toEqual(expect.any(String));

    expect((await therapist.post(`/api/runs/${run.id}/sign-off`).send({})).status).toBe(403);
    expect((await admin.post(`/api/runs/${run.id}/sign-off`).send({})).status).toBe(403);

    const signed = await supervisor.post(`/api/runs/${run.id}/sign-off`).send({ comment: 'Good early cold; re-check tomorrow.' });
    expect(signed.status).toBe(200);
    expect(signed.body.note).toMatchObject({ status: 'signed', locked: true, signedByName: 'Orla Penhale', signOffComment: 'Good early cold; re-check tomorrow.' });

    // The therapist sees it locked, and cannot change it.
    expect((await therapist.get(`/api/runs/${run.id}/note`)).body.note).toMatchObject({ status: 'signed', locked: true });
    const lockedEdit = await therapist.put(`/api/runs/${run.id}/note`).send({ ...sections, plan: 'Changed after signing' });
    expect(lockedEdit.status).toBe(409);
    expect(lockedEdit.body.error.code).toBe('note_locked');
    expect((await supervisor.put(`/api/runs/${run.id}/note`).send(sections)).status).toBe(409);
    expect((await therapist.post(`/api/runs/${run.id}/note/submit`)).status).toBe(409);
    expect((await supervisor.post(`/api/runs/${run.id}/sign-off`).send({})).status).toBe(409);
    expect((await therapist.get(`/api/runs/${run.id}/note`)).body.note.plan).toBe(sections.plan);

    const shortReason = await supervisor.post(`/api/runs/${run.id}/note/reopen`).send({ reason: 'typo' });
    expect(shortReason.status).toBe(400);
    expect(shortReason.body.error.fields).toHaveProperty('reason');
    expect((await therapist.post(`/api/runs/${run.id}/note/reopen`).send({ reason: 'I want to change it' })).status).toBe(403);

    const reopened = await supervisor.post(`/api/runs/${run.id}/note/reopen`).send({ reason: 'Pain score was recorded on the wrong side' });
    expect(reopened.status).toBe(200);
    expect(reopened.body.note).toMatchObject({ status: 'draft', locked: false, signedAt: null, signedByName: null, signOffComment: null, submittedAt: null });

    const again = await therapist.put(`/api/runs/${run.id}/note`).send({ ...sections, subjective: 'Pain 4/10 on the right.' });
    expect(again.status).toBe(200);
    expect(again.body.note.subjective).toBe('Pain 4/10 on the right.');

    const events = await AuditEvent.findAll({ where: { recordType: 'session-note', recordId: note.id }, order: [['id', 'ASC']] });
    expect(events.map((e) => e.action)).toEqual([
      'session-note.drafted',
      'session-note.edited',
      'session-note.submitted',
      'session-note.signed',
      'session-note.reopened',
      'session-note.edited',
    ]);
    const versions = events.map((e) => e.detail.version as number);
    expect(versions).toEqual([...versions].sort((a, b) => a - b));
    expect(new Set(versions).size).toBe(versions.length);
    expect(events[3].detail).toMatchObject({ comment: 'Good early cold; re-check tomorrow.' });
    expect(events[4].detail).toMatchObject({ reason: 'Pain score was recorded on the wrong side', previous: { status: 'signed' } });
  });

  it('the review detail carries the note with its sign-off', async () => {
    const run = await completedAcuteRun();
    await therapist.get(`/api/runs/${run.id}/note`);
    await therapist.post(`/api/runs/${run.id}/note/submit`);
    await supervisor.post(`/api/runs/${run.id}/sign-off`).send({});
    const detail = await supervisor.get(`/api/review/runs/${run.id}`);
    expect(detail.body.note).toMatchObject({ status: 'signed', locked: true, signOffComment: null });
  });

  it('a note is written only once a run has finished', async () => {
    const run = await completedAcuteRun(false);
    const res = await therapist.get(`/api/runs/${run.id}/note`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('run_not_finished');
    expect((await therapist.put(`/api/runs/${run.id}/note`).send(sections)).status).toBe(409);
  });

  it('refuses a section over 8000 characters or missing, naming it, and saves nothing', async () => {
    const run = await completedAcuteRun();
    const before = (await therapist.get(`/api/runs/${run.id}/note`)).body.note;
    const long = await therapist.put(`/api/runs/${run.id}/note`).send({ ...sections, plan: 'x'.repeat(8001) });
    expect(long.status).toBe(400);
    expect(long.body.error.fields).toHaveProperty('plan');
    const missing = await therapist.put(`/api/runs/${run.id}/note`).send({ subjective: 'only this' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toHaveProperty('objective');
    expect((await therapist.get(`/api/runs/${run.id}/note`)).body.note.plan).toBe(before.plan);
  });

  it('an empty section cannot be submitted', async () => {
    const run = await completedAcuteRun();
    await therapist.get(`/api/runs/${run.id}/note`);
    await therapist.put(`/api/runs/${run.id}/note`).send({ ...sections, assessment: '   ' });
    const res = await therapist.post(`/api/runs/${run.id}/note/submit`);
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('assessment');
    expect((await therapist.get(`/api/runs/${run.id}/note`)).body.note.status).toBe('draft');
  });

  it("another clinic's run answers 404 for every note route", async () => {
    const run = await completedAcuteRun();
    await therapist.get(`/api/runs/${run.id}/note`);
    await therapist.post(`/api/runs/${run.id}/note/submit`);
    expect((await otherTherapist.get(`/api/runs/${run.id}/note`)).status).toBe(404);
    expect((await otherTherapist.put(`/api/runs/${run.id}/note`).send(sections)).status).toBe(404);
    expect((await otherTherapist.post(`/api/runs/${run.id}/note/submit`)).status).toBe(404);
    expect((await otherSupervisor.post(`/api/runs/${run.id}/sign-off`).send({ comment: 'not mine' })).status).toBe(404);
    expect((await otherSupervisor.post(`/api/runs/${run.id}/note/reopen`).send({ reason: 'not mine either' })).status).toBe(404);
    // Still waiting for its own supervisor.
    expect((await supervisor.get(`/api/runs/${run.id}/note`)).body.note.status).toBe('submitted');
  });

  it('reopening a draft, or signing a run without a note, is refused with a clear message', async () => {
    const run = await completedAcuteRun();
    const noNote = await supervisor.post(`/api/runs/${run.id}/sign-off`).send({});
    expect(noNote.status).toBe(409);
    expect(noNote.body.error.message).toMatch(/submits? it/i);
    await therapist.get(`/api/runs/${run.id}/note`);
    expect((await supervisor.post(`/api/runs/${run.id}/note/reopen`).send({ reason: 'Nothing to reopen here' })).status).toBe(409);
  });
});
