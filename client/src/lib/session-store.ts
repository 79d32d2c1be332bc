/**
 * The access token and its expiry, kept in sessionStorage so that a reload keeps the session
 * but closing the tab ends it. This is client state, not server state: the signed-in user's
 * details live in the query cache (features/auth).
 *
 * When the session ends the store remembers why, so that the sign-in screen can say
 * "your session has expired" rather than nothing.
 */
export type SessionEndReason = 'expired' | 'signed-out';

export interface Session {
  token: string;
  /** Epoch milliseconds after which the token is no longer accepted. */
  expiresAt: number;
}

export interface SessionSnapshot {
  session: Session | null;
  endReason: SessionEndReason | null;
}

const STORAGE_KEY = 'morrowline.session';
/** setTimeout cannot wait longer than 2^31-1 ms; longer expiries are re-armed in steps. */
const LONGEST_TIMER_MS = 2_147_483_647;

type Listener = () => void;

export interface SessionStoreOptions {
  storage?: Storage;
  now?: () => number;
}

export function createSessionStore({ storage = window.sessionStorage, now = () => Date.now() }: SessionStoreOptions = {}) {
  const listeners = new Set<Listener>();
  let snapshot: SessionSnapshot = { session: readStored(storage), endReason: null };
  let timer: ReturnType<typeof setTimeout> | undefined;

  function emit(next: SessionSnapshot) {
    snapshot = next;
    listeners.forEach((listener) => listener());
  }

  function disarm() {
    if (timer !== undefined) clearTimeout(timer);
    timer = undefined;
  }

  // A timer ends the session the moment the token runs out, so that an idle screen does not
  // sit there looking signed in until the next request fails.
  function arm() {
    disarm();
    const session = snapshot.session;
    if (!session) return;
    const remaining = session.expiresAt - now();
    if (remaining <= 0) {
      end('expired');
      return;
    }
    timer = setTimeout(arm, Math.min(remaining, LONGEST_TIMER_MS));
  }

  function start(token: string, expiresInSeconds: number) {
    const session: Session = { token, expiresAt: now() + expiresInSeconds * 1000 };
    storage.setItem(STORAGE_KEY, JSON.stringify(session));
    emit({ session, endReason: null });
    arm();
  }

  function end(reason: SessionEndReason) {
    disarm();
    storage.removeItem(STORAGE_KEY);
    // A session already over keeps the reason it ended with: a late 401 from a request sent
    // before signing out must not turn "signed out" into "expired".
    if (snapshot.session === null) return;
    emit({ session: null, endReason: reason });
  }

  /** The token if it is still valid; an expired one ends the session on the spot. */
  function token(): string | null {
    const session = snapshot.session;
    if (!session) return null;
    if (session.expiresAt <= now()) {
      end('expired');
      return null;
    }
    return session.token;
  }

  function subscribe(listener: Listener) {
    listeners.add(listener);
    return () => {
      listeners.delete(listener);
    };
  }

  arm();

  return {
    start,
    end,
    token,
    subscribe,
    getSnapshot: () => snapshot,
    /** Forget why the last session ended, once the message has been shown. */
    acknowledgeEnd: () => {
      if (snapshot.endReason !== null) emit({ ...snapshot, endReason: null });
    },
  };
}

export type SessionStore = ReturnType<typeof createSessionStore>;

function readStored(storage: Storage): Session | null {
  try {
    const raw = storage.getItem(STORAGE_KEY);
    if (!raw) return null;
    const parsed: unknown = JSON.parse(raw);
    if (
      typeof parsed === 'object' &&
      parsed !== null &&
      typeof (parsed as Session).token === 'string' &&
      typeof (parsed as Session).expiresAt === 'number'
    ) {
      return parsed as Session;
    }
  } catch {
    // A damaged entry is treated as no session at all.
  }
  storage.removeItem(STORAGE_KEY);
  return null;
}

/** The one store the application uses. Tests build their own with createSessionStore. */
export const sessionStore = createSessionStore();
