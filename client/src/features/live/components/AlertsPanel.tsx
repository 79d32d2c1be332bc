import { ATTENTION_TEXT } from '../../../lib/text-colors';
import { Alert, Badge, Card, Group, Loader, Table, Text, Title } from '@mantine/core';
import type { ZoneDto } from '@morrowline/shared';
import { formatDateTime, formatPercent, formatSignedPercent } from '../../../lib/format';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { useOpenAlerts } from '../api/use-open-alerts';
import { AcknowledgeAlert } from './AcknowledgeAlert';
import { alertComparedWith } from './alert-compared-with';
import { alertHours } from './alert-hours';

interface AlertsPanelProps {
  zones: readonly ZoneDto[];
  mayAcknowledge: boolean;
}

/**
 * Open deviation alerts, newest first, each with what it was measured against (the published
 * schedule or the day-ahead forecast); operators and supervisors acknowledge them here.
 */
export function AlertsPanel({ zones, mayAcknowledge }: AlertsPanelProps) {
  const alerts = useOpenAlerts();
  const zoneOf = (code: string) => zones.find((z) => z.code === code);
  return (
    <Card withBorder padding="md">
      <Group justify="space-between" mb="xs">
        <Title order={4}>Open deviation alerts</Title>
        {alerts.data && <Badge color={alerts.data.length > 0 ? 'ember' : 'slate'} data-testid="open-alert-count">{alerts.data.length} open</Badge>}
      </Group>
      {alerts.isPending && <Loader size="sm" />}
      {alerts.isError && <ErrorNotice error={alerts.error} />}
      {alerts.data?.length === 0 && <Text size="sm" c="dimmed">No open alerts: every zone is within its threshold.</Text>}
      {alerts.data && alerts.data.length > 0 && (
        <Table aria-label="Open deviation alerts" data-testid="alerts-table">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Zone</Table.Th>
              <Table.Th>Hours</Table.Th>
              <Table.Th>Peak deviation</Table.Th>
              <Table.Th>Against (at the peak)</Table.Th>
              <Table.Th>Raised</Table.Th>
              <Table.Th />
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {alerts.data.map((alert) => {
              const zone = zoneOf(alert.zone);
              const tz = zone?.timeZone ?? 'UTC';
              return (
                <Table.Tr key={alert.id} data-testid={`alert-row-${alert.id}`}>
                  <Table.Td>{zone?.name ?? alert.zone}</Table.Td>
                  <Table.Td ff="monospace">{alertHours(alert, tz)}</Table.Td>
                  <Table.Td ff="monospace" c={ATTENTION_TEXT}>
                    {formatSignedPercent(alert.peakDeviationPct)} <Text span size="xs" c="dimmed">(threshold {formatPercent(alert.thresholdPct, 0)})</Text>
                  </Table.Td>
                  <Table.Td>{alertComparedWith(alert)}</Table.Td>
                  <Table.Td ff="monospace">{formatDateTime(alert.raisedAt, tz)}</Table.Td>
                  <Table.Td>{mayAcknowledge ? <AcknowledgeAlert alert={alert} /> : null}</Table.Td>
                </Table.Tr>
              );
            })}
          </Table.Tbody>
        </Table>
      )}
      {!mayAcknowledge && alerts.data && alerts.data.length > 0 && (
        <Alert color="slate" variant="light" mt="xs" p="xs">
          <Text size="xs">Operators and supervisors acknowledge alerts; your role can see them.</Text>
        </Alert>
      )}
    </Card>
  );
}
