import { DateTime } from 'luxon';
import type { ColdProtocol } from '../clinic/settings';
import type { InjuryAssessment } from '../clinical/assess-injury';
import { coldProtocolPatterns } from '../clinical/cold-schedule';
import { summariseGirth, type GirthMeasurement } from '../clinical/girth';
import { latestPainChange } from '../clinical/pain';
import { remeasureAfterHours } from '../clinical/remeasure';
import { sources } from '../clinical/sources';
import type { Phase } from '../phase';
import type { Plan } from '../plan/build-plan';
import { isAnteriorThighRegion, isThighRegion, type BodyRegionId } from '../records/body-map';
import type { InjuryView } from '../records/responses';
import type { RunOutcome, RunStatus } from '../runs/log-entry';
import { coldContraindications, massageCautions, redFlagLabel, type Screening } from '../runs/screening';
import { buildTimeline, inLogOrder, type TimelineEntry, type TimelineRow } from '../review/timeline';

/**
 * Mendstep's first draft of a session note in SOAP form, written from what the records already say: the
 * athlete's pain and own words (S), the latest measurements and what was done at the table (O), the
 * phase, severity and risks with their sources (A), and the next steps, home care and re-check (P). The
 * therapist edits it before submitting; nothing here is sent anywhere by itself.
 */

export interface DraftNoteMeasurement extends GirthMeasurement {
  takenAt: string;
  kneeFlexionDeg?: number | null;
  painNprs?: number | null;
  bruiseLengthCm?: number | null;
  bruiseWidthCm?: number | null;
  skinfoldMm?: number | null;
  notes?: string | null;
}

export interface DraftNoteInput {
  run: {
    phase: Phase;
    status: RunStatus;
    outcome: RunOutcome | null;
    plan: Pick<Plan, 'steps' | 'tolerance' | 'backToCold'>;
    screening: Screening | null;
    startedAt: string | null;
    endedAt: string | null;
    createdAt: string;
    sequenceVersion: number | null;
    /** Red flags stored with the run (from the screening or table mode's "Stop and refer"). */
    redFlags?: readonly string[] | null;
  };
  entries: readonly TimelineEntry[];
  injury: Pick<InjuryView, 'region' | 'regionLabel' | 'side' | 'injuredAt' | 'mechanism' | 'phase' | 'phaseReason' | 'severity' | 'risks'> & {
    assessment: Pick<InjuryAssessment, 'timeLost'>;
  };
  /** The injury's measurements in any order; those taken after the run ended are left out of this note. */
  measurements: readonly DraftNoteMeasurement[];
  settings: { timeZone: string; coldProtocol: ColdProtocol; swellingThresholdCm: number };
}

export interface DraftNote {
  subjective: string;
  objective: string;
  assessment: string;
  plan: string;
}

const tintinalli = "Tintinalli's Emergency Medicine, chapter on compartment syndrome";
const aronenChronister1992 = 'Aronen & Chronister, Phys Sportsmed 1992;20(7):130–136';

/** "6 min", "6 min 30 s", "45 s". */
export function formatDuration(seconds: number): string {
  const whole = Math.max(0, Math.round(seconds));
  const m = Math.floor(whole / 60);
  const s = whole % 60;
  if (m === 0) return `${s} s`;
  return s === 0 ? `${m} min` : `${m} min ${s} s`;
}

function formatWhen(iso: string, timeZone: string): string {
  return DateTime.fromISO(iso, { zone: 'utc' }).setZone(timeZone).setLocale('en-GB').toFormat('d LLL yyyy, HH:mm');
}

function formatDay(iso: string, timeZone: string): string {
  return DateTime.fromISO(iso, { zone: 'utc' }).setZone(timeZone).setLocale('en-GB').toFormat('d LLL yyyy');
}

function formatClock(iso: string, timeZone: string): string {
  return DateTime.fromISO(iso, { zone: 'utc' }).setZone(timeZone).toFormat('HH:mm');
}

// Tape and goniometer readings keep the precision they were taken to, with one decimal for centimetres.
const cm = (value: number) => value.toFixed(1);
const sentence = (text: string) => text.trim().replace(/[.!?]*$/, '.');
const lowerFirst = (text: string) => text.charAt(0).toLowerCase() + text.slice(1);

function runEndOf(input: DraftNoteInput): string {
  return input.run.endedAt ?? input.run.startedAt ?? input.run.createdAt;
}

function latestWith<K extends keyof DraftNoteMeasurement>(list: readonly DraftNoteMeasurement[], key: K): DraftNoteMeasurement | undefined {
  return [...list].reverse().find((m) => m[key] !== null && m[key] !== undefined && m[key] !== '');
}

function measurementsUpToRun(input: DraftNoteInput): DraftNoteMeasurement[] {
  const end = Date.parse(runEndOf(input));
  return input.measurements
    .filter((m) => Date.parse(m.takenAt) <= end)
    .sort((a, b) => Date.parse(a.takenAt) - Date.parse(b.takenAt));
}

// ---------------------------------------------------------------- S

function subjective(input: DraftNoteInput, measured: DraftNoteMeasurement[]): string {
  const { injury, run, settings } = input;
  const lines: string[] = [];
  const days = Math.max(0, Math.floor((Date.parse(runEndOf(input)) - Date.parse(injury.injuredAt)) / 86_400_000));
  const how = injury.mechanism ? `: ${lowerFirst(sentence(injury.mechanism))}` : '.';
  lines.push(`Contusion of the ${injury.side} ${injury.regionLabel.toLowerCase()}, day ${days} since injury (${formatDay(injury.injuredAt, settings.timeZone)})${how}`);

  const pained = latestWith(measured, 'painNprs');
  if (pained) {
    let line = `Pain ${pained.painNprs}/10 (NPRS) at the last measurement (${formatWhen(pained.takenAt, settings.timeZone)})`;
    const change = latestPainChange(measured);
    if (change && change.direction !== 'unchanged') {
      line += `, ${change.direction === 'better' ? 'down' : 'up'} from ${change.previous}/10`;
      line += change.clinicallyImportant
        ? ' — a clinically important change (about 2 points or 30 %, Farrar et al. 2001; measured in chronic pain).'
        : ' — less than a clinically important change (Farrar et al. 2001; measured in chronic pain).';
    } else if (change) {
      line += `, the same as the score before.`;
    } else {
      line += '.';
    }
    lines.push(line);
  } else {
    lines.push('No pain score (NPRS) recorded yet: ask the athlete and record it.');
  }

  const words = latestWith(measured, 'notes');
  if (words?.notes) lines.push(`Noted at the last measurement: ${sentence(words.notes)}`);

  const screening = run.screening;
  if (screening) {
    const reported: string[] = [];
    if (screening.redFlags.length) reported.push(`red flag — ${screening.redFlags.map(redFlagLabel).join('; ')}`);
    const cold = screening.coldContraindications.map((id) => coldContraindications.find((c) => c.id === id)?.label ?? id);
    if (cold.length) reported.push(`cold contraindication — ${cold.join('; ')}`);
    const cautions = screening.massageCautions.map((id) => massageCautions.find((c) => c.id === id)?.label ?? id);
    if (cautions.length) reported.push(`massage caution — ${cautions.join('; ')}`);
    lines.push(
      reported.length
        ? `Screening before the run: ${reported.join('; ')}.${screening.cautionsAcknowledged ? ' Cautions acknowledged.' : ''}`
        : 'Screening before the run: no red flags, cold contraindications or massage cautions reported.',
    );
    if (screening.tolerance === 'light') lines.push('Asked for a lighter touch: hands-on steps shortened (light tolerance).');
  }
  return lines.join('\n');
}

// ---------------------------------------------------------------- O

function measurementLine(input: DraftNoteInput, measured: DraftNoteMeasurement[]): string[] {
  const { timeZone } = input.settings;
  const latest = measured.at(-1);
  if (!latest) return ['No measurements recorded before or during this run.'];
  const parts: string[] = [];
  const girth = latestWith(measured, 'girthInjuredCm');
  if (girth && typeof girth.girthInjuredCm === 'number' && typeof girth.girthOtherCm === 'number') {
    const site =
      girth.girthLandmark && typeof girth.girthDistanceCm === 'number'
        ? ` at ${girth.girthDistanceCm} cm from the ${girth.girthLandmark}`
        : girth.girthLandmark
          ? ` at the ${girth.girthLandmark}`
          : '';
    const difference = Math.round((girth.girthInjuredCm - girth.girthOtherCm) * 10) / 10;
    parts.push(`girth ${cm(girth.girthInjuredCm)} cm injured side, ${cm(girth.girthOtherCm)} cm other side (difference ${cm(difference)} cm)${site}`);
  }
  const flexion = latestWith(measured, 'kneeFlexionDeg');
  if (flexion) parts.push(`active knee flexion ${flexion.kneeFlexionDeg}°`);
  const bruise = latestWith(measured, 'bruiseLengthCm');
  if (bruise && typeof bruise.bruiseWidthCm === 'number') parts.push(`bruise ${bruise.bruiseLengthCm} × ${bruise.bruiseWidthCm} cm`);
  const skinfold = latestWith(measured, 'skinfoldMm');
  if (skinfold) parts.push(`skinfold ${skinfold.skinfoldMm} mm`);

  const lines = [parts.length ? `Latest measurements (last taken ${formatWhen(latest.takenAt, timeZone)}): ${parts.join('; ')}.` : `Last measurement ${formatWhen(latest.takenAt, timeZone)}: a note only.`];
  const summary = summariseGirth(measured, input.settings.swellingThresholdCm);
  if (summary.changeDifferenceCm !== null && summary.previous) {
    const change = summary.changeDifferenceCm;
    const direction = change > 0 ? `up ${cm(change)} cm` : change < 0 ? `down ${cm(-change)} cm` : 'unchanged';
    lines.push(
      `Side-to-side girth difference ${direction} since ${formatDay(summary.previous.takenAt, timeZone)}` +
        (summary.swellingIncreased
          ? ` — more than the clinic's swelling threshold of ${cm(summary.thresholdCm)} cm: swelling has increased.`
          : ` (the clinic's swelling threshold is ${cm(summary.thresholdCm)} cm).`),
    );
  } else if (summary.note && summary.latest) {
    lines.push(summary.note);
  }
  return lines;
}

function stepLine(row: TimelineRow): string {
  const planned = formatDuration(row.plannedSeconds);
  switch (row.result) {
    case 'completed':
      return `- ${row.label}: ${formatDuration(row.actualSeconds ?? 0)} (planned ${planned}), completed.`;
    case 'skipped':
      return `- ${row.label}: skipped${row.actualSeconds ? ` after ${formatDuration(row.actualSeconds)}` : ''} (planned ${planned})${row.reason ? ` — reason: ${row.reason}` : ''}.`;
    case 'interrupted':
      return `- ${row.label}: stopped at ${formatDuration(row.actualSeconds ?? 0)} of ${planned}${row.reason ? ` — ${row.reason}` : ''}.`;
    default:
      return `- ${row.label}: not reached (planned ${planned}).`;
  }
}

function outcomeLine(input: DraftNoteInput): string {
  const { run, entries } = input;
  const ordered = inLogOrder(entries);
  const reasonOf = (type: string) => ordered.filter((e) => e.type === type).at(-1);
  switch (run.status) {
    case 'completed':
      return 'Outcome: run completed.';
    case 'fell-back': {
      const fellBack = reasonOf('run-fell-back');
      if (run.outcome === 'stop-elevate-refer') return 'Outcome: swelling increased; cold is contraindicated, so the run stopped (stop, elevate, refer).';
      return `Outcome: back to cold — swelling increased${fellBack?.detail ? ` (${fellBack.detail})` : ''}; cold pack and compression wrap applied.`;
    }
    case 'stopped-referred': {
      const stored = run.redFlags?.length ? run.redFlags : run.screening?.redFlags.length ? run.screening.redFlags : null;
      const flags = stored ? stored.map(redFlagLabel).join('; ') : (reasonOf('red-flag')?.detail ?? 'red flag');
      return `Outcome: stopped and referred — ${flags}.`;
    }
    case 'ended-early':
      return `Outcome: ended early${reasonOf('run-ended-early')?.reason ? ` — reason: ${reasonOf('run-ended-early')!.reason}` : ''}.`;
    case 'abandoned':
      return 'Outcome: the run was left unfinished in table mode and closed as abandoned; confirm with the therapist what was done.';
    default:
      return 'Outcome: the run has not finished.';
  }
}

function objective(input: DraftNoteInput, measured: DraftNoteMeasurement[]): string {
  const { run, entries, settings } = input;
  const lines = measurementLine(input, measured);
  const timeline = buildTimeline(run.plan, entries);
  const reached = timeline.filter((row) => row.result !== 'not-reached');

  if (run.startedAt || reached.length) {
    const start = timeline.find((row) => row.startedAt)?.startedAt ?? run.startedAt ?? run.createdAt;
    const end = run.endedAt ? `–${formatClock(run.endedAt, settings.timeZone)}` : '';
    const version = run.sequenceVersion ? `, version ${run.sequenceVersion}` : '';
    lines.push(`Run on ${formatWhen(start, settings.timeZone)}${end} (${run.phase} sequence${version}; ${run.plan.tolerance} tolerance):`);
    lines.push(...timeline.map(stepLine));
  } else if (run.status === 'stopped-referred') {
    lines.push('No steps were given: the run stopped at the screening.');
  } else {
    lines.push('No steps were recorded.');
  }

  const checks = entries.filter((e) => e.type === 'swelling-check');
  const increased = checks.filter((e) => e.detail === 'increased').length;
  if (checks.length) {
    lines.push(`Swelling checks: ${checks.length} (${checks.length - increased} not increased, ${increased} increased).`);
  } else if (reached.length) {
    lines.push('No swelling check was recorded during the run.');
  }
  const pauses = entries.filter((e) => e.type === 'paused').length;
  const extensions = entries.filter((e) => e.type === 'extended').length;
  if (pauses || extensions) lines.push(`Pauses: ${pauses}; extensions: ${extensions}.`);
  lines.push(outcomeLine(input));
  return lines.join('\n');
}

// ---------------------------------------------------------------- A

function assessment(input: DraftNoteInput): string {
  const { injury, run } = input;
  const lines: string[] = [];
  const phaseWord = run.phase.charAt(0).toUpperCase() + run.phase.slice(1);
  lines.push(injury.phase === run.phase ? `${phaseWord} phase. ${injury.phaseReason}` : `${phaseWord} phase at the time of the run.`);

  const region = injury.region as BodyRegionId;
  if (injury.severity) {
    lines.push(`Severity: ${injury.severity.grade}, from active knee flexion of ${injury.severity.kneeFlexionDeg}° (${injury.severity.source}).`);
    if (injury.severity.timingWarning) lines.push(injury.severity.timingWarning);
    if (injury.assessment.timeLost) lines.push(injury.assessment.timeLost.wording);
  } else if (isAnteriorThighRegion(region)) {
    lines.push(`Severity: not graded yet — record active knee flexion (grading by ${sources.ryan1991}).`);
  } else {
    lines.push('Severity: not graded — the published knee-flexion grading applies to anterior-thigh (quadriceps) contusions only.');
  }

  if (injury.risks.applies) {
    if (injury.risks.factors.length) {
      lines.push(`Myositis ossificans risk factors (${sources.ryan1991}): ${injury.risks.factors.map((f) => f.label).join('; ')}.`);
      if (injury.risks.caution) lines.push(`Caution: ${injury.risks.caution.lines.join(' ')}`);
    } else {
      lines.push('No myositis ossificans risk factors recorded (Ryan et al. 1991).');
    }
  } else if (isThighRegion(region)) {
    lines.push('Myositis ossificans risk factors not assessed.');
  }

  const screening = run.screening;
  if (screening?.massageCautions.includes('suspected-myositis-ossificans')) {
    lines.push(`Suspected myositis ossificans at the screening: no deep work over the site; refer for imaging (${sources.myositisPhysSportsmed1995}).`);
  }
  if (screening?.coldContraindications.length) lines.push('Cold is contraindicated for this athlete: no cold was applied.');
  if (run.status === 'fell-back') lines.push('Swelling increased during the session: treat as acute again until it settles (common practice).');
  if (run.status === 'stopped-referred') lines.push(`Red flag present: possible compartment syndrome or another serious injury must be ruled out (${tintinalli}).`);
  return lines.join('\n');
}

// ---------------------------------------------------------------- P

function coldWording(protocol: ColdProtocol): string {
  const pattern = coldProtocolPatterns[protocol];
  const source = protocol === 'twenty-each-hour' ? 'common practice' : 'Bleakley et al. 2006';
  return `${pattern.description} (${source}), over a damp cloth and never straight on the skin; no more than 20 minutes of cold at a time.`;
}

const wrapWording =
  'Compression wrap between cold sessions, from below the injury to above it; loosen it if pain increases or the limb goes numb, and take it off in bed (NHS inform PRICE guidance). Rest and elevate the limb.';

const warningWording = `Warning signs — call us or a doctor at once: pain out of proportion to the injury, numbness, pins and needles or a cold, pale limb, or swelling that becomes tense and keeps increasing (${tintinalli}).`;

function plan(input: DraftNoteInput): string {
  const { run, injury, settings } = input;
  const lines: string[] = [];
  const region = injury.region as BodyRegionId;
  const coldAllowed = !(run.screening?.coldContraindications.length ?? 0) && run.plan.backToCold !== 'stop-elevate-refer';
  // After a fall back the next re-check follows the acute rhythm, whatever the run's phase was.
  let recheckPhase: Phase = run.phase;

  if (run.status === 'stopped-referred') {
    lines.push('Referred to a physician today. No further treatment until the athlete has been seen and cleared.');
    lines.push(warningWording);
    return lines.join('\n');
  }
  if (run.status === 'fell-back') {
    recheckPhase = 'acute';
    if (run.outcome === 'stop-elevate-refer' || !coldAllowed) {
      lines.push('Next steps: elevate, compress to tolerance and refer for review — cold is contraindicated for this athlete.');
    } else {
      lines.push('Next steps: back to cold and compression; no massage until the swelling has settled (common practice).');
    }
  } else if (run.status === 'ended-early' || run.status === 'abandoned') {
    lines.push('Next steps: the run did not finish — go over the reason with the athlete and repeat the session when it is safe to.');
  }

  const homeCarePhase: Phase = run.status === 'fell-back' ? 'acute' : run.phase;
  if (homeCarePhase === 'acute') {
    lines.push(`Home care: ${coldAllowed ? coldWording(settings.coldProtocol) : 'no cold (contraindicated).'}`);
    lines.push(wrapWording);
  } else if (homeCarePhase === 'proliferative') {
    lines.push('Home care: gentle, pain-free movement through the day; cold after activity if the area is sore; no heavy loading or deep massage over the site yet.');
    if (run.status === 'completed') lines.push('Next session: continue the proliferative sequence; progress the movement as pain allows.');
  } else {
    lines.push('Home care: progressive stretching and strengthening to tolerance; build up sport-specific work gradually.');
    if (isThighRegion(region)) {
      lines.push(`Return to full activity once active knee flexion reaches 120° and the athlete moves without pain (${aronenChronister1992}).`);
    }
  }
  if (injury.risks.caution && injury.risks.factors.length) lines.push('Keep deep work away from the site while the myositis ossificans risk stands; refer for imaging if it becomes warm and firm.');

  const hours = remeasureAfterHours[recheckPhase];
  const due = DateTime.fromISO(runEndOf(input), { zone: 'utc' }).plus({ hours }).toISO()!;
  lines.push(`Next re-check: girth, pain and range of motion by ${formatDay(due, settings.timeZone)} (every ${hours} h in the ${recheckPhase} phase, a clinic default of ours).`);
  lines.push(warningWording);
  return lines.join('\n');
}

export function draftSessionNote(input: DraftNoteInput): DraftNote {
  const measured = measurementsUpToRun(input);
  return {
    subjective: subjective(input, measured),
    objective: objective(input, measured),
    assessment: assessment(input),
    plan: plan(input),
  };
}
