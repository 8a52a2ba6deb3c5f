import { z } from 'zod';

/** Phases of healing of a muscle contusion (trade words; day bands from Kannus 2000). */
export const phases = ['acute', 'proliferative', 'remodelling'] as const;
export const phaseSchema = z.enum(phases);
export type Phase = z.infer<typeof phaseSchema>;
