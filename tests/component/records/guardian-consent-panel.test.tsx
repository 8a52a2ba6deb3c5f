import { screen } from '@testing-library/react';
import { guardianConsentReason } from '../../../shared/clinic/guardian-consent';
import type { AthleteView } from '../../../shared/records/responses';
import { GuardianConsentPanel } from '../../../src/features/athletes/components/guardian-consent-panel';
import { renderWithProviders } from './harness';

const thisYear = new Date().getFullYear();

function athlete(yearOfBirth: number): AthleteView {
  const reason = guardianConsentReason(yearOfBirth, new Date(), 'Europe/London');
  return {
    id: '00000000-0000-4000-8000-000000000401',
    name: 'Juno Park',
    yearOfBirth,
    sport: 'Hockey',
    position: null,
    email: null,
    consentToTreatment: true,
    consentRecordedAt: null,
    consentRecordedByName: null,
    guardianConsent: null,
    needsGuardianConsent: reason !== null,
    guardianConsentReason: reason,
    notes: null,
    createdAt: new Date().toISOString(),
  };
}

describe("the guardian's consent panel says why consent is needed", () => {
  it('for an athlete who turns 18 this year: may still be 17 today', () => {
    renderWithProviders(<GuardianConsentPanel athlete={athlete(thisYear - 18)} />);
    expect(screen.getByRole('note')).toHaveTextContent(`Born in ${thisYear - 18}, so turns 18 this year and may still be 17 today`);
    expect(screen.getByRole('button', { name: 'Record consent' })).toBeInTheDocument();
  });

  it('for an athlete who turns 19 this year, only the optional button shows', () => {
    renderWithProviders(<GuardianConsentPanel athlete={athlete(thisYear - 19)} />);
    expect(screen.queryByRole('note')).not.toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Record a guardian’s consent' })).toBeInTheDocument();
  });
});
