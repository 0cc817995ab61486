import { afterEach, describe, expect, it, vi } from 'vitest';
import { throttleTouch, TOUCH_INTERVAL_MS } from './session';

describe('throttleTouch', () => {
  afterEach(() => vi.useRealTimers());

  it('writes a session expiry once per interval per session, and again once the interval has passed', () => {
    vi.useFakeTimers({ now: new Date('2026-06-01T08:00:00Z') });
    const writes: string[] = [];
    const store = {
      touch: (sid: string, _s: unknown, cb?: (err?: unknown) => void) => {
        writes.push(sid);
        cb?.();
      },
    };
    throttleTouch(store);
    const done = vi.fn();
    store.touch('a', {}, done);
    store.touch('a', {}, done);
    store.touch('b', {}, done);
    expect(writes).toEqual(['a', 'b']);
    expect(done).toHaveBeenCalledTimes(3); // express-session waits for the callback even when nothing is written
    vi.advanceTimersByTime(TOUCH_INTERVAL_MS - 1);
    store.touch('a', {}, done);
    expect(writes).toEqual(['a', 'b']);
    vi.advanceTimersByTime(1);
    store.touch('a', {}, done);
    expect(writes).toEqual(['a', 'b', 'a']);
  });
});
