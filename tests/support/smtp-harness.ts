import { afterAll } from 'vitest';
import { Op } from 'sequelize';
import { simpleParser, type ParsedMail } from 'mailparser';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { closeDatabase } from '../../server/db/connection';
import { MailboxMessage, OutboundEmail } from '../../server/models';

/**
 * The app in the test process with its mail runtime in reach: the local SMTP server it started (port 0) can be
 * stopped and started to stand in for an outage. Retries are quick so a test sees several.
 */
export function buildMailTestApp(overrides: Record<string, string> = {}) {
  const config = loadConfig({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', LOGIN_RATE_LIMIT: '1000', MAIL_RETRY_SECONDS: '0.2', ...overrides });
  const handle = createApp(config);
  afterAll(async () => {
    await handle.mail.stop();
    await handle.pool.end();
    await closeDatabase();
  });
  return { ...handle, config };
}

export async function waitFor<T>(check: () => Promise<T | null | undefined | false>, { timeoutMs = 10_000, what = 'condition' } = {}): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value) return value;
    if (Date.now() > until) throw new Error(`Timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

/** What the local SMTP server received for an address (every test process's server writes to the same table). */
export async function receivedFor(address: string): Promise<MailboxMessage[]> {
  return MailboxMessage.findAll({ where: { recipients: { [Op.contains]: [address.toLowerCase()] } }, order: [['receivedAt', 'ASC']] });
}

/** Waits until `count` messages reached the address and returns them parsed from their RFC 5322 source. */
export async function waitForMail(address: string, count = 1, timeoutMs = 10_000): Promise<ParsedMail[]> {
  const rows = await waitFor(async () => {
    const found = await receivedFor(address);
    return found.length >= count ? found : null;
  }, { timeoutMs, what: `${count} message(s) to ${address}` });
  return Promise.all(rows.map((row) => simpleParser(row.raw)));
}

export async function outboxFor(address: string): Promise<OutboundEmail[]> {
  return OutboundEmail.findAll({ where: { toAddress: address }, order: [['createdAt', 'ASC']] });
}
