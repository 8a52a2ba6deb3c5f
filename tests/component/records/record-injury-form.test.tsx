import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { RecordInjuryForm } from '../../../src/features/injuries/components/record-injury-form';
import { fakeServer, makeInjury, renderWithProviders } from './harness';

const athleteId = '00000000-0000-4000-8000-0000000000bb';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('recording an injury', () => {
  it('asks in plain words for the site, the mechanism and the time when they are missing', async () => {
    const calls = fakeServer(() => undefined);
    renderWithProviders(<RecordInjuryForm athleteId={athleteId} onRecorded={vi.fn()} />);
    await userEvent.click(screen.getByRole('button', { name: 'Record injury' }));
    expect(await screen.findByText('Choose the injury site on the body map or in the list')).toBeInTheDocument();
    expect(screen.getByText('Choose how the injury happened')).toBeInTheDocument();
    expect(screen.getByText('Enter the date and time of the injury')).toBeInTheDocument();
    expect(screen.getByRole('radiogroup', { name: 'Injury site on the body map' })).toHaveAttribute('aria-invalid', 'true');
    expect(calls).toEqual([]);
  });

  it('sends the tapped site and the local time as an instant with its offset, then hands the new injury on', async () => {
    const injury = makeInjury();
    const calls = fakeServer((method) => (method === 'POST' ? { status: 201, body: { injury } } : undefined));
    const onRecorded = vi.fn();
    renderWithProviders(<RecordInjuryForm athleteId={athleteId} onRecorded={onRecorded} />);

    await userEvent.click(screen.getByRole('radio', { name: 'Anterior thigh (quadriceps), left' }));
    await userEvent.selectOptions(screen.getByLabelText('Mechanism'), 'knee-to-thigh');
    await userEvent.type(screen.getByLabelText('How it happened'), 'Knee in a tackle');
    await userEvent.type(screen.getByLabelText('Date and time of injury'), '2025-03-30T14:05');
    await userEvent.click(screen.getByLabelText('Knee effusion'));
    await userEvent.click(screen.getByRole('button', { name: 'Record injury' }));

    await waitFor(() => expect(onRecorded).toHaveBeenCalledWith(injury));
    const post = calls.find((c) => c.method === 'POST')!;
    expect(post.url).toBe('/api/injuries');
    expect(post.body).toMatchObject({
      athleteId,
      region: 'anterior-thigh',
      side: 'left',
      mechanismKind: 'knee-to-thigh',
      mechanism: 'Knee in a tackle',
      haematomaType: 'not-known',
      previousQuadricepsInjury: false,
      kneeEffusion: true,
    });
    const sent = (post.body as { injuredAt: string }).injuredAt;
    expect(sent).toMatch(/^2025-03-30T14:05:00(Z|[+-]\d{2}:\d{2})$/);
    expect(new Date(sent).getTime()).toBe(new Date('2025-03-30T14:05').getTime());
  });

  it("shows a server 400's field message beside the field", async () => {
    fakeServer((method) =>
      method === 'POST'
        ? { status: 400, body: { error: { code: 'invalid_input', message: 'Please check injuredAt', fields: { injuredAt: 'Injury date and time cannot be in the future' } } } }
        : undefined,
    );
    renderWithProviders(<RecordInjuryForm athleteId={athleteId} onRecorded={vi.fn()} />);
    await userEvent.selectOptions(screen.getByLabelText('Site'), 'calf');
    await userEvent.selectOptions(screen.getByLabelText('Mechanism'), 'ball');
    await userEvent.type(screen.getByLabelText('Date and time of injury'), '2025-03-30T14:05');
    await userEvent.click(screen.getByRole('button', { name: 'Record injury' }));
    expect(await screen.findByText('Injury date and time cannot be in the future')).toBeInTheDocument();
    expect(screen.getByLabelText('Date and time of injury')).toHaveAttribute('aria-invalid', 'true');
  });
});
