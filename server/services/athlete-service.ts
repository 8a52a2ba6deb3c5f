import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import type { AthleteCreate, AthleteListQuery, AthleteUpdate } from '../../shared/records/athlete';
import type { AthleteView, Paged } from '../../shared/records/responses';
import { AppError } from '../errors';
import { Athlete, User } from '../models';
import { athleteErasedMessage } from '../models/athlete';
import { recordAudit } from './audit-service';
import { guardianConsentFields, guardianConsentView } from './guardian-consent-service';

export async function toAthleteView(athlete: Athlete): Promise<AthleteView> {
  const recordedBy = athlete.consentRecordedBy ? await User.findByPk(athlete.consentRecordedBy) : null;
  const guardian = await guardianConsentView(athlete);
  return {
    id: athlete.id,
    name: athlete.name,
    yearOfBirth: athlete.yearOfBirth,
    sport: athlete.sport,
    position: athlete.position,
    email: athlete.email,
    consentToTreatment: athlete.consentToTreatment,
    consentRecordedAt: athlete.consentRecordedAt?.toISOString() ?? null,
    consentRecordedByName: recordedBy?.name ?? null,
    ...guardian,
    notes: athlete.notes,
    createdAt: athlete.createdAt.toISOString(),
    emailOptedOutAt: athlete.emailOptedOutAt?.toISOString() ?? null,
    erasedAt: athlete.erasedAt?.toISOString() ?? null,
  };
}

/** An athlete of the caller's clinic; any other is "not found". */
export async function findAthlete(actor: SessionUser, id: string): Promise<Athlete> {
  const athlete = await Athlete.findOne({ where: { id, clinicId: actor.clinicId } });
  if (!athlete) throw AppError.notFound('Athlete');
  return athlete;
}

const sortColumns = { name: 'name', yearOfBirth: 'yearOfBirth', createdAt: 'createdAt' } as const;

export async function listAthletes(actor: SessionUser, query: AthleteListQuery): Promise<Paged<AthleteView>> {
  // Erased athletes are no longer the clinic's to treat: they leave the register (their records stay reachable by id).
  const where: WhereOptions<Athlete> = { clinicId: actor.clinicId, erasedAt: null };
  if (query.q) {
    const pattern = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    Object.assign(where, {
      [Op.or]: [{ name: { [Op.iLike]: pattern } }, { sport: { [Op.iLike]: pattern } }, { position: { [Op.iLike]: pattern } }],
    });
  }
  const { rows, count } = await Athlete.findAndCountAll({
    where,
    order: [
      [sortColumns[query.sort], query.direction.toUpperCase()],
      ['id', 'ASC'],
    ],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  const openCounts = rows.length
    ? await Athlete.sequelize!.query<{ athlete_id: string; n: string }>(
        `SELECT athlete_id, count(*) AS n FROM injuries WHERE clinic_id = :clinicId AND status = 'open' AND athlete_id IN (:ids) GROUP BY athlete_id`,
        { replacements: { clinicId: actor.clinicId, ids: rows.map((r) => r.id) }, type: QueryTypes.SELECT },
      )
    : [];
  const open = new Map(openCounts.map((r) => [r.athlete_id, Number(r.n)]));
  const items = await Promise.all(rows.map(async (row) => ({ ...(await toAthleteView(row)), openInjuries: open.get(row.id) ?? 0 })));
  return { items, total: count, page: query.page, pageSize: query.pageSize };
}

function consentFields(actor: SessionUser, consent: boolean | undefined, current?: Athlete) {
  if (consent === undefined || consent === current?.consentToTreatment) return {};
  // Consent is recorded with who took it and when; withdrawing it clears both.
  return consent
    ? { consentToTreatment: true, consentRecordedBy: actor.id, consentRecordedAt: new Date() }
    : { consentToTreatment: false, consentRecordedBy: null, consentRecordedAt: null };
}

export async function createAthlete(actor: SessionUser, input: AthleteCreate): Promise<AthleteView> {
  const athlete = await Athlete.sequelize!.transaction(async (transaction) => {
    const created = await Athlete.create(
      {
        clinicId: actor.clinicId,
        name: input.name,
        yearOfBirth: input.yearOfBirth,
        sport: input.sport,
        position: input.position ?? null,
        email: input.email ?? null,
        notes: input.notes ?? null,
        consentRecordedBy: null,
        consentRecordedAt: null,
        ...consentFields(actor, input.consentToTreatment),
        ...guardianConsentFields(actor, input.guardianConsent),
      },
      { transaction },
    );
    await recordAudit(actor, 'athlete.created', { type: 'athlete', id: created.id }, {}, transaction);
    return created;
  });
  return toAthleteView(athlete);
}

export async function updateAthlete(actor: SessionUser, id: string, input: AthleteUpdate): Promise<AthleteView> {
  const athlete = await findAthlete(actor, id);
  if (athlete.erasedAt) throw AppError.conflict(athleteErasedMessage, 'athlete_erased');
  const { consentToTreatment, guardianConsent, ...rest } = input;
  await Athlete.sequelize!.transaction(async (transaction) => {
    await athlete.update({ ...rest, ...consentFields(actor, consentToTreatment, athlete), ...guardianConsentFields(actor, guardianConsent, athlete) }, { transaction });
    await recordAudit(actor, 'athlete.updated', { type: 'athlete', id }, { fields: Object.keys(input) }, transaction);
  });
  return toAthleteView(athlete);
}
