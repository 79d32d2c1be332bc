import { Alert, Center, Paper, Stack, Text, Title } from '@mantine/core';
import type { UserDto } from '@morrowline/shared';
import { useDocumentTitle } from '@mantine/hooks';
import { Navigate, useLocation, useNavigate } from 'react-router-dom';
import { Wordmark } from '../../../components/Wordmark';
import { useSession } from '../hooks/use-session';
import { SignInForm } from '../components/SignInForm';
import { SESSION_EXPIRED_MESSAGE } from '../sign-in-messages';
import { readReturnPath, type SignInLocationState } from '../return-path';

interface SignInPageProps {
  /** Where a role lands when it did not come from a particular page. */
  homePathFor: (user: UserDto) => string;
}

export function SignInPage({ homePathFor }: SignInPageProps) {
  useDocumentTitle('Sign in · Morrowline');
  const location = useLocation();
  const navigate = useNavigate();
  const { session, endReason } = useSession();
  const state = location.state as SignInLocationState | null;
  const returnPath = readReturnPath(state);

  // Someone who is signed in and opens /sign-in goes straight back to work.
  if (session && !returnPath) return <Navigate to="/" replace />;

  const expired = endReason === 'expired' || state?.expired === true;

  return (
    <Center component="main" mih="100vh" p="md">
      <Stack w="100%" maw={400} gap="lg">
        <Center>
          <Wordmark size={40} />
        </Center>
        <Paper withBorder shadow="sm" p="xl" radius="md">
          <Stack gap="md">
            <div>
              <Title order={1} size="h3">Sign in</Title>
              <Text size="sm" c="dimmed">
                The day-ahead load desk
              </Text>
            </div>
            {expired && (
              <Alert color="dusk" variant="light" data-testid="session-expired">
                {SESSION_EXPIRED_MESSAGE}
              </Alert>
            )}
            <SignInForm
              onSignedIn={(user) => navigate(returnPath ?? homePathFor(user), { replace: true })}
            />
          </Stack>
        </Paper>
        <Text size="xs" c="dimmed" ta="center">
          Forecasts support, and never replace, the judgement of the responsible system operator.
        </Text>
      </Stack>
    </Center>
  );
}
