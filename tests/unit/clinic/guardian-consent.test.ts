import { describe, expect, it } from 'vitest';
import { guardianConsentReason, needsGuardianConsent } from '../../../shared/clinic/guardian-consent';

const zone = 'Europe/London';

describe('guardian consent errs on the safe side with only a year of birth', () => {
  it('on 1 January, someone who turns 18 this year is 17 today for all we know: consent needed, and the reason says why', () => {
    const newYear = new Date('2026-01-01T09:00:00Z');
    expect(needsGuardianConsent(2008, newYear, zone)).toBe(true);
    expect(guardianConsentReason(2008, newYear, zone)).toMatch(/turns 18 this year and may still be 17 today/);
  });

  it('still needed on 31 December, until the new year proves the athlete is 18', () => {
    expect(needsGuardianConsent(2008, new Date('2026-12-31T22:00:00Z'), zone)).toBe(true);
    expect(needsGuardianConsent(2008, new Date('2027-01-01T00:30:00Z'), zone)).toBe(false);
  });

  it('an athlete clearly under 18 is told so; one reaching 19 this year needs none', () => {
    const now = new Date('2026-06-01T12:00:00Z');
    expect(guardianConsentReason(2010, now, zone)).toBe('Born in 2010, so under 18 all this year (turns 16 this year).');
    expect(guardianConsentReason(2007, now, zone)).toBeNull();
  });
});
