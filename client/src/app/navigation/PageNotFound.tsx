import { Button, EmptyState, Paper } from '@mantine/core';
import { Link } from 'react-router-dom';

export function PageNotFound() {
  return (
    <Paper withBorder p="xl" radius="md">
      <EmptyState title="No such page" description="The address does not match any screen of the desk.">
        <EmptyState.Actions>
          <Button component={Link} to="/" variant="light">
            Back to my desk
          </Button>
        </EmptyState.Actions>
      </EmptyState>
    </Paper>
  );
}
