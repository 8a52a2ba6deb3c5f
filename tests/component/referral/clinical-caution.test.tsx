import { screen } from '@testing-library/react';
import type { ReferralSummary } from '../../../shared/clinic/referral';
import { clinicalCaution } from '../../../shared/safety/caution';
import { ReferralSheet } from '../../../src/features/referral/components/referral-summary';
import { renderWithProviders } from '../records/harness';

const referral: ReferralSummary = {
  generatedAt: '2026-03-02T10:00:00.000Z',
  timeZone: 'Europe/London',
  clinic: { name: 'Test Clinic', contactEmail: null, contactPhone: null },
  preparedBy: { name: 'Therapist Test', role: 'therapist' },
  athlete: { name: 'Rowan Test', yearOfBirth: 2000, ageThisYear: 26, sport: 'rugby', position: null },
  injury: {
    id: '00000000-0000-4000-8000-000000000201',
    site: 'anterior thigh',
    side: 'left',
    mechanism: 'knee to thigh',
    injuredAt: '2026-03-01T10:00:00.000Z',
    daysSinceInjury: 1,
    haematomaType: 'not-known',
    status: 'open',
    severity: null,
    phase: 'acute',
    phaseReason: 'Within 72 hours of the injury.',
    myositisRiskFactors: [],
    reinjuryOfId: null,
  },
  reasons: [{ kind: 'red-flag', text: 'Numbness below the injury', at: null, runId: null }],
  measurements: [],
  measurementsOmitted: 0,
  runs: [],
  runsOmitted: 0,
};

describe('the referral page shows the clinical caution', () => {
  it('the shared caution line is on the sheet', () => {
    renderWithProviders(<ReferralSheet referral={referral} />);
    const sheet = screen.getByRole('article', { name: 'Referral summary' });
    expect(sheet).toContainElement(screen.getByTestId('clinical-caution'));
    expect(screen.getByTestId('clinical-caution')).toHaveTextContent(clinicalCaution);
  });
});
