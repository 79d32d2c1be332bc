import { Button, Group, Stack, Textarea } from '@mantine/core';
import type { HandoverNoteDto } from '@morrowline/shared';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { notifySuccess } from '../../../lib/notify';
import { useAcknowledgeHandover } from '../api/use-acknowledge-handover';

/** "I have read it and I have the desk", with an optional reply to the outgoing shift. */
export function AcknowledgeForm({ note }: { note: HandoverNoteDto }) {
  const [reply, setReply] = useState('');
  const acknowledge = useAcknowledgeHandover();
  return (
    <Stack gap="xs" data-print-hide>
      <Textarea
        label="Reply to the outgoing shift (optional)"
        placeholder="Questions, or anything you want them to know"
        autosize
        minRows={1}
        maxLength={5000}
        value={reply}
        onChange={(event) => setReply(event.currentTarget.value)}
      />
      {acknowledge.isError && <ErrorNotice title="The handover was not acknowledged" error={acknowledge.error} />}
      <Group>
        <Button
          loading={acknowledge.isPending}
          onClick={() =>
            acknowledge.mutate(
              { id: note.id, reply },
              { onSuccess: () => notifySuccess(`Handover from ${note.author.name} acknowledged: you have the desk`) },
            )
          }
        >
          Acknowledge
        </Button>
      </Group>
    </Stack>
  );
}
