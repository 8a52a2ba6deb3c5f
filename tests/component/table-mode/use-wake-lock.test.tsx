import { act, renderHook, waitFor } from '@testing-library/react';
import { useWakeLock } from '../../../src/features/table-mode/lib/wake-lock';

class FakeSentinel extends EventTarget {
  readonly type = 'screen';
  released = false;
  release = vi.fn(async () => this.letGo());
  /** What the browser does to a lock when the page is hidden. */
  letGo() {
    if (this.released) return;
    this.released = true;
    this.dispatchEvent(new Event('release'));
  }
}

let visibility: DocumentVisibilityState = 'visible';

function setVisibility(next: DocumentVisibilityState) {
  visibility = next;
  document.dispatchEvent(new Event('visibilitychange'));
}

function installWakeLock(answer: 'grant' | 'refuse' = 'grant') {
  const locks: FakeSentinel[] = [];
  const api = {
    request: vi.fn(async (type: string) => {
      if (type !== 'screen') throw new TypeError(`unexpected lock type ${type}`);
      if (answer === 'refuse') throw new DOMException('Wake lock refused', 'NotAllowedError');
      const lock = new FakeSentinel();
      locks.push(lock);
      return lock;
    }),
  };
  Object.defineProperty(navigator, 'wakeLock', { configurable: true, value: api });
  return { api, locks };
}

beforeEach(() => {
  visibility = 'visible';
  Object.defineProperty(document, 'visibilityState', { configurable: true, get: () => visibility });
});

afterEach(() => {
  Reflect.deleteProperty(navigator, 'wakeLock');
  Reflect.deleteProperty(document, 'visibilityState');
});

describe('keeping the screen awake in table mode', () => {
  it('holds a screen wake lock while active', async () => {
    const { api } = installWakeLock();

    const { result } = renderHook(() => useWakeLock(true));

    await waitFor(() => expect(result.current).toBe('held'));
    expect(api.request).toHaveBeenCalledWith('screen');
  });

  it('asks for nothing while inactive, and lets the lock go when table mode stops running', async () => {
    const { api, locks } = installWakeLock();
    const { result, rerender } = renderHook(({ active }) => useWakeLock(active), { initialProps: { active: false } });
    expect(result.current).toBe('off');
    expect(api.request).not.toHaveBeenCalled();

    rerender({ active: true });
    await waitFor(() => expect(result.current).toBe('held'));
    rerender({ active: false });

    expect(result.current).toBe('off');
    expect(locks[0].release).toHaveBeenCalledTimes(1);
  });

  it('lets the lock go when table mode closes', async () => {
    const { locks } = installWakeLock();
    const { result, unmount } = renderHook(() => useWakeLock(true));
    await waitFor(() => expect(result.current).toBe('held'));

    unmount();

    expect(locks[0].released).toBe(true);
  });

  it('takes the lock again when the page comes back after the browser let it go', async () => {
    const { api, locks } = installWakeLock();
    const { result } = renderHook(() => useWakeLock(true));
    await waitFor(() => expect(result.current).toBe('held'));

    act(() => {
      setVisibility('hidden');
      locks[0].letGo();
    });
    expect(result.current).toBe('off');
    act(() => setVisibility('visible'));

    await waitFor(() => expect(result.current).toBe('held'));
    expect(api.request).toHaveBeenCalledTimes(2);
    expect(locks[1].released).toBe(false);
  });

  it('waits for the page to be visible before asking', async () => {
    const { api } = installWakeLock();
    visibility = 'hidden';
    const { result } = renderHook(() => useWakeLock(true));
    expect(api.request).not.toHaveBeenCalled();

    act(() => setVisibility('visible'));

    await waitFor(() => expect(result.current).toBe('held'));
    expect(api.request).toHaveBeenCalledTimes(1);
  });

  it('reports a refusal quietly', async () => {
    installWakeLock('refuse');

    const { result } = renderHook(() => useWakeLock(true));

    await waitFor(() => expect(result.current).toBe('refused'));
  });

  it('reports a browser without the Wake Lock API as unavailable', () => {
    const { result } = renderHook(() => useWakeLock(true));

    expect(result.current).toBe('unavailable');
  });
});
