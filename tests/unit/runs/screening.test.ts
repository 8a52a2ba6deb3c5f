import {
  coldContraindications,
  massageCautions,
  redFlags,
  screeningOutcome,
  screeningSchema,
  type ScreeningInput,
} from '../../../shared/runs/screening';
import { buildPlan } from '../../../shared/plan/build-plan';
import { defaultSequences } from '../../../shared/plan/sequence';

const clear: ScreeningInput = { redFlags: [], coldContraindications: [], massageCautions: [], tolerance: 'usual' };

describe('screening before a run', () => {
  it('lists the compartment syndrome signs among the red flags', () => {
    // Pain out of proportion and pain on passive stretch (early), paraesthesia (later): Tintinalli's Emergency
    // Medicine: A Comprehensive Study Guide, chapter on compartment syndrome (edition not recorded).
    expect(redFlags.map((flag) => flag.id)).toEqual([
      'pain-out-of-proportion',
      'pain-on-passive-stretch',
      'numbness-or-cold-pale-limb',
      'suspected-fracture',
      'rapidly-increasing-tense-swelling',
    ]);
    for (const id of ['pain-out-of-proportion', 'pain-on-passive-stretch', 'numbness-or-cold-pale-limb']) {
      expect(redFlags.find((flag) => flag.id === id)!.source).toMatch(/Tintinalli/);
    }
  });

  it('lists the cold contraindications with their source', () => {
    // Rehabilitation texts, common practice.
    expect(coldContraindications.map((item) => item.id)).toEqual([
      'cold-urticaria',
      'cryoglobulinaemia',
      'paroxysmal-cold-haemoglobinuria',
      'raynauds',
      'impaired-sensation-or-circulation',
      'regenerating-nerves',
    ]);
    for (const item of coldContraindications) expect(item.source).toBe('rehabilitation texts, common practice');
  });

  it('lists the massage cautions, with myositis ossificans described by its signs', () => {
    // Local swelling, warmth and firmness: Phys Sportsmed 1995;23(2):77–82 (authors and title not retrieved).
    expect(massageCautions.map((item) => item.id)).toEqual([
      'anticoagulants-or-bleeding-disorder',
      'open-skin',
      'suspected-myositis-ossificans',
    ]);
    expect(massageCautions[2].label).toMatch(/warmth and firmness/i);
  });

  it('a screening with nothing ticked is clear', () => {
    const answers = screeningSchema.parse(clear);
    expect(screeningOutcome(answers)).toEqual({
      outcome: 'clear',
      redFlags: [],
      coldContraindicated: false,
      suspectedMyositis: false,
      bleedingRisk: false,
      openSkin: false,
    });
  });

  it('any red flag means refer, whatever else is ticked', () => {
    const answers = screeningSchema.parse({
      ...clear,
      redFlags: ['pain-on-passive-stretch'],
      massageCautions: ['open-skin'],
      cautionsAcknowledged: true,
    });
    expect(screeningOutcome(answers)).toMatchObject({ outcome: 'refer', redFlags: ['pain-on-passive-stretch'] });
  });

  it('a cold contraindication is a caution that marks cold as contraindicated', () => {
    const answers = screeningSchema.parse({ ...clear, coldContraindications: ['raynauds'], cautionsAcknowledged: true });
    expect(screeningOutcome(answers)).toEqual({
      outcome: 'caution',
      redFlags: [],
      coldContraindicated: true,
      suspectedMyositis: false,
      bleedingRisk: false,
      openSkin: false,
    });
  });

  it('warmth and firmness at the site mark suspected myositis ossificans', () => {
    const answers = screeningSchema.parse({
      ...clear,
      massageCautions: ['suspected-myositis-ossificans'],
      cautionsAcknowledged: true,
    });
    expect(screeningOutcome(answers)).toMatchObject({ outcome: 'caution', suspectedMyositis: true, coldContraindicated: false });
  });

  it('the outcome feeds the plan: cold removed and deep work removed', () => {
    const answers = screeningSchema.parse({
      ...clear,
      coldContraindications: ['cold-urticaria'],
      massageCautions: ['suspected-myositis-ossificans'],
      tolerance: 'light',
      cautionsAcknowledged: true,
    });
    const { coldContraindicated, suspectedMyositis } = screeningOutcome(answers);
    const plan = buildPlan({
      phase: 'remodelling',
      sequence: defaultSequences.remodelling,
      tolerance: answers.tolerance,
      coldContraindicated,
      suspectedMyositis,
    });
    expect(plan.steps.map((step) => step.kind)).toEqual(['warm-up-strokes']);
    expect(plan.backToCold).toBe('stop-elevate-refer');
  });

  it('a ticked caution must be acknowledged', () => {
    const result = screeningSchema.safeParse({ ...clear, massageCautions: ['anticoagulants-or-bleeding-disorder'] });
    expect(result.success).toBe(false);
    expect(result.error!.issues).toEqual([
      expect.objectContaining({ path: ['cautionsAcknowledged'], message: 'Acknowledge the cautions before starting the run' }),
    ]);
  });

  it('without cautions no acknowledgement is needed', () => {
    expect(screeningSchema.parse(clear).cautionsAcknowledged).toBe(false);
  });

  it('an unknown answer and a repeated answer are refused', () => {
    expect(screeningSchema.safeParse({ ...clear, redFlags: ['headache'] }).error!.issues[0].path).toEqual(['redFlags', 0]);
    expect(screeningSchema.safeParse({ ...clear, redFlags: ['suspected-fracture', 'suspected-fracture'] }).error!.issues[0].path).toEqual([
      'redFlags',
    ]);
  });

  it('tolerance is required and is light or usual', () => {
    const { tolerance: _tolerance, ...withoutTolerance } = clear;
    expect(screeningSchema.safeParse(withoutTolerance).success).toBe(false);
    expect(screeningSchema.safeParse({ ...clear, tolerance: 'heavy' }).success).toBe(false);
  });
});
