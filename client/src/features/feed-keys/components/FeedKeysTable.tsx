import { Badge, Button, Table, Text } from '@mantine/core';
import type { FeedKeyDto, ZoneDto } from '@morrowline/shared';
import { formatDateTime } from '../../../lib/format';

interface FeedKeysTableProps {
  keys: readonly FeedKeyDto[];
  zones: readonly ZoneDto[];
  /** The desk's time zone: a key belongs to no load zone's clock. */
  timeZone: string | undefined;
  onRevoke: (key: FeedKeyDto) => void;
}

export function FeedKeysTable({ keys, zones, timeZone, onRevoke }: FeedKeysTableProps) {
  const zoneName = (code: string) => zones.find((zone) => zone.code === code)?.name ?? code;
  return (
    <Table.ScrollContainer minWidth={820}>
      <Table aria-label="Feed keys">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Name</Table.Th>
            <Table.Th>Key</Table.Th>
            <Table.Th>May send for</Table.Th>
            <Table.Th>Created</Table.Th>
            <Table.Th>Last used</Table.Th>
            <Table.Th>Status</Table.Th>
            <Table.Th aria-label="Actions" />
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {keys.map((key) => (
            <Table.Tr key={key.id} data-testid={`feed-key-row-${key.id}`}>
              <Table.Td fw={500}>{key.name}</Table.Td>
              <Table.Td ff="monospace">{key.prefix}…</Table.Td>
              <Table.Td>{key.zone ? zoneName(key.zone) : <Text span c="dimmed" size="sm">any zone</Text>}</Table.Td>
              <Table.Td className="numeric" style={{ whiteSpace: 'nowrap' }}>
                {formatDateTime(key.createdAt, timeZone)}
                {key.createdBy && <Text size="xs" c="dimmed">{key.createdBy}</Text>}
              </Table.Td>
              <Table.Td className="numeric" style={{ whiteSpace: 'nowrap' }}>{key.lastUsedAt ? formatDateTime(key.lastUsedAt, timeZone) : <Text span c="dimmed" size="sm">never</Text>}</Table.Td>
              <Table.Td>
                {key.revokedAt ? (
                  <Badge color="gray" variant="outline" style={{ overflow: 'visible' }}>Revoked {formatDateTime(key.revokedAt, timeZone)}</Badge>
                ) : (
                  <Badge color="tide" variant="dot">Active</Badge>
                )}
              </Table.Td>
              <Table.Td ta="right">
                {!key.revokedAt && (
                  <Button size="compact-xs" variant="light" color="ember" onClick={() => onRevoke(key)}>
                    Revoke
                  </Button>
                )}
              </Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </Table.ScrollContainer>
  );
}
