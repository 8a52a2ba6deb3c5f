import type { Phase } from '../phase';
import type { MeasurementView } from '../records/responses';

/** GET /api/injuries/:id/referral: one printable page for a physician. */
export interface ReferralSummary {
  generatedAt: string;
  timeZone: string;
  clinic: { name: string; contactEmail: string | null; contactPhone: string | null };
  preparedBy: { name: string; role: string };
  athlete: { name: string; yearOfBirth: number; ageThisYear: number; sport: string; position: string | null };
  injury: {
    id: string;
    site: string;
    side: 'left' | 'right';
    mechanism: string;
    injuredAt: string;
    daysSinceInjury: number;
    haematomaType: string;
    status: 'open' | 'closed';
    severity: { grade: string; kneeFlexionDeg: number; source: string } | null;
    phase: Phase;
    phaseReason: string;
    myositisRiskFactors: string[];
    reinjuryOfId: string | null;
  };
  /** Why the athlete is referred: red flags found, a fall-back that ended in stop-elevate-refer, a suspicion. */
  reasons: ReferralReason[];
  measurements: MeasurementView[];
  /** Earlier measurements left off to keep the summary to one page. */
  measurementsOmitted: number;
  runs: ReferralRun[];
  runsOmitted: number;
}

export interface ReferralReason {
  kind: 'red-flag' | 'stop-elevate-refer' | 'suspected-myositis' | 'cold-contraindicated';
  text: string;
  at: string | null;
  runId: string | null;
}

export interface ReferralRun {
  id: string;
  at: string;
  phase: Phase;
  therapistName: string;
  outcome: string;
  /** Step labels with minutes actually spent, in order: "Ice massage 6 min". */
  stepsDone: string[];
  swellingChecks: string[];
}
