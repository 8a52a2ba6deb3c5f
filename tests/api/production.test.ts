import { execFile } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { promisify } from 'node:util';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { closeDatabase } from '../../server/db/connection';

const run = promisify(execFile);
const root = path.resolve(import.meta.dirname, '../..');
const handles: { pool: { end(): Promise<void> }; mail: { stop(): Promise<void> } }[] = [];

/** A port nothing listens on: bound for a moment, then released. */
async function closedPort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

function app(overrides: Record<string, string>) {
  const handle = createApp(loadConfig({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', MAIL_POLL_SECONDS: '0', ...overrides }));
  handles.push(handle);
  return handle.app;
}

afterAll(async () => {
  await Promise.all(handles.map((h) => Promise.all([h.pool.end(), h.mail.stop()])));
  await closeDatabase();
});

describe('GET /healthz', () => {
  it('answers 200 without a session while the database answers, and sets no cookie', async () => {
    const res = await request(app({})).get('/healthz');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, database: 'up' });
    expect(res.headers['set-cookie']).toBeUndefined();
    expect(res.headers['cache-control']).toBe('no-store');
  });

  it('answers 503 when the database does not answer (an app pointed at a closed port)', async () => {
    const port = await closedPort();
    const res = await request(app({ DATABASE_URL: `postgres://postgres@127.0.0.1:${port}/mendstep` })).get('/healthz');
    expect(res.status).toBe(503);
    expect(res.body).toEqual({ ok: false, database: 'down' });
  });
});

describe('production configuration', () => {
  const production = { NODE_ENV: 'production', SMTP_HOST: 'smtp.example.org', APP_URL: 'https://mendstep.example.org' };

  it('refuses to load without SESSION_SECRET or DATABASE_URL', () => {
    const { DATABASE_URL: _url, SESSION_SECRET: _secret, ...rest } = process.env;
    expect(() => loadConfig({ ...rest, ...production, DATABASE_URL: process.env.DATABASE_URL })).toThrow(/production needs SESSION_SECRET/);
    expect(() => loadConfig({ ...rest, ...production, SESSION_SECRET: 'a-long-production-secret' })).toThrow(/production needs DATABASE_URL/);
    const config = loadConfig({ ...rest, ...production, SESSION_SECRET: 'a-long-production-secret', DATABASE_URL: process.env.DATABASE_URL });
    expect(config.secureCookies).toBe(true);
  });

  it('the server process exits with the reason when SESSION_SECRET is missing', async () => {
    const { SESSION_SECRET: _secret, ...rest } = process.env;
    const failed = await run('node', ['--import', 'tsx', 'server/index.ts'], { cwd: root, env: { ...rest, ...production, PORT: '0' }, timeout: 30_000 }).then(
      () => null,
      (error: { code: number; stderr: string }) => error,
    );
    expect(failed?.code).not.toBe(0);
    expect(failed?.stderr).toMatch(/production needs SESSION_SECRET/);
  }, 40_000);

  it('npm start refuses production without DATABASE_URL, before it starts any database, unless ALLOW_LOCAL_DATABASE=1', async () => {
    const { DATABASE_URL: _url, SESSION_SECRET: _secret, ...rest } = process.env;
    const failed = await run('bash', ['scripts/start.sh'], { cwd: root, env: { ...rest, NODE_ENV: 'production' }, timeout: 30_000 }).then(
      () => null,
      (error: { code: number; stderr: string }) => error,
    );
    expect(failed?.code).toBe(1);
    expect(failed?.stderr).toMatch(/refusing to start in production without SESSION_SECRET DATABASE_URL/);
    expect(failed?.stderr).not.toMatch(/installing|migrating|started on/);

    const allowed = await run('bash', ['scripts/start.sh'], { cwd: root, env: { ...rest, NODE_ENV: 'production', ALLOW_LOCAL_DATABASE: '1' }, timeout: 30_000 }).then(
      () => null,
      (error: { code: number; stderr: string }) => error,
    );
    // Still refused for the missing secret: the local cluster lifts only the database requirement.
    expect(allowed?.stderr).toMatch(/without SESSION_SECRET$/m);
  }, 70_000);
});
