import { beforeAll, describe, expect, it } from 'vitest';
import { Run } from '../../server/models';
import { treatmentConsentMissingMessage } from '../../shared/clinic/treatment-consent';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
let therapist: Awaited<ReturnType<typeof signedInAgent>>;

const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();
const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };

beforeAll(async () => {
  therapist = await signedInAgent(app, (await createStaff((await createClinic()).id, 'therapist')).email);
});

async function athleteWithInjury(athlete: Record<string, unknown>) {
  const created = (await therapist.post('/api/athletes').send({ name: 'Tam Ardent', yearOfBirth: 1995, sport: 'Hockey', ...athlete })).body.athlete;
  const injury = (await therapist.post('/api/injuries').send({ athleteId: created.id, region: 'calf', side: 'left', mechanismKind: 'ball', injuredAt: hoursAgo(30) })).body.injury;
  return { athlete: created, injury };
}

describe('no consent to treatment recorded, no run', () => {
  it('refuses a run with 409 treatment_consent_required and a message pointing to the athlete page, creating nothing', async () => {
    const { athlete, injury } = await athleteWithInjury({});
    expect(athlete.consentToTreatment).toBe(false);
    const refused = await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear });
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatchObject({ code: 'treatment_consent_required', message: treatmentConsentMissingMessage, athleteId: athlete.id });
    expect(refused.body.error.message).toMatch(/athlete's page/);
    expect(await Run.count({ where: { injuryId: injury.id } })).toBe(0);
  });

  it('starts the run once consent is recorded, and refuses again after it is withdrawn', async () => {
    const { athlete, injury } = await athleteWithInjury({});
    expect((await therapist.patch(`/api/athletes/${athlete.id}`).send({ consentToTreatment: true })).status).toBe(200);
    const started = await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear });
    expect(started.status).toBe(201);

    const other = await athleteWithInjury({ consentToTreatment: true });
    expect((await therapist.patch(`/api/athletes/${other.athlete.id}`).send({ consentToTreatment: false })).status).toBe(200);
    expect((await therapist.post('/api/runs').send({ injuryId: other.injury.id })).body.error.code).toBe('treatment_consent_required');
  });
});
