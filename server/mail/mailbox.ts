import { simpleParser, type ParsedMail } from 'mailparser';
import type { SessionUser } from '../../shared/auth/schemas';
import type { MailboxListItem, MailboxMessageView } from '../../shared/mail/outbox';
import { AppError } from '../errors';
import { MailboxMessage } from '../models';

/** What the local fake SMTP server received for the admin's clinic, newest first (outside production only). */

function toListItem(m: MailboxMessage, from: string | null = m.envelopeFrom): MailboxListItem {
  return { id: m.id, to: m.recipients, from, subject: m.subject, receivedAt: m.receivedAt.toISOString(), byteSize: m.byteSize };
}

export async function listMailbox(actor: SessionUser, filter: { to?: string } = {}): Promise<MailboxListItem[]> {
  const rows = await MailboxMessage.findAll({
    where: { clinicId: actor.clinicId },
    attributes: ['id', 'recipients', 'envelopeFrom', 'subject', 'receivedAt', 'byteSize'],
    order: [['receivedAt', 'DESC']],
    limit: 200,
  });
  const to = filter.to?.toLowerCase();
  return rows.filter((m) => !to || m.recipients.includes(to)).map((m) => toListItem(m));
}

async function findMessage(actor: SessionUser, id: string): Promise<{ row: MailboxMessage; parsed: ParsedMail }> {
  const row = await MailboxMessage.findOne({ where: { id, clinicId: actor.clinicId } });
  if (!row) throw AppError.notFound('Message');
  return { row, parsed: await simpleParser(row.raw) };
}

export async function getMailboxMessage(actor: SessionUser, id: string): Promise<MailboxMessageView> {
  const { row, parsed } = await findMessage(actor, id);
  return {
    ...toListItem(row, parsed.from?.text ?? row.envelopeFrom),
    text: parsed.text ?? null,
    html: typeof parsed.html === 'string' ? parsed.html : null,
    attachments: parsed.attachments.map((a, index) => ({ index, filename: a.filename ?? null, contentType: a.contentType, size: a.size })),
  };
}

export async function getMailboxAttachment(actor: SessionUser, id: string, index: number) {
  const { parsed } = await findMessage(actor, id);
  const attachment = parsed.attachments[index];
  if (!attachment) throw AppError.notFound('Attachment');
  return attachment;
}

export async function getMailboxRaw(actor: SessionUser, id: string): Promise<Buffer> {
  const row = await MailboxMessage.findOne({ where: { id, clinicId: actor.clinicId }, attributes: ['raw'] });
  if (!row) throw AppError.notFound('Message');
  return row.raw;
}
