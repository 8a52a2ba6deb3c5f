/** Outbox and mailbox shapes shared by the server and the mailbox screen. */

export const outboundStatuses = ['pending', 'sent', 'failed-permanently'] as const;
export type OutboundStatus = (typeof outboundStatuses)[number];

export const outboundKinds = ['home-care', 'run-alert', 'invitation', 'password-reset'] as const;
export type OutboundKind = (typeof outboundKinds)[number];

/** An attachment as the outbox keeps it until the message is sent. */
export interface StoredAttachment {
  filename: string;
  contentType: string;
  contentBase64: string;
}

/** One message ready for the outbox: text always, HTML beside it, never a tracking pixel or a tracked link. */
export interface MailContent {
  subject: string;
  text: string;
  html: string;
  attachments?: StoredAttachment[];
}

export interface MailboxListItem {
  id: string;
  to: string[];
  from: string | null;
  subject: string | null;
  receivedAt: string;
  byteSize: number;
}

export interface MailboxAttachmentView {
  index: number;
  filename: string | null;
  contentType: string;
  size: number;
}

export interface MailboxMessageView extends MailboxListItem {
  text: string | null;
  html: string | null;
  attachments: MailboxAttachmentView[];
}
