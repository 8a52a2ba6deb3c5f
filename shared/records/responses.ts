import type { InjuryAssessment } from '../clinical/assess-injury';
import type { ColdSchedule } from '../clinical/cold-schedule';
import type { Phase } from '../phase';
import type { RecheckStatus } from '../clinic/recheck';
import type { CriterionResult } from '../clinical/return-to-activity';

/** What the API sends back for records: one definition for server and client. */
export interface AthleteView {
  id: string;
  name: string;
  yearOfBirth: number;
  sport: string;
  position: string | null;
  email: string | null;
  consentToTreatment: boolean;
  consentRecordedAt: string | null;
  consentRecordedByName: string | null;
  /** A parent's or guardian's consent (athletes under 18 need one before a run). Always sent by the API; optional for older fixtures. */
  guardianConsent?: { guardianName: string; recordedAt: string; recordedByName: string | null } | null;
  /** Is or may be under 18 by year of birth, in the clinic's zone (erring safe, docs/decisions/0103). */
  needsGuardianConsent?: boolean;
  /** Why the guardian's consent is needed (under 18, or may be by year of birth); null when not. Always sent by the API. */
  guardianConsentReason?: string | null;
  notes: string | null;
  createdAt: string;
  openInjuries?: number;
  /** When the athlete used an e-mail's opt-out link: no further e-mails go to them. Always sent by the API. */
  emailOptedOutAt?: string | null;
  /** When an admin erased the athlete's personal data (the record stays, anonymised). Always sent by the API. */
  erasedAt?: string | null;
}

export interface MeasurementView {
  id: string;
  injuryId: string;
  takenAt: string;
  girthInjuredCm: number | null;
  girthOtherCm: number | null;
  girthLandmark: string | null;
  girthDistanceCm: number | null;
  kneeFlexionDeg: number | null;
  painNprs: number | null;
  bruiseLengthCm: number | null;
  bruiseWidthCm: number | null;
  skinfoldMm: number | null;
  notes: string | null;
  recordedByName: string | null;
}

export interface InjuryView {
  id: string;
  athleteId: string;
  athleteName: string;
  region: string;
  regionLabel: string;
  side: 'left' | 'right';
  mechanismKind: string;
  mechanism: string | null;
  injuredAt: string;
  haematomaType: string;
  previousQuadricepsInjury: boolean;
  kneeEffusion: boolean;
  treatmentStartedAt: string | null;
  status: 'open' | 'closed';
  closedAt: string | null;
  phaseOverride: { phase: Phase; reason: string; at: string; byName: string | null } | null;
  // The computed fields every screen shows the same way.
  severity: InjuryAssessment['severity'];
  suggestedPhase: Phase;
  phase: Phase;
  phaseReason: string;
  phaseIsOverride: boolean;
  risks: InjuryAssessment['risks'];
  assessment: InjuryAssessment;
  lastMeasuredAt: string | null;
  remeasureDue: boolean;
  /** The next re-check; suggested after each run from the phase, or set by a therapist. The fields below are always sent by the API. */
  nextRecheckAt?: string | null;
  recheckStatus?: RecheckStatus;
  /** Null when Mendstep suggested it after a run. */
  recheckSetByName?: string | null;
  /** The earlier episode this injury is a re-injury of. */
  reinjuryOfId?: string | null;
  closure?: InjuryClosureView | null;
}

/** How an injury was closed: the return-to-activity check as it stood, and the reason for any unmet criterion. */
export interface InjuryClosureView {
  closedAt: string;
  closedByName: string | null;
  allMet: boolean;
  criteria: CriterionResult[];
  measurement: { id: string | null; takenAt: string } | null;
  reason: string | null;
}

export interface InjuryDetailView {
  injury: InjuryView;
  athlete: AthleteView;
  measurements: MeasurementView[];
  coldSchedule: ColdSchedule;
}

export interface Paged<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}
