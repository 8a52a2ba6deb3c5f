import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, createClinic, createStaff, signedInAgent, TEST_PASSWORD } from '../support/api-app';

const app = buildTestApp();
let therapistEmail: string;

beforeAll(async () => {
  const clinic = await createClinic();
  therapistEmail = (await createStaff(clinic.id, 'therapist')).email;
});

async function csrfAgent() {
  const agent = request.agent(app);
  const token = (await agent.get('/api/auth/csrf')).body.token as string;
  return { agent, token };
}

describe('sign-in', () => {
  it('signs a therapist in and answers with their user', async () => {
    const { agent, token } = await csrfAgent();
    const res = await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: therapistEmail, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: therapistEmail, role: 'therapist' });
    expect(Object.keys(res.body.user)).toEqual(expect.arrayContaining(['id', 'email', 'name', 'role', 'clinicId']));
    expect(res.body.user).not.toHaveProperty('passwordHash');

    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(therapistEmail);
  });

  it('accepts the e-mail address in any case', async () => {
    const { agent, token } = await csrfAgent();
    const res = await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: therapistEmail.toUpperCase(), password: TEST_PASSWORD });
    expect(res.status).toBe(200);
  });

  it('answers a wrong password and an unknown address with the same generic 401', async () => {
    const { agent, token } = await csrfAgent();
    const wrong = await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: therapistEmail, password: 'not-the-password-1' });
    const unknown = await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: 'nobody@nowhere.mendstep.test', password: 'not-the-password-1' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
    expect(wrong.body.error.code).toBe('unauthorized');
  });

  it('refuses a deactivated account with the same generic 401', async () => {
    const clinic = await createClinic();
    const gone = await createStaff(clinic.id, 'therapist', { active: false });
    const { agent, token } = await csrfAgent();
    const res = await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: gone.email, password: TEST_PASSWORD });
    expect(res.status).toBe(401);
  });

  it('answers a malformed body with 400 naming each field at fault', async () => {
    const { agent, token } = await csrfAgent();
    const res = await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: 'not-an-address', password: 42 });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['email', 'password']));
    expect(res.body.error.message).toEqual(expect.any(String));
  });

  it('answers broken JSON with 400, not 500', async () => {
    const { agent, token } = await csrfAgent();
    const res = await agent.post('/api/auth/login').set('X-CSRF-Token', token).set('Content-Type', 'application/json').send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
  });

  it('sets an HttpOnly, SameSite=Lax session cookie with an expiry (idle timeout), not Secure over plain HTTP in tests', async () => {
    const { agent, token } = await csrfAgent();
    const res = await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: therapistEmail, password: TEST_PASSWORD });
    const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('mendstep.sid='));
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Expires=/i);
    expect(cookie).not.toMatch(/Secure/i);
  });

  it('gives a new session id at sign-in (no session fixation)', async () => {
    const { agent, token } = await csrfAgent();
    const before = (await agent.get('/api/auth/csrf')).headers['set-cookie'];
    const sidBefore = ([] as string[]).concat(before ?? []).find((c) => c.startsWith('mendstep.sid='))?.split(';')[0];
    const res = await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: therapistEmail, password: TEST_PASSWORD });
    const sidAfter = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('mendstep.sid='))?.split(';')[0];
    expect(sidBefore).toBeDefined();
    expect(sidAfter).toBeDefined();
    expect(sidAfter).not.toBe(sidBefore);
  });

  it('marks the session cookie Secure in production', async () => {
    const { createApp } = await import('../../server/app');
    const { loadConfig } = await import('../../server/config');
    const prod = createApp(loadConfig({ ...process.env, NODE_ENV: 'production', SESSION_SECRET: 'a-production-secret-for-tests', LOG_LEVEL: 'silent', TRUST_PROXY: '1' }));
    try {
      const agent = request.agent(prod.app);
      // express-session sets a Secure cookie only over TLS: here TLS ends at a proxy in front of us.
      const res = await agent.get('/api/auth/csrf').set('X-Forwarded-Proto', 'https');
      const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
      expect(cookies.find((c) => c.startsWith('mendstep.sid='))).toMatch(/Secure/);
      expect(res.headers['strict-transport-security']).toBeDefined();
      // The local mailbox is never offered in production.
      expect((await agent.get('/api/health').set('X-Forwarded-Proto', 'https')).body).toEqual({ ok: true, mailbox: false });
    } finally {
      await prod.pool.end();
    }
  });
});

describe('CSRF protection', () => {
  it('refuses a state-changing request without the X-CSRF-Token header', async () => {
    const agent = request.agent(app);
    await agent.get('/api/auth/csrf');
    const res = await agent.post('/api/auth/login').send({ email: therapistEmail, password: TEST_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
  });

  it('refuses a signed-in user\'s sign-out with a forged token', async () => {
    const session = await signedInAgent(app, therapistEmail);
    const res = await session.agent.post('/api/auth/logout').set('X-CSRF-Token', 'forged.token');
    expect(res.status).toBe(403);
    expect((await session.get('/api/auth/me')).status).toBe(200);
  });
});

describe('sign-out', () => {
  it('ends the session: 204, then /me answers 401', async () => {
    const session = await signedInAgent(app, therapistEmail);
    const res = await session.post('/api/auth/logout');
    expect(res.status).toBe(204);
    expect((await session.get('/api/auth/me')).status).toBe(401);
  });
});

describe('rate limit', () => {
  it('after too many failed sign-ins answers 429 with one generic message, even for the right password', async () => {
    const limited = buildTestApp({ LOGIN_RATE_LIMIT: '3' });
    const agent = request.agent(limited);
    const token = (await agent.get('/api/auth/csrf')).body.token;
    for (let i = 0; i < 3; i++) {
      const res = await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: therapistEmail, password: `wrong-password-${i}` });
      expect(res.status).toBe(401);
    }
    const blocked = await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: therapistEmail, password: TEST_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
  });
});

describe('security headers', () => {
  it('sends a Content-Security-Policy that allows only our own origin for scripts', async () => {
    const res = await request(app).get('/api/health');
    expect(res.body.mailbox).toBe(true);
    expect(res.headers['content-security-policy']).toMatch(/script-src 'self'/);
    expect(res.headers['content-security-policy']).not.toMatch(/upgrade-insecure-requests/);
    expect(res.headers['x-request-id']).toEqual(expect.any(String));
  });

  it('never sends a stack trace: an unknown API route answers JSON 404', async () => {
    const session = await signedInAgent(app, therapistEmail);
    const res = await session.get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
