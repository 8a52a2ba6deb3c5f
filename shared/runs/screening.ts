import { z } from 'zod';
import { sources } from '../clinical/sources';
import { toleranceSchema } from '../plan/build-plan';

/**
 * The screening form answered before every run (decisions.md: a form, not a timed step). A red flag stops
 * the run and refers; a cold contraindication or massage caution changes the plan and must be acknowledged.
 */

export interface ScreeningItem<Id extends string> {
  id: Id;
  label: string;
  source: string;
}

const tintinalli =
  "Tintinalli's Emergency Medicine: A Comprehensive Study Guide, chapter on compartment syndrome (edition not recorded)";
const rehabilitationTexts = 'rehabilitation texts, common practice';

export const redFlags = [
  { id: 'pain-out-of-proportion', label: 'Pain out of proportion to the injury', source: tintinalli },
  { id: 'pain-on-passive-stretch', label: 'Pain when the muscle is passively stretched', source: tintinalli },
  {
    id: 'numbness-or-cold-pale-limb',
    label: 'Numbness, pins and needles, or a cold, pale limb',
    source: tintinalli,
  },
  { id: 'suspected-fracture', label: 'Suspected fracture', source: sources.commonPractice },
  {
    id: 'rapidly-increasing-tense-swelling',
    label: 'Swelling that is tense and increasing fast',
    source: tintinalli,
  },
] as const satisfies readonly ScreeningItem<string>[];

export const coldContraindications = [
  { id: 'cold-urticaria', label: 'Cold urticaria (hives from cold)', source: rehabilitationTexts },
  { id: 'cryoglobulinaemia', label: 'Cryoglobulinaemia', source: rehabilitationTexts },
  { id: 'paroxysmal-cold-haemoglobinuria', label: 'Paroxysmal cold haemoglobinuria', source: rehabilitationTexts },
  { id: 'raynauds', label: "Raynaud's", source: rehabilitationTexts },
  {
    id: 'impaired-sensation-or-circulation',
    label: 'Impaired sensation or circulation in the area',
    source: rehabilitationTexts,
  },
  { id: 'regenerating-nerves', label: 'Regenerating nerves in the area', source: rehabilitationTexts },
] as const satisfies readonly ScreeningItem<string>[];

export const massageCautions = [
  {
    id: 'anticoagulants-or-bleeding-disorder',
    label: 'Takes anticoagulants or has a bleeding disorder',
    source: sources.commonPractice,
  },
  { id: 'open-skin', label: 'Open skin over the area', source: sources.commonPractice },
  {
    id: 'suspected-myositis-ossificans',
    label: 'Warmth and firmness at the site (suspected myositis ossificans)',
    source: sources.myositisPhysSportsmed1995,
  },
] as const satisfies readonly ScreeningItem<string>[];

type IdsOf<T extends readonly { id: string }[]> = T[number]['id'];
export type RedFlagId = IdsOf<typeof redFlags>;
export type ColdContraindicationId = IdsOf<typeof coldContraindications>;
export type MassageCautionId = IdsOf<typeof massageCautions>;

const idsOf = <T extends readonly { id: string }[]>(items: T) =>
  items.map((item) => item.id) as unknown as readonly [IdsOf<T>, ...IdsOf<T>[]];

export const redFlagIdSchema = z.enum(idsOf(redFlags), { error: 'Unknown red flag' });
export const coldContraindicationIdSchema = z.enum(idsOf(coldContraindications), {
  error: 'Unknown cold contraindication',
});
export const massageCautionIdSchema = z.enum(idsOf(massageCautions), { error: 'Unknown massage caution' });

// Ticked boxes arrive as arrays of ids; a repeated id means a broken form, not a second answer.
function uniqueList<T extends z.ZodType<string>>(item: T, label: string) {
  return z
    .array(item)
    .default([])
    .refine((ids) => new Set(ids).size === ids.length, { error: `${label} lists an answer twice` });
}

export const screeningSchema = z
  .object({
    redFlags: uniqueList(redFlagIdSchema, 'Red flags'),
    coldContraindications: uniqueList(coldContraindicationIdSchema, 'Cold contraindications'),
    massageCautions: uniqueList(massageCautionIdSchema, 'Massage cautions'),
    tolerance: toleranceSchema,
    cautionsAcknowledged: z.boolean({ error: 'Cautions acknowledged must be true or false' }).default(false),
  })
  .superRefine((answers, ctx) => {
    const anyCaution = answers.coldContraindications.length > 0 || answers.massageCautions.length > 0;
    if (anyCaution && !answers.cautionsAcknowledged) {
      ctx.addIssue({
        code: 'custom',
        path: ['cautionsAcknowledged'],
        message: 'Acknowledge the cautions before starting the run',
      });
    }
  });
export type Screening = z.infer<typeof screeningSchema>;
export type ScreeningInput = z.input<typeof screeningSchema>;

export const screeningOutcomes = ['clear', 'caution', 'refer'] as const;
export type ScreeningOutcomeKind = (typeof screeningOutcomes)[number];

export interface ScreeningOutcome {
  outcome: ScreeningOutcomeKind;
  redFlags: RedFlagId[];
  coldContraindicated: boolean;
  suspectedMyositis: boolean;
  /** Anticoagulants or a bleeding disorder: deep work leaves the plan (treatment rule 4). */
  bleedingRisk: boolean;
  /** Open skin over the area: deep work leaves the plan (treatment rule 4). */
  openSkin: boolean;
}

type ScreeningAnswers = Pick<Screening, 'redFlags' | 'coldContraindications' | 'massageCautions'>;

export function screeningOutcome(answers: ScreeningAnswers): ScreeningOutcome {
  const coldContraindicated = answers.coldContraindications.length > 0;
  const suspectedMyositis = answers.massageCautions.includes('suspected-myositis-ossificans');
  const anyCaution = coldContraindicated || answers.massageCautions.length > 0;
  // A red flag outranks everything: the run stops and the athlete is referred, whatever else was ticked.
  const outcome: ScreeningOutcomeKind = answers.redFlags.length > 0 ? 'refer' : anyCaution ? 'caution' : 'clear';
  return {
    outcome,
    redFlags: [...answers.redFlags],
    coldContraindicated,
    suspectedMyositis,
    bleedingRisk: answers.massageCautions.includes('anticoagulants-or-bleeding-disorder'),
    openSkin: answers.massageCautions.includes('open-skin'),
  };
}

export function redFlagLabel(id: string): string {
  return redFlags.find((flag) => flag.id === id)?.label ?? id;
}
