import type { Phase } from '../phase';
import type { MeasurementView } from '../records/responses';
import type { RunOutcome, RunStatus } from '../runs/log-entry';
import type { RunLogEntryView, RunView } from '../runs/responses';
import type { NoteStatus, SessionNoteView } from '../notes/responses';
import type { AttentionFlag } from './attention';
import type { ReviewOutcome } from './query';
import type { TimelineRow } from './timeline';

/** What the review API sends back: one definition for server and client. */

/** A run's note as the runs list shows it: 'none' until someone opens or drafts it. */
export type ReviewNoteStatus = NoteStatus | 'none';

export interface ReviewRunRow {
  id: string;
  createdAt: string;
  startedAt: string | null;
  endedAt: string | null;
  athleteId: string;
  athleteName: string;
  therapistId: string;
  therapistName: string;
  injuryId: string;
  injuryLabel: string;
  phase: Phase;
  status: RunStatus;
  /** How the run ended as the review desk files it (the status of a finished run). */
  outcome: ReviewOutcome;
  /** Table mode's own word for the end, e.g. 'stop-elevate-refer' within the fall backs; null when abandoned. */
  runOutcome: RunOutcome | null;
  noteStatus: ReviewNoteStatus;
  attention: AttentionFlag[];
}

export interface ReviewRunsPage {
  items: ReviewRunRow[];
  /** Matching runs: exact when totalExact, otherwise "at least" (counted up to 1,000 runs past the page asked for). */
  total: number;
  totalExact: boolean;
  page: number;
  pageSize: number;
}

export interface ReviewFilterOption {
  id: string;
  name: string;
}

export interface ReviewFilterOptions {
  therapists: ReviewFilterOption[];
  athletes: ReviewFilterOption[];
}

export interface ReviewRunDetail {
  run: RunView;
  entries: RunLogEntryView[];
  timeline: TimelineRow[];
  /** The latest measurement taken at or before the run started. */
  measurementsBefore: MeasurementView | null;
  /** The first measurement taken after the run ended. */
  measurementsAfter: MeasurementView | null;
  note: SessionNoteView | null;
  attention: AttentionFlag[];
}

export type { AdherenceFigures, AdherenceReport, TherapistAdherence } from './adherence';
export type { AttentionFlag, AttentionKind } from './attention';
export type { ReviewOutcome, ReviewSortField } from './query';
export type { TimelineRow, TimelineStep } from './timeline';
