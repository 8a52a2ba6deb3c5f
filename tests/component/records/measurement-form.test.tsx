import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it } from 'vitest';
import { vi } from 'vitest';
import { MeasurementForm } from '../../../src/features/injuries/components/measurement-form';
import { fakeServer, renderWithProviders } from './harness';

const injuryId = '00000000-0000-4000-8000-0000000000aa';

afterEach(() => {
  vi.unstubAllGlobals();
});

/** The message under an input, found the way a screen reader finds it: through aria-describedby. */
function describedText(input: HTMLElement) {
  return (input.getAttribute('aria-describedby') ?? '')
    .split(' ')
    .map((id) => document.getElementById(id)?.textContent ?? '')
    .join(' ');
}

describe('the measurement form', () => {
  it('shows each range error beside its own field and sends nothing', async () => {
    const calls = fakeServer(() => undefined);
    renderWithProviders(<MeasurementForm injuryId={injuryId} />);
    await userEvent.type(screen.getByLabelText(/Knee flexion, active/), '200');
    await userEvent.type(screen.getByLabelText(/Pain, NPRS/), '11');
    await userEvent.type(screen.getByLabelText(/Skinfold over the site/), 'thick');
    await userEvent.click(screen.getByRole('button', { name: 'Save measurement' }));

    const flexion = screen.getByLabelText(/Knee flexion, active/);
    await waitFor(() => expect(flexion).toHaveAttribute('aria-invalid', 'true'));
    expect(describedText(flexion)).toContain('Knee flexion must be a whole number between 0 and 160°');
    expect(describedText(flexion)).toContain('0–160°');
    expect(describedText(screen.getByLabelText(/Pain, NPRS/))).toContain('Pain (NPRS) must be a whole number between 0 and 10');
    expect(describedText(screen.getByLabelText(/Skinfold over the site/))).toContain('Skinfold must be between 1 and 60 mm');
    expect(screen.getByLabelText(/Girth, injured side/)).not.toHaveAttribute('aria-invalid');
    expect(calls).toEqual([]);
  });

  it('asks for the other side when only one girth is given, and for a landmark', async () => {
    fakeServer(() => undefined);
    renderWithProviders(<MeasurementForm injuryId={injuryId} />);
    await userEvent.type(screen.getByLabelText(/Girth, injured side/), '52,5');
    await userEvent.click(screen.getByRole('button', { name: 'Save measurement' }));
    await waitFor(() => expect(describedText(screen.getByLabelText(/Girth, other side/))).toContain('Girth must be measured on both sides, or on neither'));
    expect(describedText(screen.getByLabelText('Girth landmark'))).toContain('Girth landmark is required with a girth');
  });

  it('says so above the form when nothing at all was measured', async () => {
    fakeServer(() => undefined);
    renderWithProviders(<MeasurementForm injuryId={injuryId} />);
    await userEvent.click(screen.getByRole('button', { name: 'Save measurement' }));
    expect(await screen.findByText('Record at least one measurement or a note')).toBeInTheDocument();
  });

  it("puts a server 400's field messages beside the fields it names", async () => {
    const calls = fakeServer((method) =>
      method === 'POST'
        ? {
            status: 400,
            body: {
              error: {
                code: 'bad_request',
                message: 'A measurement cannot be taken before the injury happened',
                fields: { takenAt: 'Must be after the injury date and time' },
              },
            },
          }
        : undefined,
    );
    renderWithProviders(<MeasurementForm injuryId={injuryId} />);
    await userEvent.type(screen.getByLabelText(/Knee flexion, active/), '80');
    await userEvent.click(screen.getByRole('button', { name: 'Save measurement' }));

    const takenAt = screen.getByLabelText('Taken at');
    await waitFor(() => expect(takenAt).toHaveAttribute('aria-invalid', 'true'));
    expect(describedText(takenAt)).toContain('Must be after the injury date and time');
    const post = calls.find((c) => c.method === 'POST');
    expect(post?.url).toBe(`/api/injuries/${injuryId}/measurements`);
    expect(post?.body).toMatchObject({ kneeFlexionDeg: 80, painNprs: null, girthInjuredCm: null });
    // The datetime-local value went out as an instant with this device's offset.
    expect((post?.body as { takenAt: string }).takenAt).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:00(Z|[+-]\d{2}:\d{2})$/);
  });
});
