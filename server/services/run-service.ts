import { createHash } from 'node:crypto';
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import type { PadSize as ClinicalPadSize } from '../../shared/clinical/pad-size';
import { buildPlan, type PadSize, type Plan } from '../../shared/plan/build-plan';
import type { LogEntry, RunOutcome, RunStatus } from '../../shared/runs/log-entry';
import { runProgress, type RunInProgressView } from '../../shared/runs/run-progress';
import { activeStatuses, finishedStatuses, type RunDetailView, type RunLogEntryView, type RunView } from '../../shared/runs/responses';
import { redFlagLabel, screeningOutcome, type Screening } from '../../shared/runs/screening';
import type { Phase } from '../../shared/phase';
import { AppError } from '../errors';
import { Athlete, Injury, Run, RunLogEntry, User } from '../models';
import { recordAudit } from './audit-service';
import { getClinicSettings } from './clinic-settings-service';
import { findInjury, getInjuryView } from './injury-service';
import { currentSequence } from './sequence-service';
import { queueRunFinishedMail } from './home-care-service';
import { assertGuardianConsent } from './guardian-consent-service';
import { assertTreatmentConsent } from './treatment-consent-service';
import { suggestRecheckAfterRun } from './recheck-service';

const sideWord = { left: 'left', right: 'right' } as const;

function toPlanPad(pad: ClinicalPadSize | null): PadSize | null {
  if (!pad) return null;
  return { minLengthCm: pad.length.minCm, maxLengthCm: pad.length.maxCm, minWidthCm: pad.width.minCm, maxWidthCm: pad.width.maxCm };
}

function runInjuryLabel(injury: Pick<Injury, 'region' | 'side'>): string {
  return `${injury.region.replace(/-/g, ' ')}, ${sideWord[injury.side]}`;
}

export async function toRunView(run: Run): Promise<RunView> {
  const [athlete, injury, therapist] = await Promise.all([Athlete.findByPk(run.athleteId), Injury.findByPk(run.injuryId), User.findByPk(run.therapistId)]);
  const outcome = run.screening ? screeningOutcome(run.screening) : null;
  return {
    id: run.id,
    injuryId: run.injuryId,
    athleteId: run.athleteId,
    athleteName: athlete?.name ?? '',
    injuryLabel: injury ? runInjuryLabel(injury) : '',
    therapistId: run.therapistId,
    therapistName: therapist?.name ?? '',
    phase: run.phase,
    status: run.status,
    outcome: run.outcome,
    plan: run.plan,
    sequenceVersion: run.sequenceVersion,
    screening: run.screening,
    screeningOutcome: outcome,
    startedAt: run.startedAt?.toISOString() ?? null,
    endedAt: run.endedAt?.toISOString() ?? null,
    createdAt: run.createdAt.toISOString(),
    ...(run.status === 'stopped-referred' && run.redFlags?.length
      ? { message: `Stop and refer: ${run.redFlags.map((id) => redFlagLabel(id)).join('; ')}. Refer the athlete to a physician now; do not treat.` }
      : {}),
  };
}

function toEntryView(entry: RunLogEntry): RunLogEntryView {
  return {
    id: String(entry.id),
    key: entry.idempotencyKey,
    seq: entry.seq,
    type: entry.type,
    stepIndex: entry.stepIndex,
    kind: entry.kind,
    plannedSeconds: entry.plannedSeconds,
    actualSeconds: entry.actualSeconds,
    at: entry.at.toISOString(),
    reason: entry.reason,
    detail: entry.detail,
    recordedAt: entry.createdAt.toISOString(),
  };
}

/** A run of the caller's clinic; any other is "not found". */
export async function findRun(actor: SessionUser, id: string, transaction?: Transaction, lock = false): Promise<Run> {
  const run = await Run.findOne({ where: { id, clinicId: actor.clinicId }, transaction, lock: lock ? transaction?.LOCK.UPDATE : undefined });
  if (!run) throw AppError.notFound('Run');
  return run;
}

/** Runs nobody has touched for the clinic's limit are closed as abandoned (decisions: 12 hours by default). */
export async function abandonStaleRuns(clinicId: string): Promise<number> {
  const settings = await getClinicSettings(clinicId);
  const cutoff = new Date(Date.now() - settings.abandonAfterHours * 3_600_000);
  const [count] = await Run.update(
    { status: 'abandoned', endedAt: new Date() },
    { where: { clinicId, status: { [Op.in]: [...activeStatuses] }, lastActivityAt: { [Op.lt]: cutoff } } },
  );
  return count;
}

async function planFor(actor: SessionUser, injury: Injury, screening: Screening | null): Promise<{ plan: Plan; phase: Phase; sequenceId: string; sequenceVersion: number }> {
  const [view, settings] = await Promise.all([getInjuryView(actor, injury), getClinicSettings(actor.clinicId)]);
  const sequence = await currentSequence(actor.clinicId, view.phase);
  const outcome = screening ? screeningOutcome(screening) : null;
  const plan = buildPlan({
    phase: view.phase,
    sequence: { phase: view.phase, steps: sequence.steps },
    tolerance: screening?.tolerance ?? 'usual',
    padSize: toPlanPad(view.assessment.padSize),
    padOversize: view.assessment.padSize?.oversize ?? false,
    coldContraindicated: outcome?.coldContraindicated ?? false,
    suspectedMyositis: outcome?.suspectedMyositis ?? false,
    bleedingRisk: outcome?.bleedingRisk ?? false,
    openSkin: outcome?.openSkin ?? false,
    minColdIntervalSeconds: settings.minColdIntervalMinutes * 60,
  });
  return { plan, phase: view.phase, sequenceId: sequence.id, sequenceVersion: sequence.version };
}

function screeningFields(screening: Screening | null) {
  if (!screening) return { status: 'screening' as RunStatus, outcome: null, redFlags: null, endedAt: null };
  const outcome = screeningOutcome(screening);
  if (outcome.outcome === 'refer') {
    // A red flag is recorded as a run that stopped before it began, so the supervisor sees it.
    return { status: 'stopped-referred' as RunStatus, outcome: 'stopped-referred' as RunOutcome, redFlags: outcome.redFlags, endedAt: new Date() };
  }
  return { status: 'ready' as RunStatus, outcome: null, redFlags: null, endedAt: null };
}

export async function createRun(actor: SessionUser, input: { injuryId: string; screening?: Screening }): Promise<RunView> {
  const injury = await findInjury(actor, input.injuryId);
  if (injury.status !== 'open') throw AppError.conflict('This injury is closed; reopen it before starting a run.', 'injury_closed');
  await assertTreatmentConsent(actor, injury.athleteId);
  await assertGuardianConsent(actor, injury.athleteId);
  await abandonStaleRuns(actor.clinicId);
  const active = await Run.findOne({ where: { injuryId: injury.id, status: { [Op.in]: [...activeStatuses] } } });
  if (active) throw AppError.conflict('A run is already in progress for this injury.', 'run_active', { runId: active.id });

  const screening = input.screening ?? null;
  const { plan, phase, sequenceId, sequenceVersion } = await planFor(actor, injury, screening);
  const fields = screeningFields(screening);
  try {
    const run = await Run.sequelize!.transaction(async (transaction) => {
      const created = await Run.create(
        {
          clinicId: actor.clinicId,
          injuryId: injury.id,
          athleteId: injury.athleteId,
          therapistId: actor.id,
          phase,
          plan,
          sequenceId,
          sequenceVersion,
          screening,
          startedAt: null,
          ...fields,
        },
        { transaction },
      );
      await recordAudit(actor, 'run.created', { type: 'run', id: created.id }, { injuryId: injury.id, status: created.status }, transaction);
      await suggestRecheckAfterRun(actor, created, transaction);
      // A red-flag screening records a finished run: the supervisor's alert is committed with it.
      await queueRunFinishedMail(actor, created, transaction);
      return created;
    });
    return toRunView(run);
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw AppError.conflict('A run is already in progress for this injury.', 'run_active');
    throw error;
  }
}

export async function completeScreening(actor: SessionUser, runId: string, screening: Screening): Promise<RunView> {
  const run = await findRun(actor, runId);
  if (run.status !== 'screening') throw AppError.conflict('This run has already been screened.', 'already_screened');
  const injury = await findInjury(actor, run.injuryId);
  const { plan, phase, sequenceId, sequenceVersion } = await planFor(actor, injury, screening);
  await Run.sequelize!.transaction(async (transaction) => {
    await run.update({ plan, phase, sequenceId, sequenceVersion, screening, lastActivityAt: new Date(), ...screeningFields(screening) }, { transaction });
    await recordAudit(actor, 'run.screened', { type: 'run', id: run.id }, { status: run.status }, transaction);
    await suggestRecheckAfterRun(actor, run, transaction);
    await queueRunFinishedMail(actor, run, transaction);
  });
  return toRunView(run);
}

export async function getRunDetail(actor: SessionUser, runId: string): Promise<RunDetailView> {
  const run = await findRun(actor, runId);
  const entries = await RunLogEntry.findAll({
    where: { runId: run.id },
    order: [
      ['seq', 'ASC NULLS LAST'],
      ['at', 'ASC'],
      ['id', 'ASC'],
    ],
  });
  return { run: await toRunView(run), entries: entries.map(toEntryView) };
}

/** Stable across key order, so the same entry sent again hashes the same. */
function hashEntry(entry: LogEntry): string {
  const canonical = JSON.stringify(Object.fromEntries(Object.entries(entry).filter(([, v]) => v !== undefined).sort(([a], [b]) => a.localeCompare(b))));
  return createHash('sha256').update(canonical).digest('hex');
}

/** What an entry does to its run: the first starts it; the last kinds end it. */
function runChangesFor(run: Run, entry: LogEntry): Partial<Pick<Run, 'status' | 'outcome' | 'startedAt' | 'endedAt' | 'redFlags'>> {
  const at = new Date(entry.at);
  const start = run.startedAt ? {} : { startedAt: at };
  switch (entry.type) {
    case 'run-completed':
      return { ...start, status: 'completed', outcome: 'completed', endedAt: at };
    case 'run-fell-back':
      return { ...start, status: 'fell-back', outcome: entry.detail?.startsWith('stop, elevate') ? 'stop-elevate-refer' : 'fell-back', endedAt: at };
    case 'red-flag':
      return { ...start, status: 'stopped-referred', outcome: 'stopped-referred', endedAt: at, redFlags: [...(run.redFlags ?? []), entry.reason ?? 'red flag'] };
    case 'run-ended-early':
      return { ...start, status: 'ended-early', outcome: 'ended-early', endedAt: at };
    default:
      return { ...start, status: 'running' };
  }
}

export type AppendResult = { created: boolean; entry: RunLogEntryView };

/**
 * Stores one log entry exactly once. The same key and body again → the stored entry (not stored twice);
 * the same key with another body → 409; a finished run takes no new entries.
 */
export async function appendLogEntry(actor: SessionUser, runId: string, key: string, entry: LogEntry): Promise<AppendResult> {
  const bodyHash = hashEntry(entry);
  const replay = async (transaction?: Transaction): Promise<AppendResult | null> => {
    const existing = await RunLogEntry.findOne({ where: { runId, idempotencyKey: key }, transaction });
    if (!existing) return null;
    if (existing.bodyHash !== bodyHash) {
      throw AppError.conflict('This Idempotency-Key was already used for a different entry.', 'idempotency_key_reused');
    }
    return { created: false, entry: toEntryView(existing) };
  };

  try {
    const result = await Run.sequelize!.transaction(async (transaction) => {
      // The row lock serialises entries of one run, so status changes follow the log's order.
      const run = await findRun(actor, runId, transaction, true);
      const earlier = await replay(transaction);
      if (earlier) return earlier;
      if (finishedStatuses.includes(run.status)) throw AppError.conflict('This run has finished; it takes no new entries.', 'run_finished');
      if (run.status === 'screening') throw AppError.conflict('Complete the screening before the run starts.', 'not_screened');

      const stored = await RunLogEntry.create(
        {
          clinicId: actor.clinicId,
          runId,
          idempotencyKey: key,
          bodyHash,
          seq: entry.seq ?? null,
          type: entry.type,
          stepIndex: entry.stepIndex ?? null,
          kind: entry.kind ?? null,
          plannedSeconds: entry.plannedSeconds ?? null,
          actualSeconds: entry.actualSeconds ?? null,
          at: new Date(entry.at),
          reason: entry.reason ?? null,
          detail: entry.detail ?? null,
          recordedBy: actor.id,
        },
        { transaction },
      );
      const changes = runChangesFor(run, entry);
      await run.update({ ...changes, lastActivityAt: new Date() }, { transaction });
      if (changes.status && changes.status !== 'running') {
        await recordAudit(actor, `run.${changes.status}`, { type: 'run', id: runId }, { entryType: entry.type }, transaction);
        await suggestRecheckAfterRun(actor, run, transaction);
        await queueRunFinishedMail(actor, run, transaction);
      }
      return { created: true, entry: toEntryView(stored) };
    });
    return result;
  } catch (error) {
    // Two copies of one entry raced: the other one won, so this is a replay.
    if (error instanceof UniqueConstraintError) {
      const earlier = await replay();
      if (earlier) return earlier;
    }
    throw error;
  }
}

export async function listRunsForInjury(actor: SessionUser, injuryId: string): Promise<RunView[]> {
  await findInjury(actor, injuryId);
  const runs = await Run.findAll({ where: { clinicId: actor.clinicId, injuryId }, order: [['createdAt', 'DESC']], limit: 50 });
  return Promise.all(runs.map(toRunView));
}

/**
 * The clinic's runs under way (ready to begin or running), newest first, for Today and the injury page: a run
 * left in table mode keeps its place on the office screens until it ends. Runs past the abandon cut-off are
 * left out without writing: the periodic clean-up files them.
 */
export async function listRunsInProgress(actor: SessionUser, injuryId?: string): Promise<RunInProgressView[]> {
  const settings = await getClinicSettings(actor.clinicId);
  const cutoff = new Date(Date.now() - settings.abandonAfterHours * 3_600_000);
  const runs = await Run.findAll({
    where: { clinicId: actor.clinicId, status: { [Op.in]: ['ready', 'running'] }, lastActivityAt: { [Op.gte]: cutoff }, ...(injuryId ? { injuryId } : {}) },
    order: [['createdAt', 'DESC']],
    limit: 50,
  });
  if (!runs.length) return [];
  // Polled by every open Today screen: one query per table for all the runs, not three per run.
  const ids = (rows: Run[], key: 'athleteId' | 'injuryId' | 'therapistId') => [...new Set(rows.map((r) => r[key]))];
  const [entries, athletes, injuries, therapists] = await Promise.all([
    RunLogEntry.findAll({
      where: { clinicId: actor.clinicId, runId: { [Op.in]: runs.map((r) => r.id) }, type: { [Op.in]: ['step-completed', 'step-skipped'] } },
      attributes: ['runId', 'type', 'stepIndex', 'at'],
    }),
    Athlete.findAll({ where: { id: { [Op.in]: ids(runs, 'athleteId') } }, attributes: ['id', 'name'] }),
    Injury.findAll({ where: { id: { [Op.in]: ids(runs, 'injuryId') } }, attributes: ['id', 'region', 'side'] }),
    User.findAll({ where: { id: { [Op.in]: ids(runs, 'therapistId') } }, attributes: ['id', 'name'] }),
  ]);
  const byId = <T extends { id: string }>(rows: T[]) => new Map(rows.map((row) => [row.id, row]));
  const [athleteOf, injuryOf, therapistOf] = [byId(athletes), byId(injuries), byId(therapists)];
  return runs.map((run) => {
    const injury = injuryOf.get(run.injuryId);
    return {
      runId: run.id,
      injuryId: run.injuryId,
      athleteName: athleteOf.get(run.athleteId)?.name ?? '',
      injuryLabel: injury ? runInjuryLabel(injury) : '',
      therapistName: therapistOf.get(run.therapistId)?.name ?? '',
      status: run.status,
      ...runProgress(run.plan, entries.filter((e) => e.runId === run.id), run.startedAt),
      lastActivityAt: run.lastActivityAt.toISOString(),
    };
  });
}
