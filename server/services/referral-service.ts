import type { SessionUser } from '../../shared/auth/schemas';
import { ageThisYear } from '../../shared/clinic/guardian-consent';
import type { ReferralReason, ReferralRun, ReferralSummary } from '../../shared/clinic/referral';
import { stepKindInfo, type StepKind } from '../../shared/plan/step-kinds';
import { mechanismKindLabels, type MechanismKind } from '../../shared/records/injury';
import { redFlagLabel, coldContraindications } from '../../shared/runs/screening';
import { AppError } from '../errors';
import { Athlete, Clinic, Run, RunLogEntry, User } from '../models';
import { recordAudit } from './audit-service';
import { getClinicSettings } from './clinic-settings-service';
import { findInjury, getInjuryView, listMeasurements } from './injury-service';

// One printed A4 page holds about this many rows of each table beside the rest; the newest are kept.
const maxMeasurements = 8;
const maxRuns = 6;

const outcomeWords: Record<string, string> = {
  completed: 'Completed',
  'fell-back': 'Back to cold (swelling increased)',
  'stop-elevate-refer': 'Stop, elevate and refer (swelling increased; cold contraindicated)',
  'stopped-referred': 'Stopped and referred',
  'ended-early': 'Ended early',
  abandoned: 'Abandoned',
  screening: 'Not started',
  ready: 'Not started',
  running: 'In progress',
};

const minutes = (seconds: number) => (seconds < 60 ? `${seconds} s` : `${Math.round(seconds / 60)} min`);

function stepsDone(entries: RunLogEntry[]): string[] {
  return entries
    .filter((e) => (e.type === 'step-completed' || e.type === 'step-interrupted') && e.kind)
    .map((e) => {
      const label = stepKindInfo[e.kind as StepKind]?.label ?? e.kind!;
      const time = e.actualSeconds !== null ? ` ${minutes(e.actualSeconds)}` : '';
      return `${label}${time}${e.type === 'step-interrupted' ? ' (interrupted)' : ''}`;
    });
}

/** Why the physician is seeing the athlete, newest first; the chosen run's reasons lead. */
function reasonsFrom(runs: Run[], chosen: Run | null): ReferralReason[] {
  const ordered = chosen ? [chosen, ...runs.filter((r) => r.id !== chosen.id)] : runs;
  const reasons: ReferralReason[] = [];
  for (const run of ordered) {
    const at = (run.endedAt ?? run.createdAt).toISOString();
    if (run.status === 'stopped-referred') {
      const flags = run.redFlags?.length ? run.redFlags : ['red flag (not named)'];
      for (const flag of flags) reasons.push({ kind: 'red-flag', text: `Red flag: ${redFlagLabel(flag)}`, at, runId: run.id });
    }
    if (run.outcome === 'stop-elevate-refer') {
      reasons.push({ kind: 'stop-elevate-refer', text: 'Swelling increased during treatment while cold was contraindicated: stopped, elevated, referred', at, runId: run.id });
    }
  }
  // The latest screening says what the physician should know about cold and suspected myositis ossificans.
  const screened = ordered.find((r) => r.screening);
  if (screened?.screening?.massageCautions.includes('suspected-myositis-ossificans')) {
    reasons.push({ kind: 'suspected-myositis', text: 'Suspected myositis ossificans (warmth and firmness at the site): imaging may be needed', at: screened.createdAt.toISOString(), runId: screened.id });
  }
  const cold = screened?.screening?.coldContraindications ?? [];
  if (cold.length) {
    const labels = cold.map((id) => coldContraindications.find((c) => c.id === id)?.label ?? id).join('; ');
    reasons.push({ kind: 'cold-contraindicated', text: `Cold contraindicated: ${labels}`, at: screened!.createdAt.toISOString(), runId: screened!.id });
  }
  return reasons;
}

export async function getReferralSummary(actor: SessionUser, injuryId: string, runId?: string): Promise<ReferralSummary> {
  const injury = await findInjury(actor, injuryId);
  const chosen = runId ? await Run.findOne({ where: { id: runId, injuryId: injury.id, clinicId: actor.clinicId } }) : null;
  if (runId && !chosen) throw AppError.notFound('Run');

  const [view, athlete, clinic, settings, measurements, runs] = await Promise.all([
    getInjuryView(actor, injury),
    Athlete.findByPk(injury.athleteId),
    Clinic.findByPk(actor.clinicId),
    getClinicSettings(actor.clinicId),
    listMeasurements(actor, injury.id),
    Run.findAll({ where: { injuryId: injury.id, clinicId: actor.clinicId }, order: [['createdAt', 'DESC']] }),
  ]);
  const shownRuns = runs.slice(0, maxRuns);
  const [entries, therapists] = await Promise.all([
    RunLogEntry.findAll({ where: { runId: shownRuns.map((r) => r.id) }, order: [['seq', 'ASC NULLS LAST'], ['at', 'ASC'], ['id', 'ASC']] }),
    User.findAll({ where: { id: [...new Set(shownRuns.map((r) => r.therapistId))] }, attributes: ['id', 'name'] }),
  ]);
  const therapistName = new Map(therapists.map((t) => [t.id, t.name]));
  const runViews: ReferralRun[] = shownRuns.reverse().map((run) => {
    const own = entries.filter((e) => e.runId === run.id);
    return {
      id: run.id,
      at: (run.startedAt ?? run.createdAt).toISOString(),
      phase: run.phase,
      therapistName: therapistName.get(run.therapistId) ?? '',
      outcome: outcomeWords[run.outcome ?? run.status] ?? run.status,
      stepsDone: stepsDone(own),
      swellingChecks: own.filter((e) => e.type === 'swelling-check').map((e) => e.detail ?? 'checked'),
    };
  });

  const now = new Date();
  const summary: ReferralSummary = {
    generatedAt: now.toISOString(),
    timeZone: settings.timeZone,
    clinic: { name: clinic?.name ?? '', contactEmail: settings.contactEmail, contactPhone: settings.contactPhone },
    preparedBy: { name: actor.name, role: actor.role },
    athlete: {
      name: athlete!.name,
      yearOfBirth: athlete!.yearOfBirth,
      ageThisYear: ageThisYear(athlete!.yearOfBirth, now, settings.timeZone),
      sport: athlete!.sport,
      position: athlete!.position,
    },
    injury: {
      id: injury.id,
      site: view.regionLabel,
      side: injury.side,
      mechanism: `${mechanismKindLabels[injury.mechanismKind as MechanismKind] ?? injury.mechanismKind}${injury.mechanism ? `: ${injury.mechanism}` : ''}`,
      injuredAt: injury.injuredAt.toISOString(),
      daysSinceInjury: view.assessment.daysSinceInjury,
      haematomaType: injury.haematomaType,
      status: injury.status,
      severity: view.severity ? { grade: view.severity.grade, kneeFlexionDeg: view.severity.kneeFlexionDeg, source: view.severity.source } : null,
      phase: view.phase,
      phaseReason: view.phaseReason,
      myositisRiskFactors: view.risks.factors.map((f) => f.label),
      reinjuryOfId: injury.reinjuryOfId ?? null,
    },
    reasons: reasonsFrom(runs, chosen),
    measurements: measurements.slice(-maxMeasurements),
    measurementsOmitted: Math.max(0, measurements.length - maxMeasurements),
    runs: runViews,
    runsOmitted: Math.max(0, runs.length - maxRuns),
  };
  // A referral hands the athlete's record to someone outside the clinic: the trail says who prepared it.
  await recordAudit(actor, 'injury.referral-summary', { type: 'injury', id: injury.id }, { runId: runId ?? null });
  return summary;
}
