import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let otherClinic: Awaited<ReturnType<typeof signedInAgent>>;
let supervisorEmail: string;
let adminEmail: string;

const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();
const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };

beforeAll(async () => {
  const clinic = await createClinic();
  const other = await createClinic();
  therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist')).email);
  supervisorEmail = (await createStaff(clinic.id, 'supervisor')).email;
  adminEmail = (await createStaff(clinic.id, 'admin')).email;
  otherClinic = await signedInAgent(app, (await createStaff(other.id, 'therapist')).email);
});

async function injuryDaysAgo(days: number, bruise = true) {
  const athlete = (await therapist.post('/api/athletes').send({ consentToTreatment: true, name: 'Kit Varga', yearOfBirth: 2000, sport: 'Hockey' })).body.athlete;
  const injury = (
    await therapist.post('/api/injuries').send({ athleteId: athlete.id, region: 'calf', side: 'right', mechanismKind: 'ball', injuredAt: hoursAgo(days * 24) })
  ).body.injury;
  if (bruise) {
    await therapist.post(`/api/injuries/${injury.id}/measurements`).send({ takenAt: hoursAgo(1), bruiseLengthCm: 6, bruiseWidthCm: 4, painNprs: 4 });
  }
  return injury;
}

async function startRun(injuryId: string, screening: object = clear) {
  const res = await therapist.post('/api/runs').send({ injuryId, screening });
  expect(res.status).toBe(201);
  return res.body.run;
}

const entry = (over: Record<string, unknown> = {}) => ({
  type: 'step-completed',
  stepIndex: 0,
  kind: 'ice-massage',
  plannedSeconds: 360,
  actualSeconds: 361,
  at: new Date().toISOString(),
  ...over,
});

describe('starting a run', () => {
  it('builds the proliferative plan from the clinic sequence: ice massage within 5–7 minutes (common practice)', async () => {
    const injury = await injuryDaysAgo(10);
    const run = await startRun(injury.id);
    expect(run).toMatchObject({ injuryId: injury.id, phase: 'proliferative', status: 'ready' });
    const ice = run.plan.steps.find((s: { kind: string }) => s.kind === 'ice-massage');
    expect(ice.seconds).toBeGreaterThanOrEqual(300);
    expect(ice.seconds).toBeLessThanOrEqual(420);
    expect(run.plan.steps.some((s: { kind: string }) => s.kind === 'cross-fibre-friction')).toBe(false);
  });

  it('builds an acute plan with no hands-on massage and a 20-minute cold pack, and the pad size in the wrap cue', async () => {
    const injury = await injuryDaysAgo(1);
    const run = await startRun(injury.id);
    expect(run.phase).toBe('acute');
    expect(run.plan.steps.some((s: { handsOn: boolean; kind: string }) => s.handsOn && s.kind !== 'compression-wrap')).toBe(false);
    // Common practice: cold 20 minutes of each hour.
    expect(run.plan.steps.find((s: { kind: string }) => s.kind === 'cold-pack').seconds).toBe(1200);
    // Common practice: pad two to three times the bruise (6 × 4 cm → 12–18 × 8–12 cm).
    expect(run.plan.steps.find((s: { kind: string }) => s.kind === 'compression-wrap').cue).toContain('12–18 × 8–12 cm');
  });

  it('without screening answers starts in screening; the screening then makes it ready', async () => {
    const injury = await injuryDaysAgo(10);
    const res = await therapist.post('/api/runs').send({ injuryId: injury.id });
    expect(res.status).toBe(201);
    expect(res.body.run.status).toBe('screening');
    const screened = await therapist.put(`/api/runs/${res.body.run.id}/screening`).send({ screening: { ...clear, tolerance: 'light' } });
    expect(screened.status).toBe(200);
    expect(screened.body.run.status).toBe('ready');
    expect(screened.body.run.plan.tolerance).toBe('light');
  });

  it('a red flag in the screening refuses the run with a clear message, and records it as stopped and referred', async () => {
    const injury = await injuryDaysAgo(2);
    const run = await startRun(injury.id, { ...clear, redFlags: ['pain-on-passive-stretch'] });
    expect(run.status).toBe('stopped-referred');
    expect(run.message).toMatch(/refer/i);
    const log = await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send(entry());
    expect(log.status).toBe(409);
  });

  it('a cold contraindication takes cold out of the plan and back to cold becomes stop, elevate, refer', async () => {
    const injury = await injuryDaysAgo(10);
    const run = await startRun(injury.id, { ...clear, coldContraindications: ['raynauds'], cautionsAcknowledged: true });
    expect(run.plan.steps.some((s: { kind: string }) => s.kind === 'ice-massage' || s.kind === 'cold-pack')).toBe(false);
    expect(run.plan.backToCold).toBe('stop-elevate-refer');
  });

  it.each(['anticoagulants-or-bleeding-disorder', 'open-skin'])('%s at screening takes deep work out of the plan, and the plan says so', async (caution) => {
    // Massage cautions: anticoagulants or bleeding disorders, open skin (clinical notes: common practice).
    const injury = await injuryDaysAgo(25);
    const run = await startRun(injury.id, { ...clear, massageCautions: [caution], cautionsAcknowledged: true });
    expect(run.phase).toBe('remodelling');
    const kinds = run.plan.steps.map((s: { kind: string }) => s.kind);
    expect(kinds.filter((kind: string) => /friction|broadening|stripping/.test(kind))).toEqual([]);
    expect(run.plan.cautions.join(' ')).toMatch(/no friction, broadening or stripping/);
    expect(run.plan.cautions.join(' ')).toMatch(/Left out of this plan: Cross-fibre friction/);
  });

  it('a caution must be acknowledged: 400 naming cautionsAcknowledged', async () => {
    const injury = await injuryDaysAgo(10);
    const res = await therapist.post('/api/runs').send({ injuryId: injury.id, screening: { ...clear, massageCautions: ['open-skin'] } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('screening.cautionsAcknowledged');
  });

  it('allows one active run per injury and names the active one', async () => {
    const injury = await injuryDaysAgo(10);
    const first = await startRun(injury.id);
    const second = await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear });
    expect(second.status).toBe(409);
    expect(second.body.error.runId).toBe(first.id);
  });

  it("answers another clinic's injury and run with 404", async () => {
    const injury = await injuryDaysAgo(10);
    expect((await otherClinic.post('/api/runs').send({ injuryId: injury.id, screening: clear })).status).toBe(404);
    const run = await startRun(injury.id);
    expect((await otherClinic.get(`/api/runs/${run.id}`)).status).toBe(404);
    expect((await otherClinic.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send(entry())).status).toBe(404);
  });
});

describe('the step log (idempotency contract)', () => {
  it('first time 201; same key and body 200 with the same entry and nothing new; same key, other body 409', async () => {
    const run = await startRun((await injuryDaysAgo(10)).id);
    const key = randomUUID();
    const body = entry({ seq: 1 });
    const first = await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', key).send(body);
    expect(first.status).toBe(201);
    const again = await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', key).send(body);
    expect(again.status).toBe(200);
    expect(again.body.entry).toEqual(first.body.entry);
    const different = await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', key).send({ ...body, actualSeconds: 300 });
    expect(different.status).toBe(409);
    const detail = await therapist.get(`/api/runs/${run.id}`);
    expect(detail.body.entries).toHaveLength(1);
    expect(detail.body.run.status).toBe('running');
  });

  it('the same body with its keys in another order is still the same entry', async () => {
    const run = await startRun((await injuryDaysAgo(10)).id);
    const key = randomUUID();
    const body = entry();
    const reversed = Object.fromEntries(Object.entries(body).reverse());
    expect((await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', key).send(body)).status).toBe(201);
    expect((await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', key).send(reversed)).status).toBe(200);
  });

  it('stores concurrent copies of one entry once', async () => {
    const run = await startRun((await injuryDaysAgo(10)).id);
    const key = randomUUID();
    const body = entry();
    const results = await Promise.all(Array.from({ length: 5 }, () => therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', key).send(body)));
    expect(results.map((r) => r.status).sort()).toEqual([200, 200, 200, 200, 201]);
    expect((await therapist.get(`/api/runs/${run.id}`)).body.entries).toHaveLength(1);
  });

  it('returns entries in the order they happened, and a finished run refuses new entries with 409 but still answers replays', async () => {
    const run = await startRun((await injuryDaysAgo(10)).id);
    const keys = [randomUUID(), randomUUID(), randomUUID()];
    const bodies = [
      entry({ seq: 1 }),
      { type: 'swelling-check', at: new Date().toISOString(), detail: 'not increased', seq: 2 },
      { type: 'run-completed', at: new Date().toISOString(), seq: 3 },
    ];
    // Sent out of order, as a retry after an outage might.
    for (const i of [1, 0, 2]) {
      expect((await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', keys[i]).send(bodies[i])).status).toBe(201);
    }
    const detail = await therapist.get(`/api/runs/${run.id}`);
    expect(detail.body.entries.map((e: { type: string }) => e.type)).toEqual(['step-completed', 'swelling-check', 'run-completed']);
    expect(detail.body.run).toMatchObject({ status: 'completed', outcome: 'completed' });
    expect(detail.body.run.endedAt).toEqual(expect.any(String));

    const late = await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send(entry());
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('run_finished');
    const replay = await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', keys[2]).send(bodies[2]);
    expect(replay.status).toBe(200);
  });

  it('a fall back ends the run as fell back; a red flag as stopped and referred', async () => {
    const run = await startRun((await injuryDaysAgo(10)).id);
    await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send(entry({ type: 'step-interrupted', actualSeconds: 100 }));
    await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send({ type: 'run-fell-back', at: new Date().toISOString() });
    expect((await therapist.get(`/api/runs/${run.id}`)).body.run).toMatchObject({ status: 'fell-back', outcome: 'fell-back' });

    const run2 = await startRun((await injuryDaysAgo(10)).id);
    await therapist.post(`/api/runs/${run2.id}/log`).set('Idempotency-Key', randomUUID()).send({ type: 'red-flag', reason: 'Numbness', at: new Date().toISOString() });
    expect((await therapist.get(`/api/runs/${run2.id}`)).body.run.status).toBe('stopped-referred');
  });

  it('answers a missing or malformed Idempotency-Key with 400 naming it', async () => {
    const run = await startRun((await injuryDaysAgo(10)).id);
    const res = await therapist.post(`/api/runs/${run.id}/log`).send(entry());
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('Idempotency-Key');
    const bad = await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', 'abc').send(entry());
    expect(bad.status).toBe(400);
  });

  it('answers a bad entry with 400 naming the field, and stores nothing', async () => {
    const run = await startRun((await injuryDaysAgo(10)).id);
    const res = await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send(entry({ type: 'teleported' }));
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('type');
    const skip = await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send(entry({ type: 'step-skipped' }));
    expect(skip.status).toBe(400);
    expect(skip.body.error.fields).toHaveProperty('reason');
    expect((await therapist.get(`/api/runs/${run.id}`)).body.entries).toHaveLength(0);
  });
});

describe('sequences', () => {
  it('a supervisor saves a new version within the bounds; ice massage outside 5–7 minutes is refused naming the step', async () => {
    const supervisor = await signedInAgent(app, supervisorEmail);
    const current = (await supervisor.get('/api/sequences')).body.items.find((s: { phase: string }) => s.phase === 'proliferative');
    const tooLong = current.steps.map((s: { kind: string; seconds: number }) => (s.kind === 'ice-massage' ? { ...s, seconds: 900 } : s));
    const refused = await supervisor.put('/api/sequences').send({ phase: 'proliferative', steps: tooLong });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error.fields)[0]).toMatch(/^steps\.\d+\.seconds$/);

    const shorter = current.steps.map((s: { kind: string; seconds: number }) => (s.kind === 'ice-massage' ? { ...s, seconds: 300 } : s));
    const saved = await supervisor.put('/api/sequences').send({ phase: 'proliferative', steps: shorter });
    expect(saved.status).toBe(200);
    expect(saved.body.sequence.version).toBe(current.version + 1);
  });

  it('a cold pack 30 seconds after an ice massage is refused, naming the step', async () => {
    // Treatment rule 2: the clinic's minimum interval between cold steps (decisions.md, default 10 min).
    const supervisor = await signedInAgent(app, supervisorEmail);
    const steps = [
      { kind: 'ice-massage', seconds: 420 },
      { kind: 'rest-recheck', seconds: 30 },
      { kind: 'cold-pack', seconds: 1200 },
    ];
    const refused = await supervisor.put('/api/sequences').send({ phase: 'proliferative', steps });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error.fields)).toEqual(['steps.2.kind']);
  });

  it("a sequence is checked against the clinic's own minimum interval", async () => {
    const supervisor = await signedInAgent(app, supervisorEmail);
    const admin = await signedInAgent(app, adminEmail);
    const steps = [
      { kind: 'ice-massage', seconds: 360 },
      { kind: 'light-strokes', seconds: 600 },
      { kind: 'passive-movement', seconds: 180 },
      { kind: 'ice-massage', seconds: 360 },
    ];
    expect((await admin.put('/api/settings').send({ minColdIntervalMinutes: 15 })).status).toBe(200);
    try {
      const refused = await supervisor.put('/api/sequences').send({ phase: 'proliferative', steps });
      expect(refused.status).toBe(400);
      expect(refused.body.error.fields['steps.3.kind']).toMatch(/13 min after the previous cold step.*15 min/);
    } finally {
      expect((await admin.put('/api/settings').send({ minColdIntervalMinutes: 10 })).status).toBe(200);
    }
    expect((await supervisor.put('/api/sequences').send({ phase: 'proliferative', steps })).status).toBe(200);
  });

  it('a therapist cannot change a sequence', async () => {
    const res = await therapist.put('/api/sequences').send({ phase: 'acute', steps: [{ kind: 'cold-pack', seconds: 1200, optional: false }] });
    expect(res.status).toBe(403);
  });
});
