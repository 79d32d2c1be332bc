import { Badge, Group, Paper, Skeleton, Stack, Text, Title } from '@mantine/core';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { ROLE_COLORS, ROLE_LABELS } from '../../../lib/roles';
import { useCurrentShift } from '../api/use-current-shift';
import { formatDayClock } from './shift-time';

/** The shift now running, its times in the desk's local time, and who signed in for it. */
export function CurrentShiftPanel() {
  const shift = useCurrentShift();
  return (
    <Paper withBorder radius="md" p="md" data-testid="current-shift" data-print-hide>
      {shift.isPending && <Skeleton h={48} />}
      {shift.isError && <ErrorNotice title="The current shift could not be loaded" error={shift.error} onRetry={() => void shift.refetch()} />}
      {shift.data && (
        <Group justify="space-between" align="flex-start" wrap="wrap" gap="lg">
          <Stack gap={2}>
            <Text size="xs" c="dimmed" tt="uppercase" fw={600}>
              Shift now
            </Text>
            <Title order={3} data-testid="current-shift-label">
              {shift.data.current.label}
            </Title>
            <Text size="sm" c="dimmed">
              {formatDayClock(shift.data.current.start, shift.data.current.timeZone)} to{' '}
              {formatDayClock(shift.data.current.end, shift.data.current.timeZone)} · {shift.data.current.timeZone} · before it:{' '}
              {shift.data.previous.label}
            </Text>
          </Stack>
          <Stack gap={4}>
            <Text size="xs" c="dimmed" tt="uppercase" fw={600}>
              Signed in this shift
            </Text>
            {shift.data.onShift.length === 0 ? (
              <Text size="sm" c="dimmed">
                No operator or supervisor yet
              </Text>
            ) : (
              <Group gap="xs" data-testid="on-shift">
                {shift.data.onShift.map((person) => (
                  <Badge key={person.id} color={ROLE_COLORS[person.role as keyof typeof ROLE_COLORS] ?? 'slate'} size="lg" tt="none">
                    {person.name} · {ROLE_LABELS[person.role as keyof typeof ROLE_LABELS] ?? person.role}
                  </Badge>
                ))}
              </Group>
            )}
          </Stack>
        </Group>
      )}
    </Paper>
  );
}
