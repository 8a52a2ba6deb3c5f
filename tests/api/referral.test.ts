import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/models';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let otherClinic: Awaited<ReturnType<typeof signedInAgent>>;
let clinicId: string;

const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();
const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };

beforeAll(async () => {
  const clinic = await createClinic('Harbour Sports Clinic');
  clinicId = clinic.id;
  await clinic.update({ settings: { timeZone: 'Europe/London', contactPhone: '+44 161 496 0000' } });
  therapist = await signedInAgent(app, (await createStaff(clinicId, 'therapist', { name: 'Rafe Referrer' })).email);
  otherClinic = await signedInAgent(app, (await createStaff((await createClinic()).id, 'therapist')).email);
});

async function thighInjuryWithHistory() {
  const athlete = (await therapist.post('/api/athletes').send({ consentToTreatment: true, name: 'Sami Okafor', yearOfBirth: 1999, sport: 'Rugby union' })).body.athlete;
  const injury = (
    await therapist.post('/api/injuries').send({ athleteId: athlete.id, region: 'anterior-thigh', side: 'left', mechanismKind: 'knee-to-thigh', mechanism: 'Knee in a tackle', injuredAt: hoursAgo(50) })
  ).body.injury;
  await therapist.post(`/api/injuries/${injury.id}/measurements`).send({ takenAt: hoursAgo(30), kneeFlexionDeg: 70, painNprs: 6, girthInjuredCm: 55, girthOtherCm: 52, girthLandmark: 'superior pole of patella', girthDistanceCm: 15 });
  await therapist.post(`/api/injuries/${injury.id}/measurements`).send({ takenAt: hoursAgo(3), kneeFlexionDeg: 60, painNprs: 8 });
  // A run with steps done, then one stopped at screening for a red flag.
  const first = (await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear })).body.run;
  const log = (entry: object) => therapist.post(`/api/runs/${first.id}/log`).set('Idempotency-Key', randomUUID()).send(entry);
  await log({ type: 'step-completed', seq: 1, stepIndex: 0, kind: 'cold-pack', plannedSeconds: 1200, actualSeconds: 1200, at: hoursAgo(20) });
  await log({ type: 'run-completed', seq: 2, at: hoursAgo(19.5) });
  const stopped = (await therapist.post('/api/runs').send({ injuryId: injury.id, screening: { ...clear, redFlags: ['pain-out-of-proportion'] } })).body.run;
  expect(stopped.status).toBe('stopped-referred');
  return { athlete, injury, stopped };
}

describe('referral summary', () => {
  it('gathers the athlete, the injury, measurements over time, the phase, the red flag and what was done', async () => {
    const { injury, stopped } = await thighInjuryWithHistory();
    const res = await therapist.get(`/api/injuries/${injury.id}/referral?runId=${stopped.id}`);
    expect(res.status).toBe(200);
    const r = res.body.referral;
    expect(r.clinic).toEqual({ name: 'Harbour Sports Clinic', contactEmail: null, contactPhone: '+44 161 496 0000' });
    expect(r.preparedBy.name).toBe('Rafe Referrer');
    expect(r.athlete).toMatchObject({ name: 'Sami Okafor', yearOfBirth: 1999, sport: 'Rugby union' });
    expect(r.injury).toMatchObject({ site: 'Anterior thigh (quadriceps)', side: 'left', mechanism: 'Knee to thigh: Knee in a tackle', phase: 'acute' });
    // Graded from the latest knee flexion, 60°: moderate (Ryan et al. 1991, 45°–90°).
    expect(r.injury.severity).toMatchObject({ grade: 'moderate', kneeFlexionDeg: 60 });
    expect(r.reasons[0]).toMatchObject({ kind: 'red-flag', text: 'Red flag: Pain out of proportion to the injury', runId: stopped.id });
    expect(r.measurements.map((m: { kneeFlexionDeg: number }) => m.kneeFlexionDeg)).toEqual([70, 60]);
    expect(r.runs.map((run: { outcome: string }) => run.outcome)).toEqual(['Completed', 'Stopped and referred']);
    expect(r.runs[0].stepsDone).toEqual(['Cold pack 20 min']);
    expect(await AuditEvent.count({ where: { clinicId, action: 'injury.referral-summary', recordId: injury.id } })).toBe(1);
  });

  it("finds the red flag without a run named, and keeps another clinic's injury and a stranger run out", async () => {
    const { injury } = await thighInjuryWithHistory();
    const res = await therapist.get(`/api/injuries/${injury.id}/referral`);
    expect(res.body.referral.reasons.map((r: { kind: string }) => r.kind)).toContain('red-flag');
    expect((await otherClinic.get(`/api/injuries/${injury.id}/referral`)).status).toBe(404);
    const elsewhere = await thighInjuryWithHistory();
    expect((await therapist.get(`/api/injuries/${injury.id}/referral?runId=${elsewhere.stopped.id}`)).status).toBe(404);
    expect((await therapist.get(`/api/injuries/${injury.id}/referral?runId=nope`)).status).toBe(400);
  });
});
