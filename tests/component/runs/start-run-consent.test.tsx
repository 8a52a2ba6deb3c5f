import { screen } from '@testing-library/react';
import { treatmentConsentMissingMessage, treatmentConsentRequiredCode } from '../../../shared/clinic/treatment-consent';
import { StartRun } from '../../../src/app/routes/start-run-route';
import { fakeServer, renderWithProviders } from '../records/harness';

const injuryId = '00000000-0000-4000-8000-000000000301';
const athleteId = '00000000-0000-4000-8000-000000000302';

afterEach(() => vi.unstubAllGlobals());

describe('Start a run without consent to treatment', () => {
  it('shows the refusal and links to the athlete page where consent is recorded', async () => {
    const calls = fakeServer((method, url) =>
      method === 'POST' && url === '/api/runs'
        ? { status: 409, body: { error: { code: treatmentConsentRequiredCode, message: treatmentConsentMissingMessage, athleteId } } }
        : undefined,
    );
    renderWithProviders(<StartRun injuryId={injuryId} />);
    expect(await screen.findByRole('alert')).toHaveTextContent(treatmentConsentMissingMessage);
    expect(screen.getByRole('link', { name: 'Record consent on the athlete’s page' })).toHaveAttribute('href', `/athletes/${athleteId}`);
    expect(screen.getByRole('link', { name: 'Back to the injury' })).toHaveAttribute('href', `/injuries/${injuryId}`);
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(1);
  });

  it('another refusal shows its message without a consent link', async () => {
    fakeServer((method) => (method === 'POST' ? { status: 409, body: { error: { code: 'injury_closed', message: 'This injury is closed; reopen it before starting a run.' } } } : undefined));
    renderWithProviders(<StartRun injuryId={injuryId} />);
    expect(await screen.findByRole('alert')).toHaveTextContent('This injury is closed');
    expect(screen.queryByRole('link', { name: /Record consent/ })).not.toBeInTheDocument();
  });
});
