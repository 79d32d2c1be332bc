import type { UserDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { useSession } from '../hooks/use-session';
import { currentUserKey } from './current-user-key';

export function fetchCurrentUser(signal?: AbortSignal): Promise<UserDto> {
  return api.get<UserDto>('/auth/me', { signal });
}

/** GET /api/auth/me, only while there is a session to ask about. */
export function useCurrentUser() {
  const { session } = useSession();
  return useQuery({
    queryKey: currentUserKey,
    queryFn: ({ signal }) => fetchCurrentUser(signal),
    enabled: session !== null,
    staleTime: 60_000,
  });
}

/**
 * The signed-in user, for screens inside the session guard (which waits for it to load).
 * Outside the guard this is a programming error, so it throws rather than returning undefined.
 */
export function useSignedInUser(): UserDto {
  const { data } = useCurrentUser();
  if (!data) throw new Error('useSignedInUser was called outside the signed-in part of the app.');
  return data;
}
