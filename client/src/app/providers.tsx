import { localStorageColorSchemeManager, MantineProvider } from '@mantine/core';
import { Notifications } from '@mantine/notifications';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { useEffect, useState, type ReactNode } from 'react';
import { sessionStore } from '../lib/session-store';
import { createQueryClient } from '../lib/query-client';
import { cssVariablesResolver } from './css-variables';
import { theme } from './theme';

const colorSchemeManager = localStorageColorSchemeManager({ key: 'morrowline.color-scheme' });

interface AppProvidersProps {
  children: ReactNode;
  /** Tests pass their own client so that each starts with an empty cache. */
  queryClient?: QueryClient;
}

export function AppProviders({ children, queryClient: given }: AppProvidersProps) {
  const [queryClient] = useState(() => given ?? createQueryClient());

  // When a session ends, nothing the last user fetched may linger for the next one.
  useEffect(
    () =>
      sessionStore.subscribe(() => {
        if (!sessionStore.getSnapshot().session) queryClient.clear();
      }),
    [queryClient],
  );

  return (
    <MantineProvider
      theme={theme}
      colorSchemeManager={colorSchemeManager}
      defaultColorScheme="auto"
      cssVariablesResolver={cssVariablesResolver}
    >
      <Notifications position="top-right" limit={4} />
      <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>
    </MantineProvider>
  );
}
