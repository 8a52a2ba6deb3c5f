import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { PhaseCard } from '../../../src/features/injuries/components/phase-card';
import { fakeServer, makeInjury, renderWithProviders } from './harness';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('the phase card', () => {
  it('shows the suggested phase in words with its reason (Kannus 2000 day bands)', () => {
    fakeServer(() => undefined);
    renderWithProviders(<PhaseCard injury={makeInjury({ injuredHoursAgo: 20 })} />);
    const card = screen.getByRole('region', { name: 'Phase of healing' });
    expect(within(card).getAllByText('Acute')[0]).toBeInTheDocument();
    expect(within(card).getByText('Suggested')).toBeInTheDocument();
    expect(within(card).getByText(/Day 0 since injury: days 0 to 6 are the acute phase \(Kannus 2000\)/)).toBeInTheDocument();
  });

  it('will not save an override without a reason of at least 5 characters', async () => {
    const injury = makeInjury({ injuredHoursAgo: 20 });
    const calls = fakeServer((method) => (method === 'PUT' ? { body: { injury } } : undefined));
    renderWithProviders(<PhaseCard injury={injury} />);
    await userEvent.click(screen.getByRole('button', { name: 'Override the phase' }));
    const form = screen.getByRole('form', { name: 'Override the phase' });
    await userEvent.click(within(form).getByLabelText('Proliferative'));

    await userEvent.click(within(form).getByRole('button', { name: 'Save override' }));
    expect(await within(form).findByText('Override reason must be between 5 and 500 characters')).toBeInTheDocument();
    expect(within(form).getByLabelText('Reason for the override')).toHaveAttribute('aria-invalid', 'true');

    await userEvent.type(within(form).getByLabelText('Reason for the override'), 'ok  ');
    await userEvent.click(within(form).getByRole('button', { name: 'Save override' }));
    expect(await within(form).findByText('Override reason must be between 5 and 500 characters')).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'PUT')).toEqual([]);

    await userEvent.clear(within(form).getByLabelText('Reason for the override'));
    await userEvent.type(within(form).getByLabelText('Reason for the override'), 'Swelling settled, moving well');
    await userEvent.click(within(form).getByRole('button', { name: 'Save override' }));
    await waitFor(() => expect(calls.find((c) => c.method === 'PUT')).toBeDefined());
    const put = calls.find((c) => c.method === 'PUT')!;
    expect(put.url).toBe(`/api/injuries/${injury.id}/phase-override`);
    expect(put.body).toEqual({ override: { phase: 'proliferative', reason: 'Swelling settled, moving well' } });
  });

  it('marks an override as such, keeps the suggestion beside it, and clears it', async () => {
    const injury = makeInjury({ injuredHoursAgo: 20, phaseOverride: { phase: 'proliferative', reason: 'Early recovery' } });
    const calls = fakeServer((method) => (method === 'PUT' ? { body: { injury } } : undefined));
    renderWithProviders(<PhaseCard injury={injury} />);
    const card = screen.getByRole('region', { name: 'Phase of healing' });
    expect(within(card).getByText('Override')).toBeInTheDocument();
    expect(screen.getByTestId('phase-reason')).toHaveTextContent('Set to proliferative by the therapist: Early recovery. Suggested from time and signs: acute.');
    expect(within(card).getByText(/Set by Tamsin Ruel/)).toBeInTheDocument();
    expect(within(card).getByText(/Day 0 since injury: days 0 to 6 are the acute phase/)).toBeInTheDocument();

    await userEvent.click(within(card).getByRole('button', { name: 'Clear override' }));
    await waitFor(() => expect(calls.find((c) => c.method === 'PUT')?.body).toEqual({ override: null }));
  });
});
