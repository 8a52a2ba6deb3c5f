import { beforeAll, describe, expect, it } from 'vitest';
import { functionalTestIds } from '../../shared/clinical/return-to-activity';
import { AuditEvent, Injury } from '../../server/models';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let otherClinic: Awaited<ReturnType<typeof signedInAgent>>;
let clinicId: string;

const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();
const allTests = [...functionalTestIds];
// The check's values: knee flexion ≥ 120° (Aronen & Chronister, Phys Sportsmed 1992;20(7):130–136); girth
// difference within the clinic threshold (1.0 cm, a clinic default of ours); pain at rest 0 (common practice).
const recovered = { girthInjuredCm: 52.5, girthOtherCm: 52.0, girthLandmark: 'superior pole of patella', girthDistanceCm: 15, kneeFlexionDeg: 130, painNprs: 0 };

beforeAll(async () => {
  clinicId = (await createClinic()).id;
  therapist = await signedInAgent(app, (await createStaff(clinicId, 'therapist', { name: 'Cleo Closer' })).email);
  otherClinic = await signedInAgent(app, (await createStaff((await createClinic()).id, 'therapist')).email);
});

async function thighInjury(region = 'anterior-thigh') {
  const athlete = (await therapist.post('/api/athletes').send({ consentToTreatment: true, name: 'Ilse Marr', yearOfBirth: 1996, sport: 'Football' })).body.athlete;
  const injury = (
    await therapist.post('/api/injuries').send({ athleteId: athlete.id, region, side: 'right', mechanismKind: 'knee-to-thigh', injuredAt: hoursAgo(30 * 24) })
  ).body.injury;
  return injury as { id: string; athleteId: string };
}

const measure = (injuryId: string, hoursBack: number, values: object) =>
  therapist.post(`/api/injuries/${injuryId}/measurements`).send({ takenAt: hoursAgo(hoursBack), ...values });

describe('closing an injury with the return-to-activity check', () => {
  it('closes when every criterion of the latest measurement is met, keeping the check with the injury', async () => {
    const injury = await thighInjury();
    await measure(injury.id, 2, recovered);
    const check = await therapist.get(`/api/injuries/${injury.id}/closure`);
    expect(check.status).toBe(200);
    expect(check.body.girthThresholdCm).toBe(1);
    expect(check.body.check.criteria.find((c: { id: string }) => c.id === 'knee-flexion').status).toBe('met');

    const res = await therapist.post(`/api/injuries/${injury.id}/close`).send({ passedTests: allTests });
    expect(res.status).toBe(200);
    expect(res.body.injury.status).toBe('closed');
    expect(res.body.injury.closure).toMatchObject({ allMet: true, reason: null, closedByName: 'Cleo Closer' });
    expect(res.body.injury.nextRecheckAt).toBeNull();
    const event = await AuditEvent.findOne({ where: { clinicId, action: 'injury.closed', recordId: injury.id } });
    expect(event?.detail).toMatchObject({ allMet: true, unmet: [] });
  });

  it('reads the criteria from the latest measurement: a later, worse reading blocks closing without a reason', async () => {
    const injury = await thighInjury();
    await measure(injury.id, 48, recovered);
    await measure(injury.id, 1, { ...recovered, kneeFlexionDeg: 110 }); // below 120° (Aronen & Chronister 1992)
    // An older measurement entered afterwards does not count as the latest.
    await measure(injury.id, 72, recovered);

    const refused = await therapist.post(`/api/injuries/${injury.id}/close`).send({ passedTests: allTests });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields).toHaveProperty('reason');
    expect(refused.body.error.message).toMatch(/knee flexion of at least 120°/);
    expect((await Injury.findByPk(injury.id))?.status).toBe('open');

    const closed = await therapist.post(`/api/injuries/${injury.id}/close`).send({ passedTests: allTests, reason: 'Returns to light training only, cleared by the team physician' });
    expect(closed.status).toBe(200);
    expect(closed.body.injury.closure.allMet).toBe(false);
    expect(closed.body.injury.closure.reason).toBe('Returns to light training only, cleared by the team physician');
    expect(closed.body.injury.closure.criteria.find((c: { id: string }) => c.id === 'knee-flexion')).toMatchObject({ status: 'unmet', value: '110°' });
    expect(Date.parse(closed.body.injury.closure.measurement.takenAt)).toBeGreaterThan(Date.now() - 2 * 3_600_000);
  });

  it('needs a reason when a functional test is not ticked, or when the latest measurement lacks a value', async () => {
    const injury = await thighInjury();
    await measure(injury.id, 3, recovered);
    await measure(injury.id, 1, { painNprs: 0 });
    const res = await therapist.post(`/api/injuries/${injury.id}/close`).send({ passedTests: allTests.slice(0, 2) });
    expect(res.status).toBe(400);
    const check = (await therapist.get(`/api/injuries/${injury.id}/closure`)).body.check;
    expect(check.unmet.map((c: { id: string; status: string }) => `${c.id}:${c.status}`)).toEqual([
      'knee-flexion:not-measured',
      'girth-difference:not-measured',
      `functional:${allTests[0]}:unmet`,
      `functional:${allTests[1]}:unmet`,
      `functional:${allTests[2]}:unmet`,
    ]);
  });

  it('refuses an unknown functional test, a second close, and another clinic', async () => {
    const injury = await thighInjury('calf');
    await measure(injury.id, 1, { painNprs: 0 });
    const bad = await therapist.post(`/api/injuries/${injury.id}/close`).send({ passedTests: ['touches-toes'] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)[0]).toMatch(/^passedTests/);
    expect((await otherClinic.post(`/api/injuries/${injury.id}/close`).send({ passedTests: allTests })).status).toBe(404);
    expect((await therapist.post(`/api/injuries/${injury.id}/close`).send({ passedTests: allTests })).status).toBe(200);
    const again = await therapist.post(`/api/injuries/${injury.id}/close`).send({ passedTests: allTests });
    expect(again.status).toBe(409);
  });

  it('refuses to close while a run is in progress', async () => {
    const injury = await thighInjury('calf');
    await measure(injury.id, 1, { painNprs: 0 });
    const run = await therapist.post('/api/runs').send({ injuryId: injury.id });
    expect(run.status).toBe(201);
    const res = await therapist.post(`/api/injuries/${injury.id}/close`).send({ passedTests: allTests });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('run_active');
  });
});

describe('re-injury', () => {
  it('creates a new injury linked to the closed episode, which stays closed', async () => {
    const injury = await thighInjury();
    await measure(injury.id, 2, recovered);
    await therapist.post(`/api/injuries/${injury.id}/close`).send({ passedTests: allTests });

    const res = await therapist.post(`/api/injuries/${injury.id}/reinjury`).send({ mechanismKind: 'collision', mechanism: 'Same thigh, hip of an opponent', injuredAt: new Date().toISOString() });
    expect(res.status).toBe(201);
    const again = res.body.injury;
    expect(again).toMatchObject({ athleteId: injury.athleteId, region: 'anterior-thigh', side: 'right', status: 'open', reinjuryOfId: injury.id });
    expect(again.id).not.toBe(injury.id);
    // A previous quadriceps injury is a myositis ossificans risk factor (Ryan et al. 1991).
    expect(again.previousQuadricepsInjury).toBe(true);
    expect(again.risks.factors.map((f: { id: string }) => f.id)).toContain('previous-quadriceps-injury');

    const earlier = await therapist.get(`/api/injuries/${injury.id}/closure`);
    expect(earlier.body.status).toBe('closed');
    expect(earlier.body.reinjuries.map((r: { id: string }) => r.id)).toEqual([again.id]);
    expect((await therapist.get(`/api/injuries/${again.id}/closure`)).body.reinjuryOf.id).toBe(injury.id);
  });

  it('refuses a re-injury of an open injury, or one dated before the episode closed', async () => {
    const injury = await thighInjury();
    const open = await therapist.post(`/api/injuries/${injury.id}/reinjury`).send({ mechanismKind: 'ball', injuredAt: new Date().toISOString() });
    expect(open.status).toBe(409);
    await measure(injury.id, 2, recovered);
    await therapist.post(`/api/injuries/${injury.id}/close`).send({ passedTests: allTests });
    const early = await therapist.post(`/api/injuries/${injury.id}/reinjury`).send({ mechanismKind: 'ball', injuredAt: hoursAgo(24) });
    expect(early.status).toBe(400);
    expect(early.body.error.fields).toHaveProperty('injuredAt');
  });
});
