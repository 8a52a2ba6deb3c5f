import { assessInjury } from '../../../shared/clinical/assess-injury';
import { buildPlan } from '../../../shared/plan/build-plan';
import { defaultSequences } from '../../../shared/plan/sequence';
import type { Phase } from '../../../shared/phase';
import type { BodyRegionId } from '../../../shared/records/body-map';
import type { TimelineEntry } from '../../../shared/review/timeline';
import { draftSessionNote, formatDuration, type DraftNoteInput, type DraftNoteMeasurement } from '../../../shared/notes/draft-note';
import type { Screening } from '../../../shared/runs/screening';

const injuredAt = '2026-03-02T10:00:00.000Z';
const clear: Screening = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual', cautionsAcknowledged: false };
const settings = { timeZone: 'Europe/London', coldProtocol: 'twenty-each-hour' as const, swellingThresholdCm: 1 };

const iso = (base: string, minutes: number) => new Date(Date.parse(base) + minutes * 60_000).toISOString();

function fixture(options: {
  phase: Phase;
  region?: BodyRegionId;
  sport?: string;
  status?: DraftNoteInput['run']['status'];
  outcome?: DraftNoteInput['run']['outcome'];
  screening?: Screening;
  entries?: TimelineEntry[];
  measurements?: DraftNoteMeasurement[];
  runStart: string | null;
  runEnd: string;
  coldContraindicated?: boolean;
}): DraftNoteInput {
  const region = options.region ?? 'anterior-thigh';
  const measurements = options.measurements ?? [];
  const assessment = assessInjury({
    injury: { region, injuredAt, previousQuadricepsInjury: false, kneeEffusion: false, treatmentStartedAt: iso(injuredAt, 60) },
    athleteSport: options.sport ?? 'Hockey',
    measurements,
    settings,
    now: options.runEnd,
  });
  const plan = buildPlan({
    phase: options.phase,
    sequence: defaultSequences[options.phase],
    tolerance: 'usual',
    coldContraindicated: options.coldContraindicated ?? false,
    suspectedMyositis: false,
  });
  return {
    run: {
      phase: options.phase,
      status: options.status ?? 'completed',
      outcome: options.outcome ?? 'completed',
      plan,
      screening: options.screening ?? clear,
      startedAt: options.runStart,
      endedAt: options.runEnd,
      createdAt: options.runStart ?? options.runEnd,
      sequenceVersion: 1,
    },
    entries: options.entries ?? [],
    injury: {
      region,
      regionLabel: region === 'calf' ? 'Calf' : 'Anterior thigh (quadriceps)',
      side: 'left',
      injuredAt,
      mechanism: 'Knee into the front of the thigh in a tackle',
      phase: assessment.phase,
      phaseReason: assessment.phaseReason,
      severity: assessment.severity,
      risks: assessment.risks,
      assessment,
    },
    measurements,
    settings,
  };
}

const step = (seq: number, stepIndex: number | null, kind: string, planned: number, actual: number, at: string, extra: Partial<TimelineEntry> = {}): TimelineEntry => ({
  seq,
  type: 'step-completed',
  stepIndex,
  kind,
  plannedSeconds: planned,
  actualSeconds: actual,
  at,
  reason: null,
  detail: null,
  ...extra,
});

describe('drafting a SOAP session note', () => {
  const acuteStart = '2026-03-02T18:00:00.000Z';
  const acuteEnd = iso(acuteStart, 30);
  const acuteMeasurements: DraftNoteMeasurement[] = [
    { takenAt: iso(injuredAt, 120), girthInjuredCm: 51.5, girthOtherCm: 49, girthLandmark: 'superior pole of patella', girthDistanceCm: 15, kneeFlexionDeg: 75, painNprs: 6, bruiseLengthCm: 9, bruiseWidthCm: 6 },
    { takenAt: iso(acuteStart, -10), girthInjuredCm: 52, girthOtherCm: 49, girthLandmark: 'superior pole of patella', girthDistanceCm: 15, kneeFlexionDeg: 80, painNprs: 4, notes: 'Says it throbs at night' },
    // Taken the day after: a note for this run must not quote it.
    { takenAt: iso(acuteEnd, 24 * 60), painNprs: 1 },
  ];
  const acuteEntries: TimelineEntry[] = [
    step(1, 0, 'cold-pack', 1200, 1200, iso(acuteStart, 20)),
    step(2, 1, 'compression-wrap', 180, 150, iso(acuteStart, 23)),
    step(3, 2, 'rest-recheck', 300, 280, iso(acuteStart, 28)),
    { seq: 4, type: 'swelling-check', stepIndex: 2, kind: 'rest-recheck', plannedSeconds: 300, actualSeconds: null, at: iso(acuteStart, 28), reason: null, detail: 'not increased' },
    { seq: 5, type: 'run-completed', stepIndex: null, kind: null, plannedSeconds: null, actualSeconds: null, at: iso(acuteStart, 28), reason: null, detail: null },
  ];
  const acute = () => fixture({ phase: 'acute', runStart: acuteStart, runEnd: acuteEnd, measurements: acuteMeasurements, entries: acuteEntries });

  it('S reports the latest pain on the NPRS before the run and its change, citing Farrar et al. 2001', () => {
    const note = draftSessionNote(acute());
    expect(note.subjective).toContain('Pain 4/10 (NPRS) at the last measurement (2 Mar 2026, 17:50)');
    // 6 → 4 is 2 points: clinically important by Farrar et al. 2001 (about 2 points or 30 %).
    expect(note.subjective).toMatch(/down from 6\/10 — a clinically important change .*Farrar et al\. 2001/);
    expect(note.subjective).not.toContain('1/10');
    expect(note.subjective).toContain('Says it throbs at night.');
    expect(note.subjective).toContain('no red flags');
  });

  it('O lists the latest measurements and every step with planned and actual times and the swelling checks', () => {
    const note = draftSessionNote(acute());
    expect(note.objective).toContain('girth 52.0 cm injured side, 49.0 cm other side (difference 3.0 cm) at 15 cm from the superior pole of patella');
    expect(note.objective).toContain('active knee flexion 80°');
    // The bruise was measured only at the first visit; the latest bruise still describes the injury.
    expect(note.objective).toContain('bruise 9 × 6 cm');
    expect(note.objective).toContain('- Cold pack: 20 min (planned 20 min), completed.');
    expect(note.objective).toContain('- Compression wrap: 2 min 30 s (planned 3 min), completed.');
    expect(note.objective).toContain('Swelling checks: 1 (1 not increased, 0 increased).');
    expect(note.objective).toContain('Outcome: run completed.');
  });

  it('A gives the phase, the severity with its source (Ryan et al. 1991) and the myositis risk factors', () => {
    const note = draftSessionNote(acute());
    expect(note.assessment).toMatch(/^Acute phase\. Day 0 since injury/);
    // Ryan et al. 1991: moderate 45°–90° of active knee flexion.
    expect(note.assessment).toContain('Severity: moderate, from active knee flexion of 80°');
    expect(note.assessment).toContain('Quadriceps contusions: West Point update');
    // Ryan et al. 1991 risk factor: knee flexion below 120°.
    expect(note.assessment).toContain('Knee flexion below 120° (lowest recorded 75°)');
  });

  it('P for the acute phase gives the cold schedule (20 minutes of each hour, common practice), the wrap care and the next re-check', () => {
    const note = draftSessionNote(acute());
    expect(note.plan).toContain('Cold for 20 minutes at the start of each hour while awake (common practice)');
    expect(note.plan).toContain('from below the injury to above it');
    expect(note.plan).toContain('take it off in bed (NHS inform PRICE guidance)');
    // Re-measure daily while acute (a clinic default of ours): run ended 2 Mar 18:30 → by 3 Mar.
    expect(note.plan).toContain('Next re-check: girth, pain and range of motion by 3 Mar 2026 (every 24 h in the acute phase');
    expect(note.plan).toContain('Warning signs');
  });

  it('P follows the clinic’s intermittent protocol when it is chosen (Bleakley et al. 2006)', () => {
    const input = acute();
    input.settings = { ...input.settings, coldProtocol: 'intermittent-10-10-10' };
    expect(draftSessionNote(input).plan).toContain('Cold 10 minutes, off 10 minutes, cold 10 minutes, every 2 hours while awake (Bleakley et al. 2006)');
  });

  it('a fall back shows the interrupted step and sends the plan back to cold, with a 24-hour re-check', () => {
    const start = '2026-03-12T10:00:00.000Z';
    const entries: TimelineEntry[] = [
      step(1, 0, 'ice-massage', 360, 360, iso(start, 6)),
      step(2, 1, 'light-strokes', 300, 100, iso(start, 8), { type: 'step-interrupted', reason: 'swelling increased' }),
      { seq: 3, type: 'swelling-check', stepIndex: 1, kind: 'light-strokes', plannedSeconds: null, actualSeconds: null, at: iso(start, 8), reason: null, detail: 'increased' },
      step(4, null, 'cold-pack', 1200, 1200, iso(start, 28), { detail: 'back to cold' }),
      step(5, null, 'compression-wrap', 180, 200, iso(start, 32), { detail: 'back to cold' }),
      { seq: 6, type: 'run-fell-back', stepIndex: null, kind: null, plannedSeconds: null, actualSeconds: null, at: iso(start, 32), reason: 'swelling increased', detail: 'back to cold after light centre-out strokes' },
    ];
    const note = draftSessionNote(
      fixture({ phase: 'proliferative', region: 'calf', status: 'fell-back', outcome: 'fell-back', runStart: start, runEnd: iso(start, 32), entries, measurements: [{ takenAt: iso(start, -30), painNprs: 3 }] }),
    );
    expect(note.objective).toContain('- Light centre-out strokes: stopped at 1 min 40 s of 5 min — swelling increased.');
    expect(note.objective).toContain('- Back to cold: cold pack: 20 min (planned 20 min), completed.');
    expect(note.objective).toContain('- Passive movement: not reached (planned 3 min).');
    expect(note.objective).toContain('Outcome: back to cold — swelling increased (back to cold after light centre-out strokes)');
    expect(note.assessment).toContain('Severity: not graded — the published knee-flexion grading applies to anterior-thigh');
    expect(note.plan).toContain('back to cold and compression; no massage until the swelling has settled');
    expect(note.plan).toContain('Cold for 20 minutes at the start of each hour');
    expect(note.plan).toContain('every 24 h in the acute phase');
  });

  it('a skipped step keeps its reason in O', () => {
    const start = '2026-03-12T10:00:00.000Z';
    const entries: TimelineEntry[] = [
      step(1, 0, 'ice-massage', 360, 0, iso(start, 0), { type: 'step-skipped', reason: 'athlete declined ice', detail: 'required step' }),
    ];
    const note = draftSessionNote(fixture({ phase: 'proliferative', runStart: start, runEnd: iso(start, 1), entries, status: 'ended-early', outcome: 'ended-early' }));
    expect(note.objective).toContain('- Ice massage: skipped (planned 6 min) — reason: athlete declined ice.');
    expect(note.subjective).toContain('No pain score (NPRS) recorded yet');
  });

  it('a red flag at the screening refers the athlete and plans no treatment', () => {
    const start = '2026-03-03T10:00:00.000Z';
    const note = draftSessionNote(
      fixture({
        phase: 'acute',
        status: 'stopped-referred',
        outcome: 'stopped-referred',
        screening: { ...clear, redFlags: ['pain-out-of-proportion'] },
        // A red flag at the screening stops the run before it starts.
        runStart: null,
        runEnd: start,
      }),
    );
    expect(note.subjective).toContain('red flag — Pain out of proportion to the injury');
    expect(note.objective).toContain('No steps were given: the run stopped at the screening.');
    expect(note.objective).toContain('Outcome: stopped and referred — Pain out of proportion to the injury.');
    expect(note.plan).toMatch(/^Referred to a physician today\. No further treatment/);
    expect(note.plan).not.toContain('Home care');
  });

  it('a cold contraindication removes cold from the home care', () => {
    const input = fixture({
      phase: 'acute',
      screening: { ...clear, coldContraindications: ['raynauds'], cautionsAcknowledged: true },
      runStart: acuteStart,
      runEnd: acuteEnd,
      coldContraindicated: true,
    });
    const note = draftSessionNote(input);
    expect(note.subjective).toContain("cold contraindication — Raynaud's");
    expect(note.plan).toContain('Home care: no cold (contraindicated).');
    expect(note.plan).not.toContain('20 minutes');
  });

  it('remodelling on the thigh names the 120° knee-flexion return criterion (Aronen & Chronister 1992)', () => {
    const start = '2026-03-30T10:00:00.000Z';
    const note = draftSessionNote(fixture({ phase: 'remodelling', runStart: start, runEnd: iso(start, 25), measurements: [{ takenAt: iso(start, -5), kneeFlexionDeg: 118, painNprs: 1 }] }));
    expect(note.plan).toContain('active knee flexion reaches 120°');
    expect(note.plan).toContain('Aronen & Chronister');
    expect(note.plan).toContain('every 168 h in the remodelling phase');
  });

  it('every section fits the 8000-character limit of the note form', () => {
    const note = draftSessionNote(acute());
    for (const text of Object.values(note)) expect(text.length).toBeLessThanOrEqual(8000);
  });

  it('formats durations as minutes and seconds', () => {
    expect(formatDuration(360)).toBe('6 min');
    expect(formatDuration(390)).toBe('6 min 30 s');
    expect(formatDuration(45)).toBe('45 s');
  });
});
