import { describe, expect, it } from 'vitest';
import { chooseStartingPoint } from '../../../src/features/table-mode/lib/starting-point';
import { finishedStatuses } from '../../../shared/runs/responses';

const snapshotKnowing = (logSeq: number) => ({ context: { logSeq } });
const entries = (n: number) => Array.from({ length: n }, (_, i) => ({ seq: i + 1 }));

describe('where table mode starts a run from', () => {
  it.each(finishedStatuses)('a run the server has %s is shown finished, whatever the tablet stored', (status) => {
    expect(chooseStartingPoint({ status }, snapshotKnowing(99), entries(3)).kind).toBe('finished');
    expect(chooseStartingPoint({ status }, undefined, []).kind).toBe('finished');
  });

  it("restores the tablet's snapshot when it knows at least as much as the server's log", () => {
    const stored = snapshotKnowing(4);
    expect(chooseStartingPoint({ status: 'running' }, stored, entries(4))).toEqual({ kind: 'restore', snapshot: stored });
    expect(chooseStartingPoint({ status: 'running' }, stored, entries(2))).toEqual({ kind: 'restore', snapshot: stored });
  });

  it("rebuilds from the server's log when the stored snapshot is older than it", () => {
    expect(chooseStartingPoint({ status: 'running' }, snapshotKnowing(2), entries(5)).kind).toBe('rebuild');
    expect(chooseStartingPoint({ status: 'running' }, undefined, entries(1)).kind).toBe('rebuild');
  });

  it('starts fresh only when neither the tablet nor the server has anything', () => {
    expect(chooseStartingPoint({ status: 'ready' }, undefined, []).kind).toBe('new');
  });
});
