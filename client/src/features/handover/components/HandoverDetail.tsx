import { Button, Center, Group, Loader, Stack, Text, Title } from '@mantine/core';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { useHandoverNote } from '../api/use-handover-note';
import { HandoverNoteCard } from './HandoverNoteCard';
import { ShiftEventsList } from './ShiftEventsList';
import './handover-print.css';

/** One note with its shift's events; also the page that prints. */
export function HandoverDetail({ id, onBack }: { id: number; onBack: () => void }) {
  const note = useHandoverNote(id);
  return (
    <Stack gap="md" data-handover-print data-testid="handover-detail">
      <Group data-print-hide>
        <Button variant="subtle" onClick={onBack}>
          ← Back to past notes
        </Button>
        <Button variant="light" onClick={() => window.print()} disabled={!note.data}>
          Print
        </Button>
      </Group>
      {note.isPending && (
        <Center p="xl">
          <Loader aria-label="Loading the note" />
        </Center>
      )}
      {note.isError && <ErrorNotice title="The note could not be loaded" error={note.error} onRetry={() => void note.refetch()} />}
      {note.data && (
        <>
          <Title order={3}>Handover · {note.data.shift.label}</Title>
          <HandoverNoteCard note={note.data}>
            <Stack gap={4}>
              <Title order={5}>Events of the shift</Title>
              <Text size="xs" c="dimmed">
                From the audit trail, from the start of the shift until the note was written.
              </Text>
              <ShiftEventsList events={note.data.events} timeZone={note.data.shift.timeZone} />
            </Stack>
          </HandoverNoteCard>
        </>
      )}
    </Stack>
  );
}
