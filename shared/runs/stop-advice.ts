/**
 * What table mode says when a run stops. A red flag (suspected compartment syndrome among them): take the wrap
 * off, no cold, limb level with the heart (not raised), urgent referral — Donaldson J, Haddad B, Khan WS,
 * Open Orthop J 8:185–193 (2014, year from memory): remove constricting dressings, keep the limb at heart
 * level; British Orthopaedic Association standard (2015, secondary summary): release circumferential dressings.
 * Swelling with cold contraindicated keeps decisions.md's "stop, elevate, refer".
 */
export const redFlagStopAdvice =
  'Do not continue treatment. Take the compression wrap off, apply no cold, keep the limb level with the heart (not raised), and refer the athlete to a physician urgently.';
export const stopElevateReferAdvice = 'Do not continue treatment. Elevate the limb and refer the athlete to a physician now.';
