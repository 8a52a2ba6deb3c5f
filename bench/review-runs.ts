/**
 * Review desk benchmark: p50 and p95 of the runs list (first page, a deep page, a filtered page and a few
 * more shapes) and of the run detail, at 100,000 runs and 1,000,000 log entries, with the review indexes of
 * migrations/20261202000500 and without them (the baseline), side by side.
 *
 *   node --import tsx bench/review-runs.ts [--reps 60] [--keep] [--reuse]
 *
 * It uses a scratch database, mendstep_bench, on the test cluster (scripts/db.sh start test): dropped and
 * created afresh, migrated with sequelize-cli, filled with generate_series SQL, and dropped again at the end
 * unless --keep is given (--reuse then starts from the kept one, migrated again, without refilling it).
 * Shapes are measured round-robin, one call of each per round, so a burst of load from elsewhere on the
 * machine lands on every shape alike rather than on whichever was being measured. Service functions are called directly (no HTTP), so the figures are the database
 * and service work; one HTTP call per shape is timed too, for comparison. Not part of the test suite.
 */
import { execFileSync } from 'node:child_process';
import { performance } from 'node:perf_hooks';
import os from 'node:os';
import path from 'node:path';
import bcrypt from 'bcrypt';
import pg from 'pg';
import request from 'supertest';
import { createApp } from '../server/app';
import { loadConfig } from '../server/config';
import { closeDatabase, connectDatabase } from '../server/db/connection';
import type { SessionUser } from '../shared/auth/schemas';
import { buildPlan } from '../shared/plan/build-plan';
import { defaultSequences } from '../shared/plan/sequence';
import { phases } from '../shared/phase';
import { reviewRunsQuerySchema, type ReviewRunsQueryInput } from '../shared/review/query';
import { getReviewRunDetail, listReviewRuns } from '../server/services/review-service';

const root = path.resolve(import.meta.dirname, '..');
const args = process.argv.slice(2);
const reps = Number(args[args.indexOf('--reps') + 1]) || 60;
const keep = args.includes('--keep');
const reuse = args.includes('--reuse');

const RUNS = 100_000;
const ENTRIES_PER_RUN = 10;
const THERAPISTS = 8;
const ATHLETES = 1_000;
const INJURIES = 4_000;
const CLINIC = '0a000000-0000-4000-8000-00000000be01';
const OTHER_CLINIC = '0a000000-0000-4000-8000-00000000be02';
const SUPERVISOR = '0b000000-0000-4000-8000-00000000be00';
const therapistId = (i: number) => `0b000000-0000-4000-8000-00000000b${String(i).padStart(3, '0')}`;
const PASSWORD = 'bench-password-1234';

function log(message: string) {
  process.stderr.write(`[bench] ${message}\n`);
}

async function timed<T>(label: string, work: () => Promise<T>): Promise<T> {
  const start = performance.now();
  const result = await work();
  log(`${label}: ${((performance.now() - start) / 1000).toFixed(1)} s`);
  return result;
}

function quantile(sorted: number[], q: number): number {
  // Nearest rank: the p95 of 60 samples is the 57th, a value that was actually measured.
  return sorted[Math.min(sorted.length - 1, Math.ceil(q * sorted.length) - 1)];
}

interface Figures {
  p50: number;
  p95: number;
  max: number;
}

function figures(samples: number[]): Figures {
  const sorted = [...samples].sort((a, b) => a - b);
  return { p50: quantile(sorted, 0.5), p95: quantile(sorted, 0.95), max: sorted.at(-1)! };
}

/** Every shape once per round, `reps` rounds after two warm-up rounds; the figures per shape. */
async function measureAll<K extends string>(works: Record<K, (i: number) => Promise<unknown>>): Promise<Record<K, Figures>> {
  const names = Object.keys(works) as K[];
  const samples = Object.fromEntries(names.map((name) => [name, [] as number[]])) as Record<K, number[]>;
  for (let round = -2; round < reps; round++) {
    for (const name of names) {
      const start = performance.now();
      await works[name](round + 2);
      if (round >= 0) samples[name].push(performance.now() - start);
    }
  }
  return Object.fromEntries(names.map((name) => [name, figures(samples[name])])) as Record<K, Figures>;
}

async function prepareDatabase(): Promise<{ url: string; admin: pg.Client; fresh: boolean }> {
  const testUrl = execFileSync('bash', ['scripts/db.sh', 'start', 'test'], { cwd: root, encoding: 'utf8' }).trim();
  const adminUrl = new URL(testUrl);
  adminUrl.pathname = '/postgres';
  const benchUrl = new URL(testUrl);
  benchUrl.pathname = '/mendstep_bench';
  const admin = new pg.Client({ connectionString: adminUrl.toString() });
  await admin.connect();
  const exists = (await admin.query(`SELECT 1 FROM pg_database WHERE datname = 'mendstep_bench'`)).rowCount === 1;
  const fresh = !(reuse && exists);
  if (fresh) {
    await admin.query('DROP DATABASE IF EXISTS mendstep_bench WITH (FORCE)');
    await admin.query('CREATE DATABASE mendstep_bench');
  }
  await timed('migrate', async () => {
    execFileSync('npx', ['sequelize-cli', 'db:migrate'], { cwd: root, env: { ...process.env, DATABASE_URL: benchUrl.toString(), NODE_ENV: 'test' }, stdio: 'ignore' });
  });
  return { url: benchUrl.toString(), admin, fresh };
}

async function fill(db: pg.Client) {
  const hash = await bcrypt.hash(PASSWORD, 10);
  await db.query(`INSERT INTO clinics (id, name, settings) VALUES ($1, 'Bench clinic', '{"timeZone":"Europe/London"}'), ($2, 'Other bench clinic', '{}')`, [CLINIC, OTHER_CLINIC]);
  await db.query(`INSERT INTO users (id, clinic_id, email, name, role, password_hash, active) VALUES ($1, $2, 'supervisor@bench.test', 'Bench Supervisor', 'supervisor', $3, true)`, [SUPERVISOR, CLINIC, hash]);
  for (let i = 0; i < THERAPISTS; i++) {
    await db.query(`INSERT INTO users (id, clinic_id, email, name, role, password_hash, active) VALUES ($1, $2, $3, $4, 'therapist', $5, true)`, [
      therapistId(i),
      CLINIC,
      `therapist${i}@bench.test`,
      `Therapist ${String.fromCharCode(65 + i)}`,
      hash,
    ]);
  }
  await db.query(
    `INSERT INTO athletes (id, clinic_id, name, year_of_birth, sport)
     SELECT md5('athlete' || g)::uuid, $1, 'Athlete ' || lpad(g::text, 4, '0'), 1990 + g % 15, 'Football' FROM generate_series(1, ${ATHLETES}) g`,
    [CLINIC],
  );
  await db.query(
    `INSERT INTO injuries (id, clinic_id, athlete_id, region, side, mechanism_kind, injured_at, status)
     SELECT md5('injury' || g)::uuid, $1, md5('athlete' || (1 + g % ${ATHLETES}))::uuid, 'calf', 'left', 'ball', now() - interval '800 days', 'closed'
       FROM generate_series(1, ${INJURIES}) g`,
    [CLINIC],
  );
  const plans = Object.fromEntries(
    phases.map((phase) => [phase, buildPlan({ phase, sequence: defaultSequences[phase], tolerance: 'usual', coldContraindicated: false, suspectedMyositis: false })]),
  );
  // Runs every ~10 minutes over the last two years; outcomes in plausible shares (8 % fall backs, 4 % early
  // ends, 2 % red flags, 1 % abandoned). Phases rotate; therapists rotate.
  await timed(`insert ${RUNS.toLocaleString('en')} runs`, () =>
    db.query(
      `INSERT INTO runs (id, clinic_id, injury_id, athlete_id, therapist_id, phase, status, outcome, plan, sequence_version, screening,
                         started_at, ended_at, last_activity_at, created_at, updated_at)
       SELECT md5('run' || g)::uuid, $1, md5('injury' || (1 + g % ${INJURIES}))::uuid, md5('athlete' || (1 + (1 + g % ${INJURIES}) % ${ATHLETES}))::uuid,
              ('0b000000-0000-4000-8000-00000000b' || lpad((g % ${THERAPISTS})::text, 3, '0'))::uuid,
              (ARRAY['acute','proliferative','remodelling'])[1 + g % 3],
              s.status, CASE WHEN s.status = 'abandoned' THEN NULL ELSE s.status END,
              (ARRAY[$2::jsonb, $3::jsonb, $4::jsonb])[1 + g % 3], 1, '{"redFlags":[],"coldContraindications":[],"massageCautions":[],"tolerance":"usual","cautionsAcknowledged":false}',
              t.at + interval '4 minutes', t.at + interval '35 minutes', t.at + interval '35 minutes', t.at, t.at + interval '35 minutes'
         FROM generate_series(1, ${RUNS}) g
         CROSS JOIN LATERAL (SELECT now() - (g * interval '10 minutes') - interval '1 hour' AS at) t
         CROSS JOIN LATERAL (SELECT CASE
             WHEN g % 100 < 8 THEN 'fell-back' WHEN g % 100 < 12 THEN 'ended-early'
             WHEN g % 100 < 14 THEN 'stopped-referred' WHEN g % 100 < 15 THEN 'abandoned' ELSE 'completed' END AS status) s`,
      [CLINIC, JSON.stringify(plans.acute), JSON.stringify(plans.proliferative), JSON.stringify(plans.remodelling)],
    ),
  );
  // Ten entries per run: eight steps (one in fifty a required skip, one in a hundred an ice massage outside
  // 5–7 min), a swelling check and the run's end.
  await timed(`insert ${(RUNS * ENTRIES_PER_RUN).toLocaleString('en')} log entries`, () =>
    db.query(
      `INSERT INTO run_log_entries (clinic_id, run_id, idempotency_key, body_hash, seq, type, step_index, kind, planned_seconds, actual_seconds, at, reason, detail, created_at)
       SELECT $1, r.id, gen_random_uuid(), md5(r.id::text || k) || md5(k || r.id::text), k,
              CASE WHEN k = 9 THEN 'swelling-check' WHEN k = 10 THEN 'run-completed'
                   WHEN k = 3 AND hashtext(r.id::text) % 50 = 0 THEN 'step-skipped' ELSE 'step-completed' END,
              CASE WHEN k <= 8 THEN k - 1 END,
              CASE WHEN k = 1 THEN 'ice-massage' WHEN k <= 8 THEN 'light-strokes' END,
              CASE WHEN k = 1 THEN 360 WHEN k <= 8 THEN 180 END,
              CASE WHEN k = 1 AND hashtext(r.id::text) % 100 = 1 THEN 450 WHEN k = 1 THEN 360 WHEN k <= 8 THEN 180 END,
              r.started_at + k * interval '3 minutes',
              CASE WHEN k = 3 AND hashtext(r.id::text) % 50 = 0 THEN 'athlete too tender' END,
              CASE WHEN k = 9 THEN 'not increased' WHEN k = 3 AND hashtext(r.id::text) % 50 = 0 THEN 'required step' END,
              r.started_at + k * interval '3 minutes'
         FROM runs r CROSS JOIN generate_series(1, ${ENTRIES_PER_RUN}) k`,
      [CLINIC],
    ),
  );
  // Two runs in five have a note: signed, submitted or draft.
  await timed('insert session notes', () =>
    db.query(
      `INSERT INTO session_notes (clinic_id, run_id, subjective, objective, assessment, plan, status, submitted_by, submitted_at, signed_by, signed_at, version)
       SELECT $1, r.id, 'S', 'O', 'A', 'P', s.status,
              CASE WHEN s.status <> 'draft' THEN r.therapist_id END, CASE WHEN s.status <> 'draft' THEN r.ended_at END,
              CASE WHEN s.status = 'signed' THEN $2::uuid END, CASE WHEN s.status = 'signed' THEN r.ended_at + interval '1 day' END, 1
         FROM runs r
         CROSS JOIN LATERAL (SELECT CASE abs(hashtext(r.id::text)) % 5 WHEN 0 THEN 'signed' WHEN 1 THEN 'submitted' WHEN 2 THEN 'draft' END AS status) s
        WHERE s.status IS NOT NULL`,
      [CLINIC, SUPERVISOR],
    ),
  );
  await timed('vacuum analyze', () => db.query('VACUUM ANALYZE'));
}

/** The indexes migration 20261202000500 adds for the review desk (the session-note table's own unique key stays). */
async function reviewIndexes(db: pg.Client): Promise<{ name: string; definition: string }[]> {
  const { rows } = await db.query<{ indexname: string; indexdef: string }>(
    `SELECT indexname, indexdef FROM pg_indexes
      WHERE indexname IN ('runs_review_created','runs_review_therapist','runs_review_athlete','runs_review_phase','runs_review_status',
                          'users_clinic_name','athletes_clinic_name_id','run_log_entries_attention','session_notes_clinic_status')`,
  );
  return rows.map((r) => ({ name: r.indexname, definition: r.indexdef }));
}

type Shape = { name: string; query?: ReviewRunsQueryInput; detail?: true };

async function main() {
  const { url, admin, fresh } = await prepareDatabase();
  const db = new pg.Client({ connectionString: url });
  await db.connect();
  try {
    if (fresh) await fill(db);
    connectDatabase(url);
    const actor: SessionUser = { id: SUPERVISOR, email: 'supervisor@bench.test', name: 'Bench Supervisor', role: 'supervisor', clinicId: CLINIC };
    const { rows: sample } = await db.query<{ id: string }>(`SELECT id FROM runs ORDER BY hashtext(id::text) LIMIT 200`);
    const day = (daysAgo: number) => new Date(Date.now() - daysAgo * 86_400_000).toISOString().slice(0, 10);
    const shapes: Shape[] = [
      { name: 'list: first page (newest 25)', query: {} },
      { name: 'list: deep page 2000', query: { page: 2000 } },
      { name: 'list: fell back + therapist + 6 months', query: { outcome: 'fell-back', therapistId: therapistId(3), from: day(270), to: day(90) } },
      { name: 'list: filtered, page 3', query: { outcome: 'fell-back', therapistId: therapistId(3), from: day(270), to: day(90), page: 3 } },
      { name: 'list: needs attention', query: { attention: 'true' } },
      { name: 'list: note not signed, page 100', query: { noteSigned: 'false', page: 100 } },
      { name: 'list: athlete filter', query: { athleteId: sample[0] ? (await db.query(`SELECT athlete_id FROM runs WHERE id = $1`, [sample[0].id])).rows[0].athlete_id : undefined } },
      { name: 'list: sort by athlete name', query: { sort: 'athleteName', direction: 'asc' } },
      { name: 'run detail (random runs)', detail: true },
    ];
    const work = (shape: Shape) => (i: number) =>
      shape.detail ? getReviewRunDetail(actor, sample[i % sample.length].id) : listReviewRuns(actor, reviewRunsQuerySchema.parse(shape.query));

    // Each list shape's total, so the figures say how much each page had to count.
    const totals = new Map<string, string>();
    for (const shape of shapes.filter((s) => s.query)) {
      const page = await listReviewRuns(actor, reviewRunsQuerySchema.parse(shape.query));
      totals.set(shape.name, `${page.total}${page.totalExact ? '' : '+'}`);
    }

    const works = Object.fromEntries(shapes.map((shape) => [shape.name, work(shape)]));
    // Baseline first (the review indexes dropped, then put back as they were), so the figures with the indexes
    // come second, from caches at least as warm: the comparison never flatters the indexes.
    const indexes = await reviewIndexes(db);
    for (const index of indexes) await db.query(`DROP INDEX ${index.name}`);
    await db.query('ANALYZE');
    const loadBefore = os.loadavg()[0];
    const baseline = await timed('baseline', () => measureAll(works));
    for (const index of indexes) await db.query(index.definition);
    await db.query('ANALYZE');
    const withIndexes = await timed('with indexes', () => measureAll(works));

    // One HTTP round trip per shape through the whole middleware pipeline (session, CSRF, JSON), for comparison.
    const handle = createApp(loadConfig({ ...process.env, DATABASE_URL: url, NODE_ENV: 'test', LOG_LEVEL: 'silent', MAIL_FAKE: '0', SESSION_SECRET: 'bench-secret-bench-secret-bench-secret' }));
    const agent = request.agent(handle.app);
    const token = (await agent.get('/api/auth/csrf')).body.token;
    await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: 'supervisor@bench.test', password: PASSWORD });
    const http = new Map<string, number>();
    for (const shape of shapes) {
      const url = shape.detail ? `/api/review/runs/${sample[7].id}` : `/api/review/runs?${new URLSearchParams(Object.entries(shape.query ?? {}).map(([k, v]) => [k, String(v)]))}`;
      await agent.get(url); // warm
      const start = performance.now();
      const res = await agent.get(url);
      http.set(shape.name, performance.now() - start);
      if (res.status !== 200) throw new Error(`${url}: ${res.status} ${JSON.stringify(res.body)}`);
    }
    await handle.pool.end();
    await handle.mail.stop();

    const ms = (value: number) => value.toFixed(1).padStart(7);
    const lines = [
      '',
      `Review desk, ${RUNS.toLocaleString('en')} runs / ${(RUNS * ENTRIES_PER_RUN).toLocaleString('en')} log entries, ${reps} repetitions each (ms; goal p95 ≤ 50)`,
      '',
      `${'shape'.padEnd(42)} ${'total'.padStart(7)} | ${'p50'.padStart(7)} ${'p95'.padStart(7)} ${'max'.padStart(7)} | ${'HTTP'.padStart(7)} | ${'base p50'.padStart(8)} ${'base p95'.padStart(8)} | ${'p95 ×'.padStart(6)}`,
      '-'.repeat(120),
      ...shapes.map((shape) => {
        const w = withIndexes[shape.name];
        const b = baseline[shape.name];
        const total = totals.get(shape.name);
        return (
          `${shape.name.padEnd(42)} ${(total ?? '').padStart(7)} | ${ms(w.p50)} ${ms(w.p95)} ${ms(w.max)} | ${ms(http.get(shape.name)!)} | ` +
          `${ms(b.p50).padStart(8)} ${ms(b.p95).padStart(8)} | ${(b.p95 / w.p95).toFixed(1).padStart(5)}×`
        );
      }),
      '',
      `Machine: ${os.cpus().length} cores; 1-minute load average ${loadBefore.toFixed(1)} when measuring began, ${os.loadavg()[0].toFixed(1)} at the end (other work on the machine inflates every figure alike).`,
      'total: the list\'s answer; "+" marks a lower bound (counted up to 1,000 runs past the page, see review-service.ts).',
      'HTTP: one call after a warm-up, through sessions, CSRF and JSON. "base": the review indexes of migration 20261202000500 dropped.',
      '"p95 ×": baseline p95 divided by p95 with the indexes.',
    ];
    process.stdout.write(`${lines.join('\n')}\n`);
  } finally {
    await closeDatabase();
    await db.end();
    if (!keep) await admin.query('DROP DATABASE IF EXISTS mendstep_bench WITH (FORCE)');
    await admin.end();
  }
}

main().catch((error) => {
  console.error(error);
  process.exitCode = 1;
});
