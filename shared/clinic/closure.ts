import type { ReturnToActivityCheck } from '../clinical/return-to-activity';
import type { InjuryClosureView } from '../records/responses';

/** GET /api/injuries/:id/closure: what the closing panel needs to run the check live as tests are ticked. */
export interface ClosureView {
  injuryId: string;
  status: 'open' | 'closed';
  region: string;
  /** The clinic's girth threshold the check compares the side-to-side difference with. */
  girthThresholdCm: number;
  /** The check with no functional test ticked yet: the measured criteria as they stand. */
  check: ReturnToActivityCheck;
  /** The latest measurement's values, so the client can run the same check as tests are ticked. */
  latestMeasurement: {
    id: string;
    takenAt: string;
    kneeFlexionDeg: number | null;
    girthInjuredCm: number | null;
    girthOtherCm: number | null;
    painNprs: number | null;
  } | null;
  closure: InjuryClosureView | null;
  /** The earlier episode this one re-injures, and later re-injuries of this one. */
  reinjuryOf: EpisodeLink | null;
  reinjuries: EpisodeLink[];
  /** A run in progress blocks closing until it ends. */
  activeRunId: string | null;
}

export interface EpisodeLink {
  id: string;
  injuredAt: string;
  status: 'open' | 'closed';
  closedAt: string | null;
}

export const unmetReasonMessage = 'Give the reason for closing while a return-to-activity criterion is unmet';
