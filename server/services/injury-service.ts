import { Op } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import type { ClinicSettings } from '../../shared/clinic/settings';
import { assessInjury } from '../../shared/clinical/assess-injury';
import { coldSchedule } from '../../shared/clinical/cold-schedule';
import { isRemeasureDue } from '../../shared/clinical/remeasure';
import { recheckStatus } from '../../shared/clinic/recheck';
import { bodyRegionById, type BodyRegionId } from '../../shared/records/body-map';
import type { InjuryCreate, InjuryUpdate, PhaseOverride } from '../../shared/records/injury';
import type { MeasurementCreate } from '../../shared/records/measurement';
import type { InjuryDetailView, InjuryView, MeasurementView } from '../../shared/records/responses';
import { AppError } from '../errors';
import { Athlete, Injury, Measurement } from '../models';
import { findAthlete, toAthleteView } from './athlete-service';
import { recordAudit } from './audit-service';
import { getClinicSettings } from './clinic-settings-service';
import { staffNames } from './staff-names';

/** An injury of the caller's clinic; any other is "not found". */
export async function findInjury(actor: SessionUser, id: string): Promise<Injury> {
  const injury = await Injury.findOne({ where: { id, clinicId: actor.clinicId } });
  if (!injury) throw AppError.notFound('Injury');
  return injury;
}


function toMeasurementView(m: Measurement, names: Map<string, string>): MeasurementView {
  return {
    id: m.id,
    injuryId: m.injuryId,
    takenAt: m.takenAt.toISOString(),
    girthInjuredCm: m.girthInjuredCm,
    girthOtherCm: m.girthOtherCm,
    girthLandmark: m.girthLandmark,
    girthDistanceCm: m.girthDistanceCm,
    kneeFlexionDeg: m.kneeFlexionDeg,
    painNprs: m.painNprs,
    bruiseLengthCm: m.bruiseLengthCm,
    bruiseWidthCm: m.bruiseWidthCm,
    skinfoldMm: m.skinfoldMm,
    notes: m.notes,
    recordedByName: m.recordedBy ? names.get(m.recordedBy) ?? null : null,
  };
}

/** The record plus what Mendstep computes from it, so every screen shows the same severity, phase and risks. */
export function toInjuryView(
  injury: Injury,
  athlete: Pick<Athlete, 'name' | 'sport'>,
  measurements: Measurement[],
  settings: ClinicSettings,
  names: Map<string, string>,
  now = new Date(),
): InjuryView {
  const override = injury.phaseOverride;
  const assessment = assessInjury({
    injury: {
      region: injury.region as BodyRegionId,
      injuredAt: injury.injuredAt,
      previousQuadricepsInjury: injury.previousQuadricepsInjury,
      kneeEffusion: injury.kneeEffusion,
      treatmentStartedAt: injury.treatmentStartedAt,
      phaseOverride: override ? { phase: override.phase, reason: override.reason } : null,
    },
    athleteSport: athlete.sport,
    measurements,
    settings,
    now,
  });
  const lastMeasuredAt = measurements.reduce<Date | null>((latest, m) => (!latest || m.takenAt > latest ? m.takenAt : latest), null);
  return {
    id: injury.id,
    athleteId: injury.athleteId,
    athleteName: athlete.name,
    region: injury.region,
    regionLabel: bodyRegionById(injury.region as BodyRegionId)?.label ?? injury.region,
    side: injury.side,
    mechanismKind: injury.mechanismKind,
    mechanism: injury.mechanism,
    injuredAt: injury.injuredAt.toISOString(),
    haematomaType: injury.haematomaType,
    previousQuadricepsInjury: injury.previousQuadricepsInjury,
    kneeEffusion: injury.kneeEffusion,
    treatmentStartedAt: injury.treatmentStartedAt?.toISOString() ?? null,
    status: injury.status,
    closedAt: injury.closedAt?.toISOString() ?? null,
    phaseOverride: override ? { phase: override.phase, reason: override.reason, at: override.at, byName: names.get(override.by) ?? null } : null,
    severity: assessment.severity,
    suggestedPhase: assessment.suggestedPhase,
    phase: assessment.phase,
    phaseReason: assessment.phaseReason,
    phaseIsOverride: assessment.phaseIsOverride,
    risks: assessment.risks,
    assessment,
    lastMeasuredAt: lastMeasuredAt?.toISOString() ?? null,
    remeasureDue: injury.status === 'open' && isRemeasureDue(assessment.phase, lastMeasuredAt, now),
    ...recheckAndClosure(injury, settings, names, now),
  };
}

/** Staff named on an injury's record: the override's author, who set the re-check, who closed it. */
function injuryStaffIds(injury: Injury): (string | null | undefined)[] {
  return [injury.phaseOverride?.by, injury.recheckSetBy, injury.closure?.closedBy];
}

function recheckAndClosure(injury: Injury, settings: ClinicSettings, names: Map<string, string>, now: Date) {
  const open = injury.status === 'open';
  const closure = !open && injury.closure ? injury.closure : null;
  return {
    nextRecheckAt: open ? (injury.nextRecheckAt?.toISOString() ?? null) : null,
    recheckStatus: recheckStatus(open ? (injury.nextRecheckAt ?? null) : null, now, settings.timeZone),
    recheckSetByName: open && injury.recheckSetBy ? (names.get(injury.recheckSetBy) ?? null) : null,
    reinjuryOfId: injury.reinjuryOfId ?? null,
    closure: closure
      ? {
          closedAt: (injury.closedAt ?? injury.updatedAt).toISOString(),
          closedByName: names.get(closure.closedBy) ?? null,
          allMet: closure.allMet,
          criteria: closure.criteria,
          measurement: closure.measurement,
          reason: closure.reason,
        }
      : null,
  };
}

export async function getInjuryView(actor: SessionUser, injury: Injury): Promise<InjuryView> {
  const [athlete, measurements, settings] = await Promise.all([
    Athlete.findByPk(injury.athleteId),
    Measurement.findAll({ where: { injuryId: injury.id }, order: [['takenAt', 'ASC']] }),
    getClinicSettings(actor.clinicId),
  ]);
  const names = await staffNames(injuryStaffIds(injury));
  return toInjuryView(injury, athlete!, measurements, settings, names);
}

export async function getInjuryDetail(actor: SessionUser, id: string): Promise<InjuryDetailView> {
  const injury = await findInjury(actor, id);
  const [athlete, measurements, settings] = await Promise.all([
    Athlete.findByPk(injury.athleteId),
    Measurement.findAll({ where: { injuryId: injury.id }, order: [['takenAt', 'ASC']] }),
    getClinicSettings(actor.clinicId),
  ]);
  const names = await staffNames([...injuryStaffIds(injury), ...measurements.map((m) => m.recordedBy)]);
  const latestSkinfold = [...measurements].reverse().find((m) => m.skinfoldMm !== null)?.skinfoldMm ?? null;
  return {
    injury: toInjuryView(injury, athlete!, measurements, settings, names),
    athlete: await toAthleteView(athlete!),
    measurements: measurements.map((m) => toMeasurementView(m, names)),
    coldSchedule: coldSchedule({
      start: new Date().toISOString(),
      timeZone: settings.timeZone,
      wakingHours: settings.wakingHours,
      protocol: settings.coldProtocol,
      skinfoldMm: latestSkinfold,
    }),
  };
}

/** Injuries of the clinic (open ones for Today by default), with their computed fields, oldest injury last. */
export async function listInjuries(actor: SessionUser, filter: { status?: 'open' | 'closed'; athleteId?: string }): Promise<InjuryView[]> {
  const injuries = await Injury.findAll({
    where: {
      clinicId: actor.clinicId,
      ...(filter.status ? { status: filter.status } : {}),
      ...(filter.athleteId ? { athleteId: filter.athleteId } : {}),
    },
    order: [['injuredAt', 'DESC']],
  });
  if (!injuries.length) return [];
  const [athletes, measurements, settings] = await Promise.all([
    Athlete.findAll({ where: { id: { [Op.in]: [...new Set(injuries.map((i) => i.athleteId))] } } }),
    Measurement.findAll({ where: { injuryId: { [Op.in]: injuries.map((i) => i.id) } }, order: [['takenAt', 'ASC']] }),
    getClinicSettings(actor.clinicId),
  ]);
  const athleteById = new Map(athletes.map((a) => [a.id, a]));
  const byInjury = new Map<string, Measurement[]>();
  for (const m of measurements) byInjury.set(m.injuryId, [...(byInjury.get(m.injuryId) ?? []), m]);
  const names = await staffNames(injuries.flatMap(injuryStaffIds));
  const now = new Date();
  return injuries.map((injury) => toInjuryView(injury, athleteById.get(injury.athleteId)!, byInjury.get(injury.id) ?? [], settings, names, now));
}

export async function createInjury(actor: SessionUser, input: InjuryCreate): Promise<InjuryView> {
  // The athlete must be the caller's clinic's; another clinic's athlete is "not found".
  await findAthlete(actor, input.athleteId);
  const injury = await Injury.sequelize!.transaction(async (transaction) => {
    const created = await Injury.create(
      {
        clinicId: actor.clinicId,
        athleteId: input.athleteId,
        region: input.region,
        side: input.side,
        mechanismKind: input.mechanismKind,
        mechanism: input.mechanism ?? null,
        injuredAt: new Date(input.injuredAt),
        haematomaType: input.haematomaType,
        previousQuadricepsInjury: input.previousQuadricepsInjury,
        kneeEffusion: input.kneeEffusion,
        treatmentStartedAt: input.treatmentStartedAt ? new Date(input.treatmentStartedAt) : null,
        closedAt: null,
        phaseOverride: null,
        createdBy: actor.id,
      },
      { transaction },
    );
    await recordAudit(actor, 'injury.created', { type: 'injury', id: created.id }, { athleteId: input.athleteId }, transaction);
    return created;
  });
  return getInjuryView(actor, injury);
}

function storedOverride(actor: SessionUser, override: PhaseOverride | null | undefined) {
  if (override === undefined) return {};
  return { phaseOverride: override ? { phase: override.phase, reason: override.reason, by: actor.id, at: new Date().toISOString() } : null };
}

export async function updateInjury(actor: SessionUser, id: string, input: InjuryUpdate): Promise<InjuryView> {
  const injury = await findInjury(actor, id);
  const { phaseOverride, injuredAt, treatmentStartedAt, closedAt, status, ...rest } = input;
  const nextInjuredAt = injuredAt ? new Date(injuredAt) : injury.injuredAt;
  const nextTreatment = treatmentStartedAt === undefined ? injury.treatmentStartedAt : treatmentStartedAt ? new Date(treatmentStartedAt) : null;
  if (nextTreatment && nextTreatment < nextInjuredAt) {
    throw AppError.badRequest('Treatment start cannot be before the injury', { treatmentStartedAt: 'Treatment start cannot be before the injury' });
  }
  // Closing goes through the return-to-activity check (POST /close) and reopening through a re-injury, so
  // an edit cannot skip them.
  if (status !== undefined || closedAt !== undefined) {
    const field = status !== undefined ? 'status' : 'closedAt';
    throw AppError.badRequest('Close an injury through its return-to-activity check, or record a re-injury.', {
      [field]: 'Use the closing check to close an injury',
    });
  }
  await Injury.sequelize!.transaction(async (transaction) => {
    await injury.update(
      {
        ...rest,
        ...(injuredAt ? { injuredAt: nextInjuredAt } : {}),
        ...(treatmentStartedAt !== undefined ? { treatmentStartedAt: nextTreatment } : {}),
        ...storedOverride(actor, phaseOverride),
      },
      { transaction },
    );
    await recordAudit(actor, 'injury.updated', { type: 'injury', id }, { fields: Object.keys(input) }, transaction);
  });
  return getInjuryView(actor, injury);
}

export async function setPhaseOverride(actor: SessionUser, id: string, override: PhaseOverride | null): Promise<InjuryView> {
  const injury = await findInjury(actor, id);
  await Injury.sequelize!.transaction(async (transaction) => {
    await injury.update(storedOverride(actor, override), { transaction });
    await recordAudit(
      actor,
      override ? 'injury.phase-overridden' : 'injury.phase-override-cleared',
      { type: 'injury', id },
      override ? { phase: override.phase, reason: override.reason } : {},
      transaction,
    );
  });
  return getInjuryView(actor, injury);
}

export async function addMeasurement(actor: SessionUser, injuryId: string, input: MeasurementCreate): Promise<{ measurement: MeasurementView; injury: InjuryView }> {
  const injury = await findInjury(actor, injuryId);
  if (new Date(input.takenAt) < injury.injuredAt) {
    throw AppError.badRequest('A measurement cannot be taken before the injury happened', { takenAt: 'Must be after the injury date and time' });
  }
  const measurement = await Measurement.sequelize!.transaction(async (transaction) => {
    const created = await Measurement.create(
      {
        clinicId: actor.clinicId,
        injuryId,
        takenAt: new Date(input.takenAt),
        girthInjuredCm: input.girthInjuredCm ?? null,
        girthOtherCm: input.girthOtherCm ?? null,
        girthLandmark: input.girthLandmark ?? null,
        girthDistanceCm: input.girthDistanceCm ?? null,
        kneeFlexionDeg: input.kneeFlexionDeg ?? null,
        painNprs: input.painNprs ?? null,
        bruiseLengthCm: input.bruiseLengthCm ?? null,
        bruiseWidthCm: input.bruiseWidthCm ?? null,
        skinfoldMm: input.skinfoldMm ?? null,
        notes: input.notes ?? null,
        recordedBy: actor.id,
      },
      { transaction },
    );
    await recordAudit(actor, 'measurement.created', { type: 'measurement', id: created.id }, { injuryId }, transaction);
    return created;
  });
  return { measurement: toMeasurementView(measurement, new Map([[actor.id, actor.name]])), injury: await getInjuryView(actor, injury) };
}

export async function listMeasurements(actor: SessionUser, injuryId: string): Promise<MeasurementView[]> {
  await findInjury(actor, injuryId);
  const rows = await Measurement.findAll({ where: { injuryId, clinicId: actor.clinicId }, order: [['takenAt', 'ASC']] });
  const names = await staffNames(rows.map((m) => m.recordedBy));
  return rows.map((m) => toMeasurementView(m, names));
}
