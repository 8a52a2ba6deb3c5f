import { beforeAll, describe, expect, it } from 'vitest';
import { Run } from '../../server/models';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
let therapist: Awaited<ReturnType<typeof signedInAgent>>;

const thisYear = new Date().getUTCFullYear();
const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();
const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };

beforeAll(async () => {
  therapist = await signedInAgent(app, (await createStaff((await createClinic()).id, 'therapist', { name: 'Gia Guard' })).email);
});

async function athleteWithInjury(yearOfBirth: number) {
  const athlete = (await therapist.post('/api/athletes').send({ name: 'Juno Park', yearOfBirth, sport: 'Hockey', consentToTreatment: true })).body.athlete;
  const injury = (await therapist.post('/api/injuries').send({ athleteId: athlete.id, region: 'calf', side: 'left', mechanismKind: 'ball', injuredAt: hoursAgo(30) })).body.injury;
  return { athlete, injury };
}

describe("a guardian's consent for athletes under 18", () => {
  it('refuses to start a run for a 16-year-old until a guardian consent is recorded, then starts it', async () => {
    // Our rule (an age of majority common to most places): under 18, counted by year of birth.
    const { athlete, injury } = await athleteWithInjury(thisYear - 16);
    expect(athlete.needsGuardianConsent).toBe(true);
    expect(athlete.guardianConsent).toBeNull();

    const refused = await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('guardian_consent_required');
    expect(refused.body.error.message).toMatch(/under 18.*guardian's consent/);
    expect(await Run.count({ where: { injuryId: injury.id } })).toBe(0);

    const recorded = await therapist.patch(`/api/athletes/${athlete.id}`).send({ guardianConsent: { guardianName: 'Mara Park (mother)' } });
    expect(recorded.status).toBe(200);
    expect(recorded.body.athlete.guardianConsent).toMatchObject({ guardianName: 'Mara Park (mother)', recordedByName: 'Gia Guard' });
    expect(Date.parse(recorded.body.athlete.guardianConsent.recordedAt)).toBeGreaterThan(Date.now() - 60_000);

    expect((await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear })).status).toBe(201);
  });

  it('withdrawing the consent blocks the next run again', async () => {
    const { athlete, injury } = await athleteWithInjury(thisYear - 15);
    await therapist.patch(`/api/athletes/${athlete.id}`).send({ guardianConsent: { guardianName: 'Theo Park' } });
    const withdrawn = await therapist.patch(`/api/athletes/${athlete.id}`).send({ guardianConsent: null });
    expect(withdrawn.body.athlete.guardianConsent).toBeNull();
    expect((await therapist.post('/api/runs').send({ injuryId: injury.id })).status).toBe(409);
  });

  it('asks for a guardian for an athlete who reaches 18 this year, who may still be 17 today, and says why', async () => {
    const { athlete, injury } = await athleteWithInjury(thisYear - 18);
    expect(athlete.needsGuardianConsent).toBe(true);
    expect(athlete.guardianConsentReason).toMatch(/may still be 17 today/);
    const refused = await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('guardian_consent_required');
  });

  it('needs no guardian for an athlete who reaches 19 this year', async () => {
    const { athlete, injury } = await athleteWithInjury(thisYear - 19);
    expect(athlete.needsGuardianConsent).toBe(false);
    expect(athlete.guardianConsentReason).toBeNull();
    expect((await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear })).status).toBe(201);
  });

  it('answers a guardian without a name with 400 naming the field', async () => {
    const { athlete } = await athleteWithInjury(thisYear - 12);
    const res = await therapist.patch(`/api/athletes/${athlete.id}`).send({ guardianConsent: { guardianName: ' ' } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty(['guardianConsent.guardianName']);
  });
});
