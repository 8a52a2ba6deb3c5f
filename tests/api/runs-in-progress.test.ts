import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let therapist: Agent;
let otherClinic: Agent;
const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };

beforeAll(async () => {
  const clinic = await createClinic();
  therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist', { name: 'Wren Halloway' })).email);
  otherClinic = await signedInAgent(app, (await createStaff((await createClinic()).id, 'therapist')).email);
});

async function proliferativeRun() {
  const athlete = (await therapist.post('/api/athletes').send({ name: 'Sol Adeyemi', yearOfBirth: 1996, sport: 'Hockey', consentToTreatment: true })).body.athlete;
  const injuredAt = new Date(Date.now() - 10 * 86_400_000).toISOString();
  const injury = (await therapist.post('/api/injuries').send({ athleteId: athlete.id, region: 'calf', side: 'left', mechanismKind: 'ball', injuredAt })).body.injury;
  return (await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear })).body.run;
}

const post = (runId: string, entry: Record<string, unknown>) => therapist.post(`/api/runs/${runId}/log`).set('Idempotency-Key', randomUUID()).send(entry);

describe('runs in progress, for Today and the injury page', () => {
  it('lists a run left running with the plan step it is on and when that step should end; a finished run leaves the list', async () => {
    const run = await proliferativeRun();
    const first = run.plan.steps[0];
    const endedAt = new Date(Date.now() - 60_000);
    expect((await post(run.id, { seq: 1, type: 'step-completed', stepIndex: 0, kind: first.kind, plannedSeconds: first.seconds, actualSeconds: first.seconds, at: endedAt.toISOString() })).status).toBe(201);

    const listed = (await therapist.get('/api/runs/in-progress')).body.items.find((r: { runId: string }) => r.runId === run.id);
    expect(listed).toMatchObject({ injuryId: run.injuryId, stepIndex: 1, stepCount: run.plan.steps.length, stepLabel: run.plan.steps[1].label, therapistName: 'Wren Halloway' });
    expect(Date.parse(listed.stepEndsAt)).toBe(endedAt.getTime() + run.plan.steps[1].seconds * 1000);
    expect((await therapist.get(`/api/runs/in-progress?injuryId=${run.injuryId}`)).body.items).toHaveLength(1);

    expect((await otherClinic.get('/api/runs/in-progress')).body.items.some((r: { runId: string }) => r.runId === run.id)).toBe(false);

    expect((await post(run.id, { seq: 2, type: 'run-ended-early', reason: 'Athlete called to the pitch', at: new Date().toISOString() })).status).toBe(201);
    expect((await therapist.get(`/api/runs/in-progress?injuryId=${run.injuryId}`)).body.items).toHaveLength(0);
  });

  it('refuses a malformed injury id with 400 naming it', async () => {
    const res = await therapist.get('/api/runs/in-progress?injuryId=nope');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('injuryId');
  });
});
