import { Alert, Text } from '@mantine/core';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { serverStatusStore, useServerStatus, type ServerStatusStore } from '../lib/server-status';

/** How often the desk asks whether the database is back while it is out. */
export const DATABASE_RETRY_MS = 5_000;

/**
 * While the server cannot reach its database: a banner saying so, the session kept, and a check
 * of GET /api/health every few seconds. When the database answers again, every query on the
 * screen is fetched afresh and the banner goes.
 */
export function DatabaseOutageBanner({ store = serverStatusStore, retryMs = DATABASE_RETRY_MS }: { store?: ServerStatusStore; retryMs?: number }) {
  const status = useServerStatus(store);
  const queryClient = useQueryClient();

  useEffect(() => {
    if (status !== 'database-down') return;
    let stopped = false;
    const timer = setInterval(() => {
      // Health answers 200 only when the database is up (503 with database "down" otherwise).
      void globalThis
        .fetch('/api/health', { headers: { Accept: 'application/json' } })
        .then((response) => {
          if (stopped || !response.ok) return;
          store.reachable();
          void queryClient.invalidateQueries();
        })
        .catch(() => undefined);
    }, retryMs);
    return () => {
      stopped = true;
      clearInterval(timer);
    };
  }, [status, store, retryMs, queryClient]);

  if (status !== 'database-down') return null;
  return (
    <Alert color="ember" variant="filled" radius="md" mb="md" role="alert" data-testid="database-outage-banner" title="The server cannot reach its database">
      <Text size="sm">
        You are still signed in. Screens may show older data and changes cannot be saved until it is back; trying again every{' '}
        {Math.round(retryMs / 1000)} seconds.
      </Text>
    </Alert>
  );
}
