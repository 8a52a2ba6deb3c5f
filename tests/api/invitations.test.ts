import { createHash, randomUUID } from 'node:crypto';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuthToken, User } from '../../server/models';
import { createClinic, createStaff, signedInAgent } from '../support/api-app';
import { buildMailTestApp, waitForMail } from '../support/smtp-harness';

const APP_URL = 'https://mendstep.example.test';
const { app } = buildMailTestApp({ APP_URL });
let admin: Awaited<ReturnType<typeof signedInAgent>>;
let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let clinicName: string;

const tokenIn = (text: string | undefined) => /\/set-password\?token=([A-Za-z0-9_-]{43})/.exec(text ?? '')?.[1];

async function csrfAgent() {
  const agent = request.agent(app);
  const token = (await agent.get('/api/auth/csrf')).body.token as string;
  return { agent, post: (url: string) => agent.post(url).set('X-CSRF-Token', token) };
}

beforeAll(async () => {
  const clinic = await createClinic();
  clinicName = clinic.name;
  admin = await signedInAgent(app, (await createStaff(clinic.id, 'admin', { name: 'Priya Dunmore' })).email);
  therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist')).email);
});

describe('staff invitations', () => {
  it('an admin invites by e-mail: an inactive account, a single-use link valid 7 days, then a password and a working sign-in', async () => {
    const email = `new-supervisor-${randomUUID()}@example.test`;
    const res = await admin.post('/api/staff/invitations').send({ name: 'Marek Oyelaran', email: email.toUpperCase(), role: 'supervisor' });
    expect(res.status).toBe(201);
    expect(res.body.member).toMatchObject({ email, name: 'Marek Oyelaran', role: 'supervisor', active: false });
    const days = (Date.parse(res.body.expiresAt) - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.99);
    expect(days).toBeLessThanOrEqual(7);

    const [message] = await waitForMail(email);
    expect(message.subject).toContain(clinicName);
    expect(message.text).toContain('Priya Dunmore has invited you');
    expect(message.text).toContain(`${APP_URL}/set-password?token=`);
    const token = tokenIn(message.text)!;
    // Only a hash is kept: the database alone cannot open the account.
    const stored = await AuthToken.findOne({ where: { userId: res.body.member.id } });
    expect(stored!.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(stored!.tokenHash).not.toContain(token);

    const visitor = await csrfAgent();
    // Not yet: no password, inactive.
    expect((await visitor.post('/api/auth/login').send({ email, password: 'whatever-long-enough' })).status).toBe(401);
    const info = await visitor.post('/api/auth/password-token').send({ token });
    expect(info.body.link).toMatchObject({ purpose: 'invitation', name: 'Marek Oyelaran', email });

    const set = await visitor.post('/api/auth/password').send({ token, password: 'lantern-harbour-91' });
    expect(set.status).toBe(200);
    expect((await User.findByPk(res.body.member.id))!.active).toBe(true);
    const signedIn = await signedInAgent(app, email, 'lantern-harbour-91');
    expect(signedIn.user.role).toBe('supervisor');

    // Single use.
    const again = await visitor.post('/api/auth/password').send({ token, password: 'another-password-22' });
    expect(again.status).toBe(400);
    expect(again.body.error.fields).toHaveProperty('token');
  });

  it('inviting the same address again before it is accepted sends a new link and retires the old one', async () => {
    const email = `twice-${randomUUID()}@example.test`;
    await admin.post('/api/staff/invitations').send({ name: 'Jun Taverner', email, role: 'therapist' });
    const first = tokenIn((await waitForMail(email))[0].text)!;
    const second = await admin.post('/api/staff/invitations').send({ name: 'Jun Taverner', email, role: 'supervisor' });
    expect(second.status).toBe(201);
    const mails = await waitForMail(email, 2);
    const latest = tokenIn(mails[1].text)!;
    const visitor = await csrfAgent();
    expect((await visitor.post('/api/auth/password-token').send({ token: first })).status).toBe(400);
    expect((await visitor.post('/api/auth/password-token').send({ token: latest })).status).toBe(200);
  });

  it('an expired invitation link is refused', async () => {
    const email = `late-${randomUUID()}@example.test`;
    const res = await admin.post('/api/staff/invitations').send({ name: 'Ola Brenn', email, role: 'therapist' });
    const token = tokenIn((await waitForMail(email))[0].text)!;
    await AuthToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: res.body.member.id } });
    const visitor = await csrfAgent();
    const set = await visitor.post('/api/auth/password').send({ token, password: 'lantern-harbour-91' });
    expect(set.status).toBe(400);
    expect(set.body.error.fields.token).toMatch(/expired/);
    expect((await User.findByPk(res.body.member.id))!.active).toBe(false);
  });

  it('refuses an address that already has an account (409 on email), bad input (400 naming the field) and non-admins (403)', async () => {
    const taken = await admin.post('/api/staff/invitations').send({ name: 'Copy', email: admin.user.email, role: 'therapist' });
    expect(taken.status).toBe(409);
    expect(taken.body.error.fields).toHaveProperty('email');
    const bad = await admin.post('/api/staff/invitations').send({ name: '', email: 'not-an-address', role: 'owner' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['email', 'name', 'role']);
    expect((await therapist.post('/api/staff/invitations').send({ name: 'X', email: `x-${randomUUID()}@example.test`, role: 'admin' })).status).toBe(403);
  });
});
