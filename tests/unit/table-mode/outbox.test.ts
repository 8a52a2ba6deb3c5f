import 'fake-indexeddb/auto';
import { createActor } from 'xstate';
import { validate as isUuid, version as uuidVersion } from 'uuid';
import type { LogEntry } from '../../../shared/runs/log-entry';
import { treatmentRunMachine, type TreatmentRunSnapshot } from '../../../machines/treatment-run';
import {
  createOutboxItem,
  createOutboxStore,
  recordRunTransitions,
  type OutboxItem,
  type OutboxStore,
} from '../../../src/features/table-mode/lib/outbox';
import {
  createOutboxSender,
  outboxStatusText,
  outcomeOf,
  retryDelayMs,
  type OutboxSenderOptions,
  type SendResult,
} from '../../../src/features/table-mode/lib/outbox-sender';
import { planFor, second, startRun, T0 } from '../../support/run-harness';

let databases = 0;
/** Each test gets its own database; opening the same name again is what a reload does. */
const freshName = () => `outbox-test-${++databases}`;

const entryAt = (seconds: number, type: LogEntry['type'] = 'paused'): LogEntry => ({
  type,
  kind: 'light-strokes',
  stepIndex: 1,
  at: new Date(T0 + seconds * 1000).toISOString(),
  detail: `${seconds}`,
});

function items(runId: string, seqs: number[]): OutboxItem[] {
  return seqs.map((seq) => createOutboxItem(runId, seq, entryAt(seq)));
}

/** Timers the test fires by hand; fake timers would also stop fake-indexeddb's own scheduling. */
function manualTimers() {
  const pending: { fn: () => void; ms: number; cancelled: boolean }[] = [];
  return {
    setTimer: (fn: () => void, ms: number) => {
      const timer = { fn, ms, cancelled: false };
      pending.push(timer);
      return () => {
        timer.cancelled = true;
      };
    },
    /** Delays of the timers still armed. */
    armed: () => pending.filter((t) => !t.cancelled).map((t) => t.ms),
    /** Fires the armed timers, as if their time had come. */
    fire() {
      const due = pending.splice(0).filter((t) => !t.cancelled);
      due.forEach((t) => t.fn());
    },
  };
}

/** A send function answering from a script of statuses (or 'network' for a failed fetch). */
function scriptedSend(script: (number | 'network')[], fallback: number | 'network' = 201) {
  const sent: OutboxItem[] = [];
  let inFlight = 0;
  let maxInFlight = 0;
  const send = async (item: OutboxItem): Promise<SendResult> => {
    sent.push(item);
    inFlight += 1;
    maxInFlight = Math.max(maxInFlight, inFlight);
    await new Promise((resolve) => setTimeout(resolve, 1));
    inFlight -= 1;
    const answer = script.length > 0 ? script.shift()! : fallback;
    if (answer === 'network') throw new TypeError('Failed to fetch');
    return { status: answer, message: answer >= 400 ? `Server said ${answer}` : undefined };
  };
  return { send, sent, maxInFlight: () => maxInFlight };
}

function sender(store: OutboxStore, send: OutboxSenderOptions['send'], extra: Partial<OutboxSenderOptions> = {}) {
  const timers = manualTimers();
  const unauthorized = vi.fn();
  const outbox = createOutboxSender({
    send,
    store,
    setTimer: timers.setTimer,
    random: () => 0.5,
    now: () => T0,
    onUnauthorized: unauthorized,
    onlineEvents: null,
    ...extra,
  });
  return { outbox, timers, unauthorized };
}

describe('the outbox store', () => {
  it('a transition\'s snapshot and entries are written together and read back, entries in seq order', async () => {
    const store = createOutboxStore(freshName());
    const written = items('run-1', [3, 1, 2]);

    await store.saveTransition({ runId: 'run-1', snapshot: { value: 'running', logSeq: 3 }, entries: written });

    expect(await store.loadSnapshot('run-1')).toEqual({ value: 'running', logSeq: 3 });
    const pending = await store.pendingEntries('run-1');
    expect(pending.map((item) => item.seq)).toEqual([1, 2, 3]);
    expect(pending.every((item) => item.state === 'waiting' && item.attempts === 0)).toBe(true);
  });

  it('a transition that cannot be stored leaves neither its snapshot nor any of its entries', async () => {
    const store = createOutboxStore(freshName());
    await store.saveTransition({ runId: 'run-1', snapshot: { logSeq: 1 }, entries: items('run-1', [1]) });
    const broken = { ...createOutboxItem('run-1', 3, entryAt(3)), notStorable: () => 'a function cannot be cloned' };

    await expect(
      store.saveTransition({ runId: 'run-1', snapshot: { logSeq: 3 }, entries: [createOutboxItem('run-1', 2, entryAt(2)), broken] }),
    ).rejects.toThrow();

    expect(await store.loadSnapshot('run-1')).toEqual({ logSeq: 1 });
    expect((await store.pendingEntries('run-1')).map((item) => item.seq)).toEqual([1]);
  });

  it('each new entry gets its own version 4 UUID as its key', () => {
    const made = items('run-1', [1, 2, 3]);

    expect(made.every((item) => isUuid(item.key) && uuidVersion(item.key) === 4)).toBe(true);
    expect(new Set(made.map((item) => item.key)).size).toBe(3);
  });

  it('pending entries can be read for one run or for all, and clearing a run keeps its unsent entries', async () => {
    const store = createOutboxStore(freshName());
    await store.saveTransition({ runId: 'run-b', snapshot: { b: 1 }, entries: items('run-b', [1]) });
    await store.saveTransition({ runId: 'run-a', snapshot: { a: 1 }, entries: items('run-a', [2, 1]) });

    await store.clearRun('run-a');

    expect(await store.loadSnapshot('run-a')).toBeUndefined();
    expect(await store.loadSnapshot('run-b')).toEqual({ b: 1 });
    expect((await store.pendingEntries()).map((item) => `${item.runId}#${item.seq}`)).toEqual(['run-a#1', 'run-a#2', 'run-b#1']);
    expect((await store.pendingEntries('run-b')).map((item) => item.seq)).toEqual([1]);
  });

  it('an entry marked as needing attention keeps its place, its state and the reason', async () => {
    const store = createOutboxStore(freshName());
    const [first, secondItem] = items('run-1', [1, 2]);
    await store.saveTransition({ runId: 'run-1', snapshot: {}, entries: [first, secondItem] });

    await store.markNeedsAttention(first.key, 'Reason cannot be empty');
    await store.removeEntry(secondItem.key);

    expect(await store.pendingEntries()).toEqual([
      { ...first, state: 'needs-attention', attempts: 1, lastError: 'Reason cannot be empty' },
    ]);
  });
});

describe('recording a treatment run\'s transitions', () => {
  it('after a reload the run resumes from the stored snapshot and every logged entry is waiting, once each', async () => {
    const name = freshName();
    const store = createOutboxStore(name);
    const run = startRun(planFor('remodelling'));
    // startRun has already started the actor; the recorder sees every transition from here on.
    let saves = 0;
    const stopRecording = recordRunTransitions(run.actor, 'run-1', { store, onSaved: () => (saves += 1) });
    run.send({ type: 'BEGIN' });
    run.advance(30 * second);
    run.send({ type: 'PAUSE' });
    run.send({ type: 'RESUME' });
    run.send({ type: 'SKIP', reason: 'athlete already warm' });
    run.advance(10 * second);
    // BEGIN, PAUSE, RESUME and SKIP: the clock moves alone within a step, so it makes no transition.
    await vi.waitFor(() => expect(saves).toBe(4));
    stopRecording();
    const logged = run.log.map(({ seq, entry }) => ({ seq, entry }));

    const reopened = createOutboxStore(name);
    const snapshot = await reopened.loadSnapshot<TreatmentRunSnapshot>('run-1');
    const restored = createActor(treatmentRunMachine, { snapshot: snapshot!, input: { plan: snapshot!.context.plan } });
    restored.start();
    const pending = await reopened.pendingEntries('run-1');

    expect(restored.getSnapshot().context.currentIndex).toBe(1);
    expect(restored.getSnapshot().context.logSeq).toBe(logged.length);
    expect(pending.map(({ seq, entry }) => ({ seq, entry }))).toEqual(logged);
    expect(new Set(pending.map((item) => item.key)).size).toBe(logged.length);
  });
});

describe('the outbox sender', () => {
  it('sends entries one at a time in seq order and removes each on 201 or 200', async () => {
    const store = createOutboxStore(freshName());
    await store.saveTransition({ runId: 'run-1', snapshot: {}, entries: items('run-1', [2, 3, 1]) });
    const server = scriptedSend([201, 200, 201]);
    const { outbox } = sender(store, server.send);

    await outbox.flush();

    expect(server.sent.map((item) => item.seq)).toEqual([1, 2, 3]);
    expect(server.maxInFlight()).toBe(1);
    expect(await store.pendingEntries()).toEqual([]);
    expect(outbox.getStatus()).toEqual({ waiting: 0, needsAttention: 0, sending: false, paused: null, retryAt: null });
  });

  it('a 503 is tried again after 1 s, 2 s, 4 s, and later entries wait behind it', async () => {
    const store = createOutboxStore(freshName());
    await store.saveTransition({ runId: 'run-1', snapshot: {}, entries: items('run-1', [1, 2]) });
    const server = scriptedSend([503, 503, 503]);
    const { outbox, timers } = sender(store, server.send);

    await outbox.flush();
    expect(timers.armed()).toEqual([1000]);
    expect(outbox.getStatus()).toMatchObject({ waiting: 2, retryAt: T0 + 1000 });
    timers.fire();
    await vi.waitFor(() => expect(timers.armed()).toEqual([2000]));
    timers.fire();
    await vi.waitFor(() => expect(timers.armed()).toEqual([4000]));
    const [stuck] = await store.pendingEntries();
    timers.fire();
    await vi.waitFor(async () => expect(await store.pendingEntries()).toEqual([]));

    expect(stuck).toMatchObject({ seq: 1, attempts: 3, lastError: 'Server said 503', state: 'waiting' });
    expect(server.sent.map((item) => item.seq)).toEqual([1, 1, 1, 1, 2]);
  });

  it('a failed network (fetch throws) is tried again, and the entry is kept until it is stored', async () => {
    const store = createOutboxStore(freshName());
    await store.saveTransition({ runId: 'run-1', snapshot: {}, entries: items('run-1', [1]) });
    const server = scriptedSend(['network', 'network']);
    const { outbox, timers } = sender(store, server.send);

    await outbox.flush();
    expect((await store.pendingEntries())[0]).toMatchObject({ attempts: 1, lastError: 'Failed to fetch' });
    timers.fire();
    await vi.waitFor(() => expect(timers.armed()).toEqual([2000]));
    timers.fire();
    await vi.waitFor(async () => expect(await store.pendingEntries()).toEqual([]));

    expect(server.sent).toHaveLength(3);
  });

  it('an "online" event cuts a retry wait short and sends at once', async () => {
    const store = createOutboxStore(freshName());
    await store.saveTransition({ runId: 'run-1', snapshot: {}, entries: items('run-1', [1]) });
    const server = scriptedSend(['network']);
    const network = new EventTarget();
    const { outbox, timers } = sender(store, server.send, { onlineEvents: network });
    outbox.start();
    await vi.waitFor(() => expect(timers.armed()).toEqual([1000]));

    network.dispatchEvent(new Event('online'));

    await vi.waitFor(async () => expect(await store.pendingEntries()).toEqual([]));
    expect(timers.armed()).toEqual([]);
    outbox.stop();
  });

  it('a send that fails after the sender stopped arms no retry', async () => {
    const store = createOutboxStore(freshName());
    await store.saveTransition({ runId: 'run-1', snapshot: {}, entries: items('run-1', [1]) });
    let answer: (result: SendResult) => void = () => undefined;
    const send = vi.fn(() => new Promise<SendResult>((resolve) => (answer = resolve)));
    const { outbox, timers } = sender(store, send);

    const flushed = outbox.flush();
    await vi.waitFor(() => expect(send).toHaveBeenCalledTimes(1));
    outbox.stop();
    answer({ status: 503 });
    await flushed;

    expect(timers.armed()).toEqual([]);
    expect(await store.pendingEntries()).toHaveLength(1);
  });

  it('a 401 pauses sending and asks for sign-in; resume sends everything in order', async () => {
    const store = createOutboxStore(freshName());
    await store.saveTransition({ runId: 'run-1', snapshot: {}, entries: items('run-1', [1, 2]) });
    const server = scriptedSend([401]);
    const { outbox, timers, unauthorized } = sender(store, server.send);

    await outbox.flush();
    await store.saveTransition({ runId: 'run-1', snapshot: {}, entries: items('run-1', [3]) });
    await outbox.flush();

    expect(unauthorized).toHaveBeenCalledTimes(1);
    expect(outbox.getStatus()).toMatchObject({ paused: 'unauthorized', waiting: 3 });
    expect(server.sent.map((item) => item.seq)).toEqual([1]);
    expect(timers.armed()).toEqual([]);

    await outbox.resume();

    expect(server.sent.map((item) => item.seq)).toEqual([1, 1, 2, 3]);
    expect(outbox.getStatus()).toMatchObject({ paused: null, waiting: 0 });
  });

  it.each([400, 422, 409, 404])('a %i keeps the entry as needing attention and goes on with the next', async (status) => {
    const store = createOutboxStore(freshName());
    await store.saveTransition({ runId: 'run-1', snapshot: {}, entries: items('run-1', [1, 2, 3]) });
    const server = scriptedSend([201, status]);
    const { outbox, timers } = sender(store, server.send);

    await outbox.flush();

    expect(server.sent.map((item) => item.seq)).toEqual([1, 2, 3]);
    expect(timers.armed()).toEqual([]);
    const kept = await store.pendingEntries();
    expect(kept).toHaveLength(1);
    expect(kept[0]).toMatchObject({ seq: 2, state: 'needs-attention', lastError: `Server said ${status}` });
    expect(outbox.getStatus()).toMatchObject({ waiting: 0, needsAttention: 1 });
    expect(outboxStatusText(outbox.getStatus())).toBe('1 needs attention');
  });

  it('an entry needing attention is not sent again on the next flush', async () => {
    const store = createOutboxStore(freshName());
    await store.saveTransition({ runId: 'run-1', snapshot: {}, entries: items('run-1', [1]) });
    const server = scriptedSend([422]);
    const { outbox } = sender(store, server.send);

    await outbox.flush();
    await outbox.flush();

    expect(server.sent).toHaveLength(1);
  });

  it('nothing is lost across a reload: a new sender on the same database sends what the old one could not, each key once', async () => {
    const name = freshName();
    const before = createOutboxStore(name);
    const written = items('run-1', [1, 2, 3]);
    await before.saveTransition({ runId: 'run-1', snapshot: {}, entries: written });
    const offline = scriptedSend([], 'network');
    const first = sender(before, offline.send);
    await first.outbox.flush();
    first.outbox.stop();

    const afterReload = createOutboxStore(name);
    const online = scriptedSend([]);
    const second_ = sender(afterReload, online.send);
    await second_.outbox.flush();

    expect(offline.sent.map((item) => item.seq)).toEqual([1]);
    expect(online.sent.map((item) => item.key)).toEqual(written.map((item) => item.key));
    expect(await afterReload.pendingEntries()).toEqual([]);
  });

  it('reports its status to onChange and to subscribers: waiting, sending, then all saved', async () => {
    const store = createOutboxStore(freshName());
    await store.saveTransition({ runId: 'run-1', snapshot: {}, entries: items('run-1', [1, 2]) });
    const server = scriptedSend([]);
    const changes: string[] = [];
    const { outbox } = sender(store, server.send, {
      onChange: (status) => changes.push(`${outboxStatusText(status)}${status.sending ? ' (sending)' : ''}`),
    });
    const heard = vi.fn();
    outbox.subscribe(heard);

    await outbox.flush();

    expect(changes).toEqual([
      '2 waiting to save',
      '2 waiting to save (sending)',
      '2 waiting to save',
      '1 waiting to save',
      '1 waiting to save (sending)',
      '1 waiting to save',
      'All saved',
    ]);
    expect(heard).toHaveBeenCalledTimes(changes.length);
  });
});

describe('sending outcomes and retry delays', () => {
  it.each([
    [200, 'saved'],
    [201, 'saved'],
    [401, 'unauthorized'],
    [408, 'retry'],
    [429, 'retry'],
    [500, 'retry'],
    [502, 'retry'],
    [503, 'retry'],
    [400, 'needs-attention'],
    [403, 'needs-attention'],
    [404, 'needs-attention'],
    [409, 'needs-attention'],
    [422, 'needs-attention'],
  ] as const)('status %i → %s', (status, outcome) => {
    expect(outcomeOf(status)).toBe(outcome);
  });

  it('waits double after each failure from 1 s, and never more than 30 s', () => {
    const plain = [1, 2, 3, 4, 5, 6, 7, 12].map((failures) => retryDelayMs(failures, { random: () => 0.5 }));

    expect(plain).toEqual([1000, 2000, 4000, 8000, 16_000, 30_000, 30_000, 30_000]);
  });

  it('spreads each wait by at most 20 % either way, still capped at 30 s', () => {
    expect(retryDelayMs(3, { random: () => 0 })).toBe(3200);
    expect(retryDelayMs(3, { random: () => 1 })).toBe(4800);
    expect(retryDelayMs(5, { random: () => 1 })).toBe(19_200);
    expect(retryDelayMs(6, { random: () => 0 })).toBe(25_600);
    expect(retryDelayMs(6, { random: () => 1 })).toBe(30_000);
  });
});
