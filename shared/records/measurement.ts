import { z } from 'zod';
import { boundedText, isPresent, pastInstant, rangedNumber } from './fields';

/*
 * The ranges are validation bounds of ours, wide enough for any adult limb and narrow enough to catch a
 * slipped digit (1600° or 4.5 m of girth); they are not clinical thresholds.
 */
const measurementFields = {
  takenAt: pastInstant('Measurement time'),
  girthInjuredCm: rangedNumber({
    label: 'Girth of the injured side',
    min: 10,
    max: 120,
    unit: ' cm',
    description: 'Circumference of the injured limb at the landmark distance, cm',
  })
    .nullable()
    .optional(),
  girthOtherCm: rangedNumber({
    label: 'Girth of the other side',
    min: 10,
    max: 120,
    unit: ' cm',
    description: 'Circumference of the uninjured limb at the same landmark distance, cm',
  })
    .nullable()
    .optional(),
  girthLandmark: boundedText('Girth landmark', 120)
    .nullable()
    .optional()
    .describe('Where the tape distance is measured from, e.g. "superior pole of patella"'),
  girthDistanceCm: rangedNumber({
    label: 'Girth distance from the landmark',
    min: 0,
    max: 40,
    unit: ' cm',
    description: 'Distance from the landmark to the tape, cm',
  })
    .nullable()
    .optional(),
  kneeFlexionDeg: rangedNumber({
    label: 'Knee flexion',
    min: 0,
    max: 160,
    unit: '°',
    integer: true,
    description: 'Active knee flexion range of motion, degrees',
  })
    .nullable()
    .optional(),
  painNprs: rangedNumber({
    label: 'Pain (NPRS)',
    min: 0,
    max: 10,
    unit: '',
    integer: true,
    description: 'Numeric pain rating scale, 0 no pain to 10 worst imaginable',
  })
    .nullable()
    .optional(),
  bruiseLengthCm: rangedNumber({
    label: 'Bruise length',
    min: 0,
    max: 60,
    unit: ' cm',
    description: 'Longest dimension of the visible bruise, cm',
  })
    .nullable()
    .optional(),
  bruiseWidthCm: rangedNumber({
    label: 'Bruise width',
    min: 0,
    max: 60,
    unit: ' cm',
    description: 'Dimension of the visible bruise across its length, cm',
  })
    .nullable()
    .optional(),
  skinfoldMm: rangedNumber({
    label: 'Skinfold',
    min: 1,
    max: 60,
    unit: ' mm',
    description: 'Skinfold over the site, mm; informs the cold-application figures shown',
  })
    .nullable()
    .optional(),
  notes: boundedText('Notes', 4000).nullable().optional(),
};

type MeasurementShape = { [K in keyof typeof measurementFields]?: unknown };

/**
 * Paired values only make sense together; each issue names the missing field, so the form highlights the
 * box the therapist still has to fill rather than the one they did.
 */
function checkPairs(value: MeasurementShape, ctx: z.RefinementCtx): void {
  const requireBoth = (a: keyof MeasurementShape, b: keyof MeasurementShape, message: string) => {
    if (isPresent(value[a]) && !isPresent(value[b])) ctx.addIssue({ code: 'custom', path: [b], message });
    if (isPresent(value[b]) && !isPresent(value[a])) ctx.addIssue({ code: 'custom', path: [a], message });
  };
  requireBoth('girthInjuredCm', 'girthOtherCm', 'Girth must be measured on both sides, or on neither');
  requireBoth('bruiseLengthCm', 'bruiseWidthCm', 'Bruise size needs both length and width, or neither');

  const girthGiven = isPresent(value.girthInjuredCm) || isPresent(value.girthOtherCm);
  if (girthGiven) {
    // A girth without its site cannot be compared with the next one, which is the whole point of taking it.
    const landmark = typeof value.girthLandmark === 'string' ? value.girthLandmark.trim() : '';
    if (landmark === '') {
      ctx.addIssue({ code: 'custom', path: ['girthLandmark'], message: 'Girth landmark is required with a girth' });
    }
    if (!isPresent(value.girthDistanceCm)) {
      ctx.addIssue({
        code: 'custom',
        path: ['girthDistanceCm'],
        message: 'Girth distance from the landmark (0 to 40 cm) is required with a girth',
      });
    }
  }

  const recorded: (keyof MeasurementShape)[] = [
    'girthInjuredCm',
    'girthOtherCm',
    'kneeFlexionDeg',
    'painNprs',
    'bruiseLengthCm',
    'bruiseWidthCm',
    'skinfoldMm',
    'notes',
  ];
  if (!recorded.some((key) => isPresent(value[key]) && value[key] !== '')) {
    ctx.addIssue({ code: 'custom', path: [], message: 'Record at least one measurement or a note' });
  }
}

export const measurementCreateSchema = z.object(measurementFields).superRefine(checkPairs);
export type MeasurementCreate = z.infer<typeof measurementCreateSchema>;
export type MeasurementCreateInput = z.input<typeof measurementCreateSchema>;
