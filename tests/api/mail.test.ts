import { randomUUID } from 'node:crypto';
import { DateTime } from 'luxon';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { coldSchedule } from '../../shared/clinical/cold-schedule';
import { createApp } from '../../server/app';
import { assertDeployable, loadConfig } from '../../server/config';
import { isPermanentFailure, retryDelayMs } from '../../server/mail/outbox-worker';
import { Injury, OutboundEmail } from '../../server/models';
import { settleBackgroundMail } from '../../server/services/mail-outbox-service';
import { createClinic, createStaff, signedInAgent } from '../support/api-app';
import { buildMailTestApp, outboxFor, receivedFor, waitFor, waitForMail } from '../support/smtp-harness';
import { readIcs } from '../support/smtp-ics';

const APP_URL = 'https://mendstep.example.test';
const { app, mail } = buildMailTestApp({ APP_URL });

let clinic: Awaited<ReturnType<typeof createClinic>>;
let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
let supervisors: { id: string; email: string }[];
let inactiveSupervisor: string;

const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };
const zone = 'Europe/London';

/** Today at a fixed London clock time, so the rest-of-day schedule is the same whenever the suite runs. */
const todayAt = (hhmm: string) => {
  const [hour, minute] = hhmm.split(':').map(Number);
  return DateTime.now().setZone(zone).set({ hour, minute, second: 0, millisecond: 0 }).toUTC().toISO()!;
};

beforeAll(async () => {
  clinic = await createClinic();
  therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist')).email);
  admin = await signedInAgent(app, (await createStaff(clinic.id, 'admin')).email);
  supervisors = [await createStaff(clinic.id, 'supervisor', { name: 'Sol Aranda' }), await createStaff(clinic.id, 'supervisor', { name: 'Bea Lund' })];
  inactiveSupervisor = (await createStaff(clinic.id, 'supervisor', { active: false })).email;
});

async function acuteInjury(athlete: Record<string, unknown> = {}) {
  const email = `athlete-${randomUUID()}@example.test`;
  const created = (
    await therapist.post('/api/athletes').send({ name: 'Rhiannon Vale', yearOfBirth: 1999, sport: 'Rugby', email, consentToTreatment: true, ...athlete })
  ).body.athlete;
  const injuredAt = DateTime.fromISO(todayAt('09:00')).minus({ hours: 10 }).toISO()!;
  const injury = (
    await therapist.post('/api/injuries').send({ athleteId: created.id, region: 'anterior-thigh', side: 'left', mechanismKind: 'knee-to-thigh', injuredAt })
  ).body.injury;
  return { athleteEmail: email, injury };
}

const entry = (type: string, at: string, over: Record<string, unknown> = {}) => ({ type, at, ...over });

async function log(runId: string, body: object) {
  const res = await therapist.post(`/api/runs/${runId}/log`).set('Idempotency-Key', randomUUID()).send(body);
  expect(res.status).toBe(201);
}

/** The default acute sequence: 20-minute cold pack, wrap, rest and re-check; completed at 10:00 London time. */
async function completeAcuteRun(injuryId: string, beforeLogging?: () => Promise<unknown>) {
  const run = (await therapist.post('/api/runs').send({ injuryId, screening: clear })).body.run;
  expect(run.phase).toBe('acute');
  await beforeLogging?.();
  await log(run.id, entry('step-completed', todayAt('09:52'), { seq: 1, stepIndex: 0, kind: 'cold-pack', plannedSeconds: 1200, actualSeconds: 1200 }));
  await log(run.id, entry('step-completed', todayAt('09:55'), { seq: 2, stepIndex: 1, kind: 'compression-wrap', plannedSeconds: 180, actualSeconds: 180 }));
  await log(run.id, entry('step-completed', todayAt('10:00'), { seq: 3, stepIndex: 2, kind: 'rest-recheck', plannedSeconds: 300, actualSeconds: 300 }));
  await log(run.id, entry('run-completed', todayAt('10:00'), { seq: 4 }));
  return run;
}

describe('home-care plan after a run', () => {
  it('after an acute run completes, the athlete receives the rest of the day’s cold schedule, wrap care and warning signs, with a valid .ics', async () => {
    const { athleteEmail, injury } = await acuteInjury();
    const run = await completeAcuteRun(injury.id);
    const [message] = await waitForMail(athleteEmail);

    // Cold 20 minutes of each hour while awake (common practice): the first home session comes 40 minutes after the
    // run's cold pack ended at 09:52, then every hour while the clinic's waking hours (07:00–22:00) last.
    const expected = coldSchedule({ start: todayAt('10:32'), timeZone: zone, wakingHours: { start: '07:00', end: '22:00' }, protocol: 'twenty-each-hour' });
    expect(expected.sessions[0].startsAt.slice(11, 16)).toBe('10:32');

    expect(message.subject).toContain(clinic.name);
    expect(message.text).toContain('10:32 to 10:52  cold, 20 minutes');
    expect(message.text).toContain('no bandage in bed');
    expect(message.text).toContain('pins and needles');
    // The injury's next re-check (set when the run finished) is named in the clinic's time.
    const recheck = (await Injury.findByPk(injury.id))!.nextRecheckAt;
    expect(recheck).toBeInstanceOf(Date);
    const recheckLocal = DateTime.fromJSDate(recheck!, { zone }).setLocale('en-GB');
    expect(message.text).toContain(`Your next re-check: ${recheckLocal.toFormat('cccc d LLLL')} at ${recheckLocal.toFormat('HH:mm')}.`);
    expect(message.text).toContain('does not replace');
    expect(message.html).toBeTruthy();
    const html = message.html as string;
    expect(html).not.toMatch(/<img/i);
    // No tracking: the one link is the athlete's opt-out page.
    const links = [...html.matchAll(/https?:\/\/[^"\s)<]+/gi)].map((m) => m[0]);
    expect(links.length).toBeGreaterThan(0);
    expect(links.every((link) => link.startsWith(`${APP_URL}/opt-out?token=`))).toBe(true);

    const calendar = message.attachments.find((a) => a.filename === 'cold-reminders.ics');
    expect(calendar?.contentType).toBe('text/calendar');
    const ics = readIcs(calendar!.content.toString('utf8'));
    // RFC 5545: VCALENDAR with VERSION:2.0 and PRODID (§3.7.3, §3.7.4); each VEVENT has UID and DTSTAMP (§3.6.1),
    // and DTSTART with DTEND or DURATION.
    expect(ics.version).toBe('2.0');
    expect(ics.prodid).toBeTruthy();
    expect(ics.events.map((e) => [e.start.toISOString(), e.durationSeconds])).toEqual(
      expected.sessions.map((s) => [new Date(s.startsAt).toISOString(), s.minutes * 60]),
    );
    for (const e of ics.events) {
      expect(e.uid).toContain(run.id);
      expect(e.dtstamp).toBeTruthy();
      expect(e.hasEndOrDuration).toBe(true);
      expect(e.alarms[0].action).toBe('DISPLAY');
    }
  });

  it('an athlete without consent, or without an e-mail address, gets nothing', async () => {
    // A run needs consent to start, so this consent is withdrawn while the run is under way.
    const noConsent = await acuteInjury();
    await completeAcuteRun(noConsent.injury.id, () => therapist.patch(`/api/athletes/${noConsent.injury.athleteId}`).send({ consentToTreatment: false }).expect(200));
    const noAddress = await acuteInjury({ email: null });
    await completeAcuteRun(noAddress.injury.id);
    await settleBackgroundMail();
    expect(await outboxFor(noConsent.athleteEmail)).toEqual([]);
    expect(await receivedFor(noConsent.athleteEmail)).toEqual([]);
  });
});

describe('supervisor alerts', () => {
  it('a run that falls back to cold alerts every active supervisor once, with a link to the run', async () => {
    const { injury } = await acuteInjury();
    const run = (await therapist.post('/api/runs').send({ injuryId: injury.id, screening: clear })).body.run;
    await log(run.id, entry('step-interrupted', todayAt('09:40'), { seq: 1, stepIndex: 1, kind: 'compression-wrap', plannedSeconds: 180, actualSeconds: 60 }));
    await log(run.id, entry('swelling-check', todayAt('09:40'), { seq: 2, detail: 'increased' }));
    await log(run.id, entry('run-fell-back', todayAt('10:00'), { seq: 3, reason: 'swelling increased', detail: 'back to cold after compression wrap' }));

    for (const supervisor of supervisors) {
      const [alert] = await waitForMail(supervisor.email);
      expect(alert.subject).toContain('Back to cold');
      expect(alert.subject).toContain('Rhiannon Vale');
      expect(alert.text).toContain(`${APP_URL}/review/runs/${run.id}`);
      expect(alert.html as string).toContain(`href="${APP_URL}/review/runs/${run.id}"`);
    }
    await settleBackgroundMail();
    expect(await outboxFor(inactiveSupervisor)).toEqual([]);
    // A fall back is not the end of home care: the athlete still gets the plan.
    expect(await OutboundEmail.count({ where: { kind: 'home-care', dedupeKey: `home-care:${run.id}` } })).toBe(1);
    expect(await OutboundEmail.count({ where: { kind: 'run-alert', dedupeKey: `run-alert:${run.id}:${supervisors[0].id}` } })).toBe(1);
  });

  it('a red flag at screening alerts the supervisors with the flag named', async () => {
    const { injury, athleteEmail } = await acuteInjury();
    const res = await therapist.post('/api/runs').send({ injuryId: injury.id, screening: { ...clear, redFlags: ['numbness-or-cold-pale-limb'] } });
    expect(res.body.run.status).toBe('stopped-referred');
    const alerts = await waitFor(async () => {
      const found = await outboxFor(supervisors[1].email);
      const mine = found.filter((m) => m.dedupeKey?.startsWith(`run-alert:${res.body.run.id}`));
      return mine.length ? mine : null;
    }, { what: 'the red-flag alert' });
    expect(alerts[0].subject).toContain('Stop and refer');
    expect(alerts[0].text).toContain('Numbness, pins and needles, or a cold, pale limb');
    expect(alerts[0].text).toContain('at screening');
    await settleBackgroundMail();
    expect(await outboxFor(athleteEmail)).toEqual([]);
  });
});

describe('the outbox', () => {
  it('with the SMTP server down, a message waits in the outbox, is retried, and goes out exactly once when the server returns', async () => {
    const fake = mail.fakeServer!;
    await fake.stop();
    const email = `invitee-${randomUUID()}@example.test`;
    try {
      const res = await admin.post('/api/staff/invitations').send({ name: 'Ada Morrow', email, role: 'therapist' });
      expect(res.status).toBe(201);
      // Several attempts fail while the server is away; the message stays pending with the reason.
      const waiting = await waitFor(async () => {
        const [row] = await outboxFor(email);
        return row && row.attempts >= 2 ? row : null;
      }, { what: 'two failed attempts' });
      expect(waiting.status).toBe('pending');
      expect(waiting.lastError).toMatch(/ECONNECTION|ECONNREFUSED/);
      expect(await receivedFor(email)).toEqual([]);
    } finally {
      await fake.start();
    }
    const [delivered] = await waitForMail(email);
    expect(delivered.subject).toContain('invited');
    const [row] = await waitFor(async () => {
      const rows = await outboxFor(email);
      return rows[0]?.status === 'sent' ? rows : null;
    }, { what: 'the row marked sent' });
    expect(row.sentAt).toBeInstanceOf(Date);
    // Sweeping again (as every process does) sends nothing twice.
    await mail.worker.run('all');
    await mail.worker.run('all');
    expect(await receivedFor(email)).toHaveLength(1);
  });

  it('two workers sweeping the same due messages at once send each exactly once (FOR UPDATE SKIP LOCKED)', async () => {
    const fake = mail.fakeServer!;
    await fake.stop();
    const addresses = Array.from({ length: 4 }, () => `burst-${randomUUID()}@example.test`);
    try {
      for (const email of addresses) await admin.post('/api/staff/invitations').send({ name: 'Burst Test', email, role: 'therapist' });
      await waitFor(async () => {
        const rows = await Promise.all(addresses.map(outboxFor));
        return rows.every(([r]) => r && r.attempts >= 1) || null;
      }, { what: 'a failed attempt each' });
      // Make them all due now, so both sweeps below compete for every one of them.
      await OutboundEmail.update({ nextAttemptAt: new Date(Date.now() - 1000) }, { where: { toAddress: addresses } });
    } finally {
      await fake.start();
    }
    const second = createApp(loadConfig({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', MAIL_POLL_SECONDS: '0' }));
    try {
      await Promise.all([mail.worker.run('all'), second.mail.worker.run('all')]);
      for (const email of addresses) {
        await waitForMail(email);
        expect(await receivedFor(email)).toHaveLength(1);
      }
    } finally {
      await second.mail.stop();
      await second.pool.end();
    }
  });
});

describe('the mailbox (outside production)', () => {
  it('shows an admin the messages of their own clinic, with text, HTML and attachments', async () => {
    const { athleteEmail, injury } = await acuteInjury();
    await completeAcuteRun(injury.id);
    await waitForMail(athleteEmail);
    const list = await admin.get(`/api/mailbox?to=${encodeURIComponent(athleteEmail)}`);
    expect(list.status).toBe(200);
    expect(list.body.items).toHaveLength(1);
    const item = list.body.items[0];
    expect(item.to).toEqual([athleteEmail]);
    const detail = await admin.get(`/api/mailbox/${item.id}`);
    expect(detail.body.message.text).toContain('COLD FOR THE REST OF TODAY');
    expect(detail.body.message.html).toContain('<table');
    expect(detail.body.message.attachments).toEqual([expect.objectContaining({ index: 0, filename: 'cold-reminders.ics', contentType: 'text/calendar' })]);
    const ics = await admin.get(`/api/mailbox/${item.id}/attachments/0`);
    expect(ics.status).toBe(200);
    expect(readIcs(ics.text).events.length).toBeGreaterThan(0);
  });

  it('shows another clinic’s admin none of them, refuses other roles, and does not exist in production', async () => {
    const other = await createClinic();
    const otherAdmin = await signedInAgent(app, (await createStaff(other.id, 'admin')).email);
    const mine = (await admin.get('/api/mailbox')).body.items;
    expect(mine.length).toBeGreaterThan(0);
    expect((await otherAdmin.get('/api/mailbox')).body.items).toEqual([]);
    expect((await otherAdmin.get(`/api/mailbox/${mine[0].id}`)).status).toBe(404);
    expect((await therapist.get('/api/mailbox')).status).toBe(403);
    expect((await request(app).get('/api/mailbox')).status).toBe(401);

    const production = createApp(loadConfig({ ...process.env, NODE_ENV: 'production', SESSION_SECRET: 'a-production-secret-for-tests', LOG_LEVEL: 'silent', SMTP_HOST: '127.0.0.1', SMTP_PORT: '9', MAIL_POLL_SECONDS: '0' }));
    try {
      expect(production.mail.fakeServer).toBeNull();
      const res = await request(production.app).get('/api/mailbox');
      expect(res.status).toBe(404);
    } finally {
      await production.mail.stop();
      await production.pool.end();
    }
  });
});

describe('mail configuration and retry rules', () => {
  const production = { ...process.env, NODE_ENV: 'production', SESSION_SECRET: 'a-production-secret-for-tests' };

  it('refuses to serve in production without an SMTP host and an APP_URL, and never runs the local server there', () => {
    expect(() => assertDeployable(loadConfig(production))).toThrow('SMTP_HOST and APP_URL must be set in production');
    expect(() => assertDeployable(loadConfig({ ...production, SMTP_HOST: 'smtp.example.org', APP_URL: 'https://mendstep.example.org' }))).not.toThrow();
    expect(() => loadConfig({ ...production, MAIL_FAKE: '1' })).toThrow(/MAIL_FAKE/);
    expect(loadConfig({ ...production, SMTP_HOST: 'smtp.example.org' }).mail).toMatchObject({ fakeServer: false, smtpPort: 587 });
    expect(loadConfig({ ...process.env, NODE_ENV: 'development' }).mail).toMatchObject({ fakeServer: true, smtpPort: 2525 });
  });

  it('backs off 30 s, 60 s, 120 s … up to 15 minutes', () => {
    expect([1, 2, 3, 10].map((n) => retryDelayMs(n, 30))).toEqual([30_000, 60_000, 120_000, 900_000]);
  });

  it('gives up at once only when the server refuses the recipient or the message, not on a refused login or an outage', () => {
    const error = (over: object) => Object.assign(new Error('refused'), over);
    expect(isPermanentFailure(error({ code: 'EENVELOPE', command: 'RCPT TO', responseCode: 550 }))).toBe(true);
    expect(isPermanentFailure(error({ code: 'EMESSAGE', command: 'DATA', responseCode: 552 }))).toBe(true);
    expect(isPermanentFailure(error({ code: 'EAUTH', command: 'AUTH PLAIN', responseCode: 535 }))).toBe(false);
    expect(isPermanentFailure(error({ code: 'EENVELOPE', command: 'RCPT TO', responseCode: 451 }))).toBe(false);
    expect(isPermanentFailure(error({ code: 'ECONNECTION', command: 'CONN' }))).toBe(false);
  });
});
