import { Card, Loader, Table, Text, Title } from '@mantine/core';
import type { ZoneDto } from '@morrowline/shared';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { formatDateTime, formatSignedPercent } from '../../../lib/format';
import { ALERT_HISTORY_SIZE, useAlertHistory } from '../api/use-alert-history';
import { alertComparedWith } from './alert-compared-with';
import { alertHours } from './alert-hours';

/** Acknowledged alerts, newest acknowledgement first: who acknowledged which, when, and what they said. */
export function AlertHistory({ zones }: { zones: readonly ZoneDto[] }) {
  const history = useAlertHistory();
  const zoneOf = (code: string) => zones.find((z) => z.code === code);
  return (
    <Card withBorder padding="md">
      <Title order={4} mb="xs">Alert history</Title>
      {history.isPending && <Loader size="sm" />}
      {history.isError && <ErrorNotice error={history.error} />}
      {history.data?.length === 0 && <Text size="sm" c="dimmed">No alert has been acknowledged yet.</Text>}
      {history.data && history.data.length > 0 && (
        <>
          <Text size="xs" c="dimmed" mb="xs">The last {ALERT_HISTORY_SIZE} acknowledged alerts; times in each zone’s own clock.</Text>
          <Table aria-label="Acknowledged deviation alerts" data-testid="alert-history">
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Zone</Table.Th>
                <Table.Th>Hours</Table.Th>
                <Table.Th>Peak deviation</Table.Th>
                <Table.Th>Against (at the peak)</Table.Th>
                <Table.Th>Acknowledged by</Table.Th>
                <Table.Th>When</Table.Th>
                <Table.Th>Comment</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {history.data.map((alert) => {
                const zone = zoneOf(alert.zone);
                const tz = zone?.timeZone ?? 'UTC';
                return (
                  <Table.Tr key={alert.id} data-testid={`alert-history-row-${alert.id}`}>
                    <Table.Td>{zone?.name ?? alert.zone}</Table.Td>
                    <Table.Td ff="monospace">{alertHours(alert, tz)}</Table.Td>
                    <Table.Td ff="monospace">
                      {formatSignedPercent(alert.peakDeviationPct)}
                    </Table.Td>
                    <Table.Td>{alertComparedWith(alert)}</Table.Td>
                    <Table.Td>{alert.acknowledgedByName ?? alert.acknowledgedBy ?? '—'}</Table.Td>
                    <Table.Td ff="monospace">{formatDateTime(alert.acknowledgedAt, tz)}</Table.Td>
                    <Table.Td>{alert.comment ?? <Text span c="dimmed" size="sm">none</Text>}</Table.Td>
                  </Table.Tr>
                );
              })}
            </Table.Tbody>
          </Table>
        </>
      )}
    </Card>
  );
}
