import type { UserDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { usersKey } from './users-key';

/** GET /api/users (admin). */
export function useUsers() {
  return useQuery({
    queryKey: usersKey,
    queryFn: ({ signal }) => api.get<UserDto[]>('/users', { signal }),
  });
}
