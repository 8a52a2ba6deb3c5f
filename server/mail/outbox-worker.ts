import { Op, type Transaction } from 'sequelize';
import type { Transporter } from 'nodemailer';
import type { Logger } from 'pino';
import { OutboundEmail } from '../models';

/** Messages without a date of their own are given up after this long (an outage of three days). */
export const MAX_MESSAGE_AGE_MS = 72 * 3_600_000;
const MAX_RETRY_DELAY_MS = 15 * 60_000;
const BATCH = 10;

type SendError = Error & { code?: string; command?: string; responseCode?: number };

/**
 * A refusal that will not change by trying again: the server rejected this recipient or this message (5xx to
 * RCPT or DATA). A 5xx to the login or the sender is our configuration, which an admin fixes, so those wait.
 */
export function isPermanentFailure(error: SendError): boolean {
  const code = error.responseCode;
  if (typeof code !== 'number' || code < 500) return false;
  const command = (error.command ?? '').toUpperCase();
  return command.startsWith('RCPT') || command === 'DATA' || error.code === 'EMESSAGE';
}

export function retryDelayMs(attempts: number, retrySeconds: number): number {
  return Math.min(retrySeconds * 1000 * 2 ** Math.max(0, attempts - 1), MAX_RETRY_DELAY_MS);
}

export interface OutboxWorkerOptions {
  /** The transport to send with now, or null while there is none (then messages wait). */
  transport: () => Promise<Transporter | null>;
  from: string;
  /** 0: sweep only the messages this process queued or already tried. */
  pollSeconds: number;
  retrySeconds: number;
  logger: Logger;
}

/**
 * Sends what waits in the outbox. Each message is claimed with `FOR UPDATE SKIP LOCKED` inside the
 * transaction that marks it sent, so two processes (or two passes) never send the same message; a failed
 * send leaves it pending with a later `next_attempt_at`, doubling the wait each time.
 */
export class OutboxWorker {
  private readonly watched = new Set<string>();
  private pollTimer: NodeJS.Timeout | null = null;
  private retryTimer: NodeJS.Timeout | null = null;
  private current: Promise<void> | null = null;
  private again: 'watched' | 'all' | null = null;
  private stopped = false;
  private warnedNoTransport = false;

  constructor(private readonly options: OutboxWorkerOptions) {}

  start(): void {
    if (this.options.pollSeconds > 0) {
      this.pollTimer = setInterval(() => void this.run('all'), this.options.pollSeconds * 1000);
      this.pollTimer.unref();
      void this.run('all');
    }
  }

  async stop(): Promise<void> {
    this.stopped = true;
    if (this.pollTimer) clearInterval(this.pollTimer);
    if (this.retryTimer) clearTimeout(this.retryTimer);
    await this.current?.catch(() => undefined);
  }

  /** Called after a transaction that queued messages commits: send them now rather than at the next sweep. */
  kick(ids: string[]): void {
    for (const id of ids) this.watched.add(id);
    void this.run('watched');
  }

  /** One pass now; `all` also takes messages other processes queued (used by the sweep and by tests). */
  run(scope: 'watched' | 'all' = 'watched'): Promise<void> {
    if (this.stopped) return Promise.resolve();
    if (this.current) {
      this.again = this.again === 'all' || scope === 'all' ? 'all' : 'watched';
      return this.current;
    }
    this.current = this.pass(scope)
      .catch((error) => {
        if (!this.stopped) this.options.logger.warn({ err: error }, 'outbox pass failed');
      })
      .finally(() => {
        this.current = null;
        const next = this.again;
        this.again = null;
        if (next && !this.stopped) void this.run(next);
        else void this.scheduleRetry();
      });
    return this.current;
  }

  private async pass(scope: 'watched' | 'all'): Promise<void> {
    if (scope === 'watched' && this.watched.size === 0) return;
    const transport = await this.options.transport();
    if (!transport) {
      if (!this.warnedNoTransport) this.options.logger.warn('no SMTP server configured: messages wait in the outbox');
      this.warnedNoTransport = true;
      return;
    }
    for (;;) {
      const handled = await this.sendBatch(transport, scope === 'watched' ? [...this.watched] : null);
      if (handled < BATCH || this.stopped) return;
    }
  }

  private async sendBatch(transport: Transporter, ids: string[] | null): Promise<number> {
    const sequelize = OutboundEmail.sequelize!;
    return sequelize.transaction(async (transaction) => {
      const rows = await OutboundEmail.findAll({
        where: { status: 'pending', nextAttemptAt: { [Op.lte]: new Date() }, ...(ids ? { id: { [Op.in]: ids } } : {}) },
        order: [['nextAttemptAt', 'ASC']],
        limit: BATCH,
        lock: transaction.LOCK.UPDATE,
        skipLocked: true,
        transaction,
      });
      for (const row of rows) {
        this.watched.add(row.id);
        await this.sendOne(transport, row, transaction);
        if (row.status !== 'pending') this.watched.delete(row.id);
      }
      return rows.length;
    });
  }

  private async sendOne(transport: Transporter, row: OutboundEmail, transaction: Transaction): Promise<void> {
    const now = new Date();
    const outOfDate = row.discardAfter ? row.discardAfter <= now : now.getTime() - row.createdAt.getTime() > MAX_MESSAGE_AGE_MS;
    if (outOfDate) {
      await row.update({ status: 'failed-permanently', lastError: 'Not sent: it went out of date while the SMTP server could not be reached.' }, { transaction });
      return;
    }
    try {
      await transport.sendMail({
        from: this.options.from,
        to: row.toAddress,
        subject: row.subject,
        text: row.text,
        ...(row.html ? { html: row.html } : {}),
        attachments: row.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.contentBase64, 'base64') })),
        messageId: row.messageId,
        // Asks mail systems not to answer with out-of-office replies (RFC 3834).
        headers: { 'Auto-Submitted': 'auto-generated' },
      });
      await row.update({ status: 'sent', sentAt: new Date(), attempts: row.attempts + 1, lastError: null }, { transaction });
    } catch (caught) {
      const error = caught as SendError;
      const attempts = row.attempts + 1;
      const permanent = isPermanentFailure(error);
      const lastError = `${error.code ?? 'error'}${error.responseCode ? ` ${error.responseCode}` : ''}: ${error.message}`.slice(0, 2000);
      await row.update(
        permanent
          ? { status: 'failed-permanently', attempts, lastError }
          : { attempts, lastError, nextAttemptAt: new Date(Date.now() + retryDelayMs(attempts, this.options.retrySeconds)) },
        { transaction },
      );
      this.options.logger.warn({ outboundEmailId: row.id, attempts, permanent, err: { message: error.message, code: error.code } }, 'e-mail not sent');
    }
  }

  /** Wakes up when the earliest message this process is watching falls due again. */
  private async scheduleRetry(): Promise<void> {
    if (this.stopped || this.watched.size === 0) return;
    try {
      const rows = await OutboundEmail.findAll({ where: { id: { [Op.in]: [...this.watched] } }, attributes: ['id', 'status', 'nextAttemptAt'] });
      for (const row of rows) if (row.status !== 'pending') this.watched.delete(row.id);
      for (const id of [...this.watched]) if (!rows.some((r) => r.id === id)) this.watched.delete(id);
      const pending = rows.filter((r) => r.status === 'pending');
      if (!pending.length || this.stopped) return;
      const due = Math.min(...pending.map((r) => r.nextAttemptAt.getTime()));
      if (this.retryTimer) clearTimeout(this.retryTimer);
      this.retryTimer = setTimeout(() => void this.run('watched'), Math.max(50, due - Date.now()));
      this.retryTimer.unref();
    } catch (error) {
      if (!this.stopped) this.options.logger.warn({ err: error }, 'outbox retry could not be scheduled');
    }
  }
}
