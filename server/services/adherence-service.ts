import { QueryTypes } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import type { Phase } from '../../shared/phase';
import type { RunStatus } from '../../shared/runs/log-entry';
import { adherenceReport, type AdherenceReport, type AdherenceRun } from '../../shared/review/adherence';
import { stepResultTypes, type StepEntryLike } from '../../shared/review/attention';
import { defaultAdherenceDays, resolveRange, reviewOutcomes, type AdherenceQuery } from '../../shared/review/query';
import { AppError } from '../errors';
import { Run, User } from '../models';
import { getClinicSettings } from './clinic-settings-service';
import { runFilterSql } from './review-service';

const dayMs = 86_400_000;

/**
 * The clinic's adherence figures over a date range (finished runs created in it). The service only reads;
 * every rule of what counts lives in shared/review/adherence.ts, where it is unit-tested.
 */
export async function getAdherence(actor: SessionUser, query: AdherenceQuery): Promise<AdherenceReport> {
  // Without a range: the four weeks up to now; with one end only, the four weeks before its end, or from its start to now.
  const { timeZone } = await getClinicSettings(actor.clinicId);
  const resolved = resolveRange(query, timeZone);
  const to = resolved.to ?? new Date();
  const from = resolved.from ?? new Date(to.getTime() - defaultAdherenceDays * dayMs);
  if (from >= to) throw AppError.badRequest('The end of the range must be after its start', { to: 'The end of the range must not be before its start' });
  const { where: filter, replacements: bounded } = await runFilterSql(actor, { from: from.toISOString(), to: to.toISOString() });
  const sequelize = Run.sequelize!;
  const [runs, entries] = await Promise.all([
    sequelize.query<{ id: string; therapist_id: string; phase: Phase; status: RunStatus }>(
      `SELECT r.id, r.therapist_id, r.phase, r.status FROM runs r WHERE ${filter}`,
      { replacements: bounded, type: QueryTypes.SELECT },
    ),
    sequelize.query<{ run_id: string; type: string; kind: string | null; step_index: number | null; actual_seconds: number | null; detail: string | null }>(
      `SELECT e.run_id, e.type, e.kind, e.step_index, e.actual_seconds, e.detail
         FROM run_log_entries e JOIN runs r ON r.id = e.run_id
        WHERE ${filter} AND e.clinic_id = :clinicId AND e.type IN (${stepResultTypes.map((t) => `'${t}'`).join(', ')})`,
      { replacements: bounded, type: QueryTypes.SELECT },
    ),
  ]);
  const entriesByRun = new Map<string, StepEntryLike[]>();
  for (const e of entries) {
    const entry: StepEntryLike = { type: e.type, kind: e.kind, stepIndex: e.step_index, actualSeconds: e.actual_seconds, detail: e.detail };
    const list = entriesByRun.get(e.run_id);
    if (list) list.push(entry);
    else entriesByRun.set(e.run_id, [entry]);
  }
  const adherenceRuns: AdherenceRun[] = runs
    .filter((r) => (reviewOutcomes as readonly string[]).includes(r.status))
    .map((r) => ({ therapistId: r.therapist_id, phase: r.phase, status: r.status, entries: entriesByRun.get(r.id) ?? [] }));
  const staff = await User.findAll({ where: { clinicId: actor.clinicId, id: [...new Set(runs.map((r) => r.therapist_id))] }, attributes: ['id', 'name'] });
  return adherenceReport(adherenceRuns, new Map(staff.map((u) => [u.id, u.name])), { from: from.toISOString(), to: to.toISOString() });
}
