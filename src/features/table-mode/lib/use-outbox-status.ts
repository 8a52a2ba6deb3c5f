import { useSyncExternalStore } from 'react';
import { outboxStatusText, type OutboxSender, type OutboxStatus } from './outbox-sender';

/** The outbox's status for table mode's "All saved" / "N waiting to save" line; re-renders on change. */
export function useOutboxStatus(sender: Pick<OutboxSender, 'subscribe' | 'getStatus'>): OutboxStatus & { text: string } {
  const status = useSyncExternalStore(sender.subscribe, sender.getStatus, sender.getStatus);
  return { ...status, text: outboxStatusText(status) };
}
