import { Button, Popover, Stack, Textarea } from '@mantine/core';
import type { AlertDto } from '@morrowline/shared';
import { useState } from 'react';
import { useAcknowledgeAlert } from '../api/use-acknowledge-alert';

/** "Acknowledge" with an optional comment, for operators and supervisors. */
export function AcknowledgeAlert({ alert }: { alert: AlertDto }) {
  const [opened, setOpened] = useState(false);
  const [comment, setComment] = useState('');
  const acknowledge = useAcknowledgeAlert();
  const submit = () => acknowledge.mutate({ id: alert.id, comment }, { onSuccess: () => setOpened(false) });
  return (
    <Popover opened={opened} onChange={setOpened} position="bottom-end" withArrow trapFocus>
      <Popover.Target>
        <Button size="xs" variant="light" onClick={() => setOpened((o) => !o)}>
          Acknowledge
        </Button>
      </Popover.Target>
      <Popover.Dropdown>
        <Stack gap="xs" w={280}>
          <Textarea label="Comment (optional)" placeholder="What is known about it" autosize minRows={2} maxLength={500} value={comment} onChange={(e) => setComment(e.currentTarget.value)} />
          <Button size="xs" onClick={submit} loading={acknowledge.isPending}>
            Acknowledge alert
          </Button>
        </Stack>
      </Popover.Dropdown>
    </Popover>
  );
}
