import { Button, Center, EmptyState } from '@mantine/core';
import { useRouteError } from 'react-router-dom';
import { describeError } from '../../lib/api-error';

/** A screen that crashed: say so plainly and offer a way back, instead of the router's default page. */
export function RouteError() {
  const error = useRouteError();
  const { message } = describeError(error);
  return (
    <Center mih="60vh" p="md">
      <EmptyState title="This screen ran into a problem" description={message}>
        <EmptyState.Actions>
          <Button variant="light" onClick={() => window.location.assign('/')}>
            Reload the desk
          </Button>
        </EmptyState.Actions>
      </EmptyState>
    </Center>
  );
}
