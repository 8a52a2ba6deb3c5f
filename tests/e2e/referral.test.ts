import { describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { screenshot, signIn, useServerAndBrowser, watchConsole } from '../support/e2e';

const env = useServerAndBrowser();

const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();

describe('referral summary in Chromium', () => {
  it('a red flag at screening leads to a one-page referral whose PDF names the athlete and the red flag', async () => {
    const context = await env.browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    const errors = watchConsole(page);
    // The second demo clinic's therapist: this test's records stay out of the main demo clinic's screens.
    await signIn(page, env.server.baseUrl, 'therapist@other.mendstep.test');
    await page.waitForURL('**/today');

    // The records come through the API with the page's own session, as the screens would send them.
    const token = (await (await page.request.get(`${env.server.baseUrl}/api/auth/csrf`)).json()).token as string;
    const post = async (url: string, data: object) => {
      const res = await page.request.post(`${env.server.baseUrl}${url}`, { data, headers: { 'X-CSRF-Token': token } });
      expect(res.status(), url).toBeLessThan(300);
      return res.json();
    };
    const name = `Wren Aldous ${Date.now().toString(36)}`;
    const { athlete } = await post('/api/athletes', { name, yearOfBirth: 1998, sport: 'Hockey', consentToTreatment: true });
    const { injury } = await post('/api/injuries', {
      athleteId: athlete.id,
      region: 'anterior-thigh',
      side: 'right',
      mechanismKind: 'stick-or-bat',
      mechanism: 'Stick across the thigh',
      injuredAt: hoursAgo(26),
    });
    await post(`/api/injuries/${injury.id}/measurements`, { takenAt: hoursAgo(2), kneeFlexionDeg: 75, painNprs: 8, girthInjuredCm: 56, girthOtherCm: 53, girthLandmark: 'superior pole of patella', girthDistanceCm: 15 });

    // Screening with a red flag stops the run before it starts.
    await page.goto(`${env.server.baseUrl}/runs/new?injuryId=${injury.id}`);
    await page.waitForURL(/\/runs\/[0-9a-f-]{36}\/screening$/);
    await page.getByLabel('Pain out of proportion to the injury').check();
    await page.getByRole('button', { name: 'Record stop and refer' }).click();
    await page.getByRole('heading', { name: 'Stop and refer' }).waitFor();
    await page.getByRole('link', { name: 'Referral summary for the physician' }).click();
    await page.waitForURL(/\/injuries\/[0-9a-f-]{36}\/referral\?runId=/);
    await page.getByRole('heading', { level: 1, name: 'Referral summary for a physician' }).waitFor();
    await expect(page.getByTestId('referral-reasons').textContent()).resolves.toContain('Red flag: Pain out of proportion to the injury');
    await page.getByLabel(/note to the physician/).fill('Thigh tense and very painful at rest; please assess today.');
    await screenshot(page, 'referral-screen');

    const pdf = await page.pdf({ format: 'A4', preferCSSPageSize: true, printBackground: true });
    const parser = new PDFParse({ data: new Uint8Array(pdf) });
    const parsed = await parser.getText();
    await parser.destroy();
    const text = parsed.text.replace(/\s+/g, ' ');
    expect(parsed.total).toBe(1);
    expect(text).toContain(name);
    expect(text).toContain('Red flag: Pain out of proportion to the injury');
    expect(text).toContain('please assess today');
    // Measurements over time, and the screen's buttons left off the paper.
    expect(text).toContain('75°');
    expect(text).not.toContain('Print or save as PDF');
    expect(text).not.toContain('Back to the injury');
    // The sign-in page asks who is signed in before anyone is: that one 401 is expected.
    expect(errors.filter((e) => !e.includes('401'))).toEqual([]);
    await context.close();
  });
});
