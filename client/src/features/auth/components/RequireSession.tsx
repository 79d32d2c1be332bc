import { Center, Loader, Stack } from '@mantine/core';
import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { DatabaseOutageBanner } from '../../../components/DatabaseOutageBanner';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { useCurrentUser } from '../api/use-current-user';
import { useSession } from '../hooks/use-session';
import type { SignInLocationState } from '../return-path';

/**
 * The gate in front of every signed-in screen: without a token it sends the browser to the
 * sign-in screen, remembering the page so that sign-in can return there; with one it waits
 * for GET /api/auth/me so that every screen below can rely on knowing the user and role.
 */
export function RequireSession({ children }: { children: ReactNode }) {
  const location = useLocation();
  const { session, endReason } = useSession();
  const currentUser = useCurrentUser();

  if (!session) {
    const state: SignInLocationState =
      endReason === 'signed-out'
        ? {}
        : { from: location.pathname + location.search + location.hash, expired: endReason === 'expired' };
    return <Navigate to="/sign-in" replace state={state} />;
  }

  if (currentUser.data) return <>{children}</>;

  if (currentUser.isError) {
    return (
      <Center mih="100vh" p="md">
        <Stack maw={420}>
          <DatabaseOutageBanner />
          <ErrorNotice
            title="Could not load your account"
            error={currentUser.error}
            onRetry={() => void currentUser.refetch()}
          />
        </Stack>
      </Center>
    );
  }

  return (
    <Center mih="100vh">
      <Loader aria-label="Loading your account" />
    </Center>
  );
}
