import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { SessionNoteView } from '../../../shared/notes/responses';
import { NoteEditor } from '../../../src/features/notes/components/note-editor';
import { NoteReviewPanel } from '../../../src/features/notes/components/note-review-panel';
import { fakeServer, renderAt, uuid } from './harness';

const runId = uuid(77);

const note = (patch: Partial<SessionNoteView> = {}): SessionNoteView => ({
  id: uuid(78),
  runId,
  subjective: 'Pain 4/10 (NPRS).',
  objective: 'Ice massage 6 min, completed.',
  assessment: 'Proliferative phase.',
  plan: 'Re-check girth in 48 h.',
  status: 'submitted',
  submittedAt: '2026-11-20T11:00:00.000Z',
  submittedByName: 'Tamsin Ruel',
  signedAt: null,
  signedByName: null,
  signOffComment: null,
  locked: false,
  updatedAt: '2026-11-20T11:00:00.000Z',
  ...patch,
});

const signed = (comment: string | null) =>
  note({ status: 'signed', locked: true, signedAt: '2026-11-21T09:30:00.000Z', signedByName: 'Owen Halloway', signOffComment: comment });

afterEach(() => vi.unstubAllGlobals());

describe('the sign-off form on the review desk', () => {
  it('signs off a submitted note with the comment and hands the signed note on', async () => {
    const calls = fakeServer((method, url, body) =>
      method === 'POST' && url === `/api/runs/${runId}/sign-off` ? { body: { note: signed((body as { comment?: string }).comment ?? null) } } : undefined,
    );
    const onChanged = vi.fn();
    renderAt(<NoteReviewPanel runId={runId} note={note()} canSignOff onChanged={onChanged} />);
    expect(screen.getByTestId('note-status')).toHaveTextContent('Submitted — waiting for sign-off');
    expect(screen.getByText('Ice massage 6 min, completed.')).toBeInTheDocument();

    await userEvent.type(screen.getByLabelText('Sign-off comment (optional)'), '  Good call to stop the ice at 6 min. ');
    await userEvent.click(screen.getByRole('button', { name: 'Sign off the note' }));

    await waitFor(() => expect(onChanged).toHaveBeenCalled());
    expect(calls).toEqual([{ method: 'POST', url: `/api/runs/${runId}/sign-off`, body: { comment: 'Good call to stop the ice at 6 min.' } }]);
    expect(onChanged.mock.calls[0][0]).toMatchObject({ status: 'signed', signOffComment: 'Good call to stop the ice at 6 min.' });
  });

  it('sends no comment at all when the box is left empty', async () => {
    const calls = fakeServer((method, url) => (method === 'POST' && url.endsWith('/sign-off') ? { body: { note: signed(null) } } : undefined));
    renderAt(<NoteReviewPanel runId={runId} note={note()} canSignOff />);
    await userEvent.click(screen.getByRole('button', { name: 'Sign off the note' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0].body).toEqual({});
  });

  it("shows the server's refusal above the form", async () => {
    fakeServer((method, url) =>
      method === 'POST' && url.endsWith('/sign-off') ? { status: 409, body: { error: { code: 'conflict', message: 'Only a submitted note can be signed off.' } } } : undefined,
    );
    renderAt(<NoteReviewPanel runId={runId} note={note()} canSignOff />);
    await userEvent.click(screen.getByRole('button', { name: 'Sign off the note' }));
    expect(await screen.findByText('Only a submitted note can be signed off.')).toBeInTheDocument();
  });

  it('offers no sign-off for a draft, nor to an admin', () => {
    fakeServer(() => undefined);
    const { unmount } = renderAt(<NoteReviewPanel runId={runId} note={note({ status: 'draft', submittedAt: null, submittedByName: null })} canSignOff />);
    expect(screen.queryByRole('button', { name: 'Sign off the note' })).toBeNull();
    expect(screen.getByText(/it can be signed once the therapist submits it/)).toBeInTheDocument();
    unmount();
    renderAt(<NoteReviewPanel runId={runId} note={note()} canSignOff={false} />);
    expect(screen.queryByRole('button', { name: 'Sign off the note' })).toBeNull();
  });

  it('shows who signed and when on a signed note, and reopens it only with a reason of 5 characters or more', async () => {
    const calls = fakeServer((method, url, body) =>
      method === 'POST' && url === `/api/runs/${runId}/note/reopen` ? { body: { note: note({ status: 'draft', locked: false, ...(body as object) }) } } : undefined,
    );
    renderAt(<NoteReviewPanel runId={runId} note={signed('Well documented.')} canSignOff />);
    expect(screen.getByTestId('note-signed')).toHaveTextContent(/^Signed by Owen Halloway on 21 Nov 2026/);
    expect(screen.getByText('Comment: “Well documented.”')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Sign off the note' })).toBeNull();

    await userEvent.click(screen.getByRole('button', { name: 'Reopen the note…' }));
    const form = screen.getByRole('form', { name: 'Reopen the note' });
    await userEvent.type(within(form).getByLabelText('Why reopen it?'), 'typo');
    await userEvent.click(within(form).getByRole('button', { name: 'Reopen the note' }));
    expect(await within(form).findByText('Give a reason of at least 5 characters')).toBeInTheDocument();
    expect(calls).toHaveLength(0);

    await userEvent.type(within(form).getByLabelText('Why reopen it?'), ' in the plan');
    await userEvent.click(within(form).getByRole('button', { name: 'Reopen the note' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0].body).toEqual({ reason: 'typo in the plan' });
  });
});

describe("the therapist's note on the run summary", () => {
  it('shows a signed note as locked text with the sign-off, with nothing to edit', async () => {
    fakeServer((method, url) => (method === 'GET' && url === `/api/runs/${runId}/note` ? { body: { note: signed('Fine.') } } : undefined));
    renderAt(<NoteEditor runId={runId} canEdit />);
    expect(await screen.findByTestId('note-signed')).toHaveTextContent('Signed by Owen Halloway');
    expect(screen.getByTestId('note-status')).toHaveTextContent('Signed — locked');
    expect(screen.getByText('Re-check girth in 48 h.')).toBeInTheDocument();
    expect(screen.queryByRole('textbox')).toBeNull();
    expect(screen.queryByRole('button', { name: /Submit|Save/ })).toBeNull();
  });

  it('saves the edited draft and then submits it', async () => {
    const draft = note({ status: 'draft', submittedAt: null, submittedByName: null });
    const calls = fakeServer((method, url, body) => {
      if (method === 'GET' && url === `/api/runs/${runId}/note`) return { body: { note: draft } };
      if (method === 'PUT' && url === `/api/runs/${runId}/note`) return { body: { note: { ...draft, ...(body as object) } } };
      if (method === 'POST' && url === `/api/runs/${runId}/note/submit`) return { body: { note: note({ plan: 'Re-check girth in 24 h.' }) } };
      return undefined;
    });
    renderAt(<NoteEditor runId={runId} canEdit />);
    const plan = await screen.findByLabelText('P — Plan');
    await userEvent.clear(plan);
    await userEvent.type(plan, 'Re-check girth in 24 h.');
    await userEvent.click(screen.getByRole('button', { name: 'Submit for sign-off' }));

    await waitFor(() => expect(screen.getByTestId('note-status')).toHaveTextContent('Submitted — waiting for sign-off'));
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual([`GET /api/runs/${runId}/note`, `PUT /api/runs/${runId}/note`, `POST /api/runs/${runId}/note/submit`]);
    expect(calls[1].body).toEqual({ subjective: draft.subjective, objective: draft.objective, assessment: draft.assessment, plan: 'Re-check girth in 24 h.' });
  });

  it('puts a field error from the server beside its section', async () => {
    const draft = note({ status: 'draft' });
    fakeServer((method, url) => {
      if (method === 'GET') return { body: { note: draft } };
      if (method === 'PUT' && url.endsWith('/note')) return { status: 400, body: { error: { code: 'invalid', message: 'Check the note', fields: { assessment: 'Assessment must be at most 8000 characters' } } } };
      return undefined;
    });
    renderAt(<NoteEditor runId={runId} canEdit />);
    await userEvent.type(await screen.findByLabelText('A — Assessment'), ' More.');
    await userEvent.click(screen.getByRole('button', { name: 'Save draft' }));
    expect(await screen.findByText('Assessment must be at most 8000 characters')).toBeInTheDocument();
    expect(screen.getByLabelText('A — Assessment')).toHaveAttribute('aria-invalid', 'true');
  });
});
