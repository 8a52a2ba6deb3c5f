import type { Phase } from '../phase';
import type { Plan } from '../plan/build-plan';
import type { Sequence } from '../plan/sequence';
import type { LogEntryType, RunOutcome, RunStatus } from './log-entry';
import type { Screening, ScreeningOutcome } from './screening';

export interface RunView {
  id: string;
  injuryId: string;
  athleteId: string;
  athleteName: string;
  injuryLabel: string;
  therapistId: string;
  therapistName: string;
  phase: Phase;
  status: RunStatus;
  outcome: RunOutcome | null;
  plan: Plan;
  sequenceVersion: number | null;
  screening: Screening | null;
  screeningOutcome: ScreeningOutcome | null;
  startedAt: string | null;
  endedAt: string | null;
  createdAt: string;
  /** Plain-language message for a run that cannot start (a red flag). */
  message?: string;
}

export interface RunLogEntryView {
  id: string;
  key: string;
  seq: number | null;
  type: LogEntryType;
  stepIndex: number | null;
  kind: string | null;
  plannedSeconds: number | null;
  actualSeconds: number | null;
  at: string;
  reason: string | null;
  detail: string | null;
  recordedAt: string;
}

export interface RunDetailView {
  run: RunView;
  entries: RunLogEntryView[];
}

export interface SequenceView extends Sequence {
  id: string;
  version: number;
  createdAt: string;
  createdByName: string | null;
}

export const finishedStatuses: readonly RunStatus[] = ['completed', 'fell-back', 'stopped-referred', 'ended-early', 'abandoned'];
export const activeStatuses: readonly RunStatus[] = ['screening', 'ready', 'running'];
