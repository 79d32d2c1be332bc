import { DESK_EVENTS, DESK_NAMESPACE } from '@morrowline/shared';
import { describe, expect, it, vi } from 'vitest';
import { fakeSocketFactory } from '../test/fake-socket';
import { createDeskSocket } from './desk-socket';
import { createSessionStore } from './session-store';

function memoryStorage(): Storage {
  const data = new Map<string, string>();
  return {
    get length() {
      return data.size;
    },
    clear: () => data.clear(),
    getItem: (key) => data.get(key) ?? null,
    key: (i) => [...data.keys()][i] ?? null,
    removeItem: (key) => void data.delete(key),
    setItem: (key, value) => void data.set(key, value),
  };
}

describe('createDeskSocket', () => {
  it('connects to the desk namespace with the session token once someone listens, and delivers events', () => {
    const sessionStore = createSessionStore({ storage: memoryStorage() });
    sessionStore.start('token-1', 3600);
    const { connect, opened } = fakeSocketFactory();
    const desk = createDeskSocket({ sessionStore, connect: connect as never });
    expect(connect).not.toHaveBeenCalled();

    const received: unknown[] = [];
    desk.on(DESK_EVENTS.readings, (payload) => received.push(payload));
    expect(opened).toHaveLength(1);
    expect(opened[0].uri).toBe(DESK_NAMESPACE);
    let sent: unknown;
    (opened[0].auth as (cb: (data: object) => void) => void)((data) => (sent = data));
    expect(sent).toEqual({ token: 'token-1' });

    opened[0].socket.emitFromServer(DESK_EVENTS.readings, { zones: [], receivedAt: 'now' });
    opened[0].socket.emitFromServer(DESK_EVENTS.alertRaised, { id: 1 });
    expect(received).toEqual([{ zones: [], receivedAt: 'now' }]);
  });

  it('disconnects when the session ends and when the last listener leaves', () => {
    const sessionStore = createSessionStore({ storage: memoryStorage() });
    sessionStore.start('token-1', 3600);
    const { connect, opened } = fakeSocketFactory();
    const desk = createDeskSocket({ sessionStore, connect: connect as never });
    const off = desk.on(DESK_EVENTS.alertRaised, () => {});

    sessionStore.end('signed-out');
    expect(opened[0].socket.disconnected).toBe(true);
    expect(desk.state()).toBe('offline');

    sessionStore.start('token-2', 3600);
    expect(opened).toHaveLength(2);
    off();
    expect(opened[1].socket.disconnected).toBe(true);
  });

  it('does not connect without a session', () => {
    const sessionStore = createSessionStore({ storage: memoryStorage() });
    const { connect } = fakeSocketFactory();
    const desk = createDeskSocket({ sessionStore, connect: connect as never });
    desk.on(DESK_EVENTS.readings, () => {});
    expect(connect).not.toHaveBeenCalled();
  });

  it('ends the session when the server refuses the token at the handshake, but not over a database outage', () => {
    const sessionStore = createSessionStore({ storage: memoryStorage() });
    sessionStore.start('token-1', 3600);
    const { connect, opened } = fakeSocketFactory();
    const desk = createDeskSocket({ sessionStore, connect: connect as never, retryAfterRefusalMs: 60_000 });
    desk.on(DESK_EVENTS.readings, () => undefined);
    opened[0].socket.active = false;

    opened[0].socket.fire('connect_error', new Error('The server cannot reach its database; try again shortly'));
    expect(sessionStore.getSnapshot().session?.token).toBe('token-1');
    expect(desk.state()).toBe('connecting');

    opened[0].socket.fire('connect_error', new Error('Your session has ended; sign in again'));
    expect(sessionStore.getSnapshot()).toEqual({ session: null, endReason: 'expired' });
    desk.close();
  });

  it('tries again after the server closed the socket (a role change), with the token of the moment', async () => {
    const sessionStore = createSessionStore({ storage: memoryStorage() });
    sessionStore.start('token-1', 3600);
    const { connect, opened } = fakeSocketFactory();
    const desk = createDeskSocket({ sessionStore, connect: connect as never, retryAfterRefusalMs: 1 });
    desk.on(DESK_EVENTS.readings, () => undefined);
    let reconnected = false;
    opened[0].socket.connect = () => ((reconnected = true), opened[0].socket);
    opened[0].socket.fire('disconnect', 'io server disconnect');
    expect(desk.state()).toBe('connecting');
    await vi.waitFor(() => expect(reconnected).toBe(true));
    desk.close();
  });
});
