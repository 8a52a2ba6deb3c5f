import { sources } from './sources';

export interface PadRange {
  minCm: number;
  maxCm: number;
}

export interface GuidanceLine {
  text: string;
  source: string;
}

export interface PadSize {
  length: PadRange;
  width: PadRange;
  note: string;
  /** The bruise needed more than the largest pad: the ranges are capped and the note says so. */
  oversize: boolean;
  source: string;
  wrapGuidance: GuidanceLine[];
}

export const padScale = { min: 2, max: 3 } as const;

/**
 * The largest felt pad the plan carries, each dimension (ours: the plan's pad table stops here). A bruise too
 * big for two to three times its size gets this pad with a note, never a plan that fails to build.
 */
export const largestPadCm = 100;

export const oversizePadNote = `The bruise is too large for a pad two to three times its size: use the largest pad (${largestPadCm} cm), cover the bruise, and check with a physician about a bruise this size.`;

/*
 * Common practice says a felt pad "two to three times the size of the injury". Mendstep reads size as each
 * linear dimension (length and width each × 2 to × 3), not area: it is how a therapist measures and cuts
 * felt, and it gives the larger pad (twice the area would be only about 1.4 × as long and as wide).
 * No published pad size for contusions was found, so none is invented here.
 */
export function padSize(bruise: {
  bruiseLengthCm?: number | null;
  bruiseWidthCm?: number | null;
}): PadSize | null {
  const { bruiseLengthCm: length, bruiseWidthCm: width } = bruise;
  if (!isPositive(length) || !isPositive(width)) return null;
  const pad = { length: range(length), width: range(width) };
  const oversize = pad.length.maxCm > largestPadCm || pad.width.maxCm > largestPadCm;
  return {
    length: capped(pad.length),
    width: capped(pad.width),
    note:
      'Felt pad two to three times the size of the bruise, read as each dimension (length and width), rounded to 0.5 cm. ' +
      'No published pad size for contusions was found.' +
      (oversize ? ` ${oversizePadNote}` : ''),
    oversize,
    source: sources.commonPractice,
    wrapGuidance: wrapGuidance.map((line) => ({ ...line })),
  };
}

export const wrapGuidance: readonly GuidanceLine[] = [
  { text: 'Place the felt pad over the bruise.', source: sources.commonPractice },
  {
    text: 'Start the elastic wrap below the injury, at the end furthest from the heart.',
    source: `${sources.nhsInformPrice}; ${sources.commonPractice}`,
  },
  {
    text: 'Wrap upwards (distal to proximal) in overlapping figure-of-eight turns.',
    source: sources.commonPractice,
  },
  { text: 'Finish above the injury.', source: sources.commonPractice },
  { text: "Firm, to the athlete's tolerance; leave the pad out if it is uncomfortable.", source: sources.commonPractice },
  {
    text: 'Loosen the wrap if pain increases or the area goes numb.',
    source: sources.nhsInformPrice,
  },
  { text: 'Take the wrap off for sleep.', source: sources.nhsInformPrice },
];

function isPositive(value: number | null | undefined): value is number {
  return typeof value === 'number' && Number.isFinite(value) && value > 0;
}

function range(dimensionCm: number): PadRange {
  return { minCm: roundToHalf(dimensionCm * padScale.min), maxCm: roundToHalf(dimensionCm * padScale.max) };
}

/** Each bound within the largest pad, so the range stays a range (min ≤ max). */
export function capped(range: PadRange): PadRange {
  return { minCm: Math.min(range.minCm, largestPadCm), maxCm: Math.min(range.maxCm, largestPadCm) };
}

function roundToHalf(value: number): number {
  // Felt is cut by eye with a ruler; half-centimetres are as fine as anyone will cut it.
  return Math.round(value * 2) / 2;
}
