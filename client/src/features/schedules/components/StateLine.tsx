import { ATTENTION_TEXT } from '../../../lib/text-colors';
import { Badge, Group, Stack, Text } from '@mantine/core';
import type { ScheduleRevisionDto } from '@morrowline/shared';
import { formatDateTime } from '../../../lib/format';
import { STATE_COLORS, STATE_LABELS } from '../model/states';

/** A revision's state in words, with who did what and when. */
export function StateLine({ revision, timeZone }: { revision: ScheduleRevisionDto; timeZone: string }) {
  const at = (iso: string | null) => formatDateTime(iso, timeZone);
  return (
    <Stack gap={2} data-testid="revision-state">
      <Group gap="xs">
        <Text fw={600}>Revision {revision.revision}</Text>
        <Badge color={STATE_COLORS[revision.state]} size="lg">{STATE_LABELS[revision.state]}</Badge>
        {revision.late && <Badge color="ember" variant="filled">Late: submitted after gate closure</Badge>}
      </Group>
      <Text size="sm" c="dimmed">
        Started by {revision.createdBy.name}, {at(revision.createdAt)}
        {revision.correctionReason && <> — correction: {revision.correctionReason}</>}
      </Text>
      {revision.submittedBy && (
        <Text size="sm">
          Submitted by {revision.submittedBy.name}, {at(revision.submittedAt)}
          {revision.submitComment && <> — “{revision.submitComment}”</>}
        </Text>
      )}
      {revision.state === 'returned' && revision.returnedBy && (
        <Text size="sm" c={ATTENTION_TEXT} data-testid="return-comment">
          Returned by {revision.returnedBy.name}, {at(revision.returnedAt)}: “{revision.returnComment}”
        </Text>
      )}
      {revision.publishedBy && (
        <Text size="sm">
          Approved and published by {revision.publishedBy.name}, {at(revision.publishedAt)}
        </Text>
      )}
      {revision.supersededAt && <Text size="sm" c="dimmed">Superseded {at(revision.supersededAt)}</Text>}
      {revision.mail && (
        <Text size="xs" c={revision.mail.error ? ATTENTION_TEXT : 'dimmed'}>
          {revision.mail.error ? `E-mail to subscribers failed: ${revision.mail.error}` : `E-mailed to ${revision.mail.sent.length} subscriber${revision.mail.sent.length === 1 ? '' : 's'}.`}
        </Text>
      )}
    </Stack>
  );
}
