import { Inbox, Mail, MailOpen, Paperclip } from 'lucide-react';
import { ApiError } from '../../../lib/api-client';
import { Notice } from '../../../components/ui/notice';
import { useMailbox } from '../api/get-mailbox';
import { attachmentUrl, useMailboxMessage } from '../api/get-mailbox-message';

const when = (iso: string) => new Date(iso).toLocaleString('en-GB', { weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

function formatSize(bytes: number): string {
  return bytes < 1024 ? `${bytes} B` : `${(bytes / 1024).toFixed(1)} kB`;
}

/**
 * What Mendstep sent, as the local SMTP server received it: for checking the e-mails of the demo and of
 * development. Production has no such mailbox (the API answers 404 there).
 */
export function MailboxScreen({ selectedId, onSelect }: { selectedId: string | null; onSelect: (id: string) => void }) {
  const mailbox = useMailbox();

  if (mailbox.isPending) return <p className="text-ink-muted">Loading the mailbox…</p>;
  if (mailbox.isError) {
    const absent = mailbox.error instanceof ApiError && mailbox.error.status === 404;
    return (
      <Notice kind={absent ? 'info' : 'error'} title={absent ? 'No mailbox here' : 'Could not load the mailbox'}>
        {absent ? 'The local mailbox exists only outside production. Here, e-mail goes to the clinic’s SMTP server.' : mailbox.error.message}
      </Notice>
    );
  }

  return (
    <div className="flex flex-col gap-4">
      <Notice title="Local mailbox">
        Every e-mail Mendstep sent for your clinic while running without an SMTP server: home-care plans, supervisor alerts, invitations and password
        resets. Nothing here left this computer.
      </Notice>
      <div className="grid gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <section aria-label="Messages" className="self-start rounded-xl bg-paper-raised ring-1 ring-ink/10">
          <h2 className="flex items-center gap-2 border-b border-ink/10 px-4 py-3 text-lg font-semibold">
            <Inbox aria-hidden className="h-5 w-5" /> Received ({mailbox.data.length})
          </h2>
          {mailbox.data.length === 0 ? (
            <p className="p-4 text-ink-muted">No messages yet. Finish a run for an athlete with an e-mail address, or invite a colleague.</p>
          ) : (
            <ul className="max-h-[70vh] overflow-y-auto">
              {mailbox.data.map((item) => {
                const selected = item.id === selectedId;
                return (
                  <li key={item.id} className="border-b border-ink/10 last:border-b-0">
                    <button
                      type="button"
                      aria-current={selected ? 'true' : undefined}
                      onClick={() => onSelect(item.id)}
                      className={`flex min-h-target w-full flex-col items-start gap-0.5 px-4 py-3 text-left ${selected ? 'bg-paper-sunk' : 'hover:bg-paper'}`}
                    >
                      <span className="flex items-center gap-2 font-semibold">
                        {selected ? <MailOpen aria-hidden className="h-4 w-4 shrink-0" /> : <Mail aria-hidden className="h-4 w-4 shrink-0" />}
                        {item.subject ?? '(no subject)'}
                      </span>
                      <span className="text-sm text-ink-soft">To {item.to.join(', ')}</span>
                      <span className="text-xs text-ink-muted">{when(item.receivedAt)}</span>
                    </button>
                  </li>
                );
              })}
            </ul>
          )}
        </section>
        {selectedId ? <MessageView id={selectedId} /> : <p className="self-start rounded-xl bg-paper-raised p-4 text-ink-muted ring-1 ring-ink/10">Choose a message to read it.</p>}
      </div>
    </div>
  );
}

function MessageView({ id }: { id: string }) {
  const message = useMailboxMessage(id);
  if (message.isPending) return <p className="text-ink-muted">Opening the message…</p>;
  if (message.isError) return <Notice kind="error" title="Could not open the message">{message.error.message}</Notice>;
  const m = message.data;
  return (
    <article aria-label="Message" className="flex min-w-0 flex-col gap-4 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
      <header>
        <h2 className="text-xl font-semibold">{m.subject ?? '(no subject)'}</h2>
        <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 text-sm">
          <dt className="text-ink-muted">From</dt>
          <dd>{m.from ?? 'unknown'}</dd>
          <dt className="text-ink-muted">To</dt>
          <dd>{m.to.join(', ')}</dd>
          <dt className="text-ink-muted">Received</dt>
          <dd>{when(m.receivedAt)}</dd>
        </dl>
      </header>
      {m.attachments.length ? (
        <section aria-label="Attachments">
          <h3 className="flex items-center gap-2 font-semibold">
            <Paperclip aria-hidden className="h-4 w-4" /> Attachments
          </h3>
          <ul className="mt-1 flex flex-col gap-1">
            {m.attachments.map((a) => (
              <li key={a.index}>
                <a href={attachmentUrl(m.id, a.index)} className="inline-flex min-h-target items-center font-medium underline underline-offset-4" download={a.filename ?? undefined}>
                  {a.filename ?? `attachment ${a.index + 1}`}
                </a>{' '}
                <span className="text-sm text-ink-muted">
                  {a.contentType}, {formatSize(a.size)}
                </span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      {m.html ? (
        <section aria-label="HTML version">
          <h3 className="mb-1 font-semibold">As the recipient sees it</h3>
          {/* No scripts, no same-origin access, no navigation: the message is shown, never run. */}
          <iframe title="HTML version of the message" sandbox="" srcDoc={m.html} className="h-[32rem] w-full rounded-lg border border-ink/20 bg-white" />
        </section>
      ) : null}
      {m.text ? (
        <section aria-label="Text version">
          <h3 className="mb-1 font-semibold">Text version</h3>
          <pre className="max-h-96 overflow-auto whitespace-pre-wrap rounded-lg bg-paper p-3 font-sans text-sm">{m.text}</pre>
        </section>
      ) : null}
    </article>
  );
}
