import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot, signIn, useServerAndBrowser, watchConsole } from '../support/e2e';
import { waitForMail } from '../support/smtp-harness';

const env = useServerAndBrowser();
const viewport = { width: 1280, height: 800 };
const tag = randomUUID().slice(0, 6);
const athleteName = `Maelis Trevannion${tag}`;
const athleteEmail = `e2e-rights-${tag}@example.org`;

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

const minutesAgo = (m: number) => new Date(Date.now() - m * 60_000).toISOString();
const pdf = Buffer.from('%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[]/Count 0>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n');

describe('data rights, e-mail opt-out and invitations in Chromium at 1280×800', () => {
  let athleteId: string;

  it('the athlete stops e-mails from the link without signing in; the therapist sees it and files a signed consent form', async () => {
    const therapist = await env.browser.newPage({ viewport });
    const errors = watchConsole(therapist);
    await signIn(therapist, env.server.baseUrl, 'therapist@mendstep.test');
    await therapist.waitForURL('**/today');
    const { athlete } = await api<{ athlete: { id: string } }>(therapist, 'POST', '/api/athletes', {
      name: athleteName,
      yearOfBirth: 1998,
      sport: 'Rugby',
      email: athleteEmail,
      consentToTreatment: true,
    });
    athleteId = athlete.id;
    const { injury } = await api<{ injury: { id: string } }>(therapist, 'POST', '/api/injuries', {
      athleteId,
      region: 'anterior-thigh',
      side: 'left',
      mechanismKind: 'knee-to-thigh',
      injuredAt: minutesAgo(300),
    });
    const clear = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };
    const { run } = await api<{ run: { id: string } }>(therapist, 'POST', '/api/runs', { injuryId: injury.id, screening: clear });
    const steps = [
      { type: 'step-completed', at: minutesAgo(6), seq: 1, stepIndex: 0, kind: 'cold-pack', plannedSeconds: 1200, actualSeconds: 1200 },
      { type: 'step-completed', at: minutesAgo(4), seq: 2, stepIndex: 1, kind: 'compression-wrap', plannedSeconds: 180, actualSeconds: 180 },
      { type: 'step-completed', at: minutesAgo(1), seq: 3, stepIndex: 2, kind: 'rest-recheck', plannedSeconds: 300, actualSeconds: 300 },
      { type: 'run-completed', at: minutesAgo(1), seq: 4 },
    ];
    for (const entry of steps) await api(therapist, 'POST', `/api/runs/${run.id}/log`, entry, { 'Idempotency-Key': randomUUID() });

    const [message] = await waitForMail(athleteEmail);
    const link = /https?:\/\/[^/\s]+(\/opt-out\?token=[A-Za-z0-9_-]{43})/.exec(message.text ?? '')![1];
    // A fresh browser profile: the athlete has no account and no session.
    const visitor = await env.browser.newContext({ viewport });
    const athletePage = await visitor.newPage();
    await athletePage.goto(`${env.server.baseUrl}${link}`);
    await athletePage.getByRole('button', { name: 'Stop e-mails' }).waitFor();
    await screenshot(athletePage, 'data-rights-opt-out-confirm');
    await athletePage.getByRole('button', { name: 'Stop e-mails' }).click();
    await athletePage.getByText('You will get no more e-mails').waitFor();
    await screenshot(athletePage, 'data-rights-opt-out-done');
    await visitor.close();

    await therapist.goto(`${env.server.baseUrl}/athletes/${athleteId}`);
    await therapist.getByTestId('email-opted-out').waitFor();
    expect(await therapist.getByTestId('email-opted-out').innerText()).toMatch(/^No e-mails \(opted out on \d{1,2} \w{3} \d{4}\)/);
    await therapist.getByLabel(/Signed consent form \(PDF\)/).setInputFiles({ name: 'signed-consent.pdf', mimeType: 'application/pdf', buffer: pdf });
    await therapist.getByRole('button', { name: 'Add form' }).click();
    const download = therapist.getByRole('link', { name: 'Download signed-consent.pdf' });
    await download.waitFor();
    expect(await download.getAttribute('href')).toMatch(/^\/api\/uploads\/[0-9a-f-]{36}$/);
    await screenshot(therapist, 'data-rights-athlete-page');
    // The sign-in page asks who is signed in before anyone is: that 401 is expected.
    expect(errors.filter((e) => !e.includes('401'))).toEqual([]);
    await therapist.close();
  });

  it('an admin invites a colleague, resends the invitation, then exports and erases the athlete from the data-rights screen', async () => {
    const admin = await env.browser.newPage({ viewport, acceptDownloads: true });
    const errors = watchConsole(admin);
    await signIn(admin, env.server.baseUrl, 'admin@mendstep.test');
    await admin.waitForURL('**/staff');
    await admin.getByRole('button', { name: 'Invite a colleague' }).click();
    const invitee = `e2e-invitee-${tag}@example.org`;
    await admin.getByLabel('Name', { exact: true }).fill(`Ines Karlsbakk${tag}`);
    await admin.getByLabel('E-mail', { exact: true }).fill(invitee);
    await admin.getByLabel('Role', { exact: true }).selectOption('supervisor');
    await admin.getByRole('button', { name: 'Send invitation' }).click();
    await admin.getByText('Invitation sent').waitFor();
    const row = admin.getByRole('row', { name: new RegExp(`Ines Karlsbakk${tag}`) });
    await expect(row.getByText('Invited', { exact: true }).isVisible()).resolves.toBe(true);
    await row.getByRole('button', { name: /Resend the invitation/ }).click();
    await admin.getByText('New invitation sent').waitFor();
    await waitForMail(invitee, 2);
    await screenshot(admin, 'data-rights-staff-invited');

    await admin.getByRole('link', { name: 'Data rights' }).click();
    await admin.waitForURL('**/data-rights');
    await admin.getByLabel('Athlete’s name').fill(`Trevannion${tag}`);
    const athleteRow = admin.getByRole('row', { name: new RegExp(athleteName) });
    await athleteRow.waitFor();
    const [zip] = await Promise.all([admin.waitForEvent('download'), athleteRow.getByRole('link', { name: /Export the data/ }).click()]);
    expect(zip.suggestedFilename()).toMatch(/^mendstep-athlete-[0-9a-f]{8}-\d{4}-\d{2}-\d{2}\.zip$/);
    const saved = await zip.path();
    // PK\x03\x04: a zip's first local file header.
    expect(fs.readFileSync(saved!).subarray(0, 4).toString('hex')).toBe('504b0304');

    await athleteRow.getByRole('button', { name: /Erase the personal data/ }).click();
    const erase = admin.getByRole('button', { name: 'Erase personal data' });
    expect(await erase.isDisabled()).toBe(true);
    await admin.getByLabel(/Type the athlete’s name to confirm/).fill(athleteName);
    await screenshot(admin, 'data-rights-erase-confirm');
    await erase.click();
    await admin.getByRole('status').filter({ hasText: `Personal data of ${athleteName} erased` }).waitFor();
    // The name searched for is gone from the clinic's records.
    await admin.getByText('No athlete of your clinic has a name like that.').waitFor();
    await screenshot(admin, 'data-rights-erased');
    expect(errors.filter((e) => !e.includes('401'))).toEqual([]);
    await admin.close();
  });
});
