import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/models';
import { createClinic, createStaff, signedInAgent } from '../support/api-app';
import { buildMailTestApp, waitForMail } from '../support/smtp-harness';

const APP_URL = 'https://mendstep.example.test';
const { app } = buildMailTestApp({ APP_URL });

let admin: Awaited<ReturnType<typeof signedInAgent>>;
let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let otherAdmin: Awaited<ReturnType<typeof signedInAgent>>;
let therapistId: string;

const tokenIn = (text: string | undefined) => /\/set-password\?token=([A-Za-z0-9_-]{43})/.exec(text ?? '')?.[1];

async function linkStatus(token: string): Promise<number> {
  const agent = request.agent(app);
  const csrf = (await agent.get('/api/auth/csrf')).body.token as string;
  return (await agent.post('/api/auth/password-token').set('X-CSRF-Token', csrf).send({ token })).status;
}

beforeAll(async () => {
  const clinic = await createClinic();
  admin = await signedInAgent(app, (await createStaff(clinic.id, 'admin')).email);
  const therapistUser = await createStaff(clinic.id, 'therapist');
  therapistId = therapistUser.id;
  therapist = await signedInAgent(app, therapistUser.email);
  otherAdmin = await signedInAgent(app, (await createStaff((await createClinic()).id, 'admin')).email);
});

describe('invitations from the staff list', () => {
  let invitedId: string;
  let email: string;

  it('lists someone invited who has not set a password as invited, not as deactivated', async () => {
    email = `invitee-${randomUUID()}@example.test`;
    const invited = await admin.post('/api/staff/invitations').send({ name: 'Noor Halvorsen', email, role: 'therapist' });
    expect(invited.status).toBe(201);
    invitedId = invited.body.member.id;
    expect(invited.body.member).toMatchObject({ active: false, invited: true });

    const staff = (await admin.get('/api/staff')).body.staff as { id: string; active: boolean; invited: boolean }[];
    expect(staff.find((m) => m.id === invitedId)).toMatchObject({ active: false, invited: true });
    expect(staff.find((m) => m.id === therapistId)).toMatchObject({ active: true, invited: false });
  });

  it('resending gives a fresh link by e-mail and the earlier link stops working', async () => {
    const [first] = await waitForMail(email);
    const firstToken = tokenIn(first.text)!;
    expect(await linkStatus(firstToken)).toBe(200);

    const resent = await admin.post(`/api/staff/${invitedId}/invitation`);
    expect(resent.status).toBe(201);
    expect(resent.body.member).toMatchObject({ id: invitedId, invited: true });
    const days = (Date.parse(resent.body.expiresAt) - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.99);

    const messages = await waitForMail(email, 2);
    const secondToken = tokenIn(messages[1].text)!;
    expect(secondToken).not.toBe(firstToken);
    expect(messages[1].text).toContain(`${APP_URL}/set-password?token=`);
    expect(await linkStatus(firstToken)).toBe(400);
    expect(await linkStatus(secondToken)).toBe(200);
    expect(await AuditEvent.count({ where: { action: 'staff.invitation-resent', recordId: invitedId } })).toBe(1);
  });

  it('an invited member cannot be switched on from the list: they join by setting a password', async () => {
    const res = await admin.patch(`/api/staff/${invitedId}`).send({ active: true });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('invitation_pending');
  });

  it('refuses to re-invite someone who has joined, hides other clinics’ members, and is for admins only', async () => {
    const joined = await admin.post(`/api/staff/${therapistId}/invitation`);
    expect(joined.status).toBe(409);
    expect(joined.body.error.code).toBe('already_joined');
    expect((await otherAdmin.post(`/api/staff/${invitedId}/invitation`)).status).toBe(404);
    expect((await therapist.post(`/api/staff/${invitedId}/invitation`)).status).toBe(403);
    expect((await admin.post('/api/staff/not-an-id/invitation')).status).toBe(400);
  });
});
