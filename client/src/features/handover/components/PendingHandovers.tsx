import { Stack, Text, Title } from '@mantine/core';
import type { UserDto } from '@morrowline/shared';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { mayAcknowledge } from '../acknowledge-rule';
import { usePendingHandovers } from '../api/use-pending-handovers';
import { AcknowledgeForm } from './AcknowledgeForm';
import { HandoverNoteCard } from './HandoverNoteCard';

/** Notes nobody has acknowledged, first on the shift log; the incoming shift acknowledges here. */
export function PendingHandovers({ user }: { user: Pick<UserDto, 'id' | 'role'> }) {
  const pending = usePendingHandovers();
  if (pending.isError) return <ErrorNotice title="Waiting handovers could not be loaded" error={pending.error} onRetry={() => void pending.refetch()} />;
  if (!pending.data || pending.data.length === 0) return null;
  return (
    <Stack gap="sm" component="section" aria-label="Waiting handovers" data-testid="pending-handovers" data-print-hide>
      <Title order={3}>Waiting to be acknowledged</Title>
      {pending.data.map((note) => (
        <HandoverNoteCard key={note.id} note={note} highlighted>
          {mayAcknowledge(user, note) ? (
            <AcknowledgeForm note={note} />
          ) : (
            <Text size="sm" c="dimmed" data-testid="no-acknowledge-reason">
              {note.author.id === user.id
                ? 'Your handover: the next operator or supervisor on shift acknowledges it.'
                : 'An operator or supervisor of the incoming shift acknowledges this handover.'}
            </Text>
          )}
        </HandoverNoteCard>
      ))}
    </Stack>
  );
}
