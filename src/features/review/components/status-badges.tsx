import type { LucideIcon } from 'lucide-react';
import { Ban, CircleCheck, CircleStop, FileCheck2, FileClock, FilePen, FileX, Flag, Hourglass, OctagonX, SkipForward, Snowflake, Sprout, TimerOff, Undo2, Waves } from 'lucide-react';
import type { Phase } from '../../../../shared/phase';
import type { AttentionKind, ReviewNoteStatus } from '../../../../shared/review/responses';

type Tone = 'alert' | 'warn' | 'good' | 'quiet';
type Look = { word: string; Icon: LucideIcon; tone: Tone };

const toneClass: Record<Tone, string> = {
  alert: 'border-ember-600 bg-ember-50 text-ember-700',
  warn: 'border-phase-proliferative bg-paper-raised text-ink',
  good: 'border-moss-500 bg-moss-50 text-moss-700',
  quiet: 'border-ink/25 bg-paper-raised text-ink-soft',
};

/** A status is always a word with an icon; the colour only repeats what they say. */
export function Badge({ look }: { look: Look }) {
  const { word, Icon, tone } = look;
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-2 py-0.5 text-sm font-medium ${toneClass[tone]}`}>
      <Icon aria-hidden className="h-4 w-4 shrink-0" />
      {word}
    </span>
  );
}

export const attentionLook: Record<AttentionKind, Look> = {
  'fell-back': { word: 'Fell back', Icon: Undo2, tone: 'alert' },
  'red-flag': { word: 'Red flag', Icon: Flag, tone: 'alert' },
  'skipped-steps': { word: 'Skipped', Icon: SkipForward, tone: 'warn' },
  // Ice massage 5–7 min at a time: common practice (clinical-sources.md).
  'ice-massage-out-of-bounds': { word: 'Ice outside 5–7 min', Icon: TimerOff, tone: 'warn' },
  abandoned: { word: 'Abandoned', Icon: Ban, tone: 'alert' },
  'ended-early': { word: 'Ended early', Icon: CircleStop, tone: 'warn' },
};

export const noteLook: Record<ReviewNoteStatus, Look> = {
  none: { word: 'No note', Icon: FileX, tone: 'quiet' },
  draft: { word: 'Draft', Icon: FilePen, tone: 'quiet' },
  submitted: { word: 'Waiting for sign-off', Icon: FileClock, tone: 'warn' },
  signed: { word: 'Signed', Icon: FileCheck2, tone: 'good' },
};

const outcomeLook: Record<string, Look> = {
  completed: { word: 'Completed', Icon: CircleCheck, tone: 'good' },
  'fell-back': { word: 'Fell back to cold', Icon: Undo2, tone: 'alert' },
  'stop-elevate-refer': { word: 'Stop, elevate and refer', Icon: OctagonX, tone: 'alert' },
  'stopped-referred': { word: 'Stopped and referred', Icon: OctagonX, tone: 'alert' },
  'ended-early': { word: 'Ended early', Icon: CircleStop, tone: 'warn' },
  abandoned: { word: 'Abandoned', Icon: Ban, tone: 'alert' },
};

/** The run's outcome, or its status while it has none (a run still going, or one left untouched). */
export function outcomeFor(outcome: string | null, status: string): Look {
  return outcomeLook[outcome ?? status] ?? { word: status.charAt(0).toUpperCase() + status.slice(1), Icon: Hourglass, tone: 'quiet' };
}

export const outcomeWords: Record<string, string> = Object.fromEntries(Object.entries(outcomeLook).map(([key, look]) => [key, look.word]));

const phaseIcon: Record<Phase, LucideIcon> = { acute: Snowflake, proliferative: Sprout, remodelling: Waves };

export function PhaseLabel({ phase }: { phase: Phase }) {
  const Icon = phaseIcon[phase];
  return (
    <span className="inline-flex items-center gap-1 capitalize">
      <Icon aria-hidden className="h-4 w-4 text-ink-soft" />
      {phase}
    </span>
  );
}
