import { Button, Group, Modal, Stack, Text } from '@mantine/core';
import type { ScheduleRevisionDto } from '@morrowline/shared';
import { describeScheduleSummary, scheduleSummary } from '../model/summary';

interface ConfirmPublishDialogProps {
  zoneName: string;
  revision: ScheduleRevisionDto;
  pending: boolean;
  onConfirm: () => void;
  onClose: () => void;
}

/**
 * Publishing sends the schedule to the market and the subscribers and cannot be taken back (only
 * corrected by a later revision), so the supervisor confirms what is about to go out.
 */
export function ConfirmPublishDialog({ zoneName, revision, pending, onConfirm, onClose }: ConfirmPublishDialogProps) {
  const summary = scheduleSummary(revision.hours);
  return (
    <Modal opened onClose={onClose} title={`Publish ${zoneName}, revision ${revision.revision}?`}>
      <Stack gap="sm">
        <Text size="sm" data-testid="publish-summary">
          Operating day {revision.operatingDay}: {describeScheduleSummary(summary)}.
        </Text>
        <Text size="sm">
          It becomes the schedule in force and is e-mailed to the zone&apos;s subscribers. It cannot be withdrawn, only corrected by a later revision.
        </Text>
        <Group justify="flex-end">
          <Button variant="default" onClick={onClose}>
            Cancel
          </Button>
          <Button loading={pending} onClick={onConfirm}>
            Publish revision {revision.revision}
          </Button>
        </Group>
      </Stack>
    </Modal>
  );
}
