import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/models';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
let otherClinic: Awaited<ReturnType<typeof signedInAgent>>;
let clinicId: string;

const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();
const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };

beforeAll(async () => {
  clinicId = (await createClinic()).id;
  therapist = await signedInAgent(app, (await createStaff(clinicId, 'therapist', { name: 'Rhea Recheck' })).email);
  admin = await signedInAgent(app, (await createStaff(clinicId, 'admin')).email);
  otherClinic = await signedInAgent(app, (await createStaff((await createClinic()).id, 'therapist')).email);
});

async function injuryDaysAgo(days: number) {
  const athlete = (await therapist.post('/api/athletes').send({ consentToTreatment: true, name: 'Oona Brisk', yearOfBirth: 1994, sport: 'Netball' })).body.athlete;
  return (await therapist.post('/api/injuries').send({ athleteId: athlete.id, region: 'calf', side: 'left', mechanismKind: 'ball', injuredAt: hoursAgo(days * 24) })).body
    .injury as { id: string; nextRecheckAt: string | null; recheckStatus: string };
}

async function finishRun(injuryId: string, endedAt: string) {
  const run = (await therapist.post('/api/runs').send({ injuryId, screening: clear })).body.run;
  const res = await therapist
    .post(`/api/runs/${run.id}/log`)
    .set('Idempotency-Key', randomUUID())
    .send({ type: 'run-completed', at: endedAt });
  expect(res.status).toBe(201);
  return run as { id: string; phase: string };
}

const injuryOf = async (id: string) => (await therapist.get(`/api/injuries/${id}`)).body.injury;

describe('next re-check', () => {
  it("is suggested when a run ends: the clinic's interval for the phase after the run's end (acute 24 h, a clinic default of ours)", async () => {
    const injury = await injuryDaysAgo(1);
    expect(injury.nextRecheckAt).toBeNull();
    expect(injury.recheckStatus).toBe('none');
    const endedAt = hoursAgo(0.5);
    const run = await finishRun(injury.id, endedAt);
    expect(run.phase).toBe('acute');
    const after = await injuryOf(injury.id);
    expect(after.nextRecheckAt).toBe(new Date(Date.parse(endedAt) + 24 * 3_600_000).toISOString());
    expect(after.recheckSetByName).toBeNull();
    expect(await AuditEvent.count({ where: { clinicId, action: 'injury.recheck-suggested', recordId: injury.id } })).toBe(1);
  });

  it("follows the clinic's own interval for the phase, and each run suggests again over a therapist's time", async () => {
    await admin.put('/api/settings').send({ recheckIntervalHours: { acute: 24, proliferative: 36, remodelling: 168 } });
    const injury = await injuryDaysAgo(10);
    const later = new Date(Date.now() + 5 * 86_400_000).toISOString();
    const set = await therapist.put(`/api/injuries/${injury.id}/recheck`).send({ nextRecheckAt: later });
    expect(set.status).toBe(200);
    expect(set.body.injury).toMatchObject({ nextRecheckAt: later, recheckSetByName: 'Rhea Recheck', recheckStatus: 'later' });

    const endedAt = hoursAgo(1);
    await finishRun(injury.id, endedAt);
    const after = await injuryOf(injury.id);
    expect(after.nextRecheckAt).toBe(new Date(Date.parse(endedAt) + 36 * 3_600_000).toISOString());
    expect(after.recheckSetByName).toBeNull();
  });

  it('marks a re-check in the past as overdue, and one later today as due, on the list Today reads', async () => {
    const overdue = await injuryDaysAgo(3);
    // Run 30 h ago in the acute phase → re-check 6 h ago.
    await finishRun(overdue.id, hoursAgo(30));
    const list = (await therapist.get('/api/injuries?status=open')).body.items as { id: string; recheckStatus: string }[];
    expect(list.find((i) => i.id === overdue.id)?.recheckStatus).toBe('overdue');

    const soon = await injuryDaysAgo(3);
    // One minute ahead is "today" in any zone except in the last minute before midnight.
    await therapist.put(`/api/injuries/${soon.id}/recheck`).send({ nextRecheckAt: new Date(Date.now() + 60_000).toISOString() });
    const status = (await injuryOf(soon.id)).recheckStatus;
    expect(['due', 'overdue']).toContain(status);
  });

  it('can be cleared; refuses a past time and a closed injury; another clinic gets 404', async () => {
    const injury = await injuryDaysAgo(2);
    const past = await therapist.put(`/api/injuries/${injury.id}/recheck`).send({ nextRecheckAt: hoursAgo(2) });
    expect(past.status).toBe(400);
    expect(past.body.error.fields).toHaveProperty('nextRecheckAt');
    const cleared = await therapist.put(`/api/injuries/${injury.id}/recheck`).send({ nextRecheckAt: null });
    expect(cleared.status).toBe(200);
    expect(cleared.body.injury.recheckStatus).toBe('none');
    expect((await otherClinic.put(`/api/injuries/${injury.id}/recheck`).send({ nextRecheckAt: null })).status).toBe(404);

    await therapist.post(`/api/injuries/${injury.id}/measurements`).send({ takenAt: hoursAgo(1), painNprs: 0 });
    await therapist.post(`/api/injuries/${injury.id}/close`).send({ passedTests: [], reason: 'Moved to another clinic' });
    const closed = await therapist.put(`/api/injuries/${injury.id}/recheck`).send({ nextRecheckAt: new Date(Date.now() + 86_400_000).toISOString() });
    expect(closed.status).toBe(409);
  });
});
