import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot, signIn, useServerAndBrowser, watchConsole } from '../support/e2e';

const env = useServerAndBrowser();

/** A datetime-local value `hours` ago in the page's own zone, as a therapist would type it on the tablet. */
function localInputHoursAgo(page: Page, hours: number) {
  return page.evaluate((h) => {
    const d = new Date(Date.now() - h * 3_600_000);
    const p = (n: number) => String(n).padStart(2, '0');
    return `${d.getFullYear()}-${p(d.getMonth() + 1)}-${p(d.getDate())}T${p(d.getHours())}:${p(d.getMinutes())}`;
  }, hours);
}

async function addMeasurement(page: Page, values: Record<string, string>) {
  const form = page.getByRole('form', { name: 'Add a measurement' });
  for (const [label, value] of Object.entries(values)) await form.getByLabel(label, { exact: false }).first().fill(value);
  await form.getByRole('button', { name: 'Save measurement' }).click();
  await form.getByText('Measurement saved.').waitFor();
}

describe('records in Chromium at 1280×800', () => {
  it('a therapist registers an athlete, records a thigh contusion on the body map, measures it twice and sees what Mendstep makes of it', async () => {
    const context = await env.browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    const errors = watchConsole(page);
    const name = `Rowan Tesk ${Date.now().toString(36)}`;

    await signIn(page, env.server.baseUrl, 'therapist@mendstep.test');
    await page.waitForURL('**/today');

    // Register the athlete from the Athletes screen.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Athletes' }).click();
    await page.getByRole('heading', { level: 1, name: 'Athletes' }).waitFor();
    await page.getByRole('button', { name: 'Add athlete' }).click();
    const athleteForm = page.getByRole('form', { name: 'Add athlete' });
    await athleteForm.getByRole('button', { name: 'Add athlete' }).click();
    await athleteForm.getByText('Name must be between 1 and 120 characters').waitFor();
    await screenshot(page, 'records-add-athlete-errors');
    await athleteForm.getByLabel('Name', { exact: true }).fill(name);
    await athleteForm.getByLabel('Year of birth').fill('1999');
    await athleteForm.getByLabel('Sport', { exact: true }).fill('Football');
    await athleteForm.getByLabel('Position', { exact: true }).fill('Winger');
    await athleteForm.getByLabel('The athlete consents to treatment', { exact: false }).check();
    await athleteForm.getByRole('button', { name: 'Add athlete' }).click();
    await page.waitForURL(/\/athletes\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { level: 1, name }).waitFor();
    await expect(page.getByTestId('consent-status').textContent()).resolves.toContain('Tamsin Ruel');

    // Record the injury on the body map, dated about 20 hours ago.
    await page.getByRole('button', { name: 'Record an injury' }).click();
    const site = page.getByRole('radio', { name: 'Anterior thigh (quadriceps), left' });
    await site.click();
    await expect(site.getAttribute('aria-checked')).resolves.toBe('true');
    await expect(page.getByTestId('chosen-site').textContent()).resolves.toBe('Anterior thigh (quadriceps), left');
    const injuryForm = page.getByRole('form', { name: 'Record an injury' });
    await injuryForm.getByLabel('Mechanism').selectOption('knee-to-thigh');
    await injuryForm.getByLabel('How it happened').fill('Knee from an opponent in a tackle');
    await injuryForm.getByLabel('Date and time of injury').fill(await localInputHoursAgo(page, 20));
    await injuryForm.getByLabel('Haematoma type').selectOption('intramuscular');
    await screenshot(page, 'records-record-injury');
    await injuryForm.getByRole('button', { name: 'Record injury' }).click();
    await page.waitForURL(/\/injuries\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { level: 1, name: 'Anterior thigh (quadriceps), left' }).waitFor();

    // Two measurements: one 2 hours ago, one now, with flexion improving from 80° to 95°.
    await addMeasurement(page, {
      'Taken at': await localInputHoursAgo(page, 2),
      'Knee flexion, active': '80',
      'Pain, NPRS': '6',
      'Skinfold over the site': '12',
      'Girth, injured side': '52.5',
      'Girth, other side': '49',
      'Girth landmark': 'anteromedial knee joint line',
      'Distance from the landmark': '20',
      'Bruise length': '8',
      'Bruise width': '5',
    });
    await addMeasurement(page, {
      'Knee flexion, active': '95',
      'Pain, NPRS': '4',
      'Girth, injured side': '52',
      'Girth, other side': '49',
      'Bruise length': '7',
      'Bruise width': '5',
    });

    // Severity from the latest flexion (Ryan et al. 1991: mild > 90°), with the published mean worded as such.
    await expect(page.getByTestId('severity-grade').textContent()).resolves.toContain('Mild');
    await page.getByText('This is a group average, not a prediction for this athlete.').waitFor();
    // Phase: day 0 is acute (Kannus 2000), suggested with its reason.
    const phaseCard = page.getByRole('region', { name: 'Phase of healing' });
    await phaseCard.getByText('Acute phase', { exact: true }).first().waitFor();
    await phaseCard.getByText('Suggested', { exact: true }).waitFor();
    await expect(page.getByTestId('phase-reason').textContent()).resolves.toContain('Day 0 since injury');
    // Risks: flexion below 120° and football (Ryan et al. 1991), with the red flags.
    const cautions = page.getByRole('region', { name: 'Cautions' });
    await cautions.getByText('Knee flexion below 120° (lowest recorded 80°)').waitFor();
    await cautions.getByText('Injury in football (Football)').waitFor();
    await page.getByRole('note', { name: 'Red flags' }).getByText('Stop and refer to a physician at once', { exact: false }).waitFor();
    // Pad: 7 × 5 cm bruise → two to three times each dimension (common practice).
    await expect(page.getByTestId('pad-size').textContent()).resolves.toMatch(/14–21 cm long × 10–15 cm wide/);
    await page.getByRole('region', { name: 'Cold schedule for today' }).getByText('Cold for 20 minutes at the start of each hour while awake', { exact: false }).waitFor();
    await page.getByText('Otte et al. 2002 recommend 25 minutes', { exact: false }).waitFor();
    // Three charts, each with its numbers in a table.
    await expect(page.locator('.recharts-surface').count()).resolves.toBe(3);
    await page.getByRole('table', { name: 'Knee flexion, active, by time of measurement' }).waitFor({ state: 'attached' });
    expect(await page.getByRole('table', { name: 'Knee flexion, active, by time of measurement' }).getByRole('cell', { name: '95' }).count()).toBe(1);
    await page.waitForTimeout(300);
    await screenshot(page, 'records-injury');
    // Tablets are turned both ways at the table.
    await page.setViewportSize({ width: 800, height: 1280 });
    await page.waitForTimeout(300);
    await screenshot(page, 'records-injury-portrait');
    await page.setViewportSize({ width: 1280, height: 800 });

    // The override needs a reason.
    await page.getByRole('button', { name: 'Override the phase' }).click();
    const overrideForm = page.getByRole('form', { name: 'Override the phase' });
    await overrideForm.getByText('Proliferative').click();
    await overrideForm.getByRole('button', { name: 'Save override' }).click();
    await overrideForm.getByText('Override reason must be between 5 and 500 characters').waitFor();
    await overrideForm.getByLabel('Reason for the override').fill('Swelling settled early, full function returning');
    await overrideForm.getByRole('button', { name: 'Save override' }).click();
    await phaseCard.getByText('Override', { exact: true }).waitFor();
    await expect(page.getByTestId('phase-reason').textContent()).resolves.toContain('Set to proliferative by the therapist');
    await page.getByRole('button', { name: 'Clear override' }).click();
    await phaseCard.getByText('Suggested', { exact: true }).waitFor();

    // The athlete's page lists the injury with its phase.
    await page.getByRole('link', { name }).click();
    await page.getByRole('heading', { level: 1, name }).waitFor();
    await page.getByRole('link', { name: /Anterior thigh \(quadriceps\), left/ }).getByText('Acute').waitFor();
    await screenshot(page, 'records-athlete');

    // Today lists it with its phase in words and a link to start a run.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Today' }).click();
    const card = page.getByRole('listitem').filter({ hasText: name });
    await card.getByText('Acute').waitFor();
    expect(await card.getByRole('link', { name: /^Start a run/ }).getAttribute('href')).toMatch(/^\/runs\/new\?injuryId=[0-9a-f-]{36}$/);
    await screenshot(page, 'records-today');

    // The athlete register finds them by search.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Athletes' }).click();
    await page.getByLabel('Search athletes').fill(name);
    await page.getByRole('link', { name }).waitFor();
    await page.getByText('1 athlete matching', { exact: false }).waitFor();
    await screenshot(page, 'records-athletes');

    // 401 from /api/auth/me before sign-in is expected; anything else is not.
    expect(errors.filter((e) => !e.includes('401'))).toEqual([]);
    await context.close();
  });
});
