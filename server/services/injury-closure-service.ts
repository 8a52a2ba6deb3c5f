import { Op } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import { unmetReasonMessage, type ClosureView, type EpisodeLink } from '../../shared/clinic/closure';
import { latestMeasurement, returnToActivityCheck } from '../../shared/clinical/return-to-activity';
import { isAnteriorThighRegion, type BodyRegionId } from '../../shared/records/body-map';
import type { InjuryClose, Reinjury } from '../../shared/records/injury';
import type { InjuryView } from '../../shared/records/responses';
import { activeStatuses } from '../../shared/runs/responses';
import { AppError } from '../errors';
import { Injury, Measurement, Run, User } from '../models';
import { recordAudit } from './audit-service';
import { getClinicSettings } from './clinic-settings-service';
import { findInjury, getInjuryView } from './injury-service';

const toLink = (injury: Injury): EpisodeLink => ({
  id: injury.id,
  injuredAt: injury.injuredAt.toISOString(),
  status: injury.status,
  closedAt: injury.closedAt?.toISOString() ?? null,
});

export async function getClosure(actor: SessionUser, injuryId: string): Promise<ClosureView> {
  const injury = await findInjury(actor, injuryId);
  const [measurements, settings, earlier, later, activeRun, closedBy] = await Promise.all([
    Measurement.findAll({ where: { injuryId: injury.id, clinicId: actor.clinicId }, order: [['takenAt', 'ASC']] }),
    getClinicSettings(actor.clinicId),
    injury.reinjuryOfId ? Injury.findOne({ where: { id: injury.reinjuryOfId, clinicId: actor.clinicId } }) : null,
    Injury.findAll({ where: { reinjuryOfId: injury.id, clinicId: actor.clinicId }, order: [['injuredAt', 'ASC']] }),
    Run.findOne({ where: { injuryId: injury.id, status: { [Op.in]: [...activeStatuses] } }, attributes: ['id'] }),
    injury.closure ? User.findByPk(injury.closure.closedBy, { attributes: ['name'] }) : null,
  ]);
  const latest = latestMeasurement(measurements);
  const closure = injury.status === 'closed' && injury.closure ? injury.closure : null;
  return {
    injuryId: injury.id,
    status: injury.status,
    region: injury.region,
    girthThresholdCm: settings.swellingThresholdCm,
    check: returnToActivityCheck({ region: injury.region as BodyRegionId, measurements, girthThresholdCm: settings.swellingThresholdCm, passedTests: [] }),
    latestMeasurement: latest
      ? {
          id: latest.id,
          takenAt: latest.takenAt.toISOString(),
          kneeFlexionDeg: latest.kneeFlexionDeg,
          girthInjuredCm: latest.girthInjuredCm,
          girthOtherCm: latest.girthOtherCm,
          painNprs: latest.painNprs,
        }
      : null,
    closure: closure
      ? {
          closedAt: (injury.closedAt ?? injury.updatedAt).toISOString(),
          closedByName: closedBy?.name ?? null,
          allMet: closure.allMet,
          criteria: closure.criteria,
          measurement: closure.measurement,
          reason: closure.reason,
        }
      : null,
    reinjuryOf: earlier ? toLink(earlier) : null,
    reinjuries: later.map(toLink),
    activeRunId: activeRun?.id ?? null,
  };
}

/**
 * Closes an injury after the return-to-activity check, computed here from the latest measurement (never
 * taken from the client). Every criterion met → closed; otherwise a reason is required, and kept with the
 * check as it stood.
 */
export async function closeInjury(actor: SessionUser, injuryId: string, input: InjuryClose): Promise<InjuryView> {
  await findInjury(actor, injuryId);
  const settings = await getClinicSettings(actor.clinicId);
  const injury = await Injury.sequelize!.transaction(async (transaction) => {
    // The row lock makes a second, simultaneous close wait and then see the first.
    const row = await Injury.findOne({ where: { id: injuryId, clinicId: actor.clinicId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw AppError.notFound('Injury');
    if (row.status === 'closed') throw AppError.conflict('This injury is already closed.', 'injury_closed');
    const active = await Run.findOne({ where: { injuryId, status: { [Op.in]: [...activeStatuses] } }, transaction });
    if (active) throw AppError.conflict('A run is in progress for this injury: finish or end it before closing.', 'run_active', { runId: active.id });

    const measurements = await Measurement.findAll({ where: { injuryId, clinicId: actor.clinicId }, transaction });
    const check = returnToActivityCheck({
      region: row.region as BodyRegionId,
      measurements,
      girthThresholdCm: settings.swellingThresholdCm,
      passedTests: input.passedTests,
    });
    if (!check.allMet && !input.reason) {
      const unmet = check.unmet.map((c) => c.label.charAt(0).toLowerCase() + c.label.slice(1)).join('; ');
      throw AppError.badRequest(`${unmetReasonMessage}: ${unmet}.`, { reason: `${unmetReasonMessage}.` });
    }
    const closedAt = input.closedAt ? new Date(input.closedAt) : new Date();
    if (closedAt < row.injuredAt) {
      throw AppError.badRequest('Closed date cannot be before the injury', { closedAt: 'Closed date cannot be before the injury' });
    }
    await row.update(
      {
        status: 'closed',
        closedAt,
        nextRecheckAt: null,
        recheckSetBy: null,
        closure: {
          closedBy: actor.id,
          allMet: check.allMet,
          criteria: check.criteria,
          measurement: check.measurement,
          reason: check.allMet ? null : (input.reason ?? null),
        },
      },
      { transaction },
    );
    await recordAudit(
      actor,
      'injury.closed',
      { type: 'injury', id: row.id },
      { allMet: check.allMet, unmet: check.unmet.map((c) => c.id), reason: check.allMet ? null : input.reason, measurementId: check.measurement?.id ?? null },
      transaction,
    );
    return row;
  });
  return getInjuryView(actor, injury);
}

/**
 * A new blow to the site of a closed injury: a new injury (a new episode with its own phases and
 * measurements) linked to the earlier one, which stays closed as it was. A previous quadriceps injury is a
 * risk factor for myositis ossificans (Ryan et al. 1991), so a re-injury of the anterior thigh carries it.
 */
export async function recordReinjury(actor: SessionUser, injuryId: string, input: Reinjury): Promise<InjuryView> {
  const earlier = await findInjury(actor, injuryId);
  if (earlier.status !== 'closed') {
    throw AppError.conflict('This injury is still open: record a measurement on it, or close it before recording a re-injury.', 'injury_open');
  }
  const injuredAt = new Date(input.injuredAt);
  const notBefore = earlier.closedAt ?? earlier.injuredAt;
  if (injuredAt < notBefore) {
    const message = 'A re-injury must happen after the earlier episode was closed';
    throw AppError.badRequest(message, { injuredAt: message });
  }
  const created = await Injury.sequelize!.transaction(async (transaction) => {
    const injury = await Injury.create(
      {
        clinicId: actor.clinicId,
        athleteId: earlier.athleteId,
        region: earlier.region,
        side: earlier.side,
        mechanismKind: input.mechanismKind,
        mechanism: input.mechanism ?? null,
        injuredAt,
        haematomaType: input.haematomaType,
        previousQuadricepsInjury: earlier.previousQuadricepsInjury || isAnteriorThighRegion(earlier.region as BodyRegionId),
        kneeEffusion: false,
        treatmentStartedAt: null,
        closedAt: null,
        phaseOverride: null,
        createdBy: actor.id,
        reinjuryOfId: earlier.id,
      },
      { transaction },
    );
    await recordAudit(actor, 'injury.created', { type: 'injury', id: injury.id }, { athleteId: earlier.athleteId, reinjuryOf: earlier.id }, transaction);
    await recordAudit(actor, 'injury.reinjured', { type: 'injury', id: earlier.id }, { newInjuryId: injury.id }, transaction);
    return injury;
  });
  return getInjuryView(actor, created);
}
