import request from 'supertest';
import bcrypt from 'bcrypt';
import { randomUUID } from 'node:crypto';
import { afterAll } from 'vitest';
import { createApp } from '../../server/app';
import { loadConfig, type Config } from '../../server/config';
import { closeDatabase } from '../../server/db/connection';
import { Clinic, User } from '../../server/models';
import type { Role } from '../../shared/auth/roles';

export const TEST_PASSWORD = 'correct-horse-table-42';
// Hashed once per test file: bcrypt at cost 12 is slow on purpose.
let passwordHash: Promise<string> | undefined;
const hashOnce = () => (passwordHash ??= bcrypt.hash(TEST_PASSWORD, 12));

/** The app in this test process, against the real PostgreSQL; closed after the file's tests. */
export function buildTestApp(overrides: Partial<Record<string, string>> = {}) {
  const config: Config = loadConfig({
    ...process.env,
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    LOGIN_RATE_LIMIT: '1000',
    ...overrides,
  });
  const handle = createApp(config);
  afterAll(async () => {
    await handle.pool.end();
    await closeDatabase();
  });
  return handle.app;
}

/** A clinic of its own for each test file, so files never see each other's records. */
export async function createClinic(name = `Test clinic ${randomUUID().slice(0, 8)}`) {
  return Clinic.create({ name, settings: { timeZone: 'Europe/London' } });
}

export async function createStaff(clinicId: string, role: Role, overrides: Partial<{ email: string; name: string; active: boolean }> = {}) {
  return User.create({
    clinicId,
    role,
    email: overrides.email ?? `${role}-${randomUUID()}@test.mendstep.test`,
    name: overrides.name ?? `Test ${role}`,
    passwordHash: await hashOnce(),
    active: overrides.active ?? true,
  });
}

/** A supertest agent that keeps cookies and sends the CSRF token, signed in as the given user. */
export async function signedInAgent(app: Parameters<typeof request.agent>[0], email: string, password = TEST_PASSWORD) {
  const agent = request.agent(app);
  const csrf = async () => (await agent.get('/api/auth/csrf')).body.token as string;
  // The agent attaches cookies when a request is created: fetch the token first.
  const firstToken = await csrf();
  const login = await agent.post('/api/auth/login').set('X-CSRF-Token', firstToken).send({ email, password });
  if (login.status !== 200) throw new Error(`sign-in failed for ${email}: ${login.status} ${JSON.stringify(login.body)}`);
  // The session id changed at sign-in; the token is bound to it.
  let token = await csrf();
  return {
    agent,
    user: login.body.user,
    async refreshCsrf() {
      token = await csrf();
      return token;
    },
    get: (url: string) => agent.get(url),
    post: (url: string) => agent.post(url).set('X-CSRF-Token', token),
    put: (url: string) => agent.put(url).set('X-CSRF-Token', token),
    patch: (url: string) => agent.patch(url).set('X-CSRF-Token', token),
    delete: (url: string) => agent.delete(url).set('X-CSRF-Token', token),
  };
}
