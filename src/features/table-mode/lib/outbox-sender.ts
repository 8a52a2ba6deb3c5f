import { getOutboxStore, type OutboxItem, type OutboxStore } from './outbox';

/*
 * Sends the outbox to the server, one entry at a time in order (decisions.md, "The step log and outbox"):
 * 2xx removes the entry; 401 pauses until the therapist has signed in again; 408, 429, 5xx and network errors
 * are tried again after a growing wait; any other 4xx keeps the entry as "needs attention" and moves on.
 * Nothing leaves the outbox except on a 2xx.
 */

/** What came back from one send; `message` is the server's, kept with an entry that needs attention. */
export interface SendResult {
  status: number;
  message?: string;
}

export interface OutboxStatus {
  waiting: number;
  needsAttention: number;
  /** A request is in flight. */
  sending: boolean;
  paused: 'unauthorized' | null;
  /** When the next try after a failure is due (ms since the epoch); null when none is planned. */
  retryAt: number | null;
}

export type Cancel = () => void;

export interface OutboxSenderOptions {
  /** Sends one entry; resolves with the response's status, rejects when the network failed. */
  send: (item: OutboxItem) => Promise<SendResult>;
  store?: Pick<OutboxStore, 'pendingEntries' | 'removeEntry' | 'markNeedsAttention' | 'noteFailedAttempt'>;
  onChange?: (status: OutboxStatus) => void;
  /** The session ended: ask the therapist to sign in again, then call `resume()`. */
  onUnauthorized?: () => void;
  now?: () => number;
  setTimer?: (fn: () => void, ms: number) => Cancel;
  /** 0 to 1; spreads retries so tablets coming back together do not all call at once. */
  random?: () => number;
  baseDelayMs?: number;
  maxDelayMs?: number;
  /** Where 'online' events come from; window by default (none outside a browser). */
  onlineEvents?: Pick<EventTarget, 'addEventListener' | 'removeEventListener'> | null;
}

export interface OutboxSender {
  /** Listens for 'online' and sends what is waiting. */
  start(): void;
  stop(): void;
  /** New entries were saved: send them unless a retry wait is running (they queue behind it). */
  flush(): Promise<void>;
  /** Sends now, cutting short any retry wait (the network came back, or the therapist asked). */
  retryNow(): Promise<void>;
  /** Continues after a 401, once the therapist has signed in again. */
  resume(): Promise<void>;
  getStatus(): OutboxStatus;
  subscribe(listener: () => void): () => void;
}

export type SendOutcome = 'saved' | 'unauthorized' | 'retry' | 'needs-attention';

export function outcomeOf(status: number): SendOutcome {
  if (status >= 200 && status < 300) return 'saved';
  if (status === 401) return 'unauthorized';
  // 409 lands here: a replay of the same body is answered 200, so a 409 is a real conflict to look at.
  if (status >= 400 && status < 500 && status !== 408 && status !== 429) return 'needs-attention';
  return 'retry';
}

/** 1 s, 2 s, 4 s … up to the cap, each spread ±20 % by `random` (0.5 gives the plain value). */
export function retryDelayMs(failures: number, { baseDelayMs = 1000, maxDelayMs = 30_000, random = Math.random } = {}): number {
  const plain = baseDelayMs * 2 ** Math.max(0, failures - 1);
  return Math.round(Math.min(maxDelayMs, plain * (0.8 + 0.4 * random())));
}

const defaultSetTimer = (fn: () => void, ms: number): Cancel => {
  const id = setTimeout(fn, ms);
  return () => clearTimeout(id);
};

function sameStatus(a: OutboxStatus, b: OutboxStatus): boolean {
  return (
    a.waiting === b.waiting &&
    a.needsAttention === b.needsAttention &&
    a.sending === b.sending &&
    a.paused === b.paused &&
    a.retryAt === b.retryAt
  );
}

export function createOutboxSender(options: OutboxSenderOptions): OutboxSender {
  const store = options.store ?? getOutboxStore();
  const now = options.now ?? (() => Date.now());
  const setTimer = options.setTimer ?? defaultSetTimer;
  const onlineEvents = options.onlineEvents !== undefined ? options.onlineEvents : typeof window !== 'undefined' ? window : null;
  const listeners = new Set<() => void>();

  let status: OutboxStatus = { waiting: 0, needsAttention: 0, sending: false, paused: null, retryAt: null };
  let failures = 0;
  let cancelRetry: Cancel | null = null;
  let running: Promise<void> | null = null;
  let again = false;
  let stopped = false;

  function setStatus(patch: Partial<OutboxStatus>) {
    const next = { ...status, ...patch };
    if (sameStatus(next, status)) return;
    // A new object only on change: useSyncExternalStore compares snapshots by identity.
    status = next;
    options.onChange?.(status);
    for (const listener of listeners) listener();
  }

  function count(items: OutboxItem[]) {
    setStatus({
      waiting: items.filter((item) => item.state === 'waiting').length,
      needsAttention: items.filter((item) => item.state === 'needs-attention').length,
    });
  }

  function scheduleRetry() {
    // A send that was in flight when the sender stopped must not arm a timer nobody will cancel.
    if (stopped) return;
    const delay = retryDelayMs(failures, options);
    cancelRetry?.();
    cancelRetry = setTimer(() => {
      cancelRetry = null;
      setStatus({ retryAt: null });
      void drain();
    }, delay);
    setStatus({ retryAt: now() + delay });
  }

  async function sendOne(item: OutboxItem): Promise<'next' | 'halt'> {
    let result: SendResult | null = null;
    let error = '';
    setStatus({ sending: true });
    try {
      result = await options.send(item);
    } catch (err) {
      error = err instanceof Error && err.message ? err.message : 'Network error';
    } finally {
      setStatus({ sending: false });
    }
    const outcome = result ? outcomeOf(result.status) : 'retry';
    switch (outcome) {
      case 'saved':
        failures = 0;
        await store.removeEntry(item.key);
        return 'next';
      case 'unauthorized':
        setStatus({ paused: 'unauthorized' });
        options.onUnauthorized?.();
        return 'halt';
      case 'needs-attention':
        failures = 0;
        await store.markNeedsAttention(item.key, result?.message ?? `Refused by the server (${result?.status})`);
        return 'next';
      case 'retry':
        failures += 1;
        await store.noteFailedAttempt(item.key, result ? (result.message ?? `Server answered ${result.status}`) : error);
        // Later entries wait too: the log must reach the server in order.
        scheduleRetry();
        return 'halt';
    }
  }

  async function pass(): Promise<void> {
    for (;;) {
      const items = await store.pendingEntries();
      count(items);
      if (stopped || status.paused || cancelRetry) return;
      const next = items.find((item) => item.state === 'waiting');
      if (!next) return;
      if ((await sendOne(next)) === 'halt') {
        count(await store.pendingEntries());
        return;
      }
    }
  }

  // One pass at a time, so entries go one by one; a call during a pass asks for another look after it.
  function drain(): Promise<void> {
    if (running) {
      again = true;
      return running;
    }
    running = (async () => {
      try {
        do {
          again = false;
          await pass();
        } while (again && !stopped);
      } catch {
        // The tablet's storage failed under us; the entries are still there, so try again later.
        failures += 1;
        scheduleRetry();
      } finally {
        running = null;
      }
    })();
    return running;
  }

  function retryNow(): Promise<void> {
    cancelRetry?.();
    cancelRetry = null;
    failures = 0;
    setStatus({ retryAt: null });
    return drain();
  }

  const onOnline = () => void retryNow();

  return {
    start() {
      stopped = false;
      onlineEvents?.addEventListener('online', onOnline);
      void drain();
    },
    stop() {
      stopped = true;
      onlineEvents?.removeEventListener('online', onOnline);
      cancelRetry?.();
      cancelRetry = null;
      setStatus({ retryAt: null });
    },
    flush: drain,
    retryNow,
    resume() {
      setStatus({ paused: null });
      return retryNow();
    },
    getStatus: () => status,
    subscribe(listener) {
      listeners.add(listener);
      return () => {
        listeners.delete(listener);
      };
    },
  };
}

/** The words for the status line in table mode. */
export function outboxStatusText(status: OutboxStatus): string {
  const parts: string[] = [];
  if (status.waiting > 0) parts.push(`${status.waiting} waiting to save`);
  if (status.needsAttention > 0) parts.push(`${status.needsAttention} need${status.needsAttention === 1 ? 's' : ''} attention`);
  if (parts.length === 0) return 'All saved';
  if (status.paused === 'unauthorized') parts.push('sign in again to save');
  return parts.join(' · ');
}
