import { describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { screenshot, signIn, useServerAndBrowser } from '../support/e2e';

const env = useServerAndBrowser();

/** Calls the API from inside the signed-in page, with the CSRF token, as the app itself does. */
async function api<T>(page: Page, method: string, path: string, body?: unknown): Promise<T> {
  return page.evaluate(
    async ({ method, path, body }) => {
      const token = (await (await fetch('/api/auth/csrf')).json()).token;
      const res = await fetch(path, { method, headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token }, body: body ? JSON.stringify(body) : undefined });
      return res.json();
    },
    { method, path, body },
  ) as Promise<T>;
}

/** A new athlete with a calf contusion injured `days` ago, so each test has its own proliferative injury. */
async function newInjury(page: Page, name: string, days: number) {
  const { athlete } = await api<{ athlete: { id: string } }>(page, 'POST', '/api/athletes', { name, yearOfBirth: 1999, sport: 'Hockey', consentToTreatment: true });
  const injuredAt = new Date(Date.now() - days * 86_400_000).toISOString();
  const { injury } = await api<{ injury: { id: string } }>(page, 'POST', '/api/injuries', { athleteId: athlete.id, region: 'calf', side: 'left', mechanismKind: 'ball', injuredAt });
  return injury.id;
}

async function openTableMode(page: Page, injuryId: string, fromToday?: string) {
  if (fromToday) {
    // As a therapist would: from the injury's card on Today.
    await page.goto(`${env.server.baseUrl}/today`);
    await page.getByRole('link', { name: new RegExp(`^Start a run for ${fromToday}`) }).click();
  } else {
    await page.goto(`${env.server.baseUrl}/runs/new?injuryId=${injuryId}`);
  }
  await page.waitForURL(/\/runs\/[0-9a-f-]+\/screening$/);
  await page.getByRole('button', { name: 'Save screening and review the plan' }).click();
  await page.getByRole('link', { name: 'Open table mode' }).click();
  await page.waitForURL(/\/table\//);
  await page.getByRole('button', { name: 'Begin' }).click();
  return page.url().split('/table/')[1];
}

async function therapistPage(): Promise<{ context: BrowserContext; page: Page }> {
  const context = await env.browser.newContext({ viewport: { width: 1280, height: 800 } });
  const page = await context.newPage();
  // The page's clock is Playwright's, so minutes of treatment pass in moments without a time scale in the product.
  await page.clock.install();
  await signIn(page, env.server.baseUrl, 'therapist@mendstep.test');
  await page.waitForURL('**/today');
  return { context, page };
}

type Entry = { key: string; type: string; seq: number | null; stepIndex: number | null };

describe('table mode in Chromium at 1280×800', () => {
  it('starts a proliferative run from Today and plays it step to step with cues, resumes the same step after a reload, and falls back to cold on swelling', async () => {
    const { context, page } = await therapistPage();
    // A name of its own, so the card is this test's even on a database other runs have used.
    const name = `Tova Rennick ${Date.now().toString(36)}`;
    const injuryId = await newInjury(page, name, 10);
    const runId = await openTableMode(page, injuryId, name);

    await expect(page.getByTestId('step-label').textContent()).resolves.toBe('Ice massage');
    await screenshot(page, 'table-mode-ice-massage');
    // Default proliferative ice massage: 6 minutes (within the 5–7 minutes of common practice). The last
    // minute passes a second at a time, as it would for real, so the page looks at each second.
    await page.clock.runFor(295_000);
    for (let s = 0; s < 66; s++) await page.clock.runFor(1_000);
    await page.getByTestId('step-label').getByText('Light centre-out strokes').waitFor();
    const cues = await page.evaluate(() => (window.mendstepCueTimings ?? []).map((c) => c.cue));
    expect(cues).toContain('one-minute');
    expect(cues).toContain('final-five');
    expect(cues).toContain('step-end');

    // Halfway into the step, a reload resumes the same step with the right remaining time.
    for (let s = 0; s < 30; s++) await page.clock.runFor(1_000);
    const before = await page.getByTestId('countdown').textContent();
    const clockBefore = await page.evaluate(() => Date.now());
    await page.reload();
    await page.getByTestId('step-label').getByText('Light centre-out strokes').waitFor();
    const after = await page.getByTestId('countdown').textContent();
    // The page's clock moves on during the reload; the remaining time must have moved with it, no more, no less.
    const elapsed = ((await page.evaluate(() => Date.now())) - clockBefore) / 1000;
    const toSeconds = (t: string | null) => Number(t!.split(':')[0]) * 60 + Number(t!.split(':')[1]);
    expect(Math.abs(toSeconds(before) - elapsed - toSeconds(after))).toBeLessThanOrEqual(2);

    const swelling = page.getByRole('button', { name: /Swelling has increased/ });
    await swelling.click();
    await page.getByRole('button', { name: /Tap again to confirm/ }).click();
    await page.getByText('Back to cold', { exact: true }).first().waitFor();
    await screenshot(page, 'table-mode-back-to-cold');

    await page.getByText('All saved').waitFor();
    const detail = await api<{ entries: Entry[]; run: { status: string } }>(page, 'GET', `/api/runs/${runId}`);
    const types = detail.entries.map((e) => e.type);
    expect(types).toEqual(['step-completed', 'step-interrupted', 'swelling-check']);
    expect(new Set(detail.entries.map((e) => e.key)).size).toBe(detail.entries.length);
    await context.close();
  });

  it('going offline mid-run loses nothing: entries wait, then reach the server exactly once', async () => {
    const { context, page } = await therapistPage();
    const injuryId = await newInjury(page, 'Imre Okafor-Dunn', 10);
    const runId = await openTableMode(page, injuryId);

    await context.setOffline(true);
    await page.clock.runFor(360_000 + 1_000); // ice massage completes while offline
    await page.getByRole('button', { name: 'Pause' }).click();
    await page.getByText(/2 waiting to save/).waitFor();
    await screenshot(page, 'table-mode-offline');

    await context.setOffline(false);
    await page.clock.runFor(35_000); // the sender's backoff wait passes
    await page.getByText('All saved').waitFor({ timeout: 20_000 });
    const detail = await api<{ entries: Entry[] }>(page, 'GET', `/api/runs/${runId}`);
    expect(detail.entries.map((e) => e.type)).toEqual(['step-completed', 'paused']);
    expect(detail.entries.map((e) => e.seq)).toEqual([1, 2]);
    await context.close();
  });

  it("a tablet that lost its storage rebuilds the run from the server's log and resumes the same step", async () => {
    const { context, page } = await therapistPage();
    const injuryId = await newInjury(page, `Wren Okoro ${Date.now().toString(36)}`, 10);
    await openTableMode(page, injuryId);
    await page.clock.runFor(360_000 + 1_000);
    await page.getByTestId('step-label').getByText('Light centre-out strokes').waitFor();
    await page.getByText('All saved').waitFor();

    // Leave table mode so nothing holds the database open, then wipe the tablet's storage.
    const tableUrl = page.url();
    await page.goto(`${env.server.baseUrl}/today`);
    const wiped = await page.evaluate(
      () =>
        new Promise<string>((resolve) => {
          const request = indexedDB.deleteDatabase('mendstep-table');
          request.onsuccess = () => resolve('deleted');
          request.onerror = () => resolve('error');
          request.onblocked = () => resolve('blocked');
        }),
    );
    expect(wiped).toBe('deleted');
    await page.goto(tableUrl);
    await page.getByTestId('step-label').getByText('Light centre-out strokes').waitFor();
    expect(await page.getByRole('button', { name: 'Begin' }).count()).toBe(0);
    await context.close();
  });
});

describe('the server decides what a run is', () => {
  it('a run that ended on the server opens as finished, even on the tablet that still holds it mid-step, and cannot be run again', async () => {
    const { context, page } = await therapistPage();
    const name = `Ilse Ward ${Date.now().toString(36)}`;
    const injuryId = await newInjury(page, name, 10);
    const runId = await openTableMode(page, injuryId);
    await expect.poll(() => page.getByRole('button', { name: /Pause/ }).count()).toBeGreaterThan(0);

    // Left mid-run: the run stays in sight on the injury page and on Today, with the step it is on and Resume.
    await page.getByRole('link', { name: 'Leave table mode' }).click();
    await page.getByTestId('runs-in-progress').waitFor();
    expect(await page.getByTestId('runs-in-progress').innerText()).toMatch(/In table mode — no step finished yet/);
    await page.goto(`${env.server.baseUrl}/today`);
    await page.getByRole('link', { name: `Resume the run for ${name}, Calf, Left` }).click();
    await page.waitForURL(new RegExp(`/table/${runId}$`));
    await expect.poll(() => page.getByRole('button', { name: /Pause/ }).count()).toBeGreaterThan(0);

    // Ended elsewhere (another tablet, or the office): the server's record says so; this tablet's snapshot does not know.
    const status = await page.evaluate(async (id) => {
      const token = (await (await fetch('/api/auth/csrf')).json()).token;
      const res = await fetch(`/api/runs/${id}/log`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token, 'Idempotency-Key': crypto.randomUUID() },
        body: JSON.stringify({ seq: 90, type: 'run-ended-early', reason: 'Athlete called away', at: new Date().toISOString() }),
      });
      return res.status;
    }, runId);
    expect(status).toBe(201);

    await page.reload();
    await page.getByTestId('finished-run').waitFor();
    expect(await page.getByRole('heading', { name: 'This run was ended early' }).count()).toBe(1);
    for (const control of [/^Begin$/, /Pause/, /Skip/, /Swelling has increased/]) {
      expect(await page.getByRole('button', { name: control }).count()).toBe(0);
    }
    await screenshot(page, 'table-mode-finished-run');
    await context.close();
  });
});
