/** The query-cache key under which the signed-in user lives. */
export const currentUserKey = ['auth', 'me'] as const;
