import { Badge } from '@mantine/core';
import { useDeskConnectionState } from '../../../lib/desk-socket';

const TEXT = { connected: 'Live updates on', connecting: 'Reconnecting…', offline: 'Live updates off' } as const;
const COLOR = { connected: 'tide', connecting: 'ember', offline: 'slate' } as const;

/** Whether readings arrive on their own right now. */
export function ConnectionBadge() {
  const state = useDeskConnectionState();
  return (
    <Badge color={COLOR[state]} variant="dot" data-testid="live-connection" data-state={state}>
      {TEXT[state]}
    </Badge>
  );
}
