import { UniqueConstraintError, type Transaction } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import { draftSessionNote } from '../../shared/notes/draft-note';
import type { SessionNoteView } from '../../shared/notes/responses';
import { noteSections, type SessionNoteUpdate } from '../../shared/notes/schemas';
import { finishedStatuses } from '../../shared/runs/responses';
import { AppError } from '../errors';
import { Injury, Measurement, Run, RunLogEntry, SessionNote } from '../models';
import { recordAudit } from './audit-service';
import { getClinicSettings } from './clinic-settings-service';
import { getInjuryView } from './injury-service';
import { findRun } from './run-service';
import { staffNames } from './staff-names';

/*
 * The life of a session note: drafted by Mendstep the first time anyone opens it → edited → submitted by
 * the therapist → signed off by a supervisor, which locks it → reopened by a supervisor with a reason,
 * which unlocks it as a draft again. Every step is an audit event naming the note's version.
 */


export async function toNoteView(note: SessionNote): Promise<SessionNoteView> {
  const names = await staffNames([note.submittedBy, note.signedBy]);
  return {
    id: note.id,
    runId: note.runId,
    subjective: note.subjective,
    objective: note.objective,
    assessment: note.assessment,
    plan: note.plan,
    status: note.status,
    submittedAt: note.submittedAt?.toISOString() ?? null,
    submittedByName: note.submittedBy ? names.get(note.submittedBy) ?? null : null,
    signedAt: note.signedAt?.toISOString() ?? null,
    signedByName: note.signedBy ? names.get(note.signedBy) ?? null : null,
    signOffComment: note.signOffComment,
    locked: note.status === 'signed',
    updatedAt: note.updatedAt.toISOString(),
  };
}

/** The run's note when one exists; the run must be the caller's clinic's. */
export async function findNoteView(actor: SessionUser, runId: string): Promise<SessionNoteView | null> {
  const note = await SessionNote.findOne({ where: { runId, clinicId: actor.clinicId } });
  return note ? toNoteView(note) : null;
}

function requireFinished(run: Run): void {
  if (!finishedStatuses.includes(run.status)) {
    throw AppError.conflict('The run has not finished yet: its session note can be written once it ends.', 'run_not_finished');
  }
}

/** Mendstep's draft from the run's plan and log, the injury as it stands and the measurements up to the run's end. */
async function draftFor(actor: SessionUser, run: Run) {
  const injury = await Injury.findOne({ where: { id: run.injuryId, clinicId: actor.clinicId } });
  if (!injury) throw AppError.notFound('Injury');
  const [view, entries, measurements, settings] = await Promise.all([
    getInjuryView(actor, injury),
    RunLogEntry.findAll({ where: { runId: run.id } }),
    Measurement.findAll({ where: { injuryId: injury.id, clinicId: actor.clinicId }, order: [['takenAt', 'ASC']] }),
    getClinicSettings(actor.clinicId),
  ]);
  return draftSessionNote({
    run: {
      phase: run.phase,
      status: run.status,
      outcome: run.outcome,
      plan: run.plan,
      screening: run.screening,
      startedAt: run.startedAt?.toISOString() ?? null,
      endedAt: run.endedAt?.toISOString() ?? null,
      createdAt: run.createdAt.toISOString(),
      sequenceVersion: run.sequenceVersion,
      redFlags: run.redFlags,
    },
    entries: entries.map((e) => ({
      seq: e.seq,
      type: e.type,
      stepIndex: e.stepIndex,
      kind: e.kind,
      plannedSeconds: e.plannedSeconds,
      actualSeconds: e.actualSeconds,
      at: e.at.toISOString(),
      reason: e.reason,
      detail: e.detail,
    })),
    injury: view,
    measurements: measurements.map((m) => ({ ...m.get({ plain: true }), takenAt: m.takenAt.toISOString() })),
    settings: { timeZone: settings.timeZone, coldProtocol: settings.coldProtocol, swellingThresholdCm: settings.swellingThresholdCm },
  });
}

/** The run's note, drafted and saved as a draft the first time anyone asks for it. */
export async function getOrDraftNote(actor: SessionUser, runId: string): Promise<SessionNoteView> {
  const run = await findRun(actor, runId);
  const existing = await SessionNote.findOne({ where: { runId: run.id, clinicId: actor.clinicId } });
  if (existing) return toNoteView(existing);
  requireFinished(run);
  const draft = await draftFor(actor, run);
  try {
    const note = await SessionNote.sequelize!.transaction(async (transaction) => {
      const created = await SessionNote.create(
        { clinicId: actor.clinicId, runId: run.id, ...draft, createdBy: actor.id, updatedBy: actor.id },
        { transaction },
      );
      await recordAudit(actor, 'session-note.drafted', { type: 'session-note', id: created.id }, { runId: run.id, version: created.version }, transaction);
      return created;
    });
    return toNoteView(note);
  } catch (error) {
    // Two screens opened the note at once: the other one drafted it first.
    if (error instanceof UniqueConstraintError) {
      const winner = await SessionNote.findOne({ where: { runId: run.id, clinicId: actor.clinicId } });
      if (winner) return toNoteView(winner);
    }
    throw error;
  }
}

/** The note under a row lock, so an edit and a sign-off arriving together are applied one after the other. */
async function lockedNote(actor: SessionUser, runId: string, transaction: Transaction): Promise<SessionNote | null> {
  return SessionNote.findOne({ where: { runId, clinicId: actor.clinicId }, transaction, lock: transaction.LOCK.UPDATE });
}

const lockedMessage = 'This note is signed off and locked. A supervisor can reopen it, giving a reason.';

export async function updateNote(actor: SessionUser, runId: string, input: SessionNoteUpdate): Promise<SessionNoteView> {
  const run = await findRun(actor, runId);
  requireFinished(run);
  const note = await SessionNote.sequelize!.transaction(async (transaction) => {
    const existing = await lockedNote(actor, run.id, transaction);
    if (!existing) {
      // Written before anyone opened the draft: the therapist's own words are the first version.
      const created = await SessionNote.create(
        { clinicId: actor.clinicId, runId: run.id, ...input, createdBy: actor.id, updatedBy: actor.id },
        { transaction },
      );
      await recordAudit(actor, 'session-note.edited', { type: 'session-note', id: created.id }, { runId: run.id, version: created.version, sections: noteSections.map((s) => s.key) }, transaction);
      return created;
    }
    if (existing.status === 'signed') throw AppError.conflict(lockedMessage, 'note_locked');
    const changed = noteSections.map((s) => s.key).filter((key) => existing[key] !== input[key]);
    if (!changed.length) return existing;
    await existing.update({ ...input, updatedBy: actor.id, version: existing.version + 1 }, { transaction });
    await recordAudit(actor, 'session-note.edited', { type: 'session-note', id: existing.id }, { runId: run.id, version: existing.version, sections: changed, status: existing.status }, transaction);
    return existing;
  });
  return toNoteView(note);
}

export async function submitNote(actor: SessionUser, runId: string): Promise<SessionNoteView> {
  const run = await findRun(actor, runId);
  const note = await SessionNote.sequelize!.transaction(async (transaction) => {
    const existing = await lockedNote(actor, run.id, transaction);
    if (!existing) throw AppError.conflict('There is no note to submit yet: open the note to draft it first.', 'note_missing');
    if (existing.status === 'signed') throw AppError.conflict(lockedMessage, 'note_locked');
    // Submitting twice (a double tap) changes nothing.
    if (existing.status === 'submitted') return existing;
    const empty = noteSections.filter((s) => existing[s.key].trim() === '');
    if (empty.length) {
      throw AppError.badRequest(
        `Fill in every section before submitting: ${empty.map((s) => s.label).join(', ')} ${empty.length === 1 ? 'is' : 'are'} empty.`,
        Object.fromEntries(empty.map((s) => [s.key, `${s.label} cannot be empty when the note is submitted`])),
      );
    }
    await existing.update({ status: 'submitted', submittedBy: actor.id, submittedAt: new Date(), updatedBy: actor.id, version: existing.version + 1 }, { transaction });
    await recordAudit(actor, 'session-note.submitted', { type: 'session-note', id: existing.id }, { runId: run.id, version: existing.version }, transaction);
    return existing;
  });
  return toNoteView(note);
}

export async function signOffNote(actor: SessionUser, runId: string, comment: string | null | undefined): Promise<SessionNoteView> {
  // The route admits supervisors only; checked here too, because a signature is what the lock rests on.
  if (actor.role !== 'supervisor') throw AppError.forbidden('Only a supervisor can sign off a session note.');
  const run = await findRun(actor, runId);
  const note = await SessionNote.sequelize!.transaction(async (transaction) => {
    const existing = await lockedNote(actor, run.id, transaction);
    if (!existing) throw AppError.conflict('There is no session note for this run yet: the therapist drafts and submits it first.', 'note_not_submitted');
    if (existing.status === 'signed') throw AppError.conflict('This note is already signed off.', 'note_already_signed');
    if (existing.status !== 'submitted') {
      throw AppError.conflict('This note is still a draft: the therapist must submit it before it can be signed off.', 'note_not_submitted');
    }
    // A signature is a second pair of eyes: whoever ran the treatment or wrote the note cannot also sign it.
    if ([run.therapistId, existing.createdBy, existing.submittedBy].includes(actor.id)) {
      throw AppError.forbidden('You ran this treatment or wrote this note: another supervisor must sign it off.');
    }
    const text = comment?.trim() ? comment.trim() : null;
    await existing.update(
      { status: 'signed', signedBy: actor.id, signedAt: new Date(), signOffComment: text, updatedBy: actor.id, version: existing.version + 1 },
      { transaction },
    );
    await recordAudit(actor, 'session-note.signed', { type: 'session-note', id: existing.id }, { runId: run.id, version: existing.version, comment: text }, transaction);
    return existing;
  });
  return toNoteView(note);
}

export async function reopenNote(actor: SessionUser, runId: string, reason: string): Promise<SessionNoteView> {
  if (actor.role !== 'supervisor') throw AppError.forbidden('Only a supervisor can reopen a session note.');
  const run = await findRun(actor, runId);
  const note = await SessionNote.sequelize!.transaction(async (transaction) => {
    const existing = await lockedNote(actor, run.id, transaction);
    if (!existing) throw AppError.conflict('There is no session note for this run to reopen.', 'note_missing');
    if (existing.status === 'draft') throw AppError.conflict('This note is already a draft: it is open for editing.', 'note_already_open');
    const previous = { status: existing.status, signedAt: existing.signedAt?.toISOString() ?? null, signedBy: existing.signedBy, comment: existing.signOffComment };
    // The signature and submission belonged to the text as it was; the audit trail keeps them.
    await existing.update(
      { status: 'draft', submittedBy: null, submittedAt: null, signedBy: null, signedAt: null, signOffComment: null, updatedBy: actor.id, version: existing.version + 1 },
      { transaction },
    );
    await recordAudit(actor, 'session-note.reopened', { type: 'session-note', id: existing.id }, { runId: run.id, version: existing.version, reason, previous }, transaction);
    return existing;
  });
  return toNoteView(note);
}
