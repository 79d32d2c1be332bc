import { Alert, Card, Group, Table, Text } from '@mantine/core';
import { adjustmentVerdict, type AccuracyZoneDto } from '@morrowline/shared';
import { replayedNote, summaryRows } from '../model/accuracy-data';

/** Model against schedule for one zone or the system total, and whether the adjustments helped. */
export function AccuracySummary({ subject }: { subject: AccuracyZoneDto }) {
  const rows = summaryRows(subject.model, subject.schedule);
  const c = subject.comparison;
  const color = c.difference === null ? 'gray' : c.difference < 0 ? 'teal' : c.difference > 0 ? 'ember' : 'gray';
  return (
    <Card withBorder padding="md" data-testid="accuracy-summary">
      <Group justify="space-between" mb="xs" wrap="wrap">
        <Text fw={600}>{subject.zone === 'SYSTEM' ? 'System total' : `${subject.zoneName} (${subject.zone})`}</Text>
        <Text size="sm" c="dimmed">
          {subject.daysScored} of {subject.days.length} days scored · {subject.daysWithoutActuals} without actuals · {subject.daysWithoutForecast} without a model forecast · {subject.daysWithoutSchedule} without a published schedule
        </Text>
      </Group>
      <Table withTableBorder={false} striped={false} verticalSpacing={4} ff="monospace" fz="sm">
        <Table.Thead>
          <Table.Tr>
            <Table.Th />
            <Table.Th ta="right">Model forecast</Table.Th>
            <Table.Th ta="right">Published schedule</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {rows.map((r) => (
            <Table.Tr key={r.label}>
              <Table.Td ff="text">{r.label}</Table.Td>
              <Table.Td ta="right">{r.model}</Table.Td>
              <Table.Td ta="right">{r.schedule}</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
      <Alert mt="sm" variant="light" color={color} data-testid="accuracy-verdict">
        {adjustmentVerdict(c)}
      </Alert>
      {subject.daysReplayed > 0 && (
        <Alert mt="sm" variant="light" color="grape" title="Replayed model forecasts" data-testid="accuracy-replayed-note">
          {replayedNote(subject.daysReplayed, subject.days.length)}
        </Alert>
      )}
      <Text size="xs" c="dimmed" mt="xs">
        Bias is the mean of forecast minus actual: positive means the forecast was too high (over-forecast), negative too low. Peak-hour error is the error at the hour of each day&apos;s highest actual load.
      </Text>
    </Card>
  );
}
