import { useSyncExternalStore } from 'react';
import { sessionStore, type SessionSnapshot } from '../../../lib/session-store';

/** The token's presence and why the last session ended, re-rendering when either changes. */
export function useSession(): SessionSnapshot {
  return useSyncExternalStore(sessionStore.subscribe, sessionStore.getSnapshot);
}
