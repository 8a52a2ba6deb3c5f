import { createStore, promisifyRequest, type UseStore } from 'idb-keyval';
import { v4 as uuidv4 } from 'uuid';
import type { LogEntry } from '../../../../shared/runs/log-entry';

/*
 * The step-log outbox: what table mode has logged but the server has not yet stored, kept on the tablet
 * beside the run's persisted snapshot (decisions.md, "The step log and outbox").
 *
 * One IndexedDB object store holds both, under array keys ['snapshot', runId] and ['entry', key], so one
 * readwrite transaction writes a transition's snapshot and its entries together: after a reload either both
 * are there or neither is, and the restored machine neither re-emits an entry nor forgets one. (idb-keyval's
 * createStore opens one object store per database, which is why it is one store and not two.)
 */

export type OutboxItemState = 'waiting' | 'needs-attention';

export interface OutboxItem {
  /** UUID made when the entry was made; the server's Idempotency-Key, so a resend is never logged twice. */
  key: string;
  runId: string;
  /** The machine's log sequence number (from 1), which orders a run's entries. */
  seq: number;
  entry: LogEntry;
  state: OutboxItemState;
  /** Sends tried so far. */
  attempts: number;
  lastError?: string;
}

export interface SavedSnapshot<S = unknown> {
  runId: string;
  snapshot: S;
  savedAt: number;
}

export interface Transition<S = unknown> {
  runId: string;
  snapshot: S;
  entries: OutboxItem[];
}

export interface OutboxStore {
  saveTransition<S>(transition: Transition<S>): Promise<void>;
  loadSnapshot<S = unknown>(runId: string): Promise<S | undefined>;
  /** Entries not yet stored by the server (waiting and needs-attention), by run and then in seq order. */
  pendingEntries(runId?: string): Promise<OutboxItem[]>;
  removeEntry(key: string): Promise<void>;
  markNeedsAttention(key: string, message: string): Promise<void>;
  /** Counts a failed send that will be tried again. */
  noteFailedAttempt(key: string, message: string): Promise<void>;
  /**
   * Forgets the run's snapshot (the run is over or discarded). Its unsent entries stay and are still sent:
   * an entry is never dropped silently.
   */
  clearRun(runId: string): Promise<void>;
}

export const outboxDatabaseName = 'mendstep-table';
const storeName = 'outbox';

const snapshotKey = (runId: string): IDBValidKey => ['snapshot', runId];
const entryKey = (key: string): IDBValidKey => ['entry', key];
// Arrays sort after strings in IndexedDB, so ['entry', []] is above every ['entry', <string>].
const allEntries = () => IDBKeyRange.bound(['entry'], ['entry', []]);

/** A new outbox item for an entry the machine just emitted. */
export function createOutboxItem(runId: string, seq: number, entry: LogEntry): OutboxItem {
  return { key: uuidv4(), runId, seq, entry, state: 'waiting', attempts: 0 };
}

function bySendingOrder(a: OutboxItem, b: OutboxItem): number {
  if (a.runId !== b.runId) return a.runId < b.runId ? -1 : 1;
  return a.seq - b.seq;
}

function updateEntry(store: UseStore, key: string, change: (item: OutboxItem) => OutboxItem): Promise<void> {
  return store('readwrite', (objects) => {
    // Read and write in one transaction, so a concurrent removal cannot be undone by a stale write. The put
    // is issued from the request's own success handler: after an await the transaction may already be gone.
    const request = objects.get(entryKey(key));
    request.onsuccess = () => {
      const item = request.result as OutboxItem | undefined;
      if (item) objects.put(change(item), entryKey(key));
    };
    return promisifyRequest(objects.transaction);
  });
}

export function createOutboxStore(databaseName = outboxDatabaseName): OutboxStore {
  const store = createStore(databaseName, storeName);
  return {
    saveTransition({ runId, snapshot, entries }) {
      return store('readwrite', (objects) => {
        const done = promisifyRequest(objects.transaction);
        try {
          const saved: SavedSnapshot = { runId, snapshot, savedAt: Date.now() };
          objects.put(saved, snapshotKey(runId));
          for (const item of entries) objects.put(item, entryKey(item.key));
        } catch (error) {
          // A put that throws (a value that cannot be stored) would otherwise let the puts before it commit.
          objects.transaction.abort();
          done.catch(() => undefined);
          throw error;
        }
        return done;
      });
    },

    async loadSnapshot<S>(runId: string) {
      const saved = await store('readonly', (objects) =>
        promisifyRequest<SavedSnapshot<S> | undefined>(objects.get(snapshotKey(runId))),
      );
      return saved?.snapshot;
    },

    async pendingEntries(runId) {
      const items = await store('readonly', (objects) => promisifyRequest<OutboxItem[]>(objects.getAll(allEntries())));
      return items.filter((item) => runId === undefined || item.runId === runId).sort(bySendingOrder);
    },

    removeEntry(key) {
      return store('readwrite', (objects) => {
        objects.delete(entryKey(key));
        return promisifyRequest(objects.transaction);
      });
    },

    markNeedsAttention(key, message) {
      return updateEntry(store, key, (item) => ({ ...item, state: 'needs-attention', attempts: item.attempts + 1, lastError: message }));
    },

    noteFailedAttempt(key, message) {
      return updateEntry(store, key, (item) => ({ ...item, attempts: item.attempts + 1, lastError: message }));
    },

    clearRun(runId) {
      return store('readwrite', (objects) => {
        objects.delete(snapshotKey(runId));
        return promisifyRequest(objects.transaction);
      });
    },
  };
}

let defaultStore: OutboxStore | null = null;

/** The app's outbox. Opened on first use, so importing this module needs no IndexedDB. */
export function getOutboxStore(): OutboxStore {
  defaultStore ??= createOutboxStore();
  return defaultStore;
}

export const saveTransition = <S>(transition: Transition<S>) => getOutboxStore().saveTransition(transition);
export const loadSnapshot = <S = unknown>(runId: string) => getOutboxStore().loadSnapshot<S>(runId);
export const pendingEntries = (runId?: string) => getOutboxStore().pendingEntries(runId);
export const removeEntry = (key: string) => getOutboxStore().removeEntry(key);
export const markNeedsAttention = (key: string, message: string) => getOutboxStore().markNeedsAttention(key, message);
export const clearRun = (runId: string) => getOutboxStore().clearRun(runId);

/** The part of an actor that recordRunTransitions needs; a treatment-run actor fits. */
export interface RecordableActor<S> {
  on(type: 'log', listener: (emitted: { seq: number; entry: LogEntry }) => void): { unsubscribe(): void };
  subscribe(listener: () => void): { unsubscribe(): void };
  getPersistedSnapshot(): S;
}

export interface RecordRunOptions {
  store?: OutboxStore;
  /** After each transition is safely stored: the moment to nudge the sender. */
  onSaved?: () => void;
  /** A write failed (storage full, private mode): table mode should say its log is not being kept. */
  onError?: (error: unknown) => void;
}

/**
 * Stores every transition of a run: the persisted snapshot with the entries it emitted, in one write.
 *
 * XState hands emitted events over before snapshot subscribers hear of the new snapshot, so the entries are
 * buffered until the snapshot arrives and then written with it. Writes are started in order, and IndexedDB
 * runs readwrite transactions on one store in the order they were created, so a later snapshot is never
 * overwritten by an earlier one. Call it before `actor.start()` to catch the first transition.
 */
export function recordRunTransitions<S>(actor: RecordableActor<S>, runId: string, options: RecordRunOptions = {}): () => void {
  const store = options.store ?? getOutboxStore();
  let buffered: OutboxItem[] = [];
  const onLog = actor.on('log', ({ seq, entry }) => {
    buffered.push(createOutboxItem(runId, seq, entry));
  });
  const onSnapshot = actor.subscribe(() => {
    const entries = buffered;
    buffered = [];
    store
      .saveTransition({ runId, snapshot: actor.getPersistedSnapshot(), entries })
      .then(() => options.onSaved?.(), (error: unknown) => options.onError?.(error));
  });
  return () => {
    onLog.unsubscribe();
    onSnapshot.unsubscribe();
  };
}
