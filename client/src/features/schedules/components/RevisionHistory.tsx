import { Badge, Loader, Table, Text } from '@mantine/core';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { formatDateTime } from '../../../lib/format';
import { useRevisionHistory } from '../api/use-day-schedule';
import { mayDownload } from '../model/permissions';
import { STATE_COLORS, STATE_LABELS } from '../model/states';
import { DownloadButtons } from './DownloadButtons';

/** Every revision of one zone's day, newest first: state, who and when, why it was made. */
export function RevisionHistory({ day, zone, timeZone }: { day: string; zone: string; timeZone: string }) {
  const history = useRevisionHistory(day, zone, true);
  if (history.isPending) return <Loader size="sm" />;
  if (history.isError) return <ErrorNotice title="The revision history could not be loaded" error={history.error} />;
  if (history.data.length === 0) return <Text size="sm" c="dimmed">No revisions yet.</Text>;
  return (
    <Table aria-label={`Revisions of ${zone}`} fz="sm" withTableBorder>
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Revision</Table.Th>
          <Table.Th>State</Table.Th>
          <Table.Th>Started</Table.Th>
          <Table.Th>Submitted</Table.Th>
          <Table.Th>Published</Table.Th>
          <Table.Th>Why</Table.Th>
          <Table.Th>Files</Table.Th>
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {history.data.map((r) => (
          <Table.Tr key={r.id}>
            <Table.Td ff="monospace">{r.revision}</Table.Td>
            <Table.Td>
              <Badge color={STATE_COLORS[r.state]}>{STATE_LABELS[r.state]}</Badge>
              {r.late && <Badge color="ember" ml={4}>Late</Badge>}
            </Table.Td>
            <Table.Td>{r.createdBy.name}, {formatDateTime(r.createdAt, timeZone)}</Table.Td>
            <Table.Td>{r.submittedBy ? `${r.submittedBy.name}, ${formatDateTime(r.submittedAt, timeZone)}` : '—'}</Table.Td>
            <Table.Td>{r.publishedBy ? `${r.publishedBy.name}, ${formatDateTime(r.publishedAt, timeZone)}` : '—'}</Table.Td>
            <Table.Td>{[r.correctionReason, r.returnComment && `returned: ${r.returnComment}`].filter(Boolean).join('; ') || '—'}</Table.Td>
            <Table.Td>{mayDownload(r) ? <DownloadButtons revision={r} /> : '—'}</Table.Td>
          </Table.Tr>
        ))}
      </Table.Tbody>
    </Table>
  );
}
