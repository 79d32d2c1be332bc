import { Alert, Anchor, Text } from '@mantine/core';
import { may } from '@morrowline/shared';
import { Link, useLocation } from 'react-router-dom';
import { useSignedInUser } from '../../auth';
import { mayWriteHandover } from '../acknowledge-rule';
import { usePendingHandovers } from '../api/use-pending-handovers';
import { SHIFT_LOG_PATH } from '../shift-log-path';
import { formatDayClock } from './shift-time';

/**
 * On every desk screen while a handover waits: who wrote it and the way to the shift log. Not
 * on the shift log itself, which lists the waiting notes first; not for viewers and
 * administrators, who take no part in the shift (and may not read its notes).
 */
export function PendingHandoverBanner() {
  const user = useSignedInUser();
  const { pathname } = useLocation();
  // Handover notes are the forecasting roles' (viewers and admin may not read them).
  const readsNotes = may(user.role, 'readDeskWork');
  const hidden = !readsNotes || pathname.startsWith(SHIFT_LOG_PATH);
  const pending = usePendingHandovers(readsNotes);
  if (hidden || !pending.data || pending.data.length === 0) return null;

  const newest = pending.data[0];
  const others = pending.data.length - 1;
  const own = newest.author.id === user.id;
  const forDesk = mayWriteHandover(user);
  return (
    <Alert color="ember" variant="filled" radius="md" mb="md" role="status" data-testid="pending-handover-banner" data-print-hide>
      <Text size="sm" fw={500}>
        {own ? 'Your handover' : `Handover from ${newest.author.name}`} ({newest.shift.label}, written{' '}
        {formatDayClock(newest.createdAt, newest.shift.timeZone)}) is waiting to be acknowledged
        {others > 0 ? `, with ${others} more` : ''}.{' '}
        {forDesk && (
          <Anchor component={Link} to={SHIFT_LOG_PATH} c="white" fw={700} underline="always">
            {own ? 'Open the shift log' : 'Read and acknowledge it'}
          </Anchor>
        )}
      </Text>
    </Alert>
  );
}
