import { Code, SimpleGrid, Stack, Text } from '@mantine/core';
import type { AuditEntryDto } from '@morrowline/shared';

/** Before and after, side by side, as the server recorded them. */
export function AuditChange({ entry }: { entry: AuditEntryDto }) {
  return (
    <SimpleGrid cols={{ base: 1, sm: 2 }} spacing="sm" data-testid={`audit-change-${entry.id}`}>
      <Snapshot label="Before" value={entry.before} />
      <Snapshot label="After" value={entry.after} />
    </SimpleGrid>
  );
}

function Snapshot({ label, value }: { label: string; value: unknown }) {
  return (
    <Stack gap={4}>
      <Text size="xs" fw={600} c="dimmed" tt="uppercase">
        {label}
      </Text>
      {value === null || value === undefined ? (
        <Text size="sm" c="dimmed">
          Nothing recorded
        </Text>
      ) : (
        <Code block>{JSON.stringify(value, null, 2)}</Code>
      )}
    </Stack>
  );
}
