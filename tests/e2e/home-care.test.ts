import { randomUUID } from 'node:crypto';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { coldSchedule } from '../../shared/clinical/cold-schedule';
import { screenshot, signIn, useServerAndBrowser, watchConsole } from '../support/e2e';
import { waitForMail } from '../support/smtp-harness';
import { readIcs } from '../support/smtp-ics';

const env = useServerAndBrowser();

/** Calls the API from inside the signed-in page, with the CSRF token, as the app itself does. */
async function api<T>(page: Page, method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<T> {
  return page.evaluate(
    async ({ method, path, body, headers }) => {
      const token = (await (await fetch('/api/auth/csrf')).json()).token;
      const res = await fetch(path, { method, headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token, ...headers }, body: body ? JSON.stringify(body) : undefined });
      return res.json();
    },
    { method, path, body, headers },
  ) as Promise<T>;
}

// The demo clinic's zone; fixed clock times keep the rest-of-day schedule the same whenever the suite runs.
const zone = 'Europe/London';
const todayAt = (hhmm: string) => {
  const [hour, minute] = hhmm.split(':').map(Number);
  return DateTime.now().setZone(zone).set({ hour, minute, second: 0, millisecond: 0 }).toUTC().toISO()!;
};
const linkPath = (text: string | undefined) => /https?:\/\/[^/\s]+(\/set-password\?token=[A-Za-z0-9_-]{43})/.exec(text ?? '')![1];

const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

describe('e-mail and photos in Chromium at 1280×800', () => {
  it('after an acute run completes, the home-care plan with a valid .ics is in the mailbox, and the admin reads it on /mailbox', async () => {
    const therapist = await env.browser.newPage({ viewport: { width: 1280, height: 800 } });
    const errors = watchConsole(therapist);
    await signIn(therapist, env.server.baseUrl, 'therapist@mendstep.test');
    await therapist.waitForURL('**/today');

    const email = `e2e-${randomUUID().slice(0, 8)}@example.org`;
    const { athlete } = await api<{ athlete: { id: string } }>(therapist, 'POST', '/api/athletes', {
      name: 'Orla Penhallow',
      yearOfBirth: 2000,
      sport: 'Football',
      email,
      consentToTreatment: true,
    });
    const injuredAt = DateTime.fromISO(todayAt('09:00')).minus({ hours: 12 }).toISO();
    const { injury } = await api<{ injury: { id: string } }>(therapist, 'POST', '/api/injuries', {
      athleteId: athlete.id,
      region: 'anterior-thigh',
      side: 'right',
      mechanismKind: 'knee-to-thigh',
      injuredAt,
    });
    const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };
    const { run } = await api<{ run: { id: string; phase: string } }>(therapist, 'POST', '/api/runs', { injuryId: injury.id, screening: clear });
    expect(run.phase).toBe('acute');
    // The demo acute sequence, as table mode logs it: cold pack, wrap, rest and re-check, then the end.
    const steps = [
      { type: 'step-completed', seq: 1, stepIndex: 0, kind: 'cold-pack', plannedSeconds: 1200, actualSeconds: 1200, at: todayAt('09:52') },
      { type: 'step-completed', seq: 2, stepIndex: 1, kind: 'compression-wrap', plannedSeconds: 180, actualSeconds: 180, at: todayAt('09:55') },
      { type: 'step-completed', seq: 3, stepIndex: 2, kind: 'rest-recheck', plannedSeconds: 300, actualSeconds: 300, at: todayAt('10:00') },
      { type: 'run-completed', seq: 4, at: todayAt('10:00') },
    ];
    for (const step of steps) await api(therapist, 'POST', `/api/runs/${run.id}/log`, step, { 'Idempotency-Key': randomUUID() });

    const [message] = await waitForMail(email);
    const calendar = message.attachments.find((a) => a.filename === 'cold-reminders.ics')!;
    const ics = readIcs(calendar.content.toString('utf8'));
    // RFC 5545: VERSION:2.0 and PRODID on the VCALENDAR; UID, DTSTAMP, DTSTART and DURATION on each VEVENT.
    expect(ics.version).toBe('2.0');
    expect(ics.prodid).toBeTruthy();
    // Cold 20 minutes of each hour (common practice), from 40 minutes after the run's cold pack ended (09:52).
    const expected = coldSchedule({ start: todayAt('10:32'), timeZone: zone, wakingHours: { start: '07:00', end: '22:00' }, protocol: 'twenty-each-hour' });
    expect(ics.events.map((e) => [e.start.toISOString(), e.durationSeconds])).toEqual(expected.sessions.map((s) => [new Date(s.startsAt).toISOString(), s.minutes * 60]));
    expect(ics.events.every((e) => e.uid && e.dtstamp && e.hasEndOrDuration)).toBe(true);

    // A photo of the bruise on the injury page, under its measurement's date.
    await api(therapist, 'POST', `/api/injuries/${injury.id}/measurements`, { takenAt: new Date(Date.now() - 60_000).toISOString(), painNprs: 5, bruiseLengthCm: 8, bruiseWidthCm: 5 });
    await therapist.goto(`${env.server.baseUrl}/injuries/${injury.id}`);
    await therapist.getByLabel(/^Photo \(JPEG/).setInputFiles({ name: 'bruise.png', mimeType: 'image/png', buffer: png });
    await therapist.getByRole('button', { name: 'Add photo' }).click();
    await therapist.getByRole('status').getByText(/Photo added/).waitFor();
    const image = therapist.getByTestId('photo-strip').getByRole('img');
    await image.waitFor();
    expect(await image.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(1);
    // A PDF renamed as a photo is refused with the reason.
    await therapist.getByLabel(/^Photo \(JPEG/).setInputFiles({ name: 'bruise.jpg', mimeType: 'image/jpeg', buffer: Buffer.from('%PDF-1.4\n%%EOF\n') });
    await therapist.getByRole('button', { name: 'Add photo' }).click();
    await therapist.getByText(/this file is a PDF document/).waitFor();
    await therapist.getByRole('region', { name: 'Bruise photos' }).scrollIntoViewIfNeeded();
    await screenshot(therapist, 'injury-photos');
    await therapist.close();

    const admin = await env.browser.newPage({ viewport: { width: 1280, height: 800 } });
    errors.push(...watchConsole(admin));
    await signIn(admin, env.server.baseUrl, 'admin@mendstep.test');
    await admin.waitForURL('**/staff');
    await admin.getByRole('link', { name: 'Mailbox' }).click();
    await admin.waitForURL('**/mailbox');
    await admin.getByRole('button', { name: new RegExp(`To ${email}`) }).click();
    const view = admin.getByRole('article', { name: 'Message' });
    await view.getByText('COLD FOR THE REST OF TODAY', { exact: false }).first().waitFor();
    await expect(view.getByRole('link', { name: 'cold-reminders.ics' }).count()).resolves.toBe(1);
    const frame = admin.frameLocator('iframe[title="HTML version of the message"]');
    await frame.getByText('10:32 to 10:52').waitFor();
    await screenshot(admin, 'mailbox-home-care');
    await admin.close();
    // The 401 before sign-in and the refused upload's 400 are expected answers; anything else (a CSP report, a
    // script error) is not.
    expect(errors.filter((e) => !/status of (401|400)/.test(e))).toEqual([]);
  });

  it('an invited colleague sets a password from the e-mailed link, and a forgotten password is reset from the sign-in page', async () => {
    const admin = await env.browser.newPage({ viewport: { width: 1280, height: 800 } });
    await signIn(admin, env.server.baseUrl, 'admin@mendstep.test');
    await admin.waitForURL('**/staff');
    const email = `invited-${randomUUID().slice(0, 8)}@example.org`;
    const invited = await api<{ member: { active: boolean } }>(admin, 'POST', '/api/staff/invitations', { name: 'Keir Ashdown', email, role: 'therapist' });
    expect(invited.member.active).toBe(false);
    await admin.close();

    const [invitation] = await waitForMail(email);
    const visitor = await env.browser.newPage({ viewport: { width: 1280, height: 800 } });
    await visitor.goto(`${env.server.baseUrl}${linkPath(invitation.text)}`);
    await visitor.getByText('Welcome, Keir Ashdown.').waitFor();
    await visitor.getByLabel('New password', { exact: true }).fill('short');
    await visitor.getByLabel('New password again').fill('different');
    await visitor.getByRole('button', { name: 'Set password' }).click();
    await visitor.getByText('Use at least 12 characters.').waitFor();
    await visitor.getByText('The two passwords are not the same.').waitFor();
    await screenshot(visitor, 'set-password-invitation');
    await visitor.getByLabel('New password', { exact: true }).fill('copper-tide-lantern');
    await visitor.getByLabel('New password again').fill('copper-tide-lantern');
    await visitor.getByRole('button', { name: 'Set password' }).click();
    await visitor.getByRole('link', { name: 'Sign in' }).click();
    await signIn(visitor, env.server.baseUrl, email, 'copper-tide-lantern');
    await visitor.waitForURL('**/today');
    await visitor.getByRole('button', { name: 'Sign out' }).click();
    await visitor.waitForURL('**/sign-in');

    await visitor.getByRole('link', { name: 'Forgot your password?' }).click();
    await visitor.getByLabel('E-mail').fill(email);
    await visitor.getByRole('button', { name: 'Send me a reset link' }).click();
    await visitor.getByText('Check your e-mail').waitFor();
    await screenshot(visitor, 'forgot-password-sent');
    const [, reset] = await waitForMail(email, 2);
    expect(reset.subject).toBe('Reset your Mendstep password');
    await visitor.goto(`${env.server.baseUrl}${linkPath(reset.text)}`);
    await visitor.getByLabel('New password', { exact: true }).fill('harbour-moss-evening');
    await visitor.getByLabel('New password again').fill('harbour-moss-evening');
    await visitor.getByRole('button', { name: 'Set password' }).click();
    await visitor.getByText('Password set').waitFor();
    // The link is used up.
    await visitor.reload();
    await visitor.getByText('This link cannot be used').waitFor();
    await signIn(visitor, env.server.baseUrl, email, 'harbour-moss-evening');
    await visitor.waitForURL('**/today');
    await visitor.close();
  });
});
