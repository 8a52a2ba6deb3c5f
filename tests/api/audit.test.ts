import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/models';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const app = buildTestApp();
let clinicId: string;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
let supervisor: Awaited<ReturnType<typeof signedInAgent>>;
let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let therapistId: string;
let adminId: string;

beforeAll(async () => {
  // Sydney is 10–11 hours ahead of UTC: day filters must use the clinic's day, not the server's.
  const clinic = await createClinic();
  await clinic.update({ settings: { timeZone: 'Australia/Sydney' } });
  clinicId = clinic.id;
  const adminUser = await createStaff(clinicId, 'admin', { name: 'Aud Admin' });
  adminId = adminUser.id;
  admin = await signedInAgent(app, adminUser.email);
  supervisor = await signedInAgent(app, (await createStaff(clinicId, 'supervisor')).email);
  const therapistUser = await createStaff(clinicId, 'therapist', { name: 'Tess Therapist' });
  therapistId = therapistUser.id;
  therapist = await signedInAgent(app, therapistUser.email);

  // Recorded through the API: the trail fills as the clinic works.
  for (const name of ['Avery Kolb', 'Bo Lindqvist', 'Cy Moreau']) {
    await therapist.post('/api/athletes').send({ name, yearOfBirth: 1995, sport: 'Rugby' });
  }
  await admin.put('/api/settings').send({ abandonAfterHours: 8 });

  // Two events at known instants either side of midnight in Sydney (13:30 UTC on 2026-03-02 is 00:30 on the 3rd there).
  const other = await createClinic();
  const formulaName = await createStaff(clinicId, 'therapist', { name: '=SUM(A1) Person' });
  await AuditEvent.bulkCreate([
    { clinicId, userId: formulaName.id, action: 'test.formula-name', recordType: 'user', recordId: formulaName.id, detail: {}, createdAt: new Date('2026-01-10T09:00:00Z') },
    { clinicId, userId: therapistId, action: 'test.before-midnight', recordType: 'athlete', recordId: null, detail: {}, createdAt: new Date('2026-03-02T12:30:00Z') },
    { clinicId, userId: therapistId, action: 'test.after-midnight', recordType: 'athlete', recordId: null, detail: {}, createdAt: new Date('2026-03-02T13:30:00Z') },
    { clinicId: other.id, userId: null, action: 'test.other-clinic', recordType: 'athlete', recordId: null, detail: {}, createdAt: new Date('2026-03-02T13:30:00Z') },
  ]);
});

describe('audit viewer', () => {
  it("lists every event of the clinic, newest first, with the person's name, paged on the server", async () => {
    const all = await admin.get('/api/audit/events?pageSize=100');
    expect(all.status).toBe(200);
    const total = await AuditEvent.count({ where: { clinicId } });
    expect(all.body.total).toBe(total);
    expect(all.body.items.map((e: { action: string }) => e.action)).not.toContain('test.other-clinic');
    const times = all.body.items.map((e: { at: string }) => Date.parse(e.at));
    expect(times).toEqual([...times].sort((a, b) => b - a));
    expect(all.body.items.find((e: { action: string }) => e.action === 'settings.updated').userName).toBe('Aud Admin');

    const page1 = await admin.get('/api/audit/events?pageSize=2&page=1');
    const page2 = await admin.get('/api/audit/events?pageSize=2&page=2');
    expect(page1.body.items).toHaveLength(2);
    expect(page1.body.total).toBe(total);
    const ids = [...page1.body.items, ...page2.body.items].map((e: { id: string }) => e.id);
    expect(new Set(ids).size).toBe(4);
    expect(ids).toEqual(all.body.items.slice(0, 4).map((e: { id: string }) => e.id));
  });

  it('filters by person and by record type', async () => {
    const byTherapist = await supervisor.get(`/api/audit/events?userId=${therapistId}&pageSize=100`);
    expect(byTherapist.status).toBe(200);
    expect(byTherapist.body.total).toBe(5);
    expect(byTherapist.body.items.every((e: { userId: string }) => e.userId === therapistId)).toBe(true);

    const clinicType = await admin.get('/api/audit/events?recordType=clinic');
    expect(clinicType.body.items.map((e: { action: string; userId: string }) => [e.action, e.userId])).toEqual([['settings.updated', adminId]]);

    const filters = await admin.get('/api/audit/filters');
    expect(filters.body.recordTypes).toEqual(['athlete', 'clinic', 'user']);
    expect(filters.body.people.map((p: { name: string }) => p.name)).toContain('Tess Therapist');
  });

  it("filters by the clinic's calendar day, both ends included", async () => {
    const third = await admin.get('/api/audit/events?from=2026-03-03&to=2026-03-03');
    expect(third.body.items.map((e: { action: string }) => e.action)).toEqual(['test.after-midnight']);
    const second = await admin.get('/api/audit/events?from=2026-03-01&to=2026-03-02');
    expect(second.body.items.map((e: { action: string }) => e.action)).toEqual(['test.before-midnight']);
  });

  it('exports the filtered events as CSV with formula-looking text defused', async () => {
    const res = await admin.get(`/api/audit/events.csv?userId=${therapistId}&recordType=athlete`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="mendstep-audit-\d{4}-\d{2}-\d{2}\.csv"/);
    const lines = res.text.replace(/^\uFEFF/, '').trim().split('\r\n');
    expect(lines[0]).toBe('time,person,action,record_type,record_id,detail');
    expect(lines).toHaveLength(1 + 5);
    expect(lines.slice(1).every((line) => line.includes(',Tess Therapist,'))).toBe(true);
    // Times in Sydney: the 13:30 UTC event is 00:30 on the 3rd there.
    expect(lines.some((line) => line.startsWith('2026-03-03 00:30:00,'))).toBe(true);
    // A spreadsheet would run "=SUM(A1) Person" as a formula; the apostrophe keeps it text.
    const users = await admin.get('/api/audit/events.csv?recordType=user');
    expect(users.text).toContain(",'=SUM(A1) Person,test.formula-name,user,");
  });

  it('refuses therapists and bad filters', async () => {
    expect((await therapist.get('/api/audit/events')).status).toBe(403);
    expect((await therapist.get('/api/audit/events.csv')).status).toBe(403);
    const bad = await admin.get('/api/audit/events?from=2026-02-30&userId=nobody&pageSize=1000');
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['from', 'pageSize', 'userId']);
    const backwards = await admin.get('/api/audit/events?from=2026-03-04&to=2026-03-03');
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields).toHaveProperty('to');
  });
});
