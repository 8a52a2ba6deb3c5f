import { Op, type Transaction } from 'sequelize';
import { buildRunAlert, type RunAlertReason } from '../../shared/mail/run-alert';
import { redFlagLabel } from '../../shared/runs/screening';
import { Run, RunLogEntry, User } from '../models';
import { appLink, enqueueMail } from './mail-outbox-service';
import type { RunMailContext } from './home-care-service';

function alertReason(run: Run): RunAlertReason | null {
  if (run.status === 'stopped-referred') return 'stopped-referred';
  if (run.status === 'fell-back') return run.outcome === 'stop-elevate-refer' ? 'stop-elevate-refer' : 'fell-back';
  return null;
}

/**
 * Queues an alert to every active supervisor of the run's clinic when it went back to cold or stopped for a
 * red flag (a red-flag screening included). Returns how many were queued.
 */
export async function queueRunAlerts(context: RunMailContext, transaction: Transaction): Promise<number> {
  const { run } = context;
  const reason = alertReason(run);
  if (!reason) return 0;
  const supervisors = await User.findAll({ where: { clinicId: run.clinicId, role: 'supervisor', active: true }, order: [['name', 'ASC']], transaction });
  if (!supervisors.length) return 0;
  const [therapist, ending] = await Promise.all([
    User.findByPk(run.therapistId, { transaction }),
    RunLogEntry.findOne({
      where: { runId: run.id, type: { [Op.in]: ['run-fell-back', 'red-flag'] } },
      order: [['at', 'DESC']],
      transaction,
    }),
  ]);
  const detail = ending ? [ending.reason && ending.type !== 'red-flag' ? ending.reason : null, ending.detail].filter(Boolean).join(': ') || null : null;
  const ids = await enqueueMail(
    supervisors.map((supervisor) => ({
      clinicId: run.clinicId,
      kind: 'run-alert' as const,
      to: supervisor.email,
      dedupeKey: `run-alert:${run.id}:${supervisor.id}`,
      content: buildRunAlert({
        clinicName: context.clinicName,
        supervisorName: supervisor.name,
        therapistName: therapist?.name ?? 'A therapist',
        athleteName: context.athlete.name,
        injuryLabel: context.injuryLabel,
        phase: run.phase,
        reason,
        redFlags: (run.redFlags ?? []).map((id) => redFlagLabel(id)),
        detail,
        atScreening: reason === 'stopped-referred' && run.startedAt === null,
        endedAt: run.endedAt ?? new Date(),
        timeZone: context.settings.timeZone,
        reviewUrl: appLink(`/review/runs/${run.id}`),
      }),
    })),
    transaction,
  );
  return ids.length;
}
