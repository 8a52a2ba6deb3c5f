/**
 * Cue timing in a real browser, in real time: how late each table-mode cue fires against when it was due.
 *
 *   export DATABASE_URL=$(bash scripts/db.sh start test) && npx vite build && node --import tsx bench/cue-timing.ts
 *
 * Sets up a clinic of its own with a two-step remodelling sequence (60 s each, the shortest the bounds allow),
 * runs it in headless Chromium for real (no fake clock) and reads the cue log table mode keeps in
 * `window.mendstepCueTimings` ({ cue, scheduledAt, firedAt } from howler's play events). Headless Chromium is
 * muted, but howler still reports playing. Prints the error of every cue and a summary.
 */
import bcrypt from 'bcrypt';
import { randomUUID } from 'node:crypto';
import { Athlete, Clinic, Injury, User } from '../server/models';
import { saveSequence } from '../server/services/sequence-service';
import { launchBrowser, signIn, startServer } from '../tests/support/e2e';

const STEP_SECONDS = 60;

async function main() {
  const server = await startServer();
  const password = 'bench-password-2026';
  const clinic = await Clinic.create({ name: `Cue bench ${randomUUID().slice(0, 6)}`, settings: { timeZone: 'Europe/London' } });
  const hash = await bcrypt.hash(password, 12);
  const therapist = await User.create({ clinicId: clinic.id, role: 'therapist', email: `cue-${randomUUID()}@bench.mendstep.test`, name: 'Bench Therapist', passwordHash: hash });
  const supervisor = await User.create({ clinicId: clinic.id, role: 'supervisor', email: `cue-s-${randomUUID()}@bench.mendstep.test`, name: 'Bench Supervisor', passwordHash: hash });
  await saveSequence(
    { id: supervisor.id, clinicId: clinic.id, email: supervisor.email, name: supervisor.name, role: 'supervisor' },
    {
      phase: 'remodelling',
      steps: [
        { kind: 'warm-up-strokes', seconds: STEP_SECONDS, optional: false },
        { kind: 'cross-fibre-friction', seconds: STEP_SECONDS, optional: false },
      ],
    },
  );
  const athlete = await Athlete.create({ clinicId: clinic.id, name: 'Bench Athlete', yearOfBirth: 1998, sport: 'Hockey', position: null, email: null, notes: null, consentRecordedBy: null, consentRecordedAt: null });
  const injury = await Injury.create({
    clinicId: clinic.id,
    athleteId: athlete.id,
    region: 'calf',
    side: 'left',
    mechanismKind: 'ball',
    mechanism: null,
    injuredAt: new Date(Date.now() - 30 * 86_400_000),
    treatmentStartedAt: null,
    closedAt: null,
    phaseOverride: null,
    createdBy: therapist.id,
  });

  const browser = await launchBrowser();
  const page = await (await browser.newContext({ viewport: { width: 1280, height: 800 } })).newPage();
  await signIn(page, server.baseUrl, therapist.email, password);
  await page.waitForURL('**/today');
  await page.goto(`${server.baseUrl}/runs/new?injuryId=${injury.id}`);
  await page.getByRole('button', { name: 'Save screening and review the plan' }).click();
  await page.getByRole('link', { name: 'Open table mode' }).click();
  await page.getByRole('button', { name: 'Begin' }).click();
  const began = await page.evaluate(() => Date.now());
  console.log(`Running ${2 * STEP_SECONDS} s of table mode in real time…`);
  await page.getByText('Run complete').waitFor({ timeout: (2 * STEP_SECONDS + 30) * 1000 });
  await page.waitForTimeout(1500);
  const timings = await page.evaluate(() => window.mendstepCueTimings ?? []);

  const rows = timings.map((t) => ({ cue: t.cue, dueAtS: ((t.scheduledAt - began) / 1000).toFixed(3), errorMs: t.firedAt - t.scheduledAt }));
  console.table(rows);
  const errors = rows.map((r) => r.errorMs).sort((a, b) => a - b);
  const pct = (p: number) => errors[Math.min(errors.length - 1, Math.floor((p / 100) * errors.length))];
  console.log(`cues: ${errors.length}; error (fired − due) ms: min ${errors[0]}, p50 ${pct(50)}, p95 ${pct(95)}, max ${errors.at(-1)}`);
  // Due times against the plan: step boundaries at 60 s and 120 s after Begin.
  const ends = timings.filter((t) => t.cue === 'step-end' || t.cue === 'run-complete').map((t) => (t.scheduledAt - began) / 1000);
  console.log(`step boundaries due at (s after Begin): ${ends.map((s) => s.toFixed(3)).join(', ')} (plan: ${STEP_SECONDS}, ${2 * STEP_SECONDS})`);

  await browser.close();
  await server.stop();
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
