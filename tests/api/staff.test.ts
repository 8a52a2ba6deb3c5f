import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
let admin: { email: string; id: string };
let therapist: { email: string };
let supervisor: { email: string };
let otherClinicMember: { id: string };

beforeAll(async () => {
  const clinic = await createClinic();
  const other = await createClinic();
  admin = await createStaff(clinic.id, 'admin');
  therapist = await createStaff(clinic.id, 'therapist');
  supervisor = await createStaff(clinic.id, 'supervisor');
  otherClinicMember = await createStaff(other.id, 'therapist');
});

describe('staff list', () => {
  it("lists only the admin's own clinic's staff", async () => {
    const session = await signedInAgent(app, admin.email);
    const res = await session.get('/api/staff');
    expect(res.status).toBe(200);
    expect(res.body.staff).toHaveLength(3);
    expect(res.body.staff.map((s: { email: string }) => s.email).sort()).toEqual([admin.email, therapist.email, supervisor.email].sort());
    expect(res.body.staff[0]).not.toHaveProperty('passwordHash');
  });

  it('refuses a therapist with 403', async () => {
    const session = await signedInAgent(app, therapist.email);
    const res = await session.get('/api/staff');
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
  });

  it('refuses a supervisor with 403', async () => {
    const session = await signedInAgent(app, supervisor.email);
    expect((await session.get('/api/staff')).status).toBe(403);
  });

  it('answers 401 when signed out', async () => {
    expect((await request(app).get('/api/staff')).status).toBe(401);
  });

  it("answers 404 for another clinic's staff member, as if it did not exist", async () => {
    const session = await signedInAgent(app, admin.email);
    const res = await session.get(`/api/staff/${otherClinicMember.id}`);
    expect(res.status).toBe(404);
    const own = await session.get(`/api/staff/${admin.id}`);
    expect(own.status).toBe(200);
  });

  it('answers a malformed id with 400 naming the field', async () => {
    const session = await signedInAgent(app, admin.email);
    const res = await session.get('/api/staff/not-a-uuid');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('id');
  });
});
