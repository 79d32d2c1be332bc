import { Stack, Table, Text } from '@mantine/core';
import type { ShiftEventDto } from '@morrowline/shared';
import { formatClock } from './shift-time';

interface ShiftEventsListProps {
  events: ShiftEventDto[];
  timeZone: string;
  /** Accessible name of the table. */
  label?: string;
}

/** What the audit trail recorded during a shift: alerts, outages, refits, schedules, uploads. */
export function ShiftEventsList({ events, timeZone, label = 'Shift events' }: ShiftEventsListProps) {
  if (events.length === 0) {
    return (
      <Text size="sm" c="dimmed" data-testid="no-shift-events">
        Nothing recorded for this shift yet: no alerts, outages, refits, schedules or uploads.
      </Text>
    );
  }
  return (
    <Table aria-label={label} verticalSpacing={6} highlightOnHover={false}>
      <Table.Thead>
        <Table.Tr>
          <Table.Th w={64}>Time</Table.Th>
          <Table.Th>What happened</Table.Th>
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {events.map((event, index) => (
          <Table.Tr key={`${event.at}-${index}`}>
            <Table.Td className="numeric" valign="top">
              {formatClock(event.at, timeZone)}
            </Table.Td>
            <Table.Td>
              <Stack gap={0}>
                <Text size="sm">{event.summary}</Text>
                <Text size="xs" c="dimmed">
                  {event.actorEmail ?? 'the desk itself'}
                  {event.reason ? ` · why: ${event.reason}` : ''}
                </Text>
              </Stack>
            </Table.Td>
          </Table.Tr>
        ))}
      </Table.Tbody>
    </Table>
  );
}
