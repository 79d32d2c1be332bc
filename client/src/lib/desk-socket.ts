import {
  DESK_EVENTS,
  DESK_NAMESPACE,
  type AlertDto,
  type DeskHello,
  type DeskReadings,
  type DeskScheduleEvent,
  type ForecastRunDto,
  type RefitJobDto,
} from '@morrowline/shared';
import { useEffect, useRef, useSyncExternalStore } from 'react';
import { io, type ManagerOptions, type Socket, type SocketOptions } from 'socket.io-client';
import { sessionStore as defaultSessionStore, type SessionStore } from './session-store';

/** What each desk event carries. */
export interface DeskEventPayloads {
  [DESK_EVENTS.hello]: DeskHello;
  [DESK_EVENTS.readings]: DeskReadings;
  [DESK_EVENTS.alertRaised]: AlertDto;
  [DESK_EVENTS.alertAcknowledged]: AlertDto;
  [DESK_EVENTS.forecast]: ForecastRunDto;
  [DESK_EVENTS.refitProgress]: RefitJobDto;
  [DESK_EVENTS.schedule]: DeskScheduleEvent;
}

export type DeskEventName = keyof DeskEventPayloads;
export type DeskConnectionState = 'offline' | 'connecting' | 'connected';

type Connect = (uri: string, options: Partial<ManagerOptions & SocketOptions>) => Socket;

/** Handshake refusals that mean the token is no longer good (the server's own sentences). */
const SESSION_OVER = /session has (ended|expired)|no longer active|sign-in is not valid/i;
type AnyHandler = (payload: unknown) => void;

export interface DeskSocketOptions {
  sessionStore?: SessionStore;
  connect?: Connect;
  /** Wait before trying again after the server refused the handshake (the token may be renewed). */
  retryAfterRefusalMs?: number;
}

/**
 * The desks' one live channel. It connects while there is a session and someone listens, with
 * the current access token; reconnects on its own after a drop; and disconnects the moment the
 * session ends (sign-out or expiry). Features subscribe to events through `on` or useDeskEvent.
 */
export function createDeskSocket({
  sessionStore = defaultSessionStore,
  connect = io,
  retryAfterRefusalMs = 5_000,
}: DeskSocketOptions = {}) {
  const handlers = new Map<string, Set<AnyHandler>>();
  const stateListeners = new Set<() => void>();
  let socket: Socket | null = null;
  let socketToken: string | null = null;
  let state: DeskConnectionState = 'offline';
  let retryTimer: ReturnType<typeof setTimeout> | undefined;

  function setState(next: DeskConnectionState) {
    if (next === state) return;
    state = next;
    stateListeners.forEach((listener) => listener());
  }

  function close() {
    if (retryTimer !== undefined) clearTimeout(retryTimer);
    retryTimer = undefined;
    if (socket) {
      socket.removeAllListeners();
      socket.disconnect();
    }
    socket = null;
    socketToken = null;
    setState('offline');
  }

  function open(token: string) {
    close();
    socketToken = token;
    setState('connecting');
    const next = connect(DESK_NAMESPACE, {
      // A function, so that every reconnection sends the token current at that moment.
      auth: (send: (data: object) => void) => send({ token: sessionStore.token() ?? '' }),
      transports: ['websocket'],
    });
    socket = next;
    next.on('connect', () => setState('connected'));
    next.on('disconnect', (reason: string) => {
      setState(sessionStore.token() ? 'connecting' : 'offline');
      // The server closes a desk's socket when its session ends or its grounds change (sign-out
      // elsewhere, deactivation, role change, expiry). socket.io does not come back on its own
      // after that: try again, and the handshake says whether the token still holds.
      if (reason === 'io server disconnect') retryLater(next);
    });
    next.on('connect_error', (error: Error | undefined) => {
      // The server no longer takes this token (signed out, deactivated, expired): the session
      // is over here too. A database outage is not that: its refusal is retried below.
      if (SESSION_OVER.test(error?.message ?? '') && sessionStore.getSnapshot().session?.token === socketToken) {
        sessionStore.end('expired');
        return;
      }
      // A refused handshake is not retried by socket.io itself; try again while the session lasts.
      if (next.active) return;
      retryLater(next);
    });
    next.onAny((event: string, payload: unknown) => {
      handlers.get(event)?.forEach((handler) => handler(payload));
    });
  }

  function retryLater(target: Socket) {
    setState('connecting');
    if (retryTimer !== undefined) clearTimeout(retryTimer);
    retryTimer = setTimeout(() => {
      if (socket === target && sessionStore.token()) target.connect();
    }, retryAfterRefusalMs);
  }

  function listening(): boolean {
    for (const set of handlers.values()) if (set.size > 0) return true;
    return false;
  }

  /** Bring the connection in line with the session and whether anyone listens. */
  function sync() {
    const token = sessionStore.getSnapshot().session?.token ?? null;
    if (!token || !listening()) {
      if (socket) close();
      return;
    }
    if (token !== socketToken) open(token);
  }

  sessionStore.subscribe(sync);

  return {
    on<E extends DeskEventName>(event: E, handler: (payload: DeskEventPayloads[E]) => void): () => void {
      let set = handlers.get(event);
      if (!set) handlers.set(event, (set = new Set()));
      set.add(handler as AnyHandler);
      sync();
      return () => {
        set.delete(handler as AnyHandler);
        sync();
      };
    },
    state: () => state,
    subscribeState(listener: () => void): () => void {
      stateListeners.add(listener);
      return () => {
        stateListeners.delete(listener);
      };
    },
    close,
  };
}

export type DeskSocket = ReturnType<typeof createDeskSocket>;

/** The one live channel the application uses. */
export const deskSocket = createDeskSocket();

/** Calls `handler` for every `event` while the component is mounted (the latest handler, always). */
export function useDeskEvent<E extends DeskEventName>(
  event: E,
  handler: (payload: DeskEventPayloads[E]) => void,
  socket: DeskSocket = deskSocket,
): void {
  const latest = useRef(handler);
  useEffect(() => {
    latest.current = handler;
  });
  useEffect(() => socket.on(event, (payload) => latest.current(payload)), [event, socket]);
}

/** Whether the live channel is up, for a small indicator. */
export function useDeskConnectionState(socket: DeskSocket = deskSocket): DeskConnectionState {
  return useSyncExternalStore(socket.subscribeState, socket.state);
}
