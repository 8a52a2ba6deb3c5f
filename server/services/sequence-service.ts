import type { Transaction } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import { phases, type Phase } from '../../shared/phase';
import { defaultSequences, type Sequence as SequenceBody } from '../../shared/plan/sequence';
import type { SequenceView } from '../../shared/runs/responses';
import { stepRuleIssues } from '../../shared/plan/treatment-rules';
import { AppError } from '../errors';
import { Sequence, User } from '../models';
import { getClinicSettings } from './clinic-settings-service';
import { recordAudit } from './audit-service';

/** The clinic's newest version for a phase; a clinic that never saved one starts from our defaults as version 1. */
export async function currentSequence(clinicId: string, phase: Phase, transaction?: Transaction): Promise<Sequence> {
  const latest = await Sequence.findOne({ where: { clinicId, phase }, order: [['version', 'DESC']], transaction });
  if (latest) return latest;
  const [created] = await Sequence.findOrCreate({
    where: { clinicId, phase, version: 1 },
    defaults: { clinicId, phase, version: 1, steps: defaultSequences[phase].steps, createdBy: null },
    transaction,
  });
  return created;
}

async function toView(sequence: Sequence): Promise<SequenceView> {
  const author = sequence.createdBy ? await User.findByPk(sequence.createdBy) : null;
  return {
    id: sequence.id,
    phase: sequence.phase,
    steps: sequence.steps,
    version: sequence.version,
    createdAt: sequence.createdAt.toISOString(),
    createdByName: author?.name ?? null,
  };
}

export async function listCurrentSequences(actor: SessionUser): Promise<SequenceView[]> {
  return Promise.all(phases.map(async (phase) => toView(await currentSequence(actor.clinicId, phase))));
}

/** A save is a new version; runs keep the version (and plan) they ran. */
export async function saveSequence(actor: SessionUser, body: SequenceBody): Promise<SequenceView> {
  // The schema checked the shortest interval a clinic may set; the clinic's own interval is checked here.
  const settings = await getClinicSettings(actor.clinicId);
  const issues = stepRuleIssues(body.phase, body.steps, settings.minColdIntervalMinutes * 60);
  if (issues.length > 0) {
    throw AppError.badRequest(issues[0].message, Object.fromEntries(issues.map((issue) => [`steps.${issue.index}.${issue.field}`, issue.message])));
  }
  const saved = await Sequence.sequelize!.transaction(async (transaction) => {
    const latest = await currentSequence(actor.clinicId, body.phase, transaction);
    const created = await Sequence.create(
      { clinicId: actor.clinicId, phase: body.phase, version: latest.version + 1, steps: body.steps, createdBy: actor.id },
      { transaction },
    );
    await recordAudit(actor, 'sequence.saved', { type: 'sequence', id: created.id }, { phase: body.phase, version: created.version }, transaction);
    return created;
  });
  return toView(saved);
}
