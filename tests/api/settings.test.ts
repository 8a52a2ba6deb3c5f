import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, Clinic } from '../../server/models';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
let clinicId: string;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let supervisor: Awaited<ReturnType<typeof signedInAgent>>;

const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();
const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };

beforeAll(async () => {
  clinicId = (await createClinic('Settings test clinic')).id;
  admin = await signedInAgent(app, (await createStaff(clinicId, 'admin')).email);
  therapist = await signedInAgent(app, (await createStaff(clinicId, 'therapist')).email);
  supervisor = await signedInAgent(app, (await createStaff(clinicId, 'supervisor')).email);
});

describe('clinic settings', () => {
  it('shows the name, the settings, their defaults and where each default comes from', async () => {
    const res = await admin.get('/api/settings');
    expect(res.status).toBe(200);
    expect(res.body.clinicName).toBe('Settings test clinic');
    expect(res.body.defaults.minColdIntervalMinutes).toBe(10); // decisions.md, a clinic default of ours
    expect(res.body.defaults.recheckIntervalHours).toEqual({ acute: 24, proliferative: 72, remodelling: 168 }); // clinic defaults of ours
    expect(res.body.sources.recheckIntervalHours).toMatch(/clinic default of ours/);
    expect(res.body.sources.swellingThresholdCm).toMatch(/not a published figure/);
  });

  it('saves a change, keeps the other settings, and records the before and after in the audit trail', async () => {
    const before = (await admin.get('/api/settings')).body.settings;
    const res = await admin
      .put('/api/settings')
      .send({ clinicName: 'Riverside treatment room', coldProtocol: 'intermittent-10-10-10', contactPhone: '+44 20 7946 0000' });
    expect(res.status).toBe(200);
    expect(res.body.clinicName).toBe('Riverside treatment room');
    expect(res.body.settings).toEqual({ ...before, coldProtocol: 'intermittent-10-10-10', contactPhone: '+44 20 7946 0000' });

    const event = await AuditEvent.findOne({ where: { clinicId, action: 'settings.updated' }, order: [['id', 'DESC']] });
    expect(event?.detail).toEqual({
      changed: {
        clinicName: { from: 'Settings test clinic', to: 'Riverside treatment room' },
        coldProtocol: { from: before.coldProtocol, to: 'intermittent-10-10-10' },
        contactPhone: { from: null, to: '+44 20 7946 0000' },
      },
    });
    // The signed-in user's clinic name follows at once.
    expect((await admin.get('/api/auth/me')).body.user.clinicName).toBe('Riverside treatment room');
  });

  it('records no event when nothing changes', async () => {
    const current = (await admin.get('/api/settings')).body.settings;
    const count = await AuditEvent.count({ where: { clinicId, action: 'settings.updated' } });
    expect((await admin.put('/api/settings').send({ abandonAfterHours: current.abandonAfterHours })).status).toBe(200);
    expect(await AuditEvent.count({ where: { clinicId, action: 'settings.updated' } })).toBe(count);
  });

  it('answers bad values with 400 naming the field, and saves nothing of the request', async () => {
    const stored = (await Clinic.findByPk(clinicId))!.settings;
    const res = await admin.put('/api/settings').send({ coldProtocol: 'twenty-each-hour', timeZone: 'Mars/Olympus', recheckIntervalHours: { acute: 0, proliferative: 72, remodelling: 168 } });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['timeZone', 'recheckIntervalHours.acute']));
    expect((await Clinic.findByPk(clinicId))!.settings).toEqual(stored);

    const hours = await admin.put('/api/settings').send({ wakingHours: { start: '21:00', end: '06:00' } });
    expect(hours.status).toBe(400);
    expect(hours.body.error.fields).toHaveProperty(['wakingHours.end']);
    expect((await admin.put('/api/settings').send({})).status).toBe(400);
  });

  it('is for admins only', async () => {
    expect((await therapist.get('/api/settings')).status).toBe(403);
    expect((await supervisor.put('/api/settings').send({ abandonAfterHours: 5 })).status).toBe(403);
  });
});

describe('settings apply to new runs only', () => {
  async function readyRun() {
    const athlete = (await therapist.post('/api/athletes').send({ consentToTreatment: true, name: 'Noor Halden', yearOfBirth: 1998, sport: 'Hockey' })).body.athlete;
    const injury = (
      await therapist.post('/api/injuries').send({ athleteId: athlete.id, region: 'calf', side: 'left', mechanismKind: 'ball', injuredAt: hoursAgo(10 * 24) })
    ).body.injury;
    const res = await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear });
    expect(res.status).toBe(201);
    expect(res.body.run.status).toBe('ready');
    return res.body.run;
  }

  it('a changed minimum cold interval reaches the next run, while a ready run keeps the plan it was built with', async () => {
    await admin.put('/api/settings').send({ minColdIntervalMinutes: 10 });
    const existing = await readyRun();
    expect(existing.plan.minColdIntervalSeconds).toBe(600);

    expect((await admin.put('/api/settings').send({ minColdIntervalMinutes: 25 })).status).toBe(200);

    const reread = (await therapist.get(`/api/runs/${existing.id}`)).body.run;
    expect(reread.plan).toEqual(existing.plan);
    const next = await readyRun();
    expect(next.plan.minColdIntervalSeconds).toBe(25 * 60);
  });
});
