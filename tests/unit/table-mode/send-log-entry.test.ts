import { forgetCsrfToken } from '../../../src/lib/api-client';
import { createOutboxItem } from '../../../src/features/table-mode/lib/outbox';
import { sendLogEntry } from '../../../src/features/table-mode/lib/send-log-entry';

const item = createOutboxItem('run 7', 4, { type: 'run-completed', at: '2025-03-30T09:45:00.000Z' });

function json(status: number, body: unknown) {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

/** A fetch that hands out a CSRF token, then answers the log request with `answer`. */
function stubFetch(answer: () => Response | Promise<Response>) {
  const calls: { url: string; init?: RequestInit }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      calls.push({ url, init });
      if (url === '/api/auth/csrf') return json(200, { token: 'token-1' });
      return answer();
    }),
  );
  return calls;
}

beforeEach(() => forgetCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('sending one log entry', () => {
  it('posts the entry to the run\'s log with its key as Idempotency-Key and the CSRF token', async () => {
    const calls = stubFetch(() => json(201, { ok: true }));

    const result = await sendLogEntry(item);

    expect(result).toEqual({ status: 200 });
    const post = calls.find((call) => call.url !== '/api/auth/csrf')!;
    expect(post.url).toBe('/api/runs/run%207/log');
    expect(post.init?.method).toBe('POST');
    expect(post.init?.headers).toMatchObject({ 'Idempotency-Key': item.key, 'X-CSRF-Token': 'token-1' });
    expect(JSON.parse(String(post.init?.body))).toEqual(item.entry);
  });

  it('answers a refusal with its status and the server\'s message, for the sender to act on', async () => {
    stubFetch(() => json(422, { error: { code: 'validation', message: 'A run-completed entry is out of order' } }));

    await expect(sendLogEntry(item)).resolves.toEqual({ status: 422, message: 'A run-completed entry is out of order' });
  });

  it('an unreadable error page still gives its status (a proxy\'s 502)', async () => {
    stubFetch(() => new Response('<html>Bad gateway</html>', { status: 502 }));

    await expect(sendLogEntry(item)).resolves.toMatchObject({ status: 502 });
  });

  it('rejects when the network failed, which the sender retries', async () => {
    stubFetch(() => Promise.reject(new TypeError('Failed to fetch')));

    await expect(sendLogEntry(item)).rejects.toThrow('Failed to fetch');
  });
});
