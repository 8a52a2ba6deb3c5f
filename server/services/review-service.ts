import { QueryTypes } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import type { Phase } from '../../shared/phase';
import type { RunOutcome, RunStatus } from '../../shared/runs/log-entry';
import { attentionStatuses, iceMassageBounds, optionalSkipDetail, runAttention, type StepEntryLike } from '../../shared/review/attention';
import { reviewOutcomes, resolveRange, type ResolvedRange, type ReviewFilter, type ReviewOutcome, type ReviewRunsQuery } from '../../shared/review/query';
import type { ReviewFilterOptions, ReviewNoteStatus, ReviewRunDetail, ReviewRunRow, ReviewRunsPage } from '../../shared/review/responses';
import { buildTimeline } from '../../shared/review/timeline';
import { AppError } from '../errors';
import { Athlete, Run, User } from '../models';
import { getClinicSettings } from './clinic-settings-service';
import { listMeasurements } from './injury-service';
import { abandonStaleRuns, getRunDetail } from './run-service';
import { findNoteView } from './session-note-service';

/*
 * The review desk's runs list, written as SQL because its speed is part of the contract (p95 ≤ 50 ms at
 * 100,000 runs; see bench/review-runs.ts). The choices:
 *
 * - Only finished runs are listed, and every run index the list uses is partial on exactly that status list
 *   (migrations/20261202000500), so each filter is one index range in (clinic, filter, created_at, id) order.
 * - Paging is by page number (the table shows "page 3 of 40"), so deep pages use OFFSET — but over ids only:
 *   the inner query walks an index (index-only where the visibility map allows) and stops at offset + limit;
 *   names, injuries and notes are joined for the 25 rows that survive, never for the rows skipped.
 * - The total is counted from where the page ends, keyset-style: the runs after the page's last row in the
 *   list's own order ((sort key, created_at, id) beyond that row's), which is an index range starting right
 *   there, capped at COUNT_AHEAD rows. total = rows before the page + the page + the rows after it. Below
 *   the cap the total is exact; past it the answer is "at least this many" (totalExact: false), so neither
 *   an unfiltered list of 100,000 runs nor page 2000 pays for a full count on every request. A short page
 *   needs no count at all: it is the end.
 * - "Needs attention" and "note signed" are uncorrelated IN (subquery) filters: PostgreSQL hashes the
 *   clinic's few attention entries (a small partial index) or signed notes once, instead of probing per run.
 *   "Note not signed" matches most runs, so it is a NOT EXISTS probe per run into a covering index instead.
 */

/**
 * How far past the requested page the total is counted exactly: 40 pages of 25. Measured at 100,000 runs,
 * the "needs attention" count costs about 5 ms for 1,000 rows and 60 ms for 5,000 (bench/review-runs.ts).
 */
export const COUNT_AHEAD = 1_000;

const sqlList = (values: readonly string[]) => `(${values.map((v) => `'${v}'`).join(', ')})`;
const FINISHED = sqlList(reviewOutcomes);

/** Must read as the partial index run_log_entries_attention does, or the planner will not use it. */
export const attentionEntrySql = (alias: string) =>
  `((${alias}.type = 'step-skipped' AND ${alias}.detail IS DISTINCT FROM '${optionalSkipDetail}')` +
  ` OR (${alias}.type = 'step-completed' AND ${alias}.kind = 'ice-massage'` +
  ` AND (${alias}.actual_seconds < ${iceMassageBounds.min} OR ${alias}.actual_seconds > ${iceMassageBounds.max})))`;

/**
 * How each sort reads the list: the rows (`from`, giving `r.id` as the run), their order, and the same
 * order's key for one run (for the keyset count). Run columns are read straight from an index on runs. A
 * name sort walks the athletes (or staff) in name order through their own index and each one's runs
 * through runs_review_athlete/therapist, so the first page stops after a few names instead of sorting every
 * run of the clinic; the person's id breaks ties between equal names.
 */
interface SortPlan {
  from: (where: string) => string;
  columns: string[];
  keyOf: string;
  /** Narrows the count to the names from the page's last one on, through the names index. */
  namePrefilter?: (op: string) => string;
}

function runColumnSort(column: string | null): SortPlan {
  const columns = [...(column ? [`r.${column}`] : []), 'r.created_at', 'r.id'];
  return {
    from: (where) => `FROM runs r WHERE ${where}`,
    columns,
    keyOf: `SELECT ${columns.map((c) => c.replace('r.', 'k.')).join(', ')} FROM runs k WHERE k.id = :lastId`,
  };
}

function nameSort(table: 'athletes' | 'users', foreignKey: 'athlete_id' | 'therapist_id'): SortPlan {
  const lastName = `(SELECT p.name FROM runs k JOIN ${table} p ON p.id = k.${foreignKey} WHERE k.id = :lastId)`;
  return {
    from: (where) =>
      `FROM ${table} p CROSS JOIN LATERAL (SELECT r.id, r.created_at FROM runs r WHERE r.${foreignKey} = p.id AND ${where}) r WHERE p.clinic_id = :clinicId`,
    columns: ['p.name', 'p.id', 'r.created_at', 'r.id'],
    keyOf: `SELECT p.name, p.id, k.created_at, k.id FROM runs k JOIN ${table} p ON p.id = k.${foreignKey} WHERE k.id = :lastId`,
    namePrefilter: (op) => `p.name ${op}= ${lastName}`,
  };
}

const sortPlans: Record<ReviewRunsQuery['sort'], SortPlan> = {
  createdAt: runColumnSort(null),
  phase: runColumnSort('phase'),
  outcome: runColumnSort('status'),
  athleteName: nameSort('athletes', 'athlete_id'),
  therapistName: nameSort('users', 'therapist_id'),
};

export interface RunFilterSql {
  where: string;
  replacements: Record<string, unknown>;
}

async function rangeFor(clinicId: string, filter: Pick<ReviewFilter, 'from' | 'to'>): Promise<ResolvedRange> {
  if (!filter.from && !filter.to) return { from: null, to: null };
  const { timeZone } = await getClinicSettings(clinicId);
  const range = resolveRange(filter, timeZone);
  if (range.from && range.to && range.from >= range.to) {
    throw AppError.badRequest('The end of the range must be after its start', { to: 'The end of the range must not be before its start' });
  }
  return range;
}

/** The WHERE clause for the review filters over `runs r`, always scoped to the caller's clinic. */
export async function runFilterSql(actor: SessionUser, filter: ReviewFilter): Promise<RunFilterSql> {
  const range = await rangeFor(actor.clinicId, filter);
  const conditions = ['r.clinic_id = :clinicId', `r.status IN ${FINISHED}`];
  const replacements: Record<string, unknown> = { clinicId: actor.clinicId };
  // Each plain filter is one equality (or range bound) on a column of runs, named like its replacement.
  const plain: [key: string, condition: string, value: unknown][] = [
    ['from', 'r.created_at >= :from', range.from],
    ['to', 'r.created_at < :to', range.to],
    ['therapistId', 'r.therapist_id = :therapistId', filter.therapistId],
    ['athleteId', 'r.athlete_id = :athleteId', filter.athleteId],
    ['phase', 'r.phase = :phase', filter.phase],
    ['outcome', 'r.status = :outcome', filter.outcome],
  ];
  for (const [key, condition, value] of plain) {
    if (value === null || value === undefined) continue;
    conditions.push(condition);
    replacements[key] = value;
  }
  if (filter.noteSigned === 'true') {
    conditions.push(`r.id IN (SELECT n.run_id FROM session_notes n WHERE n.clinic_id = :clinicId AND n.status = 'signed')`);
  } else if (filter.noteSigned === 'false') {
    // Most runs match, so each is checked in the (run_id) INCLUDE (status) index as the walk reaches it.
    conditions.push(`NOT EXISTS (SELECT 1 FROM session_notes n WHERE n.run_id = r.id AND n.status = 'signed')`);
  }
  if (filter.attention === 'true') {
    conditions.push(
      `(r.status IN ${sqlList(attentionStatuses)} OR r.id IN (SELECT e.run_id FROM run_log_entries e WHERE e.clinic_id = :clinicId AND ${attentionEntrySql('e')}))`,
    );
  }
  return { where: conditions.join(' AND '), replacements };
}

export function injuryLabelOf(region: string, side: string): string {
  // The same words as the run view (run-service toRunView).
  return `${region.replace(/-/g, ' ')}, ${side}`;
}

interface RowRecord {
  id: string;
  created_at: Date;
  started_at: Date | null;
  ended_at: Date | null;
  athlete_id: string;
  therapist_id: string;
  injury_id: string;
  phase: Phase;
  status: RunStatus;
  outcome: RunOutcome | null;
  athlete_name: string;
  therapist_name: string;
  region: string;
  side: string;
  note_status: ReviewNoteStatus | null;
}

interface AttentionRecord {
  run_id: string;
  type: string;
  kind: string | null;
  step_index: number | null;
  actual_seconds: number | null;
  detail: string | null;
}

const toStepEntry = (e: AttentionRecord): StepEntryLike => ({ type: e.type, kind: e.kind, stepIndex: e.step_index, actualSeconds: e.actual_seconds, detail: e.detail });

/** The rows for a set of run ids, in the order given, with their names, note status and attention flags. */
async function rowsFor(actor: SessionUser, ids: string[]): Promise<ReviewRunRow[]> {
  if (!ids.length) return [];
  const sequelize = Run.sequelize!;
  const replacements = { clinicId: actor.clinicId, ids };
  const [records, attention] = await Promise.all([
    sequelize.query<RowRecord>(
      `SELECT r.id, r.created_at, r.started_at, r.ended_at, r.athlete_id, r.therapist_id, r.injury_id, r.phase, r.status, r.outcome,
              a.name AS athlete_name, u.name AS therapist_name, i.region, i.side, n.status AS note_status
         FROM runs r
         JOIN athletes a ON a.id = r.athlete_id
         JOIN users u ON u.id = r.therapist_id
         JOIN injuries i ON i.id = r.injury_id
         LEFT JOIN session_notes n ON n.run_id = r.id
        WHERE r.clinic_id = :clinicId AND r.id IN (:ids)`,
      { replacements, type: QueryTypes.SELECT },
    ),
    sequelize.query<AttentionRecord>(
      `SELECT e.run_id, e.type, e.kind, e.step_index, e.actual_seconds, e.detail
         FROM run_log_entries e
        WHERE e.clinic_id = :clinicId AND e.run_id IN (:ids) AND ${attentionEntrySql('e')}`,
      { replacements, type: QueryTypes.SELECT },
    ),
  ]);
  const entriesByRun = new Map<string, StepEntryLike[]>();
  for (const e of attention) {
    const list = entriesByRun.get(e.run_id);
    if (list) list.push(toStepEntry(e));
    else entriesByRun.set(e.run_id, [toStepEntry(e)]);
  }
  const byId = new Map(records.map((r) => [r.id, r]));
  return ids
    .map((id) => byId.get(id))
    .filter((r): r is RowRecord => Boolean(r))
    .map((r) => ({
      id: r.id,
      createdAt: r.created_at.toISOString(),
      startedAt: r.started_at?.toISOString() ?? null,
      endedAt: r.ended_at?.toISOString() ?? null,
      athleteId: r.athlete_id,
      athleteName: r.athlete_name,
      therapistId: r.therapist_id,
      therapistName: r.therapist_name,
      injuryId: r.injury_id,
      injuryLabel: injuryLabelOf(r.region, r.side),
      phase: r.phase,
      status: r.status,
      outcome: r.status as ReviewOutcome,
      runOutcome: r.outcome,
      noteStatus: r.note_status ?? 'none',
      attention: runAttention(r.status, entriesByRun.get(r.id) ?? []),
    }));
}

export async function listReviewRuns(actor: SessionUser, query: ReviewRunsQuery): Promise<ReviewRunsPage> {
  // decisions.md: a run untouched for 12 hours is abandoned and shows here; closing them first keeps the list true.
  const [, { where, replacements }] = await Promise.all([abandonStaleRuns(actor.clinicId), runFilterSql(actor, query)]);
  const plan = sortPlans[query.sort];
  const direction = query.direction === 'asc' ? 'ASC' : 'DESC';
  // Every order ends in (created_at, id) in the same direction: a total order, so pages never overlap.
  const orderBy = plan.columns.map((column) => `${column} ${direction}`).join(', ');
  const offset = (query.page - 1) * query.pageSize;
  const page = await Run.sequelize!.query<{ id: string }>(`SELECT r.id ${plan.from(where)} ORDER BY ${orderBy} LIMIT :limit OFFSET :offset`, {
    replacements: { ...replacements, limit: query.pageSize, offset },
    type: QueryTypes.SELECT,
  });
  const ids = page.map((row) => row.id);
  const [items, counted] = await Promise.all([rowsFor(actor, ids), countAround(query, plan, where, replacements, ids, offset)]);
  return { items, ...counted, page: query.page, pageSize: query.pageSize };
}

async function countAround(
  query: ReviewRunsQuery,
  plan: SortPlan,
  where: string,
  replacements: Record<string, unknown>,
  ids: string[],
  offset: number,
): Promise<{ total: number; totalExact: boolean }> {
  // A short page is the last one.
  if (ids.length > 0 && ids.length < query.pageSize) return { total: offset + ids.length, totalExact: true };
  if (ids.length === 0 && offset === 0) return { total: 0, totalExact: true };
  const count = async (sql: string, extra: Record<string, unknown>) => {
    const [{ n }] = await Run.sequelize!.query<{ n: number }>(`SELECT count(*)::int AS n FROM (${sql}) t`, {
      replacements: { ...replacements, ...extra },
      type: QueryTypes.SELECT,
    });
    return n;
  };
  if (ids.length === 0) {
    // Past the end: how many there are, up to the window.
    const n = await count(`SELECT 1 FROM runs r WHERE ${where} LIMIT :cap`, { cap: offset + COUNT_AHEAD });
    return { total: n, totalExact: n < offset + COUNT_AHEAD };
  }
  const op = query.direction === 'asc' ? '>' : '<';
  const after = [...(plan.namePrefilter ? [plan.namePrefilter(op)] : []), `(${plan.columns.join(', ')}) ${op} (${plan.keyOf})`];
  const n = await count(`SELECT 1 ${plan.from(where)} AND ${after.join(' AND ')} LIMIT :cap`, { lastId: ids.at(-1), cap: COUNT_AHEAD });
  return { total: offset + ids.length + n, totalExact: n < COUNT_AHEAD };
}

/** Everyone who can run a treatment, and every athlete, for the filter lists. */
export async function getReviewFilters(actor: SessionUser): Promise<ReviewFilterOptions> {
  const [therapists, athletes] = await Promise.all([
    User.findAll({ where: { clinicId: actor.clinicId, role: ['therapist', 'supervisor'] }, attributes: ['id', 'name'], order: [['name', 'ASC'], ['id', 'ASC']] }),
    Athlete.findAll({ where: { clinicId: actor.clinicId }, attributes: ['id', 'name'], order: [['name', 'ASC'], ['id', 'ASC']] }),
  ]);
  return {
    therapists: therapists.map((t) => ({ id: t.id, name: t.name })),
    athletes: athletes.map((a) => ({ id: a.id, name: a.name })),
  };
}

export async function getReviewRunDetail(actor: SessionUser, runId: string): Promise<ReviewRunDetail> {
  // The note is looked up beside the run (both scoped to the clinic); another clinic's run fails in getRunDetail.
  const [{ run, entries }, note] = await Promise.all([getRunDetail(actor, runId), findNoteView(actor, runId)]);
  const timeline = buildTimeline(run.plan, entries);
  const measurements = await listMeasurements(actor, run.injuryId);
  // The run began when its first step did; nothing is logged at the start itself, so the timeline says when.
  const start = Date.parse(timeline.find((row) => row.startedAt)?.startedAt ?? run.startedAt ?? run.createdAt);
  const before = measurements.filter((m) => Date.parse(m.takenAt) <= start).at(-1) ?? null;
  const end = run.endedAt ? Date.parse(run.endedAt) : null;
  const after = end === null ? null : (measurements.find((m) => Date.parse(m.takenAt) > end) ?? null);
  return {
    run,
    entries,
    timeline,
    measurementsBefore: before,
    measurementsAfter: after,
    note,
    attention: runAttention(run.status, entries),
  };
}
