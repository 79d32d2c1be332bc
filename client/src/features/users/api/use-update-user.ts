import type { UpdateUserRequest, UserDto } from '@morrowline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { usersKey } from './users-key';

export interface UpdateUserVariables {
  id: number;
  changes: UpdateUserRequest;
}

/** PATCH /api/users/:id (admin): role, active, name, with a reason for the audit trail. */
export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, changes }: UpdateUserVariables) => api.patch<UserDto>(`/users/${id}`, changes),
    onSuccess: (updated) => {
      // Show the change at once, then confirm it with a fresh list.
      queryClient.setQueryData<UserDto[]>(usersKey, (users) =>
        users?.map((user) => (user.id === updated.id ? updated : user)),
      );
      return queryClient.invalidateQueries({ queryKey: usersKey });
    },
  });
}
