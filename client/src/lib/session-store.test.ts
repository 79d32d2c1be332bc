import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createSessionStore } from './session-store';

const KEY = 'morrowline.session';

describe('session store', () => {
  let storage: Storage;

  beforeEach(() => {
    vi.useFakeTimers();
    vi.setSystemTime(new Date('2026-03-01T12:00:00Z'));
    storage = window.sessionStorage;
    storage.clear();
  });

  afterEach(() => {
    vi.useRealTimers();
  });

  it('keeps the token and its expiry in sessionStorage', () => {
    const store = createSessionStore({ storage });
    store.start('token-1', 900);

    expect(store.token()).toBe('token-1');
    expect(JSON.parse(storage.getItem(KEY) ?? 'null')).toEqual({
      token: 'token-1',
      expiresAt: Date.parse('2026-03-01T12:15:00Z'),
    });
    expect(store.getSnapshot().endReason).toBeNull();
  });

  it('restores a stored session after a reload', () => {
    createSessionStore({ storage }).start('token-2', 600);
    const reloaded = createSessionStore({ storage });
    expect(reloaded.token()).toBe('token-2');
  });

  it('ends the session by timer the moment the token expires, and tells why', () => {
    const store = createSessionStore({ storage });
    const listener = vi.fn();
    store.subscribe(listener);
    store.start('token-3', 60);
    listener.mockClear();

    vi.advanceTimersByTime(59_999);
    expect(store.getSnapshot().session).not.toBeNull();
    expect(listener).not.toHaveBeenCalled();

    vi.advanceTimersByTime(1);
    expect(store.getSnapshot()).toEqual({ session: null, endReason: 'expired' });
    expect(storage.getItem(KEY)).toBeNull();
    expect(listener).toHaveBeenCalledTimes(1);
  });

  it('never hands out an expired token even if the timer has not fired yet', () => {
    const store = createSessionStore({ storage });
    store.start('token-4', 30);
    // Move the clock without running timers, as after a laptop wakes from sleep.
    vi.setSystemTime(Date.now() + 31_000);
    expect(store.token()).toBeNull();
    expect(store.getSnapshot().endReason).toBe('expired');
  });

  it('treats a stored token that has already expired as an expired session', () => {
    storage.setItem(KEY, JSON.stringify({ token: 'old', expiresAt: Date.now() - 1 }));
    const store = createSessionStore({ storage });
    expect(store.token()).toBeNull();
    expect(store.getSnapshot().endReason).toBe('expired');
    expect(storage.getItem(KEY)).toBeNull();
  });

  it('ignores a damaged stored entry', () => {
    storage.setItem(KEY, '{not json');
    const store = createSessionStore({ storage });
    expect(store.getSnapshot()).toEqual({ session: null, endReason: null });
    expect(storage.getItem(KEY)).toBeNull();
  });

  it('signs out on request and stops the expiry timer', () => {
    const store = createSessionStore({ storage });
    store.start('token-5', 60);
    store.end('signed-out');
    expect(store.getSnapshot()).toEqual({ session: null, endReason: 'signed-out' });
    vi.advanceTimersByTime(120_000);
    expect(store.getSnapshot().endReason).toBe('signed-out');
  });

  it('keeps "signed out" as the reason when an expiry arrives afterwards', () => {
    const store = createSessionStore({ storage });
    store.start('token-6', 60);
    store.end('signed-out');
    store.end('expired');
    expect(store.getSnapshot().endReason).toBe('signed-out');
  });

  it('clears the reason once a new session starts', () => {
    const store = createSessionStore({ storage });
    store.start('a', 1);
    vi.advanceTimersByTime(1000);
    expect(store.getSnapshot().endReason).toBe('expired');
    store.start('b', 60);
    expect(store.getSnapshot().endReason).toBeNull();
  });
});
