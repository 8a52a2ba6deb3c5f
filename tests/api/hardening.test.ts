import { randomUUID } from 'node:crypto';
import request from 'supertest';
import pg from 'pg';
import { beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { OutboundEmail } from '../../server/models';
import { Op } from 'sequelize';
import { loadConfig } from '../../server/config';
import { isDatabaseUnavailable } from '../../server/db/availability';
import { findUnsafeText, isSafeText } from '../../shared/text-safety';
import { createClinic, createStaff, signedInAgent, TEST_PASSWORD } from '../support/api-app';
import { buildMailTestApp, waitForMail } from '../support/smtp-harness';

const { app, pool } = buildMailTestApp({ APP_URL: 'https://mendstep.example.test' });
type Agent = Awaited<ReturnType<typeof signedInAgent>>;

let therapist: Agent;
let supervisor: Agent;
let secondSupervisor: Agent;
let admin: Agent;
let supervisorId: string;

const NUL = 'Pain out of proportion\u0000';
const LONE = 'Fine \uD800 work';
const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };
const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();

beforeAll(async () => {
  const clinic = await createClinic();
  therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist')).email);
  const supervisorUser = await createStaff(clinic.id, 'supervisor');
  supervisorId = supervisorUser.id;
  supervisor = await signedInAgent(app, supervisorUser.email);
  secondSupervisor = await signedInAgent(app, (await createStaff(clinic.id, 'supervisor')).email);
  admin = await signedInAgent(app, (await createStaff(clinic.id, 'admin')).email);
});

async function newInjury(agent: Agent) {
  const athlete = (await agent.post('/api/athletes').send({ name: 'Ines Varga', yearOfBirth: 1998, sport: 'Hockey', consentToTreatment: true })).body.athlete;
  return (await agent.post('/api/injuries').send({ athleteId: athlete.id, region: 'anterior-thigh', side: 'left', mechanismKind: 'knee-to-thigh', injuredAt: hoursAgo(20) })).body.injury;
}

describe('text that PostgreSQL cannot store is refused at the edge, naming the field', () => {
  it('the shared rule knows NUL and lone surrogates, and keeps real characters (emoji, accents) as they are', () => {
    expect(isSafeText('Zoë 💪 ok')).toBe(true);
    expect(isSafeText(NUL)).toBe(false);
    expect(isSafeText(LONE)).toBe(false);
    expect(isSafeText('\uDC00 trailing low')).toBe(false);
    expect(findUnsafeText({ a: [{ b: 'fine' }, { c: LONE }] })).toEqual(['a', 1, 'c']);
  });

  it('a red-flag entry with NUL in its reason gets 400 naming reason (not 500, which table mode would retry for ever)', async () => {
    const injury = await newInjury(therapist);
    const run = (await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear })).body.run;
    const res = await therapist
      .post(`/api/runs/${run.id}/log`)
      .set('Idempotency-Key', randomUUID())
      .send({ seq: 1, type: 'red-flag', reason: NUL, at: new Date().toISOString() });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['reason']);
  });

  it('an athlete name with a lone surrogate gets 400 naming name, and nothing is stored', async () => {
    const before = (await therapist.get('/api/athletes?q=Varga')).body;
    const res = await therapist.post('/api/athletes').send({ name: `Ines ${LONE}`, yearOfBirth: 1998, sport: 'Hockey' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['name']);
    expect((await therapist.get('/api/athletes?q=Varga')).body.total).toBe(before.total);
  });

  it('a search query with NUL gets 400 naming q', async () => {
    const res = await therapist.get('/api/athletes').query({ q: 'a\u0000b' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['q']);
  });
});

describe('instants are bounded to sensible years', () => {
  it('year 0000 for injuredAt is 400 naming injuredAt', async () => {
    const athlete = (await therapist.post('/api/athletes').send({ name: 'Odo Brandt', yearOfBirth: 1995, sport: 'Rugby' })).body.athlete;
    const res = await therapist.post('/api/injuries').send({ athleteId: athlete.id, region: 'anterior-thigh', side: 'left', mechanismKind: 'knee-to-thigh', injuredAt: '0000-01-01T00:00:00Z' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('injuredAt');
  });

  it('an entry time of 9999-12-31T23:59:59-23:59 (year 10000 in UTC) is 400 naming at', async () => {
    const injury = await newInjury(therapist);
    const run = (await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear })).body.run;
    const res = await therapist
      .post(`/api/runs/${run.id}/log`)
      .set('Idempotency-Key', randomUUID())
      .send({ seq: 1, type: 'paused', at: '9999-12-31T23:59:59-23:59' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('at');
  });

  it('review desk and audit filters from 0000-01-01 are 400 naming from', async () => {
    const review = await supervisor.get('/api/review/runs').query({ from: '0000-01-01' });
    expect(review.status).toBe(400);
    expect(review.body.error.fields).toHaveProperty('from');
    const audit = await admin.get('/api/audit/events').query({ from: '0000-01-01' });
    expect(audit.status).toBe(400);
    expect(audit.body.error.fields).toHaveProperty('from');
  });
});

describe('saves that race', () => {
  it('concurrent sequence saves: each is either 200 or 409, never 500, and the versions have no gaps', async () => {
    const current = (await supervisor.get('/api/sequences')).body.items.find((s: { phase: string }) => s.phase === 'remodelling');
    const results = await Promise.all(
      Array.from({ length: 6 }, () => supervisor.put('/api/sequences').send({ phase: 'remodelling', steps: current.steps })),
    );
    const statuses = results.map((r) => r.status);
    expect(statuses.every((s) => s === 200 || s === 409)).toBe(true);
    expect(statuses).toContain(200);
    for (const refused of results.filter((r) => r.status === 409)) expect(refused.body.error.code).toBe('conflict');
    const after = (await supervisor.get('/api/sequences')).body.items.find((s: { phase: string }) => s.phase === 'remodelling');
    expect(after.version).toBe(current.version + statuses.filter((s) => s === 200).length);
  });
});

describe("a finished run's e-mails are written with the entry that finished it", () => {
  it('when the fall-back entry gets its 201, the home-care e-mail and every supervisor alert are already in the outbox', async () => {
    const athlete = (await therapist.post('/api/athletes').send({ name: 'Kai Moreno', yearOfBirth: 1997, sport: 'Football', consentToTreatment: true, email: `kai-${randomUUID()}@example.test` })).body.athlete;
    const injury = (await therapist.post('/api/injuries').send({ athleteId: athlete.id, region: 'anterior-thigh', side: 'right', mechanismKind: 'knee-to-thigh', injuredAt: hoursAgo(20) })).body.injury;
    const run = (await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear })).body.run;
    const at = new Date().toISOString();
    const res = await therapist.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send({ seq: 1, type: 'run-fell-back', at });
    expect(res.status).toBe(201);
    // No waiting for background work: what a crash right after the 201 would leave behind is what is committed.
    const queued = await OutboundEmail.findAll({ where: { dedupeKey: { [Op.like]: `%${run.id}%` } } });
    expect(queued.map((m) => m.kind).sort()).toEqual(['home-care', 'run-alert', 'run-alert']);
  });
});

describe('who may sign off', () => {
  it("the supervisor who ran the treatment cannot sign its note; another supervisor can", async () => {
    const injury = await newInjury(supervisor);
    const run = (await supervisor.post('/api/runs').send({ injuryId: injury.id, screening: clear })).body.run;
    const at = new Date().toISOString();
    expect((await supervisor.post(`/api/runs/${run.id}/log`).set('Idempotency-Key', randomUUID()).send({ seq: 1, type: 'run-ended-early', reason: 'Athlete had to leave', at })).status).toBe(201);
    expect((await supervisor.get(`/api/runs/${run.id}/note`)).status).toBe(200);
    expect((await supervisor.post(`/api/runs/${run.id}/note/submit`).send({})).status).toBeLessThan(300);
    const own = await supervisor.post(`/api/runs/${run.id}/sign-off`).send({ comment: 'Fine' });
    expect(own.status).toBe(403);
    const other = await secondSupervisor.post(`/api/runs/${run.id}/sign-off`).send({ comment: 'Fine' });
    expect(other.status).toBe(200);
    expect(other.body.note.signedBy).not.toBe(supervisorId);
  });
});

describe('invitations', () => {
  it('someone deactivated before accepting cannot use the e-mailed link', async () => {
    const email = `withdrawn-${randomUUID()}@example.test`;
    const invited = await admin.post('/api/staff/invitations').send({ name: 'Pia Lindqvist', email, role: 'therapist' });
    expect(invited.status).toBe(201);
    const [mail] = await waitForMail(email);
    const token = /\/set-password\?token=([A-Za-z0-9_-]{43})/.exec(mail.text ?? '')?.[1];
    expect(token).toBeTruthy();
    expect((await admin.patch(`/api/staff/${invited.body.member.id}`).send({ active: false })).status).toBe(200);

    const stranger = request.agent(app);
    const csrf = (await stranger.get('/api/auth/csrf')).body.token as string;
    const accept = await stranger.post('/api/auth/password').set('X-CSRF-Token', csrf).send({ token, password: 'a-brand-new-password-2026', confirm: 'a-brand-new-password-2026' });
    expect(accept.status).toBe(400);
    const csrf2 = (await stranger.get('/api/auth/csrf')).body.token as string;
    const login = await stranger.post('/api/auth/login').set('X-CSRF-Token', csrf2).send({ email, password: 'a-brand-new-password-2026' });
    expect(login.status).toBe(401);
  });
});

describe('the database going away', () => {
  it('idle pool connections killed by PostgreSQL (57P01) do not end the process, and the next request is served', async () => {
    expect((await request(app).get('/healthz')).status).toBe(200);
    const admin = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await admin.connect();
    // What a PostgreSQL restart does to every idle client: terminate its backend.
    await admin.query(`SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE datname = current_database() AND pid <> pg_backend_pid() AND state = 'idle'`);
    await admin.end();
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(pool.listenerCount('error')).toBeGreaterThan(0);
    expect((await request(app).get('/healthz')).status).toBe(200);
    expect((await therapist.get('/api/athletes')).status).toBe(200);
  });

  it('with the database unreachable, an API request gets 503 with Retry-After, not 500', async () => {
    // A signed-in cookie from the working app, presented to an app whose session store cannot reach PostgreSQL.
    const agent = request.agent(app);
    const csrf = (await agent.get('/api/auth/csrf')).body.token as string;
    const user = await createStaff((await createClinic()).id, 'therapist');
    const login = await agent.post('/api/auth/login').set('X-CSRF-Token', csrf).send({ email: user.email, password: TEST_PASSWORD });
    const cookie = login.headers['set-cookie'];
    expect(login.status).toBe(200);

    const away = createApp(loadConfig({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', DATABASE_URL: 'postgres://postgres@127.0.0.1:9/unreachable' }));
    try {
      const res = await request(away.app).get('/api/athletes').set('Cookie', cookie);
      expect(res.status).toBe(503);
      expect(res.headers['retry-after']).toMatch(/^\d+$/);
      expect(res.body.error.code).toBe('unavailable');
    } finally {
      await away.mail.stop();
      await away.pool.end();
    }
    expect(isDatabaseUnavailable(Object.assign(new Error('terminating connection due to administrator command'), { code: '57P01' }))).toBe(true);
    expect(isDatabaseUnavailable(Object.assign(new Error('duplicate key'), { code: '23505' }))).toBe(false);
  });
});
