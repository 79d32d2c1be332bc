import type { CreateUserRequest, UserDto } from '@morrowline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { usersKey } from './users-key';

/** POST /api/users (admin). */
export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: CreateUserRequest) => api.post<UserDto>('/users', request),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersKey }),
  });
}
