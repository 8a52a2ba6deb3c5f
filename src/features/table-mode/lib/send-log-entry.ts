import { apiRequest, ApiError } from '../../../lib/api-client';
import type { OutboxItem } from './outbox';
import type { SendResult } from './outbox-sender';

/** A request that hangs would hold the whole outbox behind it; after this long it counts as a network error. */
export const sendTimeoutMs = 15_000;

/**
 * Sends one outbox entry: `POST /api/runs/:runId/log` with the entry as body and its key as Idempotency-Key.
 * Resolves with the status for the sender to act on; rejects only when the request never got an answer
 * (offline, timed out), which the sender retries.
 */
export async function sendLogEntry(item: OutboxItem): Promise<SendResult> {
  try {
    await apiRequest<unknown>(`/api/runs/${encodeURIComponent(item.runId)}/log`, {
      method: 'POST',
      body: item.entry,
      headers: { 'Idempotency-Key': item.key },
      signal: AbortSignal.timeout(sendTimeoutMs),
    });
    // apiRequest hides 200 versus 201; both mean stored.
    return { status: 200 };
  } catch (error) {
    if (error instanceof ApiError) return { status: error.status, message: error.message };
    throw error;
  }
}
