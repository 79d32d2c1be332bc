import { QueryClient } from '@tanstack/react-query';
import { ApiRequestError } from './api-error';

/**
 * Client errors (4xx) are answers, not glitches: retrying a 403 or a validation failure only
 * delays the message. Network and server errors get one more try.
 */
export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        retry: (failureCount, error) => {
          if (error instanceof ApiRequestError && error.status < 500) return false;
          return failureCount < 1;
        },
      },
      mutations: { retry: false },
    },
  });
}
