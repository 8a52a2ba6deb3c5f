import { useId, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { CheckCircle2, CircleDashed, FlagTriangleRight, History, Link2, XCircle } from 'lucide-react';
import type { ClosureView } from '../../../../shared/clinic/closure';
import { functionalTests, returnToActivityCheck, type CriterionResult, type CriterionStatus, type FunctionalTestId } from '../../../../shared/clinical/return-to-activity';
import type { BodyRegionId } from '../../../../shared/records/body-map';
import { haematomaTypeLabels, haematomaTypes, mechanismKindLabels, mechanismKinds, type HaematomaType, type MechanismKind } from '../../../../shared/records/injury';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { useCloseInjury } from '../api/close-injury';
import { useClosure } from '../api/get-closure';
import { useRecordReinjury } from '../api/record-reinjury';

const when = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });

const statusLook: Record<CriterionStatus, { word: string; Icon: typeof CheckCircle2; tone: string }> = {
  met: { word: 'Met', Icon: CheckCircle2, tone: 'text-moss-700' },
  unmet: { word: 'Not met', Icon: XCircle, tone: 'text-ember-700' },
  'not-measured': { word: 'Not measured', Icon: CircleDashed, tone: 'text-ember-700' },
};

function CriterionRow({ criterion }: { criterion: CriterionResult }) {
  const { word, Icon, tone } = statusLook[criterion.status];
  return (
    <li className="flex items-start gap-3 border-t border-ink/10 py-2 first:border-t-0">
      <span className={`inline-flex w-36 shrink-0 items-center gap-1.5 font-semibold ${tone}`}>
        <Icon aria-hidden className="h-5 w-5" /> {word}
      </span>
      <span className="flex flex-col">
        <span className="font-medium">{criterion.label}</span>
        <span className="text-sm text-ink-soft">
          {criterion.value ? `Latest: ${criterion.value}` : 'No value in the latest measurement'} · target {criterion.target}
        </span>
        <span className="text-xs text-ink-muted">Source: {criterion.source}</span>
      </span>
    </li>
  );
}

/** Closing on objective criteria, or with a recorded reason; a closed injury offers a re-injury instead. */
export function ClosurePanel({ injuryId }: { injuryId: string }) {
  const closure = useClosure(injuryId);
  if (closure.isPending) return <p className="text-ink-muted">Loading the return-to-activity check…</p>;
  if (closure.isError) return <p className="text-ember-700">{closure.error.message}</p>;
  const view = closure.data;
  return (
    <section aria-labelledby="closure-heading" className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
      <h2 id="closure-heading" className="flex items-center gap-2 text-lg font-semibold">
        <FlagTriangleRight aria-hidden className="h-5 w-5 text-ink-soft" /> {view.status === 'open' ? 'Return to activity and closing' : 'Closed'}
      </h2>
      <EpisodeLinks view={view} />
      {view.status === 'open' ? <OpenClosure view={view} /> : <ClosedSummary view={view} />}
    </section>
  );
}

function EpisodeLinks({ view }: { view: ClosureView }) {
  if (!view.reinjuryOf && !view.reinjuries.length) return null;
  return (
    <ul className="flex flex-col gap-1 text-sm">
      {view.reinjuryOf ? (
        <li className="flex items-center gap-2">
          <History aria-hidden className="h-4 w-4" /> Re-injury of the episode injured {when.format(new Date(view.reinjuryOf.injuredAt))}:{' '}
          <Link className="font-medium underline" to={`/injuries/${view.reinjuryOf.id}`}>
            open the earlier episode
          </Link>
        </li>
      ) : null}
      {view.reinjuries.map((later) => (
        <li key={later.id} className="flex items-center gap-2">
          <Link2 aria-hidden className="h-4 w-4" /> Re-injured {when.format(new Date(later.injuredAt))} ({later.status}):{' '}
          <Link className="font-medium underline" to={`/injuries/${later.id}`}>
            open the re-injury
          </Link>
        </li>
      ))}
    </ul>
  );
}

/** Folded until asked for: closing is occasional, and the injury page's cards matter more day to day. */
function OpenClosure({ view }: { view: ClosureView }) {
  const [expanded, setExpanded] = useState(false);
  if (expanded) return <CloseForm view={view} onCancel={() => setExpanded(false)} />;
  const measured = view.check.criteria.filter((c) => !c.id.startsWith('functional:'));
  const met = measured.filter((c) => c.status === 'met').length;
  return (
    <>
      <p className="text-ink-soft">
        Measured criteria met: <strong className="text-ink">{met} of {measured.length}</strong>
        {view.latestMeasurement ? ` (latest measurement ${when.format(new Date(view.latestMeasurement.takenAt))})` : ' (no measurement yet)'}. The functional tests are ticked when
        you close.
      </p>
      <Button variant="secondary" className="self-start" onClick={() => setExpanded(true)}>
        Check return to activity and close
      </Button>
    </>
  );
}

function CloseForm({ view, onCancel }: { view: ClosureView; onCancel: () => void }) {
  const [passed, setPassed] = useState<string[]>([]);
  const [reason, setReason] = useState('');
  const [confirming, setConfirming] = useState(false);
  const close = useCloseInjury(view.injuryId);
  const reasonId = useId();
  // The same pure check the server runs on closing, recomputed here as each test is ticked.
  const check = returnToActivityCheck({
    region: view.region as BodyRegionId,
    measurements: view.latestMeasurement ? [view.latestMeasurement] : [],
    girthThresholdCm: view.girthThresholdCm,
    passedTests: passed,
  });
  const reasonMissing = !check.allMet && reason.trim() === '';
  const serverReason = close.error instanceof ApiError ? close.error.fields?.reason : undefined;

  return (
    <>
      <p className="text-sm text-ink-soft">
        {view.latestMeasurement
          ? `Read from the latest measurement, ${when.format(new Date(view.latestMeasurement.takenAt))}. Record a new measurement first if it is not today's.`
          : 'No measurement yet: record one with pain, and for the anterior thigh knee flexion and girth on both sides.'}
      </p>
      <ul aria-label="Return-to-activity criteria">
        {check.criteria
          .filter((c) => !c.id.startsWith('functional:'))
          .map((c) => (
            <CriterionRow key={c.id} criterion={c} />
          ))}
      </ul>
      <fieldset className="flex flex-col gap-1">
        <legend className="font-medium">Functional tests passed today (common practice)</legend>
        {functionalTests.map((test) => (
          <label key={test.id} className="flex min-h-target cursor-pointer items-center gap-3">
            <input
              type="checkbox"
              className="h-6 w-6 accent-ink"
              checked={passed.includes(test.id)}
              onChange={(e) => setPassed((current) => (e.target.checked ? [...current, test.id] : current.filter((id) => id !== test.id)))}
            />
            {test.label}
          </label>
        ))}
      </fieldset>
      {view.activeRunId ? (
        <Notice kind="caution" title="A run is in progress">
          Finish or end the run before closing this injury.
        </Notice>
      ) : null}
      <p className="flex items-center gap-2 font-semibold" role="status" data-testid="closure-verdict">
        {check.allMet ? (
          <>
            <CheckCircle2 aria-hidden className="h-5 w-5 text-moss-700" /> Every criterion is met.
          </>
        ) : (
          <>
            <XCircle aria-hidden className="h-5 w-5 text-ember-700" /> {check.unmet.length} {check.unmet.length === 1 ? 'criterion is' : 'criteria are'} not met.
          </>
        )}
      </p>
      {!check.allMet ? (
        <div className="flex flex-col gap-1">
          <label htmlFor={reasonId} className="text-sm font-medium">
            Reason for closing anyway (required)
          </label>
          <textarea
            id={reasonId}
            rows={2}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            aria-invalid={serverReason ? true : undefined}
            className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2"
            placeholder="e.g. cleared by the team physician for light training"
          />
          <p className="text-sm text-ink-muted">Returning early risks a re-injury; the reason is kept with the record and shown on the review desk&rsquo;s audit trail.</p>
        </div>
      ) : null}
      {close.isError ? (
        <Notice kind="error" title="Not closed">
          {close.error.message}
        </Notice>
      ) : null}
      {confirming ? (
        <div role="group" aria-label="Confirm closing" className="flex flex-wrap items-center gap-2 rounded-lg border border-ink/20 p-3">
          <span className="font-medium">Close this injury{check.allMet ? '' : ' with criteria not met'}?</span>
          <Button
            variant={check.allMet ? 'primary' : 'danger'}
            disabled={close.isPending}
            onClick={() => close.mutate({ passedTests: passed as FunctionalTestId[], reason: check.allMet ? undefined : reason.trim() }, { onSettled: () => setConfirming(false) })}
          >
            {close.isPending ? 'Closing…' : 'Confirm closing'}
          </Button>
          <Button variant="secondary" onClick={() => setConfirming(false)}>
            Cancel
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button disabled={Boolean(view.activeRunId) || reasonMissing} onClick={() => setConfirming(true)}>
            Close the injury
          </Button>
          <Button variant="ghost" onClick={onCancel}>
            Not now
          </Button>
        </div>
      )}
    </>
  );
}

function ClosedSummary({ view }: { view: ClosureView }) {
  const closure = view.closure;
  return (
    <>
      {closure ? (
        <>
          <p>
            Closed {when.format(new Date(closure.closedAt))}
            {closure.closedByName ? ` by ${closure.closedByName}` : ''} —{' '}
            <strong>{closure.allMet ? 'every return-to-activity criterion met' : 'with criteria not met'}</strong>.
          </p>
          {closure.reason ? <p className="rounded-lg bg-paper-sunk p-2">Reason: {closure.reason}</p> : null}
          <ul aria-label="Criteria at closing">
            {closure.criteria.map((c) => (
              <CriterionRow key={c.id} criterion={c} />
            ))}
          </ul>
        </>
      ) : (
        <p>Closed before the return-to-activity check was recorded.</p>
      )}
      <ReinjuryForm injuryId={view.injuryId} />
    </>
  );
}

function toLocalInput(date: Date): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}`;
}

function ReinjuryForm({ injuryId }: { injuryId: string }) {
  const [open, setOpen] = useState(false);
  const [kind, setKind] = useState<MechanismKind>('knee-to-thigh');
  const [mechanism, setMechanism] = useState('');
  const [injuredAt, setInjuredAt] = useState(() => toLocalInput(new Date()));
  const [haematoma, setHaematoma] = useState<HaematomaType>('not-known');
  const record = useRecordReinjury(injuryId);
  const navigate = useNavigate();
  const ids = { kind: useId(), mechanism: useId(), at: useId(), haematoma: useId() };
  const fieldError = (name: string) => (record.error instanceof ApiError ? record.error.fields?.[name] : undefined);

  if (!open) {
    return (
      <Button variant="secondary" className="self-start" onClick={() => setOpen(true)}>
        Record a re-injury
      </Button>
    );
  }
  const control = 'min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2';
  return (
    <form
      aria-label="Record a re-injury"
      className="flex flex-col gap-3 rounded-lg border border-ink/20 p-3"
      onSubmit={(e) => {
        e.preventDefault();
        const at = new Date(injuredAt);
        record.mutate(
          { mechanismKind: kind, mechanism: mechanism.trim() || undefined, injuredAt: Number.isNaN(at.getTime()) ? injuredAt : at.toISOString(), haematomaType: haematoma },
          { onSuccess: (injury) => navigate(`/injuries/${injury.id}`) },
        );
      }}
    >
      <p className="text-sm text-ink-soft">A new blow to the same site starts a new episode linked to this one; this episode stays closed as it was.</p>
      <div className="grid gap-3 md:grid-cols-2">
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.kind} className="text-sm font-medium">
            Mechanism
          </label>
          <select id={ids.kind} value={kind} onChange={(e) => setKind(e.target.value as MechanismKind)} className={control}>
            {mechanismKinds.map((k) => (
              <option key={k} value={k}>
                {mechanismKindLabels[k]}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.at} className="text-sm font-medium">
            Date and time of the re-injury
          </label>
          <input id={ids.at} type="datetime-local" value={injuredAt} max={toLocalInput(new Date())} onChange={(e) => setInjuredAt(e.target.value)} className={control} />
          {fieldError('injuredAt') ? (
            <p role="alert" className="text-sm font-medium text-ember-700">
              {fieldError('injuredAt')}
            </p>
          ) : null}
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.mechanism} className="text-sm font-medium">
            How it happened
          </label>
          <input id={ids.mechanism} value={mechanism} onChange={(e) => setMechanism(e.target.value)} className={control} />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.haematoma} className="text-sm font-medium">
            Haematoma type
          </label>
          <select id={ids.haematoma} value={haematoma} onChange={(e) => setHaematoma(e.target.value as HaematomaType)} className={control}>
            {haematomaTypes.map((t) => (
              <option key={t} value={t}>
                {haematomaTypeLabels[t]}
              </option>
            ))}
          </select>
        </div>
      </div>
      {record.isError && !fieldError('injuredAt') ? (
        <Notice kind="error" title="Not recorded">
          {record.error.message}
        </Notice>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={record.isPending}>
          {record.isPending ? 'Recording…' : 'Record the re-injury'}
        </Button>
        <Button variant="secondary" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
