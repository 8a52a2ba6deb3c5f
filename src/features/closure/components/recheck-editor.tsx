import { useId, useState } from 'react';
import { AlarmClock, CalendarCheck, CalendarClock, CalendarX } from 'lucide-react';
import type { RecheckStatus } from '../../../../shared/clinic/recheck';
import type { InjuryView } from '../../../../shared/records/responses';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useSetRecheck } from '../api/set-recheck';

const when = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

export const recheckLook: Record<RecheckStatus, { word: string; Icon: typeof AlarmClock; tone: string }> = {
  overdue: { word: 'Overdue', Icon: AlarmClock, tone: 'text-ember-700' },
  due: { word: 'Due today', Icon: CalendarClock, tone: 'text-tide-700' },
  later: { word: 'Booked', Icon: CalendarCheck, tone: 'text-ink' },
  none: { word: 'Not set', Icon: CalendarX, tone: 'text-ink-muted' },
};

/** A datetime-local value in the tablet's own zone, which is the clinic's when the tablet is in it. */
function toLocalInput(iso: string): string {
  const d = new Date(iso);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** The injury's next re-check: Mendstep's suggestion after each run, which the therapist can move or clear. */
export function RecheckEditor({ injury }: { injury: InjuryView }) {
  const status = injury.recheckStatus ?? 'none';
  const at = injury.nextRecheckAt ?? null;
  const [editing, setEditing] = useState(false);
  const [value, setValue] = useState(at ? toLocalInput(at) : '');
  const save = useSetRecheck(injury.id);
  const inputId = useId();
  const { word, Icon, tone } = recheckLook[status];

  const submit = () => {
    const parsed = new Date(value);
    if (!value || Number.isNaN(parsed.getTime())) return;
    save.mutate(parsed.toISOString(), { onSuccess: () => setEditing(false) });
  };

  return (
    <section aria-labelledby={`${inputId}-heading`} className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
      <h2 id={`${inputId}-heading`} className="flex items-center gap-2 text-lg font-semibold">
        <CalendarClock aria-hidden className="h-5 w-5 text-ink-soft" /> Next re-check
      </h2>
      <p className={`flex items-center gap-2 text-lg font-semibold ${tone}`} data-testid="recheck-status">
        <Icon aria-hidden className="h-5 w-5" /> {word}
        {at ? <span className="font-normal text-ink">· {when.format(new Date(at))}</span> : null}
      </p>
      <p className="text-sm text-ink-muted">
        {at
          ? injury.recheckSetByName
            ? `Set by ${injury.recheckSetByName}.`
            : `Suggested after the last run from the ${injury.phase} phase: the clinic's interval for that phase (a clinic default of ours unless the clinic changed it).`
          : 'Mendstep suggests one after each run, from the phase and the clinic’s settings.'}
      </p>
      {save.isError ? (
        <Notice kind="error" title="Not changed">
          {save.error.message}
        </Notice>
      ) : null}
      {editing ? (
        <div className="flex flex-wrap items-end gap-2">
          <div className="flex flex-col gap-1">
            <label htmlFor={inputId} className="text-sm font-medium">
              Date and time of the re-check
            </label>
            <input
              id={inputId}
              type="datetime-local"
              value={value}
              min={toLocalInput(new Date().toISOString())}
              onChange={(e) => setValue(e.target.value)}
              className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2"
            />
          </div>
          <Button onClick={submit} disabled={save.isPending || !value}>
            {save.isPending ? 'Saving…' : 'Save re-check'}
          </Button>
          <Button variant="secondary" onClick={() => setEditing(false)}>
            Cancel
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button
            variant="secondary"
            onClick={() => {
              setValue(at ? toLocalInput(at) : '');
              setEditing(true);
            }}
          >
            {at ? 'Move the re-check' : 'Set a re-check'}
          </Button>
          {at ? (
            <Button variant="ghost" disabled={save.isPending} onClick={() => save.mutate(null)}>
              Clear
            </Button>
          ) : null}
        </div>
      )}
    </section>
  );
}
