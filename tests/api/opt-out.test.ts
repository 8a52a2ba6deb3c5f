import { createHash, randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, Athlete } from '../../server/models';
import { settleBackgroundMail } from '../../server/services/mail-outbox-service';
import { createClinic, createStaff, signedInAgent } from '../support/api-app';
import { buildMailTestApp, outboxFor, receivedFor, waitFor, waitForMail } from '../support/smtp-harness';

const APP_URL = 'https://mendstep.example.test';
const { app, mail } = buildMailTestApp({ APP_URL });

let clinicName: string;
let therapist: Awaited<ReturnType<typeof signedInAgent>>;

const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };
const minutesAgo = (m: number) => new Date(Date.now() - m * 60_000).toISOString();
const tokenIn = (text: string | undefined | false) => new RegExp(`${APP_URL}/opt-out\\?token=([A-Za-z0-9_-]{43})`).exec(text || '')?.[1];

async function visitor() {
  const agent = request.agent(app);
  const csrf = (await agent.get('/api/auth/csrf')).body.token as string;
  return { post: (url: string) => agent.post(url).set('X-CSRF-Token', csrf) };
}

beforeAll(async () => {
  const clinic = await createClinic();
  clinicName = clinic.name;
  therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist')).email);
});

async function athleteWithAcuteInjury() {
  const email = `opt-out-${randomUUID()}@example.test`;
  const athlete = (await therapist.post('/api/athletes').send({ name: 'Ilse Marwood', yearOfBirth: 1996, sport: 'Hockey', email, consentToTreatment: true })).body.athlete;
  const injury = (
    await therapist.post('/api/injuries').send({ athleteId: athlete.id, region: 'anterior-thigh', side: 'right', mechanismKind: 'stick-or-bat', injuredAt: minutesAgo(300) })
  ).body.injury;
  return { email, athleteId: athlete.id as string, injuryId: injury.id as string };
}

/** The acute sequence run to its end (cold pack, wrap, rest and re-check), which queues the home-care plan. */
async function completeRun(injuryId: string) {
  const run = (await therapist.post('/api/runs').send({ injuryId, screening: clear })).body.run;
  const log = async (body: object) => expect((await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send(body)).status).toBe(201);
  await log({ type: 'step-completed', at: minutesAgo(8), seq: 1, stepIndex: 0, kind: 'cold-pack', plannedSeconds: 1200, actualSeconds: 1200 });
  await log({ type: 'step-completed', at: minutesAgo(5), seq: 2, stepIndex: 1, kind: 'compression-wrap', plannedSeconds: 180, actualSeconds: 180 });
  await log({ type: 'step-completed', at: minutesAgo(1), seq: 3, stepIndex: 2, kind: 'rest-recheck', plannedSeconds: 300, actualSeconds: 300 });
  await log({ type: 'run-completed', at: minutesAgo(1), seq: 4 });
  return run.id as string;
}

describe('opting out of e-mails', () => {
  let athlete: Awaited<ReturnType<typeof athleteWithAcuteInjury>>;
  let token: string;

  it('every home-care message carries a single-use opt-out link, and only the token’s hash is stored', async () => {
    athlete = await athleteWithAcuteInjury();
    await completeRun(athlete.injuryId);
    const [message] = await waitForMail(athlete.email);
    token = tokenIn(message.text)!;
    expect(token).toBeTruthy();
    expect(message.html as string).toContain(`href="${APP_URL}/opt-out?token=${token}"`);
    const rows = await Athlete.sequelize!.query<{ token_hash: string; used_at: Date | null }>(
      'SELECT token_hash, used_at FROM email_opt_out_tokens WHERE athlete_id = :id',
      { replacements: { id: athlete.athleteId }, type: QueryTypes.SELECT },
    );
    expect(rows).toEqual([{ token_hash: createHash('sha256').update(token).digest('hex'), used_at: null }]);
  });

  it('the link works without signing in: the page names only the clinic, the answer records the opt-out, and the link works once', async () => {
    const anyone = await visitor();
    const check = await anyone.post('/api/opt-out/check').send({ token });
    expect(check.status).toBe(200);
    expect(check.body.link).toEqual({ clinicName });
    // Whoever holds the link learns nothing about the person.
    expect(JSON.stringify(check.body)).not.toMatch(/Ilse|Marwood|opt-out-/);

    const answer = await anyone.post('/api/opt-out').send({ token });
    expect(answer.status).toBe(200);
    expect(answer.body.clinicName).toBe(clinicName);
    const seen = (await therapist.get(`/api/athletes/${athlete.athleteId}`)).body.athlete;
    expect(seen.emailOptedOutAt).toBe(answer.body.optedOutAt);
    const event = await AuditEvent.findOne({ where: { action: 'athlete.email-opted-out', recordId: athlete.athleteId } });
    expect(event?.userId).toBeNull();

    const again = await anyone.post('/api/opt-out').send({ token });
    expect(again.status).toBe(400);
    expect(again.body.error.fields.token).toMatch(/already been used/);
    const malformed = await anyone.post('/api/opt-out').send({ token: 'not-a-token' });
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields.token).toBeTruthy();
  });

  it('an opted-out athlete gets no message after a run, and the reason is on the audit trail', async () => {
    const runId = await completeRun(athlete.injuryId);
    await settleBackgroundMail();
    expect(await outboxFor(athlete.email)).toHaveLength(1);
    expect(await receivedFor(athlete.email)).toHaveLength(1);
    const event = await AuditEvent.findOne({ where: { action: 'email.home-care-not-sent', recordId: runId } });
    expect(event?.detail).toEqual({ reason: 'athlete opted out of e-mails' });
  });

  it('a message still waiting in the outbox when the athlete opts out is never sent', async () => {
    const fake = mail.fakeServer!;
    await fake.stop();
    const waiting = await athleteWithAcuteInjury();
    let pendingToken: string;
    try {
      await completeRun(waiting.injuryId);
      const [row] = await waitFor(async () => {
        const rows = await outboxFor(waiting.email);
        return rows[0]?.attempts ? rows : null;
      }, { what: 'a failed attempt while the SMTP server is away' });
      expect(row.status).toBe('pending');
      pendingToken = tokenIn(row.text)!;
      expect((await (await visitor()).post('/api/opt-out').send({ token: pendingToken })).status).toBe(200);
      const [after] = await outboxFor(waiting.email);
      expect(after.status).toBe('failed-permanently');
      expect(after.lastError).toMatch(/opted out/);
    } finally {
      await fake.start();
    }
    await mail.worker.run('all');
    expect(await receivedFor(waiting.email)).toEqual([]);
  });
});
