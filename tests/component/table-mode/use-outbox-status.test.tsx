import 'fake-indexeddb/auto';
import { act, render, screen } from '@testing-library/react';
import { createOutboxItem, createOutboxStore } from '../../../src/features/table-mode/lib/outbox';
import { createOutboxSender, type SendResult } from '../../../src/features/table-mode/lib/outbox-sender';
import { useOutboxStatus } from '../../../src/features/table-mode/lib/use-outbox-status';

function SaveLine({ sender }: { sender: Parameters<typeof useOutboxStatus>[0] }) {
  const status = useOutboxStatus(sender);
  return <p role="status">{status.text}</p>;
}

describe("table mode's save line", () => {
  it('shows what waits to be saved and counts down as the server answers, keeping what it refused', async () => {
    const store = createOutboxStore('outbox-status-test');
    const entries = [1, 2].map((seq) => createOutboxItem('run-1', seq, { type: 'run-completed', at: '2025-03-30T09:45:00.000Z' }));
    await store.saveTransition({ runId: 'run-1', snapshot: {}, entries });
    const answers: ((result: SendResult) => void)[] = [];
    const sender = createOutboxSender({
      store,
      send: () => new Promise<SendResult>((resolve) => answers.push(resolve)),
      onlineEvents: null,
    });
    render(<SaveLine sender={sender} />);

    let flushed: Promise<void> = Promise.resolve();
    await act(async () => {
      flushed = sender.flush();
      await vi.waitFor(() => expect(answers).toHaveLength(1));
    });
    expect(screen.getByRole('status')).toHaveTextContent('2 waiting to save');

    await act(async () => {
      answers[0]({ status: 201 });
      await vi.waitFor(() => expect(answers).toHaveLength(2));
    });
    expect(screen.getByRole('status')).toHaveTextContent('1 waiting to save');

    await act(async () => {
      answers[1]({ status: 422, message: 'Entry time is not a valid instant' });
      await flushed;
    });
    expect(screen.getByRole('status')).toHaveTextContent('1 needs attention');
  });
});
