import { randomUUID } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import { pino, type Logger } from 'pino';
import type { MailContent, OutboundKind } from '../../shared/mail/outbox';
import type { OutboxWorker } from '../mail/outbox-worker';
import { OutboundEmail } from '../models';

interface OutboxSettings {
  appUrl: string;
  from: string;
  worker: OutboxWorker | null;
  logger: Logger;
}

const fallback: OutboxSettings = {
  appUrl: 'http://127.0.0.1:3000',
  from: 'Mendstep <no-reply@mendstep.invalid>',
  worker: null,
  logger: pino({ level: 'silent' }),
};
// Apps started in one process (tests start several) stack: the newest running one is used, and stopping it
// hands back to the one before.
const configured: { token: symbol; settings: OutboxSettings }[] = [];
const current = (): OutboxSettings => configured.at(-1)?.settings ?? fallback;

/** Set by the mail runtime when the app starts: where links point and which worker to wake. */
export function configureOutbox(next: OutboxSettings): symbol {
  const token = Symbol('outbox owner');
  configured.push({ token, settings: next });
  return token;
}

export function releaseOutbox(token: symbol): void {
  const index = configured.findIndex((entry) => entry.token === token);
  if (index >= 0) configured.splice(index, 1);
}

export function outboxSettings(): Readonly<OutboxSettings> {
  return current();
}

/** A link into the app, e.g. appLink('/review/runs/…'). */
export function appLink(pathAndQuery: string): string {
  return `${current().appUrl}${pathAndQuery}`;
}

function messageIdDomain(from: string): string {
  const address = /<([^>]+)>/.exec(from)?.[1] ?? from;
  const domain = address.split('@')[1]?.trim();
  return domain && /^[A-Za-z0-9.-]+$/.test(domain) ? domain : 'mendstep.invalid';
}

export interface QueuedMail {
  clinicId: string;
  kind: OutboundKind;
  to: string;
  content: MailContent;
  /** The same key is queued once, whoever asks again (a retried request, a second notification). */
  dedupeKey?: string;
  /** Not sent after this time: the message would mislead (today's cold schedule, an expired link). */
  discardAfter?: Date | null;
}

/**
 * Puts messages in the outbox inside the caller's transaction, so they exist exactly when what caused them
 * does; the worker is woken once that transaction commits. Returns the ids of the rows written (a message
 * whose dedupe key is already queued is skipped).
 */
export async function enqueueMail(mails: QueuedMail[], transaction: Transaction): Promise<string[]> {
  const settings = current();
  const domain = messageIdDomain(settings.from);
  const ids: string[] = [];
  for (const mail of mails) {
    const id = randomUUID();
    const rows = await OutboundEmail.sequelize!.query<{ id: string }>(
      `INSERT INTO outbound_emails (id, clinic_id, kind, dedupe_key, to_address, subject, text, html, attachments, message_id, discard_after)
       VALUES (:id, :clinicId, :kind, :dedupeKey, :to, :subject, :text, :html, CAST(:attachments AS jsonb), :messageId, :discardAfter)
       ON CONFLICT (dedupe_key) DO NOTHING
       RETURNING id`,
      {
        type: QueryTypes.SELECT,
        transaction,
        replacements: {
          id,
          clinicId: mail.clinicId,
          kind: mail.kind,
          dedupeKey: mail.dedupeKey ?? null,
          to: mail.to,
          subject: mail.content.subject.slice(0, 300),
          text: mail.content.text,
          html: mail.content.html,
          attachments: JSON.stringify(mail.content.attachments ?? []),
          messageId: `<${id}@${domain}>`,
          discardAfter: mail.discardAfter ?? null,
        },
      },
    );
    if (rows.length) ids.push(id);
  }
  if (ids.length) {
    transaction.afterCommit(() => settings.worker?.kick(ids));
  }
  return ids;
}

const inFlight = new Set<Promise<unknown>>();

/**
 * Runs work that must not hold up (or fail) the request that caused it, such as queueing the messages of a
 * finished run; a failure is logged, never thrown at the caller.
 */
export function runInBackground(label: string, work: () => Promise<unknown>): void {
  const task = work()
    .catch((error) => current().logger.error({ err: error }, `${label} failed`))
    .finally(() => inFlight.delete(task));
  inFlight.add(task);
}

/** Waits for background mail work started so far (tests, and a graceful shutdown). */
export async function settleBackgroundMail(): Promise<void> {
  while (inFlight.size) await Promise.allSettled([...inFlight]);
}
