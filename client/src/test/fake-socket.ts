import { vi } from 'vitest';

/** A stand-in for socket.io's Socket: records how it was opened and lets a test emit events. */
export function fakeSocketFactory() {
  const opened: { uri: string; auth: unknown; socket: FakeSocket }[] = [];
  interface FakeSocket {
    active: boolean;
    disconnected: boolean;
    emitFromServer: (event: string, payload: unknown) => void;
    /** Fires one of socket.io's own lifecycle events ('connect', 'disconnect', 'connect_error'). */
    fire: (event: string, ...args: unknown[]) => void;
    on: (event: string, handler: (...args: unknown[]) => void) => FakeSocket;
    onAny: (handler: (event: string, payload: unknown) => void) => FakeSocket;
    removeAllListeners: () => FakeSocket;
    disconnect: () => FakeSocket;
    connect: () => FakeSocket;
  }
  const connect = vi.fn((uri: string, options: { auth?: unknown }) => {
    const listeners = new Map<string, ((...args: unknown[]) => void)[]>();
    let any: ((event: string, payload: unknown) => void)[] = [];
    const socket: FakeSocket = {
      active: true,
      disconnected: false,
      emitFromServer: (event, payload) => any.forEach((handler) => handler(event, payload)),
      fire: (event, ...args) => listeners.get(event)?.forEach((handler) => handler(...args)),
      on: (event, handler) => {
        listeners.set(event, [...(listeners.get(event) ?? []), handler]);
        return socket;
      },
      onAny: (handler) => {
        any.push(handler);
        return socket;
      },
      removeAllListeners: () => {
        listeners.clear();
        any = [];
        return socket;
      },
      disconnect: () => {
        socket.disconnected = true;
        return socket;
      },
      connect: () => socket,
    };
    opened.push({ uri, auth: options.auth, socket });
    return socket;
  });
  return { connect, opened };
}
