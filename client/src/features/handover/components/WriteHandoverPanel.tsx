import { Alert, Button, Center, Grid, Loader, Paper, Stack, Text, Title } from '@mantine/core';
import type { HandoverNoteDto } from '@morrowline/shared';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { useHandoverDraft } from '../api/use-handover-draft';
import { ShiftEventsList } from './ShiftEventsList';
import { formatClock } from './shift-time';
import { WriteHandoverForm } from './WriteHandoverForm';

/** The form for the outgoing shift, with what the audit trail gathered for the shift beside it. */
export function WriteHandoverPanel() {
  const draft = useHandoverDraft({ enabled: true });
  const [written, setWritten] = useState<HandoverNoteDto | null>(null);
  // A new form per note, so a second note starts from the items the first left open.
  const [formRound, setFormRound] = useState(0);

  if (draft.isPending) {
    return (
      <Center p="xl">
        <Loader aria-label="Loading this shift's events" />
      </Center>
    );
  }
  if (draft.isError) return <ErrorNotice title="This shift's events could not be gathered" error={draft.error} onRetry={() => void draft.refetch()} />;

  return (
    <Grid gap="lg">
      <Grid.Col span={{ base: 12, md: 7 }}>
        <Paper withBorder radius="md" p="md">
          <Title order={3} mb="sm">
            Write handover
          </Title>
          {written ? (
            <Alert color="tide" title="Handed over" data-testid="handed-over">
              <Stack gap="xs" align="flex-start">
                <Text size="sm">
                  Your note for {written.shift.label} is saved. It shows as waiting on every desk screen until the next operator
                  or supervisor acknowledges it.
                </Text>
                <Button
                  size="xs"
                  variant="light"
                  onClick={() => {
                    setWritten(null);
                    setFormRound((round) => round + 1);
                  }}
                >
                  Write another note
                </Button>
              </Stack>
            </Alert>
          ) : (
            <WriteHandoverForm key={formRound} draft={draft.data} onWritten={setWritten} />
          )}
        </Paper>
      </Grid.Col>
      <Grid.Col span={{ base: 12, md: 5 }}>
        <Paper withBorder radius="md" p="md" component="section" aria-label="Gathered for this shift">
          <Title order={4}>Gathered for this shift</Title>
          <Text size="sm" c="dimmed" mb="xs">
            From the audit trail since the shift began at {formatClock(draft.data.shift.start, draft.data.shift.timeZone)}. They stay with the note in its history.
          </Text>
          <ShiftEventsList events={draft.data.events} timeZone={draft.data.shift.timeZone} label="Events this shift" />
        </Paper>
      </Grid.Col>
    </Grid>
  );
}
