/** What the session guard hands to the sign-in screen through the router's location state. */
export interface SignInLocationState {
  /** The page (path, query and hash) to go back to after signing in. */
  from?: string;
  expired?: boolean;
}

/** Only same-site paths are followed, so a crafted state cannot send anyone elsewhere. */
export function readReturnPath(state: SignInLocationState | null | undefined): string | null {
  const from = state?.from;
  if (typeof from !== 'string' || !from.startsWith('/') || from.startsWith('//')) return null;
  if (from === '/' || from.startsWith('/sign-in')) return null;
  return from;
}
