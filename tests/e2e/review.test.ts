import { describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { v4 as uuid } from 'uuid';
import { screenshot, signIn, useServerAndBrowser, watchConsole } from '../support/e2e';

const env = useServerAndBrowser();

/** Calls the API from inside the signed-in page, with the CSRF token, as the app itself does. */
async function api<T>(page: Page, method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<{ status: number; body: T }> {
  return page.evaluate(
    async ({ method, path, body, headers }) => {
      const token = (await (await fetch('/api/auth/csrf')).json()).token;
      const res = await fetch(path, { method, headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token, ...headers }, body: body ? JSON.stringify(body) : undefined });
      return { status: res.status, body: await res.json() };
    },
    { method, path, body, headers },
  ) as Promise<{ status: number; body: T }>;
}

async function signedIn(email: string, home: string): Promise<{ context: BrowserContext; page: Page }> {
  const context = await env.browser.newContext({ viewport: { width: 1280, height: 800 } });
  const page = await context.newPage();
  await signIn(page, env.server.baseUrl, email);
  await page.waitForURL(`**${home}`);
  return { context, page };
}

/**
 * A proliferative run that fell back to cold, logged as table mode logs one, with a submitted note: made here
 * by the demo therapist so the test owns the note it signs and can run again on the same database.
 */
async function fellBackRunWithSubmittedNote(page: Page, athleteName: string) {
  const ok = <T>(reply: { status: number; body: T }) => {
    expect(reply.status, JSON.stringify(reply.body)).toBeLessThan(300);
    return reply.body;
  };
  const minutesAgo = (m: number) => new Date(Date.now() - m * 60_000).toISOString();
  const { athlete } = ok(await api<{ athlete: { id: string } }>(page, 'POST', '/api/athletes', { name: athleteName, yearOfBirth: 2001, sport: 'Rugby', consentToTreatment: true }));
  const { injury } = ok(
    await api<{ injury: { id: string } }>(page, 'POST', '/api/injuries', {
      athleteId: athlete.id,
      region: 'anterior-thigh',
      side: 'right',
      mechanismKind: 'knee-to-thigh',
      injuredAt: new Date(Date.now() - 10 * 86_400_000).toISOString(),
    }),
  );
  const measure = (takenAt: string, girthInjuredCm: number, painNprs: number) =>
    api(page, 'POST', `/api/injuries/${injury.id}/measurements`, { takenAt, girthInjuredCm, girthOtherCm: 52, girthLandmark: 'anteromedial knee joint line', girthDistanceCm: 20, kneeFlexionDeg: 100, painNprs });
  ok(await measure(minutesAgo(50), 54.5, 4));
  const screening = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };
  const { run } = ok(await api<{ run: { id: string } }>(page, 'POST', '/api/runs', { injuryId: injury.id, screening }));

  const start = Date.now() - 45 * 60_000;
  const at = (s: number) => new Date(start + s * 1000).toISOString();
  const entries = [
    { type: 'step-completed', stepIndex: 0, kind: 'ice-massage', plannedSeconds: 360, actualSeconds: 365, at: at(365) },
    { type: 'step-interrupted', stepIndex: 1, kind: 'light-strokes', plannedSeconds: 300, actualSeconds: 120, at: at(485) },
    { type: 'swelling-check', at: at(486), detail: 'increased' },
    // Back to cold's own steps carry no plan index.
    { type: 'step-completed', kind: 'rest-recheck', plannedSeconds: 600, actualSeconds: 600, at: at(1086) },
    { type: 'step-completed', kind: 'cold-pack', plannedSeconds: 1200, actualSeconds: 1200, at: at(2286) },
    { type: 'step-completed', kind: 'compression-wrap', plannedSeconds: 180, actualSeconds: 190, at: at(2476) },
    { type: 'run-fell-back', at: at(2477), detail: 'swelling increased' },
  ];
  for (const [i, entry] of entries.entries()) ok(await api(page, 'POST', `/api/runs/${run.id}/log`, { ...entry, seq: i + 1 }, { 'Idempotency-Key': uuid() }));
  ok(await measure(minutesAgo(2), 54.9, 5));

  const { note } = ok(await api<{ note: { subjective: string; objective: string; assessment: string; plan: string } }>(page, 'GET', `/api/runs/${run.id}/note`));
  ok(await api(page, 'PUT', `/api/runs/${run.id}/note`, { ...note, plan: `${note.plan}\nRe-check girth tomorrow morning before training.` }));
  ok(await api(page, 'POST', `/api/runs/${run.id}/note/submit`));
  return run.id;
}

describe('the review desk in Chromium at 1280×800', () => {
  it('the supervisor filters to fell-back runs, reads one, signs its note off; the therapist then sees it locked; the CSV has its columns', async () => {
    const therapist = await signedIn('therapist@mendstep.test', '/today');
    const athleteName = `Review Rowe ${Date.now().toString(36)}`;
    const runId = await fellBackRunWithSubmittedNote(therapist.page, athleteName);

    // A therapist is refused the review desk and its API.
    expect((await api(therapist.page, 'GET', '/api/review/runs')).status).toBe(403);

    const { context, page } = await signedIn('supervisor@mendstep.test', '/review');
    const errors = watchConsole(page);
    await page.getByRole('heading', { name: 'Review desk' }).waitFor();
    await page.getByRole('heading', { name: /^Adherence,/ }).waitFor();
    await page.getByRole('row').nth(1).waitFor();
    await screenshot(page, 'review-desk');

    await page.getByLabel('Outcome').selectOption('fell-back');
    await page.waitForURL(/outcome=fell-back/);
    const runsTable = page.getByRole('table', { name: /Runs of your clinic/ });
    // Every row left is a fall back, and says so in words (the previous page stays on screen until the new one arrives).
    await expect
      .poll(async () => {
        const outcomes = await runsTable.locator('tbody tr td:nth-child(5)').allTextContents();
        return outcomes.length > 0 && outcomes.every((text) => /Fell back to cold|Stop, elevate and refer/.test(text));
      })
      .toBe(true);

    // The demo seed's fall back (Idris Mallory's calf, note waiting for sign-off) is on the desk.
    await page.getByLabel('Athlete').selectOption({ label: 'Idris Mallory' });
    const seeded = runsTable.getByRole('row').filter({ hasText: 'Idris Mallory' });
    await seeded.first().waitFor();
    await expect(seeded.first().getByRole('list', { name: 'Needs attention' }).textContent()).resolves.toContain('Fell back');
    await screenshot(page, 'review-desk-fell-back');

    await page.getByLabel('Athlete').selectOption({ label: athleteName });
    await page.waitForURL(/athleteId=/);
    const row = runsTable.getByRole('row').filter({ hasText: athleteName });
    await row.waitFor();
    await expect(row.getByRole('list', { name: 'Needs attention' }).textContent()).resolves.toContain('Fell back');
    await expect(row.textContent()).resolves.toContain('Waiting for sign-off');

    const csvHref = await page.getByRole('link', { name: /Download CSV/ }).getAttribute('href');
    await row.getByRole('link', { name: /Open the run of/ }).click();
    await page.waitForURL(`**/review/runs/${runId}`);

    // The timeline: planned against actual, back-to-cold steps marked, drawn and written out.
    await page.getByRole('heading', { name: /^Run review — / }).waitFor();
    await page.locator('.recharts-surface').first().waitFor();
    const timeline = page.getByRole('table', { name: /Timeline/ });
    const rows = await timeline.locator('tbody tr').allInnerTexts();
    expect(rows[0]).toMatch(/Ice massage[\s\S]*6 min[\s\S]*6 min 5 s[\s\S]*Completed/);
    expect(rows[1]).toMatch(/Light centre-out strokes[\s\S]*5 min[\s\S]*2 min[\s\S]*Interrupted/);
    expect(rows.filter((text) => text.includes('Back to cold'))).toHaveLength(3);
    expect(rows.at(-1)).toMatch(/Not reached/);
    await expect(page.getByRole('region', { name: 'Swelling checks, skips and early end' }).textContent()).resolves.toContain('swelling increased');
    await expect(page.getByRole('region', { name: 'Measurements before and after' }).textContent()).resolves.toMatch(/Girth difference2\.5 cm2\.9 cm\+0\.4 cm[\s\S]*Pain, NPRS4\/105\/10\+1\/10/);

    // The note, as the therapist submitted it.
    const note = page.getByRole('region', { name: /Session note/ });
    await expect(note.getByTestId('note-status').textContent()).resolves.toContain('Submitted — waiting for sign-off');
    await expect(note.textContent()).resolves.toContain('Re-check girth tomorrow morning before training.');
    await screenshot(page, 'review-run');

    await note.getByLabel('Sign-off comment (optional)').fill('Right call to go back to cold. Re-check before training.');
    await note.getByRole('button', { name: 'Sign off the note' }).click();
    await note.getByTestId('note-signed').waitFor();
    await expect(note.getByTestId('note-signed').textContent()).resolves.toMatch(/^Signed by Owen Halloway on \d{1,2} \w{3} \d{4}/);
    expect(await note.getByRole('button', { name: 'Sign off the note' }).count()).toBe(0);
    expect(await note.getByRole('textbox').count()).toBe(0);
    await screenshot(page, 'review-run-signed');

    // The CSV of the filtered runs: a header row of the agreed columns, and the run in it.
    const csv = await context.request.get(`${env.server.baseUrl}${csvHref}`);
    expect(csv.status()).toBe(200);
    expect(csv.headers()['content-type']).toContain('text/csv');
    const text = (await csv.text()).replace(/^\uFEFF/, '');
    const [header, ...lines] = text.trim().split('\r\n');
    expect(header.split(',')).toEqual([
      'run_id', 'date', 'athlete', 'therapist', 'injury', 'phase', 'outcome', 'steps_planned', 'steps_completed', 'steps_skipped', 'swelling_checks', 'ice_massage_seconds', 'note_status', 'signed_by', 'signed_at',
    ]);
    const ours = lines.find((line) => line.startsWith(runId));
    expect(ours).toContain(athleteName);
    expect(ours).toContain('signed');
    expect(errors).toEqual([]);

    // The therapist's summary now shows the note locked, with the sign-off.
    await therapist.page.goto(`${env.server.baseUrl}/runs/${runId}/summary`);
    const own = therapist.page.getByRole('region', { name: /Session note/ });
    await own.getByTestId('note-signed').waitFor();
    await expect(own.getByTestId('note-status').textContent()).resolves.toContain('Signed — locked');
    await expect(own.textContent()).resolves.toContain('Right call to go back to cold.');
    expect(await own.getByRole('textbox').count()).toBe(0);
    await screenshot(therapist.page, 'run-summary-note-locked');

    await context.close();
    await therapist.context.close();
  });

  it("the sequence editor shows each step's bounds and refuses an ice massage outside 5–7 min before saving", async () => {
    const { context, page } = await signedIn('supervisor@mendstep.test', '/review');
    await page.getByRole('link', { name: 'Sequences' }).first().click();
    await page.getByRole('tab', { name: /Proliferative/ }).click();
    const panel = page.getByRole('tabpanel', { name: /Proliferative/ });
    const ice = panel.getByTestId('sequence-step').first();
    await expect(ice.textContent()).resolves.toContain('Allowed 5 min – 7 min');
    // Ice massage 5–7 min at a time: common practice (clinical-sources.md).
    await ice.getByLabel('Minutes').fill('8');
    await ice.getByRole('alert').waitFor();
    await panel.getByRole('button', { name: /Save as version/ }).click();
    await panel.getByText('Ice massage must last between 300 and 420 seconds (5–7 min)').waitFor();
    await screenshot(page, 'sequence-editor-bounds');
    await context.close();
  });
});
