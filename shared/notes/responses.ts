/** A session note as the API sends it. */

export const noteStatuses = ['draft', 'submitted', 'signed'] as const;
export type NoteStatus = (typeof noteStatuses)[number];

export interface SessionNoteView {
  id: string;
  runId: string;
  subjective: string;
  objective: string;
  assessment: string;
  plan: string;
  status: NoteStatus;
  submittedAt: string | null;
  submittedByName: string | null;
  signedAt: string | null;
  signedByName: string | null;
  signOffComment: string | null;
  /** Signed notes are locked: nobody edits them until a supervisor reopens the note with a reason. */
  locked: boolean;
  updatedAt: string;
}
