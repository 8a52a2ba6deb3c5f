import type { Transaction } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import { suggestRecheckAt } from '../../shared/clinic/recheck';
import type { InjuryView } from '../../shared/records/responses';
import { finishedStatuses } from '../../shared/runs/responses';
import { AppError } from '../errors';
import { Injury, type Run } from '../models';
import { recordAudit } from './audit-service';
import { getClinicSettings } from './clinic-settings-service';
import { findInjury, getInjuryView } from './injury-service';

/**
 * After every run that ended (not one that was abandoned: nobody saw the athlete then), the injury's next
 * re-check becomes the clinic's interval for the run's phase after the run's end. It replaces any earlier
 * time, a therapist's included: the run is the newest visit, and the therapist can move the time again.
 * Called inside the transaction that finishes the run, so the home-care message sent after the commit can
 * state it.
 */
export async function suggestRecheckAfterRun(actor: SessionUser, run: Run, transaction: Transaction): Promise<void> {
  if (!finishedStatuses.includes(run.status) || run.status === 'abandoned') return;
  const injury = await Injury.findOne({ where: { id: run.injuryId, clinicId: run.clinicId }, transaction });
  if (!injury || injury.status !== 'open') return;
  const settings = await getClinicSettings(run.clinicId);
  const next = suggestRecheckAt(run.phase, run.endedAt ?? new Date(), settings.recheckIntervalHours);
  await injury.update({ nextRecheckAt: next, recheckSetBy: null }, { transaction });
  await recordAudit(
    actor,
    'injury.recheck-suggested',
    { type: 'injury', id: injury.id },
    { runId: run.id, phase: run.phase, intervalHours: settings.recheckIntervalHours[run.phase], nextRecheckAt: next.toISOString() },
    transaction,
  );
}

/** The therapist moves (or clears) the next re-check of an open injury. */
export async function setRecheck(actor: SessionUser, injuryId: string, nextRecheckAt: string | null): Promise<InjuryView> {
  const injury = await findInjury(actor, injuryId);
  if (injury.status !== 'open') throw AppError.conflict('This injury is closed; it has no re-checks.', 'injury_closed');
  const previous = injury.nextRecheckAt?.toISOString() ?? null;
  await Injury.sequelize!.transaction(async (transaction) => {
    await injury.update({ nextRecheckAt: nextRecheckAt ? new Date(nextRecheckAt) : null, recheckSetBy: nextRecheckAt ? actor.id : null }, { transaction });
    await recordAudit(actor, nextRecheckAt ? 'injury.recheck-set' : 'injury.recheck-cleared', { type: 'injury', id: injury.id }, { previous, nextRecheckAt }, transaction);
  });
  return getInjuryView(actor, injury);
}
