import type { LoginRequest, LoginResponse } from '@morrowline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { sessionStore } from '../../../lib/session-store';
import { currentUserKey } from './current-user-key';

export function signIn(credentials: LoginRequest): Promise<LoginResponse> {
  return api.post<LoginResponse>('/auth/login', credentials, { authenticated: false });
}

/** POST /api/auth/login; on success the token goes to the session store and the user to the cache. */
export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (response) => {
      queryClient.setQueryData(currentUserKey, response.user);
      sessionStore.start(response.accessToken, response.expiresIn);
    },
  });
}
