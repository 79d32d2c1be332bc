import { useSyncExternalStore } from 'react';

/**
 * Whether the server said it cannot reach its database (a 503 with DATABASE_UNAVAILABLE_MESSAGE).
 * That is an outage to wait out, not the end of a session: the desk keeps its token, shows a
 * banner and tries again; the first answer that is not that 503 clears it.
 */
export type ServerStatus = 'ok' | 'database-down';

type Listener = () => void;

export function createServerStatusStore() {
  const listeners = new Set<Listener>();
  let status: ServerStatus = 'ok';

  function set(next: ServerStatus) {
    if (next === status) return;
    status = next;
    listeners.forEach((listener) => listener());
  }

  return {
    databaseDown: () => set('database-down'),
    reachable: () => set('ok'),
    getSnapshot: () => status,
    subscribe(listener: Listener): () => void {
      listeners.add(listener);
      return () => {
        listeners.delete(listener);
      };
    },
  };
}

export type ServerStatusStore = ReturnType<typeof createServerStatusStore>;

/** The one store the application uses. */
export const serverStatusStore = createServerStatusStore();

export function useServerStatus(store: ServerStatusStore = serverStatusStore): ServerStatus {
  return useSyncExternalStore(store.subscribe, store.getSnapshot);
}
