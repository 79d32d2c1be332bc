import { ATTENTION_TEXT } from '../../../lib/text-colors';
import { Badge, Button, Card, Group, Loader, Table, Text, Title } from '@mantine/core';
import type { OutageDto } from '@morrowline/shared';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { formatDateTime } from '../../../lib/format';
import { useOutages } from '../api/use-outages';
import { KIND_LABELS } from '../outage-form';
import { CloseOutageDialog } from './CloseOutageDialog';
import { OutageWindowDialog } from './OutageWindowDialog';

interface OutageWindowsPanelProps {
  zone: string;
  zoneName: string;
  timeZone: string;
  /** Operators and supervisors mark, change and close windows. */
  canEdit: boolean;
}

/** A zone's outage and bad-data windows, newest first, with marking, changing and closing. */
export function OutageWindowsPanel({ zone, zoneName, timeZone, canEdit }: OutageWindowsPanelProps) {
  const outages = useOutages(zone);
  const [dialog, setDialog] = useState<{ editing: OutageDto | null } | null>(null);
  const [closing, setClosing] = useState<OutageDto | null>(null);
  const list = [...(outages.data ?? [])].sort((a, b) => Date.parse(b.start) - Date.parse(a.start));

  return (
    <Card withBorder padding="md" data-testid="outage-windows">
      <Group justify="space-between" mb="xs">
        <Title order={4}>Outage and bad-data windows</Title>
        {canEdit && <Button size="sm" onClick={() => setDialog({ editing: null })}>Mark a window</Button>}
      </Group>
      <Text size="sm" c="dimmed" mb="sm">
        The hours of these windows do not count as normal load: the next refit leaves them out of training, and the weekly
        differencing does not carry their dip into later forecasts. Times in {timeZone}.
      </Text>
      {outages.isPending && <Loader size="sm" />}
      {outages.isError && <ErrorNotice title="The windows could not be loaded" error={outages.error} onRetry={() => void outages.refetch()} />}
      {outages.data && list.length === 0 && <Text size="sm">No windows marked on {zoneName}.</Text>}
      {list.length > 0 && (
        <Table.ScrollContainer minWidth={720}>
          <Table aria-label="Windows" verticalSpacing="xs" striped>
            <Table.Thead>
              <Table.Tr>
                <Table.Th w={120}>Kind</Table.Th>
                <Table.Th w={170}>Start</Table.Th>
                <Table.Th w={170}>End</Table.Th>
                <Table.Th>Note</Table.Th>
                <Table.Th>Marked by</Table.Th>
                {canEdit && <Table.Th />}
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {list.map((outage) => (
                <Table.Tr key={outage.id} data-testid={`outage-${outage.id}`}>
                  <Table.Td>
                    <Badge variant="light" color={outage.kind === 'outage' ? 'ember' : 'slate'} style={{ overflow: 'visible' }}>{KIND_LABELS[outage.kind]}</Badge>
                  </Table.Td>
                  <Table.Td ff="monospace" style={{ whiteSpace: 'nowrap' }}>{formatDateTime(outage.start, timeZone)}</Table.Td>
                  <Table.Td ff="monospace" style={{ whiteSpace: 'nowrap' }}>{outage.end ? formatDateTime(outage.end, timeZone) : <Text span c={ATTENTION_TEXT} fw={600}>still open</Text>}</Table.Td>
                  <Table.Td>{outage.note}</Table.Td>
                  <Table.Td>
                    <Text size="sm">{outage.createdBy ?? '—'}</Text>
                    {outage.closedBy && <Text size="xs" c="dimmed">closed by {outage.closedBy}</Text>}
                  </Table.Td>
                  {canEdit && (
                    <Table.Td>
                      <Group gap={4} wrap="nowrap" justify="flex-end">
                        <Button size="compact-sm" variant="subtle" onClick={() => setDialog({ editing: outage })}>Change</Button>
                        {outage.end === null && <Button size="compact-sm" variant="light" onClick={() => setClosing(outage)}>Close</Button>}
                      </Group>
                    </Table.Td>
                  )}
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        </Table.ScrollContainer>
      )}
      <OutageWindowDialog opened={dialog !== null} onClose={() => setDialog(null)} zone={zone} zoneName={zoneName} timeZone={timeZone} editing={dialog?.editing ?? null} />
      <CloseOutageDialog outage={closing} timeZone={timeZone} onClose={() => setClosing(null)} />
    </Card>
  );
}
