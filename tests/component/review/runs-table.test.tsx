import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { AdherenceReport, ReviewRunRow } from '../../../shared/review/responses';
import { ReviewDesk } from '../../../src/features/review/components/review-desk';
import { currentLocation, fakeServer, renderAt, stubResizeObserver, uuid } from './harness';

const therapistId = uuid(901);
const athleteId = uuid(902);

const row = (n: number, patch: Partial<ReviewRunRow> = {}): ReviewRunRow => ({
  id: uuid(n),
  createdAt: '2026-11-20T10:00:00.000Z',
  startedAt: '2026-11-20T10:02:00.000Z',
  endedAt: '2026-11-20T10:30:00.000Z',
  athleteId,
  athleteName: `Athlete ${n}`,
  therapistId,
  therapistName: 'Tamsin Ruel',
  injuryId: uuid(500 + n),
  injuryLabel: 'anterior thigh, left',
  phase: 'proliferative',
  status: 'completed',
  outcome: 'completed',
  runOutcome: 'completed',
  noteStatus: 'draft',
  attention: [],
  ...patch,
});

const figures = { runs: 0, iceMassageSteps: 0, iceMassageWithinBounds: 0, iceMassageShare: null, fallbacks: 0, fallbackRate: 0, skippedSteps: 0, totalSteps: 0, skippedRate: 0, runsPerPhase: { acute: 0, proliferative: 0, remodelling: 0 } };
const adherence: AdherenceReport = { from: '2026-11-01', to: '2026-11-28', clinic: figures, therapists: [] };

function deskServer(items: ReviewRunRow[] = [row(1)]) {
  return fakeServer((method, url) => {
    if (url.startsWith('/api/review/runs?')) return { body: { items, total: 60, page: Number(new URL(url, 'http://x').searchParams.get('page')), pageSize: 25 } };
    if (url === '/api/review/filters') return { body: { therapists: [{ id: therapistId, name: 'Tamsin Ruel' }], athletes: [{ id: athleteId, name: 'Rowan Tesk' }] } };
    if (url.startsWith('/api/review/adherence')) return { body: adherence };
    return undefined;
  });
}

const runsRequests = (calls: { url: string }[]) => calls.filter((c) => c.url.startsWith('/api/review/runs?')).map((c) => new URL(c.url, 'http://x').searchParams);

beforeEach(() => stubResizeObserver());
afterEach(() => vi.unstubAllGlobals());

describe('the review desk runs table', () => {
  it('asks the server for newest runs first, 25 to a page, when no filter is set', async () => {
    const calls = deskServer();
    renderAt(<ReviewDesk />, '/review');
    await screen.findByText('Athlete 1');
    const first = runsRequests(calls)[0];
    expect(Object.fromEntries(first)).toEqual({ sort: 'createdAt', direction: 'desc', page: '1', pageSize: '25' });
  });

  it('puts each chosen filter into the address and the runs request, and goes back to page 1', async () => {
    const calls = deskServer();
    renderAt(<ReviewDesk />, '/review?page=2');
    await screen.findByText('Athlete 1');
    expect(runsRequests(calls)[0].get('page')).toBe('2');
    await screen.findByRole('option', { name: 'Tamsin Ruel' });

    await userEvent.selectOptions(screen.getByLabelText('Outcome'), 'fell-back');
    await userEvent.selectOptions(screen.getByLabelText('Therapist'), therapistId);
    await userEvent.selectOptions(screen.getByLabelText('Session note'), 'false');
    await userEvent.click(screen.getByLabelText('Needs attention only'));

    await waitFor(() => expect(runsRequests(calls).at(-1)?.get('attention')).toBe('true'));
    const last = runsRequests(calls).at(-1)!;
    expect(last.get('outcome')).toBe('fell-back');
    expect(last.get('therapistId')).toBe(therapistId);
    expect(last.get('noteSigned')).toBe('false');
    expect(last.get('page')).toBe('1');
    const address = new URLSearchParams(currentLocation.search);
    expect(address.get('outcome')).toBe('fell-back');
    expect(address.get('attention')).toBe('true');
    expect(address.has('page')).toBe(false);
  });

  it('reads filters from the address, sends them, and offers the same selection as CSV', async () => {
    const calls = deskServer();
    renderAt(<ReviewDesk />, `/review?from=2026-11-01&to=2026-11-28&phase=acute&outcome=stopped-referred&athleteId=${athleteId}&sort=athleteName&direction=asc`);
    await screen.findByText('Athlete 1');
    const sent = runsRequests(calls)[0];
    expect(sent.get('from')).toBe('2026-11-01');
    expect(sent.get('to')).toBe('2026-11-28');
    expect(sent.get('phase')).toBe('acute');
    expect(sent.get('outcome')).toBe('stopped-referred');
    expect(sent.get('athleteId')).toBe(athleteId);
    expect(sent.get('sort')).toBe('athleteName');
    expect(sent.get('direction')).toBe('asc');
    expect(screen.getByLabelText('From')).toHaveValue('2026-11-01');
    expect(screen.getByLabelText('Phase')).toHaveValue('acute');

    const csv = new URL(screen.getByRole('link', { name: /Download CSV/ }).getAttribute('href')!, 'http://x');
    expect(csv.pathname).toBe('/api/review/runs.csv');
    expect(Object.fromEntries(csv.searchParams)).toEqual({ from: '2026-11-01', to: '2026-11-28', athleteId, phase: 'acute', outcome: 'stopped-referred', sort: 'athleteName', direction: 'asc' });
    // The adherence figures cover the same dates as the table.
    expect(calls.some((c) => c.url === '/api/review/adherence?from=2026-11-01&to=2026-11-28')).toBe(true);
  });

  it('drops a malformed value in the address instead of sending it', async () => {
    const calls = deskServer();
    renderAt(<ReviewDesk />, '/review?outcome=exploded&from=yesterday&page=-3');
    await screen.findByText('Athlete 1');
    const sent = runsRequests(calls)[0];
    expect(sent.has('outcome')).toBe(false);
    expect(sent.has('from')).toBe(false);
    expect(sent.get('page')).toBe('1');
  });

  it('sorts on the server when a heading is pressed', async () => {
    const calls = deskServer();
    renderAt(<ReviewDesk />, '/review');
    await screen.findByText('Athlete 1');
    await userEvent.click(within(screen.getByRole('columnheader', { name: /Athlete/ })).getByRole('button'));
    await waitFor(() => expect(runsRequests(calls).at(-1)?.get('sort')).toBe('athleteName'));
    expect(screen.getByRole('columnheader', { name: /Athlete/ })).not.toHaveAttribute('aria-sort', 'none');
    expect(screen.getByRole('columnheader', { name: 'Run' })).toHaveAttribute('aria-sort', 'none');
  });

  it('pages forward with the same filters', async () => {
    const calls = deskServer();
    renderAt(<ReviewDesk />, '/review?outcome=completed');
    await screen.findByText('Athlete 1');
    expect(screen.getByText('Page 1 of 3')).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Next' }));
    await waitFor(() => expect(runsRequests(calls).at(-1)?.get('page')).toBe('2'));
    expect(runsRequests(calls).at(-1)?.get('outcome')).toBe('completed');
  });

  it('marks a row that needs attention with words and icons, not colour alone', async () => {
    deskServer([
      row(1, { status: 'fell-back', outcome: 'fell-back', runOutcome: 'fell-back', attention: ['fell-back', 'ice-massage-out-of-bounds'], noteStatus: 'submitted' }),
      row(2, { attention: [], noteStatus: 'signed' }),
      row(3, { status: 'stopped-referred', outcome: 'stopped-referred', runOutcome: 'stopped-referred', attention: ['red-flag', 'skipped-steps'], noteStatus: 'none' }),
    ]);
    renderAt(<ReviewDesk />, '/review');
    const flagged = (await screen.findByText('Athlete 1')).closest('tr')!;
    const flags = within(flagged).getByRole('list', { name: 'Needs attention' });
    for (const word of ['Fell back', 'Ice outside 5–7 min']) {
      const badge = within(flags).getByText(word);
      expect(badge.querySelector('svg')).not.toBeNull();
    }
    expect(within(flagged).getByText('Waiting for sign-off').querySelector('svg')).not.toBeNull();
    expect(flagged).toHaveAttribute('data-attention', 'true');

    const quiet = screen.getByText('Athlete 2').closest('tr')!;
    expect(within(quiet).queryByRole('list', { name: 'Needs attention' })).toBeNull();
    expect(quiet).not.toHaveAttribute('data-attention');
    expect(within(quiet).getByText('Signed').querySelector('svg')).not.toBeNull();

    const referred = screen.getByText('Athlete 3').closest('tr')!;
    expect(within(referred).getByText('Red flag')).toBeInTheDocument();
    expect(within(referred).getByText('Skipped')).toBeInTheDocument();
    expect(within(referred).getByText('Stopped and referred')).toBeInTheDocument();
    expect(within(referred).getByText('No note')).toBeInTheDocument();
  });
});
