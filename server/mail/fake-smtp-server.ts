import type { AddressInfo } from 'node:net';
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import { simpleParser } from 'mailparser';
import type { Logger } from 'pino';
import { MailboxMessage, OutboundEmail } from '../models';

/** The largest message the fake server takes; ours are a few kilobytes plus a small .ics. */
const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

export interface FakeSmtpServer {
  readonly host: string;
  /** The port it listens on, or last listened on while stopped. */
  readonly port: number;
  readonly running: boolean;
  /** Listens again on the same port (tests stop it to stand in for an SMTP outage). */
  start(): Promise<void>;
  stop(): Promise<void>;
}

async function readAll(stream: SMTPServerDataStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

/** Keeps a received message whole, with the clinic of the outbox row it came from when there is one. */
async function storeMessage(raw: Buffer, session: SMTPServerSession): Promise<void> {
  const parsed = await simpleParser(raw, { skipHtmlToText: true, skipTextToHtml: true, skipImageLinks: true });
  const messageId = parsed.messageId ?? null;
  const origin = messageId ? await OutboundEmail.findOne({ where: { messageId }, attributes: ['clinicId'] }) : null;
  const mailFrom = session.envelope.mailFrom;
  await MailboxMessage.create({
    clinicId: origin?.clinicId ?? null,
    messageId: messageId?.slice(0, 300) ?? null,
    envelopeFrom: mailFrom ? mailFrom.address.slice(0, 254) : null,
    recipients: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
    subject: parsed.subject?.slice(0, 500) ?? null,
    raw,
    byteSize: raw.length,
  });
}

/**
 * A real SMTP server on loopback that keeps every message it receives in PostgreSQL (mailbox_messages), so
 * the demo and the tests send through the same nodemailer path as production. Never started in production.
 */
export function fakeSmtpServer(options: { port: number; logger: Logger }): FakeSmtpServer {
  const host = '127.0.0.1';
  let port = options.port;
  let server: SMTPServer | null = null;

  const create = () =>
    new SMTPServer({
      name: 'mendstep-local-mailbox',
      secure: false,
      // Loopback only, nothing to protect in transit, and no certificate to trust: plain SMTP, no login.
      disabledCommands: ['STARTTLS', 'AUTH'],
      authOptional: true,
      logger: false,
      size: MAX_MESSAGE_BYTES,
      closeTimeout: 1000,
      onData(stream, session, callback) {
        readAll(stream)
          .then(async (raw) => {
            if (stream.sizeExceeded) {
              const error = new Error('Message too large for the local mailbox') as Error & { responseCode: number };
              error.responseCode = 552;
              throw error;
            }
            await storeMessage(raw, session);
          })
          // Not accepted unless stored: the sender keeps the message in its outbox and tries again.
          .then(() => callback(), (error: Error & { responseCode?: number }) => {
            options.logger.warn({ err: error }, 'local mailbox could not store a message');
            if (!error.responseCode) error.responseCode = 451;
            callback(error);
          });
      },
    });

  const listen = (s: SMTPServer, wanted: number) =>
    new Promise<number>((resolve, reject) => {
      const onError = (error: Error) => reject(error);
      s.server.once('error', onError);
      s.listen(wanted, host, () => {
        s.server.off('error', onError);
        resolve((s.server.address() as AddressInfo).port);
      });
    });

  return {
    host,
    get port() {
      return port;
    },
    get running() {
      return server !== null;
    },
    async start() {
      if (server) return;
      const s = create();
      s.on('error', (error) => options.logger.warn({ err: error }, 'local SMTP server error'));
      try {
        port = await listen(s, port);
      } catch (error) {
        // Another checkout's server may hold the usual port: any free port does, since only we send to it.
        if ((error as NodeJS.ErrnoException).code !== 'EADDRINUSE' || port === 0) throw error;
        options.logger.warn(`port ${port} is taken; the local SMTP server listens on a free port instead`);
        port = await listen(s, 0);
      }
      // It must never keep a process (a test run) alive by itself.
      s.server.unref();
      server = s;
    },
    async stop() {
      const s = server;
      if (!s) return;
      server = null;
      await new Promise<void>((resolve) => s.close(() => resolve()));
    },
  };
}
