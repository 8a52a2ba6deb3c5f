import nodemailer, { type Transporter } from 'nodemailer';
import { pino, type Logger } from 'pino';
import type { Config } from '../config';
import { configureOutbox, releaseOutbox } from '../services/mail-outbox-service';
import { fakeSmtpServer, type FakeSmtpServer } from './fake-smtp-server';
import { OutboxWorker } from './outbox-worker';

export interface MailRuntime {
  /** The local fake SMTP server, outside production when no SMTP host is configured. */
  readonly fakeServer: FakeSmtpServer | null;
  readonly worker: OutboxWorker;
  /** Settles once the fake server listens (at once when there is none). */
  readonly ready: Promise<void>;
  stop(): Promise<void>;
}

/**
 * E-mail inside the server process: the outbox worker, and outside production without SMTP_HOST a local
 * SMTP server that receives everything, so `npm start` and `npm test` need nothing else running.
 */
export function startMail(config: Config, logger: Logger = pino({ level: config.logLevel })): MailRuntime {
  const mail = config.mail;
  const fakeServer = mail.fakeServer ? fakeSmtpServer({ port: mail.smtpPort, logger }) : null;
  const ready = fakeServer
    ? fakeServer
        .start()
        .then(() => logger.info(`local SMTP server (mailbox for admins at /mailbox) on ${fakeServer.host}:${fakeServer.port}`))
        .catch((error) => {
          logger.error({ err: error }, 'the local SMTP server did not start; messages wait in the outbox');
        })
    : Promise.resolve();

  let cached: { port: number; transport: Transporter } | null = null;
  const transport = async (): Promise<Transporter | null> => {
    await ready;
    if (fakeServer) {
      // A stopped fake server stands for an SMTP outage: sending is tried, and fails, as it would for real.
      if (cached?.port !== fakeServer.port) {
        cached = {
          port: fakeServer.port,
          transport: nodemailer.createTransport({ host: fakeServer.host, port: fakeServer.port, secure: false, ignoreTLS: true, connectionTimeout: 5000, greetingTimeout: 5000, socketTimeout: 15000 }),
        };
      }
      return cached.transport;
    }
    if (!mail.smtpHost) return null;
    if (!cached) {
      cached = {
        port: mail.smtpPort,
        transport: nodemailer.createTransport({
          host: mail.smtpHost,
          port: mail.smtpPort,
          secure: mail.smtpSecure,
          // Without implicit TLS, insist on STARTTLS: patient details never cross the network in clear text.
          requireTLS: !mail.smtpSecure,
          ...(mail.smtpUser ? { auth: { user: mail.smtpUser, pass: mail.smtpPassword ?? '' } } : {}),
          connectionTimeout: 10_000,
          greetingTimeout: 10_000,
          socketTimeout: 30_000,
        }),
      };
    }
    return cached.transport;
  };

  const worker = new OutboxWorker({ transport, from: mail.from, pollSeconds: mail.pollSeconds, retrySeconds: mail.retrySeconds, logger });
  const outboxToken = configureOutbox({ appUrl: config.appUrl, from: mail.from, worker, logger });
  worker.start();

  return {
    fakeServer,
    worker,
    ready,
    async stop() {
      releaseOutbox(outboxToken);
      await worker.stop();
      await fakeServer?.stop();
    },
  };
}
