import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { AthleteView } from '../../../shared/records/responses';
import { AddAthletePanel } from '../../../src/features/athletes/components/add-athlete-panel';
import { AthletesTable } from '../../../src/features/athletes/components/athletes-table';
import { fakeServer, renderWithProviders } from './harness';

afterEach(() => {
  vi.unstubAllGlobals();
});

const athlete = (i: number): AthleteView => ({
  id: `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`,
  name: `Athlete ${i}`,
  yearOfBirth: 1990 + i,
  sport: 'Hockey',
  position: null,
  email: null,
  consentToTreatment: i % 2 === 0,
  consentRecordedAt: null,
  consentRecordedByName: null,
  notes: null,
  createdAt: '2026-01-01T10:00:00.000Z',
  openInjuries: i % 3,
});

function listServer() {
  return fakeServer((method, url) => {
    if (method !== 'GET' || !url.startsWith('/api/athletes?')) return undefined;
    const params = new URL(url, 'http://x').searchParams;
    const items = Array.from({ length: 20 }, (_, i) => athlete(i + 1 + (Number(params.get('page')) - 1) * 20));
    return { body: { items, total: 45, page: Number(params.get('page')), pageSize: 20 } };
  });
}

describe('the athletes table', () => {
  it('sorts on the server by clicking a heading, and says so with aria-sort', async () => {
    const calls = listServer();
    renderWithProviders(<AthletesTable />, { route: '/athletes' });
    await screen.findByRole('link', { name: 'Athlete 1' });
    expect(calls[0].url).toBe('/api/athletes?sort=name&direction=asc&page=1&pageSize=20');
    expect(screen.getByRole('columnheader', { name: /Name/ })).toHaveAttribute('aria-sort', 'ascending');

    await userEvent.click(within(screen.getByRole('columnheader', { name: /Name/ })).getByRole('button'));
    await waitFor(() => expect(calls.at(-1)?.url).toContain('sort=name&direction=desc'));
    expect(screen.getByRole('columnheader', { name: /Name/ })).toHaveAttribute('aria-sort', 'descending');

    await userEvent.click(within(screen.getByRole('columnheader', { name: /Year of birth/ })).getByRole('button'));
    await waitFor(() => expect(calls.at(-1)?.url).toContain('sort=yearOfBirth'));
    expect(screen.getByRole('columnheader', { name: /Year of birth/ })).not.toHaveAttribute('aria-sort', 'none');
    expect(screen.getByRole('columnheader', { name: /Name/ })).toHaveAttribute('aria-sort', 'none');
    // Sport is not a server sort field, so its heading is not a button.
    expect(within(screen.getByRole('columnheader', { name: 'Sport' })).queryByRole('button')).toBeNull();
  });

  it('waits for typing to pause before searching, and pages 20 at a time', async () => {
    const calls = listServer();
    renderWithProviders(<AthletesTable />, { route: '/athletes' });
    await screen.findByRole('link', { name: 'Athlete 1' });
    expect(screen.getByText('Page 1 of 3')).toBeInTheDocument();

    await userEvent.type(screen.getByLabelText('Search athletes'), 'rowan');
    await waitFor(() => expect(calls.some((c) => c.url.includes('q=rowan'))).toBe(true));
    expect(calls.filter((c) => c.url.includes('q=')).map((c) => c.url)).toEqual(['/api/athletes?sort=name&direction=asc&page=1&pageSize=20&q=rowan']);

    await userEvent.click(screen.getByRole('button', { name: 'Next' }));
    await waitFor(() => expect(calls.at(-1)?.url).toContain('page=2'));
    expect(await screen.findByRole('link', { name: 'Athlete 21' })).toBeInTheDocument();
  });
});

describe('adding an athlete', () => {
  it('shows errors beside the fields, then maps the server’s field errors too', async () => {
    const calls = fakeServer((method) =>
      method === 'POST' ? { status: 400, body: { error: { code: 'invalid_input', message: 'Please check email', fields: { email: 'That address is already used by another athlete' } } } } : undefined,
    );
    const onAdded = vi.fn();
    renderWithProviders(<AddAthletePanel onAdded={onAdded} onCancel={vi.fn()} />);
    const form = screen.getByRole('form', { name: 'Add athlete' });
    await userEvent.click(within(form).getByRole('button', { name: 'Add athlete' }));
    expect(await within(form).findByText('Name must be between 1 and 120 characters')).toBeInTheDocument();
    expect(within(form).getByText(/Year of birth must be/)).toBeInTheDocument();
    expect(calls).toEqual([]);

    await userEvent.type(within(form).getByLabelText('Name', { exact: true }), 'Rowan Tesk');
    await userEvent.type(within(form).getByLabelText('Year of birth'), '1999');
    await userEvent.type(within(form).getByLabelText('Sport'), 'Rugby');
    await userEvent.type(within(form).getByLabelText('E-mail'), 'rowan@example.org');
    await userEvent.click(within(form).getByRole('button', { name: 'Add athlete' }));
    expect(await within(form).findByText('That address is already used by another athlete')).toBeInTheDocument();
    expect(within(form).getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
    expect(calls.find((c) => c.method === 'POST')?.body).toEqual({
      name: 'Rowan Tesk',
      yearOfBirth: 1999,
      sport: 'Rugby',
      position: null,
      email: 'rowan@example.org',
      notes: null,
      consentToTreatment: false,
    });
    expect(onAdded).not.toHaveBeenCalled();
  });
});
