import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { sessionStore } from '../../../lib/session-store';

/**
 * POST /api/auth/logout, then forget the token whatever the server said: a sign-out must
 * never fail from the user's point of view.
 */
export function useSignOut() {
  return useMutation({
    mutationFn: async () => {
      try {
        await api.post<void>('/auth/logout');
      } catch {
        // The server may be down or the token already expired; the local sign-out still counts.
      }
    },
    onSettled: () => sessionStore.end('signed-out'),
  });
}
