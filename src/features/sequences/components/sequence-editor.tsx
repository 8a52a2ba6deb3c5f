import { useEffect, useId, useRef, useState, type KeyboardEvent } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Plus, Save, Snowflake, Sprout, Waves } from 'lucide-react';
import { phases, type Phase } from '../../../../shared/phase';
import { maxSequenceSteps } from '../../../../shared/plan/sequence';
import { stepKindInfo, stepKinds, type StepKind } from '../../../../shared/plan/step-kinds';
import type { SequenceView } from '../../../../shared/runs/responses';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { useSequences } from '../api/get-sequences';
import { useSaveSequence } from '../api/save-sequence';
import { checkDraft, durationProblem, fieldErrorsToSteps, move, newStep, sameSteps, toDraft, type DraftStep, type StepErrors } from '../lib/draft';
import { boundsText, formatDuration, StepRow, type StepAction } from './step-row';

const phaseLook: Record<Phase, { word: string; Icon: typeof Snowflake }> = {
  acute: { word: 'Acute', Icon: Snowflake },
  proliferative: { word: 'Proliferative', Icon: Sprout },
  remodelling: { word: 'Remodelling', Icon: Waves },
};

const savedOn = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });

function VersionLine({ view }: { view: SequenceView }) {
  return (
    <p className="text-sm text-ink-muted" data-testid="sequence-version">
      <span className="font-semibold text-ink">Version {view.version}</span>
      {view.createdByName ? ` · saved by ${view.createdByName} on ${savedOn.format(new Date(view.createdAt))}` : ' · the clinic’s starting sequence'}
    </p>
  );
}

/** A therapist reads the sequence their runs are built from. */
function ReadOnlySequence({ view }: { view: SequenceView }) {
  return (
    <div className="flex flex-col gap-3">
      <VersionLine view={view} />
      <ol className="flex flex-col gap-2">
        {view.steps.map((step, i) => (
          <li key={i} className="flex flex-wrap items-baseline gap-x-4 rounded-xl bg-paper-raised p-3 ring-1 ring-ink/10">
            <span className="font-semibold">
              {i + 1}. {stepKindInfo[step.kind].label}
            </span>
            <span className="tabular-nums">{formatDuration(step.seconds)}</span>
            {step.optional ? <span className="text-sm text-ink-muted">optional</span> : null}
            <span className="text-sm text-ink-muted">allowed {boundsText(step)}</span>
          </li>
        ))}
      </ol>
    </div>
  );
}

function EditableSequence({ view, onDirty }: { view: SequenceView; onDirty: (dirty: boolean) => void }) {
  const [steps, setSteps] = useState<DraftStep[]>(() => toDraft(view.steps));
  const [basedOn, setBasedOn] = useState(view.id);
  const [errors, setErrors] = useState<StepErrors>({});
  const [formError, setFormError] = useState<string>();
  const [kindToAdd, setKindToAdd] = useState<StepKind | ''>('');
  const [savedVersion, setSavedVersion] = useState<number>();
  const save = useSaveSequence();
  const buttons = useRef(new Map<string, HTMLButtonElement>());
  const [focusNext, setFocusNext] = useState<{ key: string; action: StepAction } | null>(null);
  const addId = useId();

  // A new version arrived (this save, or another supervisor's): start again from it.
  if (basedOn !== view.id) {
    setBasedOn(view.id);
    setSteps(toDraft(view.steps));
  }

  const dirty = !sameSteps(steps, view.steps);
  useEffect(() => onDirty(dirty), [dirty, onDirty]);

  // Focus follows the step a keyboard user just moved, so pressing "down" again keeps moving the same step.
  useEffect(() => {
    if (!focusNext) return;
    const wanted = buttons.current.get(`${focusNext.key}:${focusNext.action}`);
    const fallback = buttons.current.get(`${focusNext.key}:${focusNext.action === 'up' ? 'down' : 'up'}`);
    (wanted && !wanted.disabled ? wanted : fallback)?.focus();
    setFocusNext(null);
  }, [focusNext]);

  const edit = (next: DraftStep[]) => {
    setSteps(next);
    setSavedVersion(undefined);
  };
  const change = (key: string, patch: Partial<DraftStep>) => {
    edit(steps.map((s) => (s.key === key ? { ...s, ...patch } : s)));
    setErrors(({ [key]: _gone, ...rest }) => rest);
  };
  const act = (index: number, action: StepAction) => {
    const key = steps[index].key;
    if (action === 'remove') {
      const next = steps.filter((s) => s.key !== key);
      edit(next);
      const neighbour = next[Math.min(index, next.length - 1)];
      if (neighbour) setFocusNext({ key: neighbour.key, action: 'remove' });
      return;
    }
    edit(move(steps, index, action === 'up' ? index - 1 : index + 1));
    setFocusNext({ key, action });
  };
  const add = () => {
    if (!kindToAdd) return;
    edit([...steps, newStep(kindToAdd)]);
    setKindToAdd('');
  };

  const onSave = async () => {
    setFormError(undefined);
    const checked = checkDraft(view.phase, steps);
    if (!('sequence' in checked)) {
      setErrors(checked.stepErrors);
      setFormError(checked.formError ?? 'Some steps are outside their safety bounds. Nothing was saved.');
      return;
    }
    const sent = steps;
    try {
      const saved = await save.mutateAsync(checked.sequence);
      setErrors({});
      setSavedVersion(saved.version);
    } catch (error) {
      if (error instanceof ApiError && error.fields) {
        const placed = fieldErrorsToSteps(error.fields, sent);
        setErrors(placed.stepErrors);
        setFormError(placed.formError ?? error.message);
      } else {
        setFormError(error instanceof Error ? error.message : 'Could not save the sequence.');
      }
    }
  };

  const acute = view.phase === 'acute';
  const addable = stepKinds.filter((kind) => !(acute && stepKindInfo[kind].massage));

  return (
    <div className="flex flex-col gap-3">
      <VersionLine view={view} />
      {formError ? (
        <Notice kind="error" title="Not saved">
          {formError}
        </Notice>
      ) : null}
      <ol className="flex flex-col gap-2" aria-label={`${phaseLook[view.phase].word} sequence steps`}>
        {steps.map((step, index) => (
          <StepRow
            key={step.key}
            step={step}
            position={index}
            count={steps.length}
            error={errors[step.key]?.seconds ?? durationProblem(step)}
            kindError={errors[step.key]?.kind}
            onChange={(patch) => change(step.key, patch)}
            onAction={(action) => act(index, action)}
            buttonRef={(action, element) => {
              if (element) buttons.current.set(`${step.key}:${action}`, element);
              else buttons.current.delete(`${step.key}:${action}`);
            }}
          />
        ))}
      </ol>
      <div className="flex flex-wrap items-end gap-3 rounded-xl border border-dashed border-ink/30 p-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={addId} className="text-sm font-medium">
            Kind of step to add
          </label>
          <select id={addId} value={kindToAdd} onChange={(e) => setKindToAdd(e.target.value as StepKind | '')} className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2">
            <option value="">Choose a kind…</option>
            {addable.map((kind) => (
              <option key={kind} value={kind}>
                {stepKindInfo[kind].label} ({boundsText({ kind })})
              </option>
            ))}
          </select>
        </div>
        <Button variant="secondary" onClick={add} disabled={!kindToAdd || steps.length >= maxSequenceSteps}>
          <Plus aria-hidden className="h-4 w-4" /> Add step
        </Button>
        {acute ? <p className="text-sm text-ink-muted">Massage kinds are left out while acute: no massage for 24–72 h (common practice).</p> : null}
        {steps.length >= maxSequenceSteps ? <p className="text-sm text-ink-muted">A sequence holds at most {maxSequenceSteps} steps.</p> : null}
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={onSave} disabled={!dirty || save.isPending}>
          <Save aria-hidden className="h-4 w-4" /> {save.isPending ? 'Saving…' : `Save as version ${view.version + 1}`}
        </Button>
        <Button variant="ghost" disabled={!dirty || save.isPending} onClick={() => { edit(toDraft(view.steps)); setErrors({}); setFormError(undefined); }}>
          Discard changes
        </Button>
        <p role="status" className="text-sm font-medium">
          {savedVersion ? `Saved as version ${savedVersion}. Runs planned from now on use it; earlier runs keep theirs.` : dirty ? 'Unsaved changes' : ''}
        </p>
      </div>
    </div>
  );
}

/** The clinic's per-phase sequences; supervisors change them within each kind's safety bounds. */
export function SequenceEditor({ canEdit }: { canEdit: boolean }) {
  const sequences = useSequences();
  const [params, setParams] = useSearchParams();
  const selected: Phase = (phases as readonly string[]).includes(params.get('phase') ?? '') ? (params.get('phase') as Phase) : 'acute';
  const [dirty, setDirty] = useState<Partial<Record<Phase, boolean>>>({});
  const tabs = useRef(new Map<Phase, HTMLButtonElement>());
  const select = (phase: Phase) => setParams({ phase }, { replace: true });

  // Arrow keys move between tabs, as the tabs pattern expects.
  const onKeyDown = (event: KeyboardEvent) => {
    const step = event.key === 'ArrowRight' ? 1 : event.key === 'ArrowLeft' ? -1 : 0;
    if (!step) return;
    const next = phases[(phases.indexOf(selected) + step + phases.length) % phases.length];
    select(next);
    tabs.current.get(next)?.focus();
  };

  if (sequences.isPending) return <p className="text-ink-muted">Loading sequences…</p>;
  if (sequences.isError) return <p className="text-ember-700">{sequences.error.message}</p>;

  return (
    <div className="flex flex-col gap-4">
      <Notice kind="caution" title="Bounds are safety rules">
        Every step must stay inside its kind’s bounds, shown beside its duration — ice massage 5–7 min at a time and no more than 20 min of
        continuous cold (common practice). Mendstep refuses a sequence that leaves them. A save makes a new version for runs planned after it;
        runs already planned keep the version they were built from.
      </Notice>
      <div role="tablist" aria-label="Phase" className="flex flex-wrap gap-2 border-b border-ink/15" onKeyDown={onKeyDown}>
        {phases.map((phase) => {
          const { word, Icon } = phaseLook[phase];
          const active = phase === selected;
          return (
            <button
              key={phase}
              ref={(el) => {
                if (el) tabs.current.set(phase, el);
              }}
              type="button"
              role="tab"
              id={`tab-${phase}`}
              aria-selected={active}
              aria-controls={`panel-${phase}`}
              tabIndex={active ? 0 : -1}
              onClick={() => select(phase)}
              className={`-mb-px inline-flex min-h-target items-center gap-2 rounded-t-lg border-b-4 px-4 font-medium ${active ? 'border-ink bg-paper-raised' : 'border-transparent hover:bg-paper-sunk'}`}
            >
              <Icon aria-hidden className="h-4 w-4" />
              {word}
              {dirty[phase] ? <span className="text-sm font-normal text-ember-700">(unsaved)</span> : null}
            </button>
          );
        })}
      </div>
      {phases.map((phase) => {
        const view = sequences.data.find((s) => s.phase === phase);
        return (
          // Every panel stays mounted, so unsaved changes survive a look at another phase.
          <div key={phase} role="tabpanel" id={`panel-${phase}`} aria-labelledby={`tab-${phase}`} hidden={phase !== selected}>
            {!view ? (
              <p className="text-ink-muted">No sequence for this phase.</p>
            ) : canEdit ? (
              <EditableSequence view={view} onDirty={(value) => setDirty((d) => (d[phase] === value ? d : { ...d, [phase]: value }))} />
            ) : (
              <ReadOnlySequence view={view} />
            )}
          </div>
        );
      })}
      {!canEdit ? <p className="text-sm text-ink-muted">Only a supervisor can change the clinic’s sequences.</p> : null}
    </div>
  );
}
