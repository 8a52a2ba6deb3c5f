import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll } from 'vitest';
import { chromium, type Browser, type Page } from 'playwright-core';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { closeDatabase } from '../../server/db/connection';

export const DEMO_PASSWORD = 'demo-table-2026';
export const SCREENSHOTS = path.resolve(import.meta.dirname, '../../.data/screenshots');

/** The built client and the API on one port, as `npm start` serves them, on a free port. */
export async function startServer(overrides: Record<string, string> = {}) {
  const config = loadConfig({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', LOGIN_RATE_LIMIT: '1000', PORT: '0', ...overrides });
  // CLIENT_DIST lets parallel work build the client into a folder of its own.
  const handle = createApp(config, { clientDist: process.env.CLIENT_DIST ? path.resolve(process.env.CLIENT_DIST) : undefined });
  const server: Server = await new Promise((resolve) => {
    const s = handle.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    async stop() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await handle.pool.end();
      await closeDatabase();
    },
  };
}

/** Debian's Chromium, never a downloaded browser; flags that keep it off the (closed) network. Playwright gives it a fresh profile. */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--autoplay-policy=no-user-gesture-required',
    ],
  });
}

/** Collects console errors (CSP violations among them) and failed requests for a page. */
export function watchConsole(page: Page) {
  const errors: string[] = [];
  page.on('console', (msg) => {
    if (msg.type() === 'error') errors.push(msg.text());
  });
  page.on('pageerror', (err) => errors.push(err.message));
  return errors;
}

export async function signIn(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

export async function screenshot(page: Page, name: string) {
  fs.mkdirSync(SCREENSHOTS, { recursive: true });
  await page.screenshot({ path: path.join(SCREENSHOTS, `${name}.png`), fullPage: true });
}

/**
 * One server and one browser for a test file, started before its tests and closed after them. Read
 * `env.server` and `env.browser` inside tests (they are set once the file's tests begin).
 */
export function useServerAndBrowser() {
  const env = {} as { server: Awaited<ReturnType<typeof startServer>>; browser: Browser };
  beforeAll(async () => {
    env.server = await startServer();
    env.browser = await launchBrowser();
  });
  afterAll(async () => {
    await env.browser?.close();
    await env.server?.stop();
  });
  return env;
}
