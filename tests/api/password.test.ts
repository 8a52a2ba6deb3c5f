import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { AuthToken, OutboundEmail, User } from '../../server/models';
import { settleBackgroundMail } from '../../server/services/mail-outbox-service';
import { passwordResetAnswer } from '../../shared/mail/account-schemas';
import { createClinic, createStaff, signedInAgent, TEST_PASSWORD } from '../support/api-app';
import { buildMailTestApp, outboxFor, waitForMail } from '../support/smtp-harness';

// A high per-address limit here; the limit itself is tested on an app of its own below.
const { app } = buildMailTestApp({ PASSWORD_RESET_RATE_LIMIT: '100' });
let clinicId: string;

const tokenIn = (text: string | undefined) => /\/set-password\?token=([A-Za-z0-9_-]{43})/.exec(text ?? '')?.[1];

async function csrfAgent(target = app) {
  const agent = request.agent(target);
  const token = (await agent.get('/api/auth/csrf')).body.token as string;
  return { agent, post: (url: string) => agent.post(url).set('X-CSRF-Token', token), get: (url: string) => agent.get(url) };
}

beforeAll(async () => {
  clinicId = (await createClinic()).id;
});

describe('password reset', () => {
  it('sends a one-hour, single-use link; the new password works, the old does not, and the account’s other sessions end', async () => {
    const user = await createStaff(clinicId, 'therapist', { name: 'Hedda Quarry' });
    const elsewhere = await signedInAgent(app, user.email);
    expect((await elsewhere.get('/api/auth/me')).status).toBe(200);

    const visitor = await csrfAgent();
    const asked = await visitor.post('/api/auth/password-reset').send({ email: user.email.toUpperCase() });
    expect(asked.status).toBe(202);
    expect(asked.body).toEqual({ message: passwordResetAnswer });

    const [message] = await waitForMail(user.email);
    expect(message.subject).toBe('Reset your Mendstep password');
    const token = tokenIn(message.text)!;
    const stored = await AuthToken.findOne({ where: { userId: user.id, purpose: 'password-reset' } });
    const minutes = (stored!.expiresAt.getTime() - stored!.createdAt.getTime()) / 60_000;
    expect(minutes).toBeCloseTo(60, 0);

    const short = await visitor.post('/api/auth/password').send({ token, password: 'too-short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toMatch(/12 characters/);

    const set = await visitor.post('/api/auth/password').send({ token, password: 'quiet-meadow-4417' });
    expect(set.status).toBe(200);
    expect((await elsewhere.get('/api/auth/me')).status).toBe(401);
    await expect(signedInAgent(app, user.email, TEST_PASSWORD)).rejects.toThrow(/sign-in failed/);
    await signedInAgent(app, user.email, 'quiet-meadow-4417');

    const reused = await visitor.post('/api/auth/password').send({ token, password: 'quiet-meadow-4418' });
    expect(reused.status).toBe(400);
    expect(reused.body.error.fields).toHaveProperty('token');
  });

  it('answers an unknown or deactivated address exactly as a known one, and queues nothing', async () => {
    const gone = await createStaff(clinicId, 'therapist', { active: false });
    const visitor = await csrfAgent();
    const unknown = await visitor.post('/api/auth/password-reset').send({ email: `nobody-${randomUUID()}@example.test` });
    const inactive = await visitor.post('/api/auth/password-reset').send({ email: gone.email });
    expect([unknown.status, inactive.status]).toEqual([202, 202]);
    expect(unknown.body).toEqual({ message: passwordResetAnswer });
    expect(inactive.body).toEqual(unknown.body);
    await settleBackgroundMail();
    expect(await outboxFor(gone.email)).toEqual([]);
    expect(await AuthToken.count({ where: { userId: gone.id } })).toBe(0);
  });

  it('a reset link cannot bring back an account deactivated after it was sent', async () => {
    const user = await createStaff(clinicId, 'therapist');
    const visitor = await csrfAgent();
    await visitor.post('/api/auth/password-reset').send({ email: user.email });
    const token = tokenIn((await waitForMail(user.email))[0].text)!;
    await User.update({ active: false }, { where: { id: user.id } });
    const set = await visitor.post('/api/auth/password').send({ token, password: 'quiet-meadow-4417' });
    expect(set.status).toBe(400);
    expect((await User.findByPk(user.id))!.active).toBe(false);
  });

  it('a bad body names its field; a malformed token is refused before any lookup', async () => {
    const visitor = await csrfAgent();
    const bad = await visitor.post('/api/auth/password-reset').send({ email: 'not-an-address' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('email');
    const malformed = await visitor.post('/api/auth/password').send({ token: 'abc', password: 'quiet-meadow-4417' });
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields).toHaveProperty('token');
  });

  it('caps reset links at three an hour per account, whatever the form sends', async () => {
    const user = await createStaff(clinicId, 'therapist');
    const visitor = await csrfAgent();
    for (let i = 0; i < 5; i += 1) await visitor.post('/api/auth/password-reset').send({ email: user.email });
    await settleBackgroundMail();
    expect(await OutboundEmail.count({ where: { toAddress: user.email, kind: 'password-reset' } })).toBe(3);
    // Only the newest link works.
    const working = await AuthToken.count({ where: { userId: user.id, usedAt: null } });
    expect(working).toBe(1);
  });

  it('rate-limits reset requests per address (429 after the limit)', async () => {
    const limited = createApp(loadConfig({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', PASSWORD_RESET_RATE_LIMIT: '2', MAIL_POLL_SECONDS: '0' }));
    try {
      const visitor = await csrfAgent(limited.app);
      const codes = [];
      for (let i = 0; i < 3; i += 1) codes.push((await visitor.post('/api/auth/password-reset').send({ email: `x${i}@example.test` })).status);
      expect(codes).toEqual([202, 202, 429]);
    } finally {
      await limited.mail.stop();
      await limited.pool.end();
    }
  });
});
