import { stringify } from 'csv-stringify/sync';
import { DateTime } from 'luxon';
import { Op, type WhereOptions } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import type { AuditFilter, AuditQuery } from '../../shared/audit/query';
import type { AuditEventView, AuditFilters, AuditPage } from '../../shared/audit/responses';
import { AuditEvent, User } from '../models';
import { getClinicSettings } from './clinic-settings-service';

/** The clinic's audit trail for admins and supervisors: filtered, paged on the server, and as CSV. */

async function auditWhere(actor: SessionUser, filter: AuditFilter): Promise<{ where: WhereOptions<AuditEvent>; timeZone: string }> {
  const { timeZone } = await getClinicSettings(actor.clinicId);
  const createdAt: Record<symbol, Date> = {};
  // Calendar days of the clinic's zone, both ends included: "to" runs up to the start of the next day.
  if (filter.from) createdAt[Op.gte] = DateTime.fromISO(filter.from, { zone: timeZone }).startOf('day').toJSDate();
  if (filter.to) createdAt[Op.lt] = DateTime.fromISO(filter.to, { zone: timeZone }).plus({ days: 1 }).startOf('day').toJSDate();
  const where: WhereOptions<AuditEvent> = {
    clinicId: actor.clinicId,
    ...(filter.userId ? { userId: filter.userId } : {}),
    ...(filter.recordType ? { recordType: filter.recordType } : {}),
    ...(filter.from || filter.to ? { createdAt } : {}),
  };
  return { where, timeZone };
}

async function namesOf(events: AuditEvent[]): Promise<Map<string, string>> {
  const ids = [...new Set(events.map((e) => e.userId).filter((id): id is string => Boolean(id)))];
  if (!ids.length) return new Map();
  const users = await User.findAll({ where: { id: ids }, attributes: ['id', 'name'] });
  return new Map(users.map((u) => [u.id, u.name]));
}

function toView(event: AuditEvent, names: Map<string, string>): AuditEventView {
  return {
    id: String(event.id),
    at: event.createdAt.toISOString(),
    userId: event.userId,
    userName: event.userId ? (names.get(event.userId) ?? null) : null,
    action: event.action,
    recordType: event.recordType,
    recordId: event.recordId,
    detail: event.detail,
  };
}

// Newest first; the id breaks ties between events of one transaction, so pages never overlap.
const newestFirst: [string, string][] = [
  ['createdAt', 'DESC'],
  ['id', 'DESC'],
];

export async function listAuditEvents(actor: SessionUser, query: AuditQuery): Promise<AuditPage> {
  const { where } = await auditWhere(actor, query);
  const { rows, count } = await AuditEvent.findAndCountAll({ where, order: newestFirst, limit: query.pageSize, offset: (query.page - 1) * query.pageSize });
  const names = await namesOf(rows);
  return { items: rows.map((row) => toView(row, names)), total: count, page: query.page, pageSize: query.pageSize };
}

export async function getAuditFilters(actor: SessionUser): Promise<AuditFilters> {
  const [people, types, settings] = await Promise.all([
    User.findAll({ where: { clinicId: actor.clinicId }, attributes: ['id', 'name', 'role', 'active'], order: [['name', 'ASC']] }),
    AuditEvent.findAll({ where: { clinicId: actor.clinicId }, attributes: ['recordType'], group: ['recordType'], order: [['recordType', 'ASC']], raw: true }),
    getClinicSettings(actor.clinicId),
  ]);
  return {
    people: people.map((p) => ({ id: p.id, name: p.name, role: p.role, active: p.active })),
    recordTypes: types.map((t) => t.recordType),
    timeZone: settings.timeZone,
  };
}

export const auditCsvColumns = ['time', 'person', 'action', 'record_type', 'record_id', 'detail'] as const;

/*
 * RFC 4180 with a byte-order mark, as the other exports. Names and detail are staff- or athlete-typed text:
 * a leading =, +, - or @ would run as a formula in a spreadsheet, so such text is prefixed with an apostrophe.
 */
const formulaSafe = (value: string | null) => (value !== null && /^[=+\-@\t\r]/.test(value) ? `'${value}` : value);

/** Every event matching the filters (not one page), newest first, times in the clinic's zone. */
export async function auditCsv(actor: SessionUser, filter: AuditFilter): Promise<{ filename: string; body: string }> {
  const { where, timeZone } = await auditWhere(actor, filter);
  const events = await AuditEvent.findAll({ where, order: newestFirst });
  const names = await namesOf(events);
  const rows = events.map((event) => [
    DateTime.fromJSDate(event.createdAt).setZone(timeZone).toFormat('yyyy-MM-dd HH:mm:ss'),
    formulaSafe(event.userId ? (names.get(event.userId) ?? event.userId) : null),
    event.action,
    event.recordType,
    event.recordId,
    formulaSafe(Object.keys(event.detail ?? {}).length ? JSON.stringify(event.detail) : null),
  ]);
  const body = stringify(rows, { header: true, columns: [...auditCsvColumns], bom: true, record_delimiter: 'windows', quoted_match: /[\r\n]/ });
  return { filename: `mendstep-audit-${DateTime.now().setZone(timeZone).toFormat('yyyy-MM-dd')}.csv`, body };
}
