import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, User } from '../../server/models';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
let clinicId: string;
let admin: Awaited<ReturnType<typeof createStaff>>;
let adminSession: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  clinicId = (await createClinic()).id;
  admin = await createStaff(clinicId, 'admin', { name: 'Ada Admin' });
  adminSession = await signedInAgent(app, admin.email);
});

describe('deactivating staff', () => {
  it("a deactivated therapist's next request answers 401, and signing in again is refused", async () => {
    const therapist = await createStaff(clinicId, 'therapist');
    const session = await signedInAgent(app, therapist.email);
    expect((await session.get('/api/injuries')).status).toBe(200);

    const res = await adminSession.patch(`/api/staff/${therapist.id}`).send({ active: false });
    expect(res.status).toBe(200);
    expect(res.body.member).toMatchObject({ id: therapist.id, active: false });

    expect((await session.get('/api/injuries')).status).toBe(401);
    expect((await session.get('/api/auth/me')).body.user ?? null).toBeNull();
    await expect(signedInAgent(app, therapist.email)).rejects.toThrow(/sign-in failed/);
  });

  it('refuses a user made inactive in the database on their next request (the session loads only active users)', async () => {
    const supervisor = await createStaff(clinicId, 'supervisor');
    const session = await signedInAgent(app, supervisor.email);
    expect((await session.get('/api/review/filters')).status).toBe(200);
    // Straight to the row, past the service that also deletes sessions: only passport's deserializer stands guard.
    await User.update({ active: false }, { where: { id: supervisor.id } });
    expect((await session.get('/api/review/filters')).status).toBe(401);
  });

  it('reactivates a member, who can then sign in again', async () => {
    const therapist = await createStaff(clinicId, 'therapist');
    await adminSession.patch(`/api/staff/${therapist.id}`).send({ active: false });
    const res = await adminSession.patch(`/api/staff/${therapist.id}`).send({ active: true });
    expect(res.status).toBe(200);
    expect(res.body.member.active).toBe(true);
    const session = await signedInAgent(app, therapist.email);
    expect((await session.get('/api/injuries')).status).toBe(200);
  });
});

describe('the last active admin', () => {
  it('cannot be demoted or deactivated; with a second admin, the first can be', async () => {
    const clinic = await createClinic();
    const only = await createStaff(clinic.id, 'admin');
    const session = await signedInAgent(app, only.email);

    const demote = await session.patch(`/api/staff/${only.id}`).send({ role: 'therapist' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe('last_admin');
    const deactivate = await session.patch(`/api/staff/${only.id}`).send({ active: false });
    expect(deactivate.status).toBe(409);
    expect((await User.findByPk(only.id))?.role).toBe('admin');
    expect((await User.findByPk(only.id))?.active).toBe(true);

    // A deactivated admin does not count as the clinic's admin.
    const dormant = await createStaff(clinic.id, 'admin', { active: false });
    expect((await session.patch(`/api/staff/${only.id}`).send({ role: 'supervisor' })).status).toBe(409);

    const second = await createStaff(clinic.id, 'admin');
    const promoted = await session.patch(`/api/staff/${dormant.id}`).send({ role: 'therapist' });
    expect(promoted.status).toBe(200);
    const secondSession = await signedInAgent(app, second.email);
    const demoted = await secondSession.patch(`/api/staff/${only.id}`).send({ role: 'supervisor' });
    expect(demoted.status).toBe(200);
    expect(demoted.body.member.role).toBe('supervisor');
    // Now the second admin is the last one.
    expect((await secondSession.patch(`/api/staff/${second.id}`).send({ active: false })).status).toBe(409);
  });

  it('two admins demoting each other at the same moment leave one admin', async () => {
    const clinic = await createClinic();
    const a = await createStaff(clinic.id, 'admin');
    const b = await createStaff(clinic.id, 'admin');
    const [sa, sb] = await Promise.all([signedInAgent(app, a.email), signedInAgent(app, b.email)]);
    const results = await Promise.all([sa.patch(`/api/staff/${b.id}`).send({ role: 'therapist' }), sb.patch(`/api/staff/${a.id}`).send({ role: 'therapist' })]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(await User.count({ where: { clinicId: clinic.id, role: 'admin', active: true } })).toBe(1);
  });
});

describe('changing roles', () => {
  it('changes a therapist into a supervisor, who then reaches the review desk', async () => {
    const member = await createStaff(clinicId, 'therapist');
    const before = await signedInAgent(app, member.email);
    expect((await before.get('/api/review/filters')).status).toBe(403);
    const res = await adminSession.patch(`/api/staff/${member.id}`).send({ role: 'supervisor' });
    expect(res.status).toBe(200);
    // The role is read on every request, so the open session has it at once.
    expect((await before.get('/api/review/filters')).status).toBe(200);
  });

  it('records every staff change as an audit event with the before and after', async () => {
    const member = await createStaff(clinicId, 'therapist', { name: 'Audit Subject' });
    await adminSession.patch(`/api/staff/${member.id}`).send({ role: 'supervisor' });
    await adminSession.patch(`/api/staff/${member.id}`).send({ active: false });
    await adminSession.patch(`/api/staff/${member.id}`).send({ active: true });
    const events = await AuditEvent.findAll({ where: { clinicId, recordId: member.id }, order: [['id', 'ASC']] });
    expect(events.map((e) => e.action)).toEqual(['staff.role-changed', 'staff.deactivated', 'staff.reactivated']);
    expect(events[0].detail).toMatchObject({ from: 'therapist', to: 'supervisor' });
    expect(events.every((e) => e.userId === admin.id)).toBe(true);
  });

  it('answers bad input with 400 naming the field, and nothing changes', async () => {
    const member = await createStaff(clinicId, 'therapist');
    const res = await adminSession.patch(`/api/staff/${member.id}`).send({ role: 'owner' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('role');
    const empty = await adminSession.patch(`/api/staff/${member.id}`).send({});
    expect(empty.status).toBe(400);
    expect((await User.findByPk(member.id))?.role).toBe('therapist');
  });

  it("answers 404 for another clinic's member and 403 for a supervisor", async () => {
    const other = await createClinic();
    const stranger = await createStaff(other.id, 'therapist');
    expect((await adminSession.patch(`/api/staff/${stranger.id}`).send({ active: false })).status).toBe(404);
    expect((await User.findByPk(stranger.id))?.active).toBe(true);

    const supervisor = await signedInAgent(app, (await createStaff(clinicId, 'supervisor')).email);
    expect((await supervisor.patch(`/api/staff/${stranger.id}`).send({ active: false })).status).toBe(403);
  });
});
