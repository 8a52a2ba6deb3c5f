import { useEffect, useState } from 'react';
import { createActor, type Actor } from 'xstate';
import { rebuildRunSnapshot } from '../../../../machines/rebuild-run';
import { treatmentRunMachine, wallClock } from '../../../../machines/treatment-run';
import type { RunLogEntryView, RunView } from '../../../../shared/runs/responses';
import type { LogEntry } from '../../../../shared/runs/log-entry';
import { createOutboxItem, loadSnapshot, saveTransition, type OutboxItem } from '../lib/outbox';
import { chooseStartingPoint } from '../lib/starting-point';

export type RunActor = Actor<typeof treatmentRunMachine>;

function entryFromServer(view: RunLogEntryView): LogEntry & { seq: number | null } {
  const entry: Record<string, unknown> = { type: view.type, at: view.at, seq: view.seq };
  for (const key of ['stepIndex', 'kind', 'plannedSeconds', 'actualSeconds', 'reason', 'detail'] as const) {
    if (view[key] !== null) entry[key] = view[key];
  }
  return entry as LogEntry & { seq: number | null };
}

/**
 * The run's machine for table mode: restored from this tablet's stored snapshot, else rebuilt from the
 * server's log, else new. Every transition's log entries and the snapshot are written to IndexedDB in one
 * transaction before `onSaved` lets the sender at them, so a reload neither loses nor repeats an entry.
 */
export function useRunActor(run: RunView, serverEntries: RunLogEntryView[], onSaved: () => void): { actor: RunActor | null; error: string | null } {
  const [actor, setActor] = useState<RunActor | null>(null);
  const [error, setError] = useState<string | null>(null);

  useEffect(() => {
    let disposed = false;
    let created: RunActor | null = null;
    let pending: OutboxItem[] = [];
    let saving: Promise<void> = Promise.resolve();

    (async () => {
      const stored = await loadSnapshot<ReturnType<RunActor['getPersistedSnapshot']>>(run.id).catch(() => undefined);
      const start = chooseStartingPoint(run, stored as (typeof stored & { context?: { logSeq?: number } }) | undefined, serverEntries);
      if (disposed || start.kind === 'finished') return;
      const snapshot =
        start.kind === 'restore' ? start.snapshot : start.kind === 'rebuild' ? rebuildRunSnapshot(run.plan, serverEntries.map(entryFromServer)) : undefined;
      created = snapshot
        ? createActor(treatmentRunMachine, { snapshot, input: { plan: run.plan }, clock: wallClock })
        : createActor(treatmentRunMachine, { input: { plan: run.plan, now: Date.now() }, clock: wallClock });

      // Emitted entries arrive before the snapshot subscribers of the same transition: gather, then save together.
      created.on('log', (emitted) => {
        pending.push(createOutboxItem(run.id, emitted.seq, { ...emitted.entry, seq: emitted.seq }));
      });
      created.subscribe({
        next: () => {
          const entries = pending;
          pending = [];
          const persisted = created!.getPersistedSnapshot();
          saving = saving
            .then(() => saveTransition({ runId: run.id, snapshot: persisted, entries }))
            .then(onSaved)
            .catch((err) => setError(`This tablet could not store the run: ${String(err?.message ?? err)}`));
        },
        error: (err) => setError(String((err as Error)?.message ?? err)),
      });
      created.start();
      // A restored run's step timer is not re-armed by XState; the TICK re-arms it or ends an overdue step.
      if (snapshot) created.send({ type: 'TICK', at: Date.now() });
      setActor(created);
    })().catch((err) => setError(String(err?.message ?? err)));

    return () => {
      disposed = true;
      created?.stop();
    };
    // The run is loaded once per screen; later refetches must not rebuild the machine.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [run.id]);

  return { actor, error };
}
