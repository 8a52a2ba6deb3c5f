import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useSelector } from '@xstate/react';
import { Link } from 'react-router-dom';
import { AlertTriangle, CheckCircle2, CloudOff, Pause, Play, Plus, SkipForward, Square, Volume2, VolumeX, OctagonAlert } from 'lucide-react';
import { currentStep, nextStep, remainingMs as remainingOf } from '../../../../machines/treatment-run';
import { stepKindInfo } from '../../../../shared/plan/step-kinds';
import type { RunDetailView } from '../../../../shared/runs/responses';
import { redFlags } from '../../../../shared/runs/screening';
import { redFlagStopAdvice, stopElevateReferAdvice } from '../../../../shared/runs/stop-advice';
import { createCuePlayer, type CuePlayer } from '../lib/audio';
import { cuesBetween, observeRun, type RunObservation } from '../lib/cue-schedule';
import { createOutboxSender, type OutboxSender } from '../lib/outbox-sender';
import { sendLogEntry } from '../lib/send-log-entry';
import { useOutboxStatus } from '../lib/use-outbox-status';
import { useWakeLock } from '../lib/wake-lock';
import { useNow } from '../hooks/use-now';
import { useRunActor, type RunActor } from '../hooks/use-run-actor';
import { CountdownRing } from './countdown-ring';
import { ReasonSheet } from './reason-sheet';
import { SwellingButton } from './swelling-button';
import { useSwellingConfirm } from '../hooks/use-swelling-confirm';
import { CautionLine } from '../../../components/ui/caution-line';

const phaseWord = { acute: 'Acute', proliferative: 'Proliferative', remodelling: 'Remodelling' } as const;

const skipReasons = [
  { value: 'Athlete did not tolerate it', label: 'Not tolerated' },
  { value: 'Athlete asked to move on', label: 'Athlete asked to move on' },
  { value: 'Not needed today', label: 'Not needed today' },
  { value: 'Out of time', label: 'Out of time' },
];
const finishReasons = [
  { value: 'Athlete had to leave', label: 'Athlete had to leave' },
  { value: 'Athlete felt unwell', label: 'Athlete felt unwell' },
  { value: 'Treatment room needed', label: 'Treatment room needed' },
];

/** Cautions at the table: cold over a thin fat layer or a superficial nerve (clinical notes). */
const coldCaution = 'Stop the cold if numbness lasts or the skin turns white; take care over superficial nerves (fibular head, medial elbow).';

declare global {
  interface Window {
    /** Scheduled against fired times of the cues played, for measuring cue timing in a browser. */
    mendstepCueTimings?: { cue: string; scheduledAt: number; firedAt: number }[];
  }
}

function useCuePlayer(): CuePlayer {
  const player = useMemo(() => createCuePlayer({ volume: 0.9 }), []);
  useEffect(() => {
    window.mendstepCueTimings = [];
    return player.onPlayed((played) => {
      const log = (window.mendstepCueTimings ??= []);
      log.push(played);
      if (log.length > 500) log.shift();
    });
  }, [player]);
  return player;
}

function useOutbox(onUnauthorized: () => void): OutboxSender {
  const handler = useRef(onUnauthorized);
  handler.current = onUnauthorized;
  const sender = useMemo(() => createOutboxSender({ send: sendLogEntry, onUnauthorized: () => handler.current() }), []);
  useEffect(() => {
    sender.start();
    void sender.flush();
    return () => sender.stop();
  }, [sender]);
  return sender;
}

/** Plays the cues that came due since the last look, and speaks a new step's name. */
function useCues(actor: RunActor, player: CuePlayer, now: number) {
  const snapshot = useSelector(actor, (s) => s);
  const previous = useRef<RunObservation | null>(null);
  useEffect(() => {
    const observation = observeRun(snapshot, Math.max(now, Date.now()));
    for (const due of cuesBetween(previous.current, observation)) player.play(due.cue, { scheduledAt: due.dueAt });
    if (previous.current && observation.stepId && observation.stepId !== previous.current.stepId) {
      const step = currentStep(snapshot);
      if (step) player.speak(step.label);
    }
    previous.current = observation;
  }, [snapshot, now, player]);
}

function RunInProgress({ actor, detail, player, sender }: { actor: RunActor; detail: RunDetailView; player: CuePlayer; sender: OutboxSender }) {
  const deadline = useSelector(actor, (s) => s.context.deadline);
  const now = useNow(deadline);
  const status = useSelector(actor, (s) => s.status);
  const isReady = useSelector(actor, (s) => s.matches('ready'));
  const isPaused = useSelector(actor, (s) => s.matches({ running: 'paused' }));
  const awaitingConfirm = useSelector(actor, (s) => s.matches({ running: 'awaitingConfirm' }) || s.matches({ backToCold: 'compression' }));
  const inBackToCold = useSelector(actor, (s) => s.matches('backToCold'));
  const step = useSelector(actor, currentStep);
  const upcoming = useSelector(actor, nextStep);
  const snapshot = useSelector(actor, (s) => s);
  const extendRefused = useSelector(actor, (s) => s.context.extendRefused);
  const outcome = useSelector(actor, (s) => s.context.outcome);
  const plan = detail.run.plan;
  const [sheet, setSheet] = useState<null | 'skip' | 'red-flag' | 'finish'>(null);
  const [muted, setMuted] = useState(false);
  const [volume, setVolume] = useState(90);
  const [speech, setSpeech] = useState(true);
  const running = status === 'active' && !isReady;
  // The machine decides what is allowed now (no pausing a cold pack, no skipping back to cold).
  const can = (type: 'PAUSE' | 'RESUME' | 'EXTEND') => snapshot.can({ type, at: now });
  const canSkip = snapshot.can({ type: 'SKIP', at: now, reason: 'check' });
  useWakeLock(status === 'active');
  useCues(actor, player, now);

  const send = useCallback((event: Parameters<RunActor['send']>[0]) => actor.send(event), [actor]);
  const at = () => Date.now();
  // One double-press rule for the S key and the on-screen control (decision record 0101).
  const swelling = useSwellingConfirm(() => send({ type: 'SWELLING_INCREASED', at: Date.now() }));
  const pressSwelling = swelling.press;

  // A tablet that slept or a hidden tab: look at the clock again at once.
  useEffect(() => {
    const onVisible = () => document.visibilityState === 'visible' && send({ type: 'TICK', at: at() });
    document.addEventListener('visibilitychange', onVisible);
    return () => document.removeEventListener('visibilitychange', onVisible);
  }, [send]);

  // Keyboard and foot pedal: Space pauses/resumes, Enter or → confirms, S twice sends back to cold.
  useEffect(() => {
    const onKey = (event: KeyboardEvent) => {
      if (sheet || event.target instanceof HTMLInputElement) return;
      if (event.key === ' ') {
        event.preventDefault();
        send({ type: isPaused ? 'RESUME' : 'PAUSE', at: at() });
      } else if (event.key === 'Enter' || event.key === 'ArrowRight') {
        if (awaitingConfirm) {
          event.preventDefault();
          send({ type: 'NEXT', at: at() });
        }
      } else if (event.key === 's' || event.key === 'S') {
        pressSwelling();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [send, isPaused, awaitingConfirm, pressSwelling, sheet]);

  if (isReady) {
    return (
      <div className="flex flex-1 flex-col items-center justify-center gap-8 text-center">
        <p className="text-3xl text-slate-300">{plan.steps.length} steps · first: {plan.steps[0]?.label ?? '—'}</p>
        <button
          type="button"
          onClick={() => {
            player.unlock();
            send({ type: 'BEGIN', at: at() });
          }}
          className="flex min-h-[120px] min-w-[320px] items-center justify-center gap-4 rounded-3xl bg-emerald-300 px-10 text-4xl font-bold text-slate-950"
        >
          <Play aria-hidden className="h-12 w-12" /> Begin
        </button>
        <p className="max-w-xl text-lg text-slate-300">Steps move on by themselves with a sound at each change. Space pauses; S twice means swelling has increased.</p>
      </div>
    );
  }

  if (status === 'done') {
    const ended = {
      completed: { title: 'Run complete', Icon: CheckCircle2, tone: 'text-emerald-300' },
      'fell-back': { title: 'Back to cold — run ended', Icon: AlertTriangle, tone: 'text-amber-300' },
      'stop-elevate-refer': { title: 'Stop, elevate and refer', Icon: OctagonAlert, tone: 'text-red-300' },
      'stopped-referred': { title: 'Stopped — refer to a physician', Icon: OctagonAlert, tone: 'text-red-300' },
      'ended-early': { title: 'Run ended early', Icon: Square, tone: 'text-slate-200' },
    }[outcome ?? 'completed'];
    return (
      <div className="flex flex-1 flex-col items-center justify-center gap-6 text-center">
        <ended.Icon aria-hidden className={`h-24 w-24 ${ended.tone}`} />
        <h2 className={`text-5xl font-bold ${ended.tone}`}>{ended.title}</h2>
        {outcome === 'stopped-referred' || outcome === 'stop-elevate-refer' ? (
          <p className="max-w-2xl text-2xl text-slate-200">{outcome === 'stopped-referred' ? redFlagStopAdvice : stopElevateReferAdvice}</p>
        ) : null}
        <Link to={`/runs/${detail.run.id}/summary`} className="flex min-h-table-target items-center rounded-2xl bg-paper px-8 text-2xl font-semibold text-slate-950">
          See the summary
        </Link>
      </div>
    );
  }

  const remaining = remainingOf(snapshot, now);
  const totalMs = step ? (step.seconds + snapshot.context.extendedSeconds) * 1000 : 0;
  const info = step ? stepKindInfo[step.kind] : null;
  const stepNumber = step && step.index !== null ? `Step ${step.index + 1} of ${plan.steps.length}` : 'Back to cold';

  return (
    <>
      <div className="flex flex-1 flex-col items-center gap-3 lg:flex-row lg:items-center lg:gap-10">
        <div className="flex flex-col items-center justify-center">
          <CountdownRing remainingMs={awaitingConfirm ? null : remaining} totalMs={totalMs} paused={isPaused} />
        </div>
        <div className="flex flex-1 flex-col justify-center gap-4">
          <p className="text-xl font-medium uppercase tracking-wider text-slate-300">
            {inBackToCold ? (
              <span className="inline-flex items-center gap-2 rounded-lg bg-amber-300 px-3 py-1 text-slate-950">
                <AlertTriangle aria-hidden className="h-5 w-5" /> Back to cold
              </span>
            ) : (
              stepNumber
            )}
            {isPaused ? <span className="ml-3 rounded-lg bg-slate-200 px-3 py-1 text-slate-950">Paused</span> : null}
          </p>
          <h2 className="text-5xl font-bold leading-tight text-paper" data-testid="step-label">
            {step?.label}
          </h2>
          <p className="text-2xl leading-snug text-slate-200">{step?.cue}</p>
          {info?.cold ? (
            <p className="flex items-start gap-2 text-lg text-amber-200">
              <AlertTriangle aria-hidden className="mt-1 h-5 w-5 shrink-0" /> Caution: {coldCaution}
            </p>
          ) : null}
          {awaitingConfirm ? (
            <button
              type="button"
              onClick={() => send({ type: 'NEXT', at: at() })}
              className="flex min-h-[96px] items-center justify-center gap-3 rounded-2xl bg-emerald-300 px-8 text-3xl font-bold text-slate-950"
            >
              <CheckCircle2 aria-hidden className="h-10 w-10" /> {info?.confirmPrompt ? `${info.confirmPrompt.replace(/\?$/, '')} — next` : 'Done — next'}
            </button>
          ) : null}
          {upcoming ? (
            <p className="text-2xl text-slate-300">
              Next: <span className="font-semibold text-paper">{upcoming.label}</span> · {Math.round(upcoming.seconds / 60)} min
            </p>
          ) : null}
          {extendRefused ? <p className="text-lg text-amber-200">This step is at its safety limit; it cannot be extended.</p> : null}
        </div>
      </div>

      <div className="mt-4 grid gap-3 md:grid-cols-[2fr_3fr]">
        <SwellingButton
          disabled={!running}
          confirm={swelling}
          label="Swelling has increased"
        />
        <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          <button type="button" onClick={() => send({ type: isPaused ? 'RESUME' : 'PAUSE', at: at() })} disabled={!can(isPaused ? 'RESUME' : 'PAUSE')} className="flex min-h-table-target flex-col items-center justify-center rounded-2xl bg-slate-800 text-lg font-semibold text-paper disabled:opacity-40">
            {isPaused ? <Play aria-hidden className="h-7 w-7" /> : <Pause aria-hidden className="h-7 w-7" />}
            {isPaused ? 'Resume' : 'Pause'}
          </button>
          <button type="button" onClick={() => send({ type: 'EXTEND', at: at() })} disabled={awaitingConfirm || !can('EXTEND')} className="flex min-h-table-target flex-col items-center justify-center rounded-2xl bg-slate-800 text-lg font-semibold text-paper disabled:opacity-40">
            <Plus aria-hidden className="h-7 w-7" /> 1 min
          </button>
          <button type="button" onClick={() => setSheet('skip')} disabled={!canSkip} className="flex min-h-table-target flex-col items-center justify-center rounded-2xl bg-slate-800 text-lg font-semibold text-paper disabled:opacity-40">
            <SkipForward aria-hidden className="h-7 w-7" /> Skip
          </button>
          <button type="button" onClick={() => setSheet('red-flag')} className="flex min-h-table-target flex-col items-center justify-center rounded-2xl bg-red-900 text-lg font-semibold text-white">
            <OctagonAlert aria-hidden className="h-7 w-7" /> Stop and refer
          </button>
        </div>
      </div>
      <div className="mt-3 flex flex-wrap items-center justify-between gap-3 text-lg text-slate-300">
        <div className="flex items-center gap-2">
          <button type="button" onClick={() => { setMuted(!muted); player.setMuted(!muted); }} className="flex min-h-table-target min-w-table-target items-center justify-center gap-2 rounded-xl px-3 ring-1 ring-slate-700" aria-pressed={muted}>
            {muted ? <VolumeX aria-hidden className="h-6 w-6" /> : <Volume2 aria-hidden className="h-6 w-6" />} {muted ? 'Sound off' : 'Sound on'}
          </button>
          <label className="flex min-h-table-target items-center gap-2 rounded-xl px-3 ring-1 ring-slate-700">
            <span>Volume</span>
            <input
              type="range"
              min={0}
              max={100}
              step={10}
              value={volume}
              onChange={(event) => {
                const next = Number(event.target.value);
                setVolume(next);
                player.setVolume(next / 100);
              }}
              className="w-28 accent-emerald-300"
            />
          </label>
          <button type="button" onClick={() => { setSpeech(!speech); player.setSpeech(!speech); }} className="min-h-table-target rounded-xl px-3 ring-1 ring-slate-700" aria-pressed={speech}>
            Spoken steps {speech ? 'on' : 'off'}
          </button>
          <button type="button" onClick={() => setSheet('finish')} className="min-h-table-target rounded-xl px-3 ring-1 ring-slate-700">
            Finish early
          </button>
        </div>

      </div>

      {sheet === 'skip' ? (
        <ReasonSheet title={`Skip ${step?.label ?? 'this step'}?`} choices={skipReasons} allowOther confirmLabel="Skip step" onCancel={() => setSheet(null)} onChoose={(reason) => { setSheet(null); send({ type: 'SKIP', at: at(), reason }); }} />
      ) : null}
      {sheet === 'finish' ? (
        <ReasonSheet title="Finish the run early?" choices={finishReasons} allowOther confirmLabel="Finish early" onCancel={() => setSheet(null)} onChoose={(reason) => { setSheet(null); send({ type: 'FINISH_EARLY', at: at(), reason }); }} />
      ) : null}
      {sheet === 'red-flag' ? (
        <ReasonSheet title="Stop and refer: which red flag?" choices={redFlags.map((f) => ({ value: f.id, label: f.label }))} allowOther={false} danger confirmLabel="Stop the run" onCancel={() => setSheet(null)} onChoose={(flag) => { setSheet(null); send({ type: 'RED_FLAG', at: at(), flag }); }} />
      ) : null}
    </>
  );
}

/** "All saved" or "N waiting to save", always in sight at the top of table mode. */
function SavedStatus({ sender }: { sender: OutboxSender }) {
  const saved = useOutboxStatus(sender);
  return (
    <p className="flex items-center gap-2 text-lg text-slate-300" data-testid="saved-status" aria-live="polite">
      {saved.waiting > 0 || saved.needsAttention > 0 ? <CloudOff aria-hidden className="h-5 w-5" /> : <CheckCircle2 aria-hidden className="h-5 w-5" />}
      {saved.text}
    </p>
  );
}

/** Table mode: the whole run on one dark screen, legible from two metres, driven by the run's machine. */
export function TableModeScreen({ detail, onSessionExpired }: { detail: RunDetailView; onSessionExpired: () => void }) {
  const player = useCuePlayer();
  const sender = useOutbox(onSessionExpired);
  const { actor, error } = useRunActor(detail.run, detail.entries, () => void sender.flush());
  const { run } = detail;

  return (
    <div className="flex min-h-screen flex-col bg-slate-950 px-6 py-4 font-sans text-paper">
      <header className="flex flex-wrap items-center justify-between gap-3 border-b border-slate-800 pb-3">
        <div className="flex items-center gap-4">
          <h1 className="text-2xl font-semibold">{run.athleteName}</h1>
          <span className="text-lg capitalize text-slate-300">{run.injuryLabel}</span>
          <span className="rounded-full border-2 border-slate-500 px-3 py-0.5 text-lg font-semibold">{phaseWord[run.phase]}</span>
        </div>
        <div className="flex items-center gap-4">
          <SavedStatus sender={sender} />
          <Link to={`/injuries/${run.injuryId}`} className="flex min-h-table-target items-center rounded-xl px-4 text-lg ring-1 ring-slate-700">
            Leave table mode
          </Link>
        </div>
      </header>
      {run.plan.cautions.length ? (
        <ul className="mt-3 space-y-1">
          {run.plan.cautions.map((caution) => (
            <li key={caution} className="flex items-start gap-2 text-lg text-amber-200">
              <AlertTriangle aria-hidden className="mt-1 h-5 w-5 shrink-0" /> {caution}
            </li>
          ))}
        </ul>
      ) : null}
      {error ? <p role="alert" className="mt-4 text-xl text-red-300">{error}</p> : null}
      {actor ? <RunInProgress actor={actor} detail={detail} player={player} sender={sender} /> : <p className="mt-10 text-2xl text-slate-300">Loading the run…</p>}
      <CautionLine tone="dark" className="mt-auto pt-4 text-base" />
    </div>
  );
}
