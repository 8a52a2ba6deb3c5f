import { redFlagStopAdvice } from '../../../shared/runs/stop-advice';

describe('the red-flag stop advice', () => {
  it('fits suspected compartment syndrome: wrap off, no cold, limb at heart level, urgent referral', () => {
    // Donaldson, Haddad & Khan, Open Orthop J 8:185–193 (2014, year from memory): remove constricting dressings,
    // keep the limb at heart level, not raised.
    expect(redFlagStopAdvice).toMatch(/compression wrap off/);
    expect(redFlagStopAdvice).toMatch(/no cold/);
    expect(redFlagStopAdvice).toMatch(/level with the heart \(not raised\)/);
    expect(redFlagStopAdvice).toMatch(/urgently/);
    expect(redFlagStopAdvice).not.toMatch(/elevate/i);
  });
});
