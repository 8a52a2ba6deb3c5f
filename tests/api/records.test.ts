import { beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let otherClinic: Awaited<ReturnType<typeof signedInAgent>>;
let adminEmail: string;

const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();

beforeAll(async () => {
  const clinic = await createClinic();
  const other = await createClinic();
  therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist')).email);
  otherClinic = await signedInAgent(app, (await createStaff(other.id, 'therapist')).email);
  adminEmail = (await createStaff(clinic.id, 'admin')).email;
});

async function newAthlete(overrides: Record<string, unknown> = {}) {
  const res = await therapist.post('/api/athletes').send({ name: 'Rowan Tesk', yearOfBirth: 1999, sport: 'Football', position: 'Winger', ...overrides });
  expect(res.status).toBe(201);
  return res.body.athlete;
}

async function newThighInjury(athleteId: string, injuredHoursAgo = 20) {
  const res = await therapist.post('/api/injuries').send({
    athleteId,
    region: 'anterior-thigh',
    side: 'left',
    mechanismKind: 'knee-to-thigh',
    mechanism: 'Knee from an opponent in a tackle',
    injuredAt: hoursAgo(injuredHoursAgo),
  });
  expect(res.status).toBe(201);
  return res.body.injury;
}

describe('athletes', () => {
  it('registers an athlete and records consent with who took it and when', async () => {
    const athlete = await newAthlete({ consentToTreatment: true, email: 'rowan@example.org' });
    expect(athlete.consentToTreatment).toBe(true);
    expect(athlete.consentRecordedAt).toEqual(expect.any(String));
    expect(athlete.consentRecordedByName).toBe('Test therapist');
  });

  it('searches, sorts and pages the register on the server', async () => {
    const tag = `Zed${Date.now()}`;
    for (const [i, year] of [1990, 2001, 1995].entries()) await newAthlete({ name: `${tag} Athlete ${i}`, yearOfBirth: year });
    const page1 = await therapist.get(`/api/athletes?q=${tag}&sort=yearOfBirth&direction=desc&pageSize=2&page=1`);
    expect(page1.status).toBe(200);
    expect(page1.body.total).toBe(3);
    expect(page1.body.items.map((a: { yearOfBirth: number }) => a.yearOfBirth)).toEqual([2001, 1995]);
    const page2 = await therapist.get(`/api/athletes?q=${tag}&sort=yearOfBirth&direction=desc&pageSize=2&page=2`);
    expect(page2.body.items.map((a: { yearOfBirth: number }) => a.yearOfBirth)).toEqual([1990]);
  });

  it('treats % and _ in a search as plain characters', async () => {
    const res = await therapist.get('/api/athletes?q=%25');
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(0);
  });

  it('answers a bad year of birth with 400 naming the field and the range, and saves nothing', async () => {
    const before = (await therapist.get('/api/athletes?pageSize=1')).body.total;
    const res = await therapist.post('/api/athletes').send({ name: 'Nobody', yearOfBirth: 1800, sport: 'Hockey' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.yearOfBirth).toMatch(/between 1900 and/);
    expect((await therapist.get('/api/athletes?pageSize=1')).body.total).toBe(before);
  });

  it('answers a bad page size with 400', async () => {
    const res = await therapist.get('/api/athletes?pageSize=1000');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('pageSize');
  });

  it("answers another clinic's athlete with 404, for reading and for changing", async () => {
    const athlete = await newAthlete();
    expect((await otherClinic.get(`/api/athletes/${athlete.id}`)).status).toBe(404);
    expect((await otherClinic.patch(`/api/athletes/${athlete.id}`).send({ name: 'Changed' })).status).toBe(404);
    expect((await therapist.get(`/api/athletes/${athlete.id}`)).body.athlete.name).toBe('Rowan Tesk');
  });

  it('refuses admins the clinical records with 403', async () => {
    const admin = await signedInAgent(app, adminEmail);
    expect((await admin.get('/api/athletes')).status).toBe(403);
  });
});

describe('injuries and measurements', () => {
  it('records a thigh injury and grades it from knee flexion (Ryan et al. 1991: 45–90° is moderate)', async () => {
    const athlete = await newAthlete();
    const injury = await newThighInjury(athlete.id);
    expect(injury.severity).toBeNull();
    expect(injury.phase).toBe('acute');

    const res = await therapist.post(`/api/injuries/${injury.id}/measurements`).send({
      takenAt: hoursAgo(2),
      kneeFlexionDeg: 80,
      girthInjuredCm: 52.5,
      girthOtherCm: 50,
      girthLandmark: 'superior pole of patella',
      girthDistanceCm: 15,
      painNprs: 6,
      bruiseLengthCm: 8,
      bruiseWidthCm: 5,
    });
    expect(res.status).toBe(201);
    // Ryan JB et al. 1991, Am J Sports Med 19(3):299–304: moderate 45–90° of active knee flexion.
    expect(res.body.injury.severity.grade).toBe('moderate');
    // Kannus 2000: days 0–7 are the acute band; 20 h after injury.
    expect(res.body.injury.phase).toBe('acute');
    expect(res.body.injury.phaseReason).toEqual(expect.any(String));
    // Ryan et al. 1991 risk factors: flexion < 120° and injury in football both apply here.
    expect(res.body.injury.risks.factors.length).toBeGreaterThanOrEqual(2);
    // Common practice: pad two to three times the injury's size: 8 × 5 cm → 16–24 × 10–15 cm.
    expect(res.body.injury.assessment.padSize.length).toEqual({ minCm: 16, maxCm: 24 });
    expect(res.body.injury.assessment.padSize.width).toEqual({ minCm: 10, maxCm: 15 });

    const detail = await therapist.get(`/api/injuries/${injury.id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.measurements).toHaveLength(1);
    expect(detail.body.athlete.id).toBe(athlete.id);
    expect(detail.body.coldSchedule.protocol).toBe('twenty-each-hour');
    expect(Array.isArray(detail.body.coldSchedule.sessions)).toBe(true);
  });

  it('answers an out-of-range knee flexion with 400 naming the field and the range, and saves nothing', async () => {
    const athlete = await newAthlete();
    const injury = await newThighInjury(athlete.id);
    const res = await therapist.post(`/api/injuries/${injury.id}/measurements`).send({ takenAt: hoursAgo(1), kneeFlexionDeg: 200, painNprs: 3 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.kneeFlexionDeg).toMatch(/0 and 160/);
    expect((await therapist.get(`/api/injuries/${injury.id}/measurements`)).body.items).toHaveLength(0);
  });

  it('refuses a measurement dated before the injury, naming takenAt', async () => {
    const athlete = await newAthlete();
    const injury = await newThighInjury(athlete.id, 5);
    const res = await therapist.post(`/api/injuries/${injury.id}/measurements`).send({ takenAt: hoursAgo(10), painNprs: 3 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('takenAt');
  });

  it('answers an unknown body region with 400 naming region', async () => {
    const athlete = await newAthlete();
    const res = await therapist.post('/api/injuries').send({ athleteId: athlete.id, region: 'elbow-tip', side: 'left', mechanismKind: 'ball', injuredAt: hoursAgo(3) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('region');
  });

  it("refuses an injury for another clinic's athlete as not found", async () => {
    const athlete = await newAthlete();
    const res = await otherClinic.post('/api/injuries').send({ athleteId: athlete.id, region: 'calf', side: 'right', mechanismKind: 'ball', injuredAt: hoursAgo(3) });
    expect(res.status).toBe(404);
  });

  it("answers another clinic's injury with 404 everywhere", async () => {
    const athlete = await newAthlete();
    const injury = await newThighInjury(athlete.id);
    expect((await otherClinic.get(`/api/injuries/${injury.id}`)).status).toBe(404);
    expect((await otherClinic.post(`/api/injuries/${injury.id}/measurements`).send({ takenAt: hoursAgo(1), painNprs: 2 })).status).toBe(404);
    expect((await otherClinic.put(`/api/injuries/${injury.id}/phase-override`).send({ override: null })).status).toBe(404);
    const list = await otherClinic.get('/api/injuries');
    expect(list.body.items.map((i: { id: string }) => i.id)).not.toContain(injury.id);
  });

  it("a therapist's phase override wins, is shown as such, needs a reason, and can be cleared", async () => {
    const athlete = await newAthlete();
    const injury = await newThighInjury(athlete.id);
    const noReason = await therapist.put(`/api/injuries/${injury.id}/phase-override`).send({ override: { phase: 'proliferative', reason: '' } });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields).toHaveProperty('override.reason');

    const set = await therapist.put(`/api/injuries/${injury.id}/phase-override`).send({ override: { phase: 'proliferative', reason: 'Swelling settled fast; mild' } });
    expect(set.status).toBe(200);
    expect(set.body.injury.phase).toBe('proliferative');
    expect(set.body.injury.suggestedPhase).toBe('acute');
    expect(set.body.injury.phaseIsOverride).toBe(true);
    expect(set.body.injury.phaseOverride.byName).toBe('Test therapist');

    const cleared = await therapist.put(`/api/injuries/${injury.id}/phase-override`).send({ override: null });
    expect(cleared.body.injury.phase).toBe('acute');
    expect(cleared.body.injury.phaseIsOverride).toBe(false);
  });

  it('lists open injuries for Today with a re-measure flag, and closing (through its check) removes one from the list', async () => {
    const athlete = await newAthlete();
    const injury = await newThighInjury(athlete.id);
    let list = await therapist.get('/api/injuries');
    const listed = list.body.items.find((i: { id: string }) => i.id === injury.id);
    expect(listed.remeasureDue).toBe(true);
    expect(listed.athleteName).toBe('Rowan Tesk');

    // An edit cannot close it: closing goes through the return-to-activity check.
    const bypass = await therapist.patch(`/api/injuries/${injury.id}`).send({ status: 'closed' });
    expect(bypass.status).toBe(400);
    expect(bypass.body.error.fields).toHaveProperty('status');
    const closed = await therapist.post(`/api/injuries/${injury.id}/close`).send({ passedTests: [], reason: 'Athlete moved to another club' });
    expect(closed.status).toBe(200);
    expect(closed.body.injury.closedAt).toEqual(expect.any(String));
    list = await therapist.get('/api/injuries');
    expect(list.body.items.map((i: { id: string }) => i.id)).not.toContain(injury.id);
  });

  it('records every change as an audit event', async () => {
    const { AuditEvent } = await import('../../server/models');
    const athlete = await newAthlete();
    const injury = await newThighInjury(athlete.id);
    await therapist.post(`/api/injuries/${injury.id}/measurements`).send({ takenAt: hoursAgo(1), painNprs: 4 });
    const events = await AuditEvent.findAll({ where: { clinicId: therapist.user.clinicId } });
    const actions = events.map((e) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['athlete.created', 'injury.created', 'measurement.created']));
  });
});
