import { Op, type Transaction } from 'sequelize';
import { DateTime } from 'luxon';
import type { SessionUser } from '../../shared/auth/schemas';
import type { ClinicSettings } from '../../shared/clinic/settings';
import { coldSchedule } from '../../shared/clinical/cold-schedule';
import { remeasureAfterHours } from '../../shared/clinical/remeasure';
import { coldRemindersIcs } from '../../shared/home-care/cold-reminders-ics';
import { buildHomeCareMessage, coldRemindersFilename, homeColdStart, type ColdAtHome, type HomeCareOutcome } from '../../shared/home-care/home-care-message';
import { stepKindInfo, type StepKind } from '../../shared/plan/step-kinds';
import { bodyRegionById, type BodyRegionId } from '../../shared/records/body-map';
import { screeningOutcome } from '../../shared/runs/screening';
import { Athlete, Clinic, Injury, Measurement, Run, RunLogEntry } from '../models';
import { queueRunAlerts } from './alert-service';
import { recordAudit } from './audit-service';
import { getClinicSettings } from './clinic-settings-service';
import { enqueueMail } from './mail-outbox-service';
import { issueOptOutLink } from './opt-out-service';

/** What the messages about one finished run need, loaded once. */
export interface RunMailContext {
  run: Run;
  athlete: Athlete;
  injury: Injury;
  injuryLabel: string;
  clinicName: string;
  settings: ClinicSettings;
}

const homeCareOutcomes: Record<string, HomeCareOutcome> = { completed: 'completed', 'fell-back': 'fell-back', 'stop-elevate-refer': 'stop-elevate-refer' };

function injuryLabelOf(injury: Injury): string {
  let region: string = injury.region;
  try {
    region = bodyRegionById(injury.region as BodyRegionId).label;
  } catch {
    // An unknown region id still names the injury in its raw form.
  }
  return `${region.charAt(0).toLowerCase()}${region.slice(1)}, ${injury.side}`;
}

function isColdKind(kind: string | null): boolean {
  return kind !== null && kind in stepKindInfo && stepKindInfo[kind as StepKind].cold;
}

/**
 * The athlete's home-care plan after a run that completed or went back to cold, when the athlete has an e-mail
 * address and has consented. Returns why nothing was queued, or null when it was.
 */
export async function queueHomeCare(context: RunMailContext, transaction: Transaction, now = new Date()): Promise<string | null> {
  const { run, athlete, injury, settings } = context;
  const outcome = run.outcome ? homeCareOutcomes[run.outcome] : undefined;
  if (!outcome || (run.status !== 'completed' && run.status !== 'fell-back')) return 'not a completed run';
  // Read again under a share lock: an opt-out or erasure that committed since the context was loaded is seen here,
  // and one under way waits until this message is queued, then cancels it.
  const latest = await Athlete.findByPk(athlete.id, { attributes: ['id', 'erasedAt', 'emailOptedOutAt'], transaction, lock: transaction.LOCK.SHARE });
  if (!latest || latest.erasedAt) return 'athlete data erased';
  if (latest.emailOptedOutAt) return 'athlete opted out of e-mails';
  if (!athlete.email) return 'no e-mail address';
  if (!athlete.consentToTreatment) return 'no consent recorded';

  const endedAt = run.endedAt ?? now;
  const coldContraindicated = outcome === 'stop-elevate-refer' || (run.screening ? screeningOutcome(run.screening).coldContraindicated : false);
  // Cold at home belongs to acute care, and to any run that had to go back to cold.
  const wantsCold = run.phase === 'acute' || outcome === 'fell-back';
  let cold: ColdAtHome = { kind: 'not-planned' };
  if (coldContraindicated) cold = { kind: 'contraindicated' };
  else if (wantsCold) {
    const [lastCold, latestSkinfold] = await Promise.all([
      RunLogEntry.findAll({ where: { runId: run.id, type: { [Op.in]: ['step-completed', 'step-interrupted'] } }, order: [['at', 'DESC']], transaction }),
      Measurement.findOne({ where: { injuryId: injury.id, skinfoldMm: { [Op.ne]: null } }, order: [['takenAt', 'DESC']], transaction }),
    ]);
    const lastColdEndedAt = lastCold.find((entry) => isColdKind(entry.kind))?.at ?? null;
    cold = {
      kind: 'schedule',
      schedule: coldSchedule({
        start: homeColdStart({ runEndedAt: endedAt, lastColdEndedAt, protocol: settings.coldProtocol }),
        timeZone: settings.timeZone,
        wakingHours: settings.wakingHours,
        protocol: settings.coldProtocol,
        skinfoldMm: latestSkinfold?.skinfoldMm ?? null,
      }),
    };
  }
  const wrap = outcome === 'fell-back' || run.plan.steps.some((step) => step.kind === 'compression-wrap');

  const message = buildHomeCareMessage({
    clinicName: context.clinicName,
    athleteName: athlete.name,
    injuryLabel: context.injuryLabel,
    runId: run.id,
    runEndedAt: endedAt,
    timeZone: settings.timeZone,
    outcome,
    cold,
    wrap,
    recheckWithinHours: remeasureAfterHours[run.phase],
    // The injury's next re-check, set when the run finished; without one the message says the clinic will get in touch.
    nextRecheckAt: injury.nextRecheckAt && injury.nextRecheckAt > endedAt ? injury.nextRecheckAt : null,
    // A fresh single-use link per message, written in this transaction with the message itself.
    optOutLink: await issueOptOutLink(athlete, transaction),
  });
  const attachments = message.reminders.length
    ? [
        {
          filename: coldRemindersFilename,
          contentType: 'text/calendar; charset=utf-8; method=PUBLISH',
          contentBase64: Buffer.from(coldRemindersIcs(message.reminders, { generatedAt: now, calendarName: `Cold reminders (${context.clinicName})` })).toString('base64'),
        },
      ]
    : [];
  await enqueueMail(
    [
      {
        clinicId: run.clinicId,
        kind: 'home-care',
        to: athlete.email,
        dedupeKey: `home-care:${run.id}`,
        content: { subject: message.subject, text: message.text, html: message.html, attachments },
        // Today's plan, once today is over, would mislead.
        discardAfter: DateTime.fromJSDate(endedAt, { zone: settings.timeZone }).endOf('day').toJSDate(),
      },
    ],
    transaction,
  );
  return null;
}

async function loadContext(clinicId: string, runId: string, transaction?: Transaction): Promise<RunMailContext | null> {
  const run = await Run.findOne({ where: { id: runId, clinicId }, transaction });
  if (!run) return null;
  const [athlete, injury, clinic, settings] = await Promise.all([
    Athlete.findByPk(run.athleteId, { transaction }),
    Injury.findByPk(run.injuryId, { transaction }),
    Clinic.findByPk(run.clinicId, { transaction }),
    getClinicSettings(run.clinicId),
  ]);
  if (!athlete || !injury || !clinic) return null;
  return { run, athlete, injury, injuryLabel: injuryLabelOf(injury), clinicName: clinic.name, settings };
}

/**
 * Queues the messages a finished run calls for, inside the caller's transaction: the home-care e-mail and the
 * supervisor alert are committed with the entry that finished the run, or not at all — a crash after the 201
 * can no longer lose them, and a retry (a replay) needs to queue nothing. The dedupe keys make a second call
 * harmless.
 */
export async function queueRunFinishedMail(
  actor: SessionUser,
  run: Pick<Run, 'id' | 'status'>,
  transaction: Transaction,
): Promise<{ homeCare: string | null; alerts: number }> {
  if (!['completed', 'fell-back', 'stopped-referred'].includes(run.status)) return { homeCare: null, alerts: 0 };
  const context = await loadContext(actor.clinicId, run.id, transaction);
  if (!context) return { homeCare: 'run not found', alerts: 0 };
  const homeCare = await queueHomeCare(context, transaction);
  const alerts = await queueRunAlerts(context, transaction);
  const ran = context.run.status === 'completed' || context.run.status === 'fell-back';
  if (ran) {
    await recordAudit(
      actor,
      homeCare ? 'email.home-care-not-sent' : 'email.home-care-queued',
      { type: 'run', id: run.id },
      homeCare ? { reason: homeCare } : {},
      transaction,
    );
  }
  if (alerts) await recordAudit(actor, 'email.run-alert-queued', { type: 'run', id: run.id }, { supervisors: alerts }, transaction);
  return { homeCare, alerts };
}
