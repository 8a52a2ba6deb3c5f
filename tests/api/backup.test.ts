import { execFile } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const run = promisify(execFile);
const root = path.resolve(import.meta.dirname, '../..');

// A scratch database on the test cluster: the shared test database is never touched.
const base = new URL(process.env.DATABASE_URL!);
const scratchName = `mendstep_backup_${randomUUID().slice(0, 8)}`;
const scratchUrl = Object.assign(new URL(base.href), { pathname: `/${scratchName}` }).href;
const adminUrl = Object.assign(new URL(base.href), { pathname: '/postgres' }).href;
const backupDir = fs.mkdtempSync(path.join(os.tmpdir(), 'mendstep-backups-'));
const env = { ...process.env, DATABASE_URL: scratchUrl, BACKUP_DIR: backupDir, NODE_ENV: 'test' };

async function sql<T extends pg.QueryResultRow>(url: string, text: string): Promise<T[]> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query<T>(text)).rows;
  } finally {
    await client.end();
  }
}

/** Every row of every table, as text, so "the same database" is checked row by row rather than by counts. */
async function everyRow(): Promise<Record<string, string[]>> {
  const tables = await sql<{ tablename: string }>(scratchUrl, "SELECT tablename FROM pg_tables WHERE schemaname = 'public' ORDER BY tablename");
  const result: Record<string, string[]> = {};
  for (const { tablename } of tables) {
    const rows = await sql<{ row: string }>(scratchUrl, `SELECT t::text AS row FROM "${tablename}" t ORDER BY 1`);
    result[tablename] = rows.map((r) => r.row);
  }
  return result;
}

beforeAll(async () => {
  await sql(adminUrl, `CREATE DATABASE ${scratchName}`);
  // The real schema and the demo data, as npm start makes them.
  await run('npx', ['sequelize-cli', 'db:migrate'], { cwd: root, env });
  await run('npx', ['sequelize-cli', 'db:seed:all'], { cwd: root, env });
}, 120_000);

afterAll(async () => {
  await sql(adminUrl, `DROP DATABASE IF EXISTS ${scratchName} WITH (FORCE)`);
  fs.rmSync(backupDir, { recursive: true, force: true });
});

describe('backup and restore', () => {
  it('backs up to a timestamped file, restores into the wiped database and finds every row; refuses a non-empty target', async () => {
    const before = await everyRow();
    expect(before.users.length).toBeGreaterThan(0);
    expect(before.runs.length).toBeGreaterThan(0);
    expect(before.sequelize_meta.length).toBeGreaterThan(0);

    const backup = await run('bash', ['scripts/db-backup.sh'], { cwd: root, env });
    const file = backup.stdout.trim();
    expect(path.dirname(file)).toBe(backupDir);
    expect(path.basename(file)).toMatch(/^mendstep-\d{8}T\d{6}Z\.dump$/);
    // pg_dump's custom format starts with "PGDMP".
    expect(fs.readFileSync(file).subarray(0, 5).toString()).toBe('PGDMP');

    await sql(scratchUrl, 'DROP SCHEMA public CASCADE; CREATE SCHEMA public');
    expect(await everyRow()).toEqual({});

    await run('bash', ['scripts/db-restore.sh', file], { cwd: root, env });
    expect(await everyRow()).toEqual(before);

    // Restoring over a database that holds tables is refused, and nothing changes.
    const again = await run('bash', ['scripts/db-restore.sh', file], { cwd: root, env }).then(
      () => null,
      (error: { code: number; stderr: string }) => error,
    );
    expect(again?.code).toBe(1);
    expect(again?.stderr).toMatch(/not empty/);
    expect(await everyRow()).toEqual(before);
  }, 120_000);

  it('refuses to run without a file', async () => {
    const missing = await run('bash', ['scripts/db-restore.sh'], { cwd: root, env }).then(
      () => null,
      (error: { code: number; stderr: string }) => error,
    );
    expect(missing?.code).toBe(2);
    expect(missing?.stderr).toMatch(/usage: npm run db:restore FILE/);
  });
});
