/**
 * The short caution shown on every screen where the work can hurt someone (table mode, the referral page).
 * One text so the screens cannot drift apart; ours, after the usual wording of clinical-tool disclaimers.
 */
export const clinicalCaution =
  "Mendstep supports, and does not replace, clinical judgement, a physician's advice, local regulations and the therapist's licensed scope of practice.";
