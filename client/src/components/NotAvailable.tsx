import { Button, EmptyState, Paper } from '@mantine/core';
import { Link } from 'react-router-dom';

interface NotAvailableProps {
  /** The screen that was asked for, e.g. "Users". */
  screen: string;
  roleLabel: string;
  homePath: string;
}

/** Shown when a role reaches a screen by URL that its navigation does not offer. */
export function NotAvailable({ screen, roleLabel, homePath }: NotAvailableProps) {
  return (
    <Paper withBorder p="xl" radius="md" data-testid="not-available">
      <EmptyState
        title={`${screen} is not available for your role`}
        description={`Signed in as ${roleLabel}. Ask a desk administrator if you need access.`}
        variant="light"
        color="ember"
        icon={<LockGlyph />}
      >
        <EmptyState.Actions>
          <Button component={Link} to={homePath} variant="light">
            Back to my desk
          </Button>
        </EmptyState.Actions>
      </EmptyState>
    </Paper>
  );
}

function LockGlyph() {
  return (
    <svg width="26" height="26" viewBox="0 0 24 24" aria-hidden="true" fill="none" stroke="currentColor" strokeWidth="1.8">
      <rect x="5" y="10.5" width="14" height="10" rx="2" />
      <path d="M8 10.5V8a4 4 0 0 1 8 0v2.5" strokeLinecap="round" />
    </svg>
  );
}
