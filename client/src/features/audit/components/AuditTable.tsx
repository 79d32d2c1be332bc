import { Button, Table, Text } from '@mantine/core';
import type { AuditEntryDto } from '@morrowline/shared';
import { Fragment, useState } from 'react';
import { formatDateTime } from '../../../lib/format';
import { useDeskTimeZone } from '../../../lib/use-desk-time-zone';
import { AuditChange } from './AuditChange';

export function AuditTable({ entries }: { entries: AuditEntryDto[] }) {
  const deskTimeZone = useDeskTimeZone();
  const [expanded, setExpanded] = useState<ReadonlySet<number>>(new Set());
  const toggle = (id: number) =>
    setExpanded((current) => {
      const next = new Set(current);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  return (
    <Table.ScrollContainer minWidth={820}>
      <Table aria-label="Audit trail">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Time</Table.Th>
            <Table.Th>Who</Table.Th>
            <Table.Th>Action</Table.Th>
            <Table.Th>Subject</Table.Th>
            <Table.Th>Reason</Table.Th>
            <Table.Th aria-label="Change" />
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {entries.map((entry) => {
            const open = expanded.has(entry.id);
            const hasChange = entry.before != null || entry.after != null;
            return (
              <Fragment key={entry.id}>
                <Table.Tr>
                  <Table.Td className="numeric" style={{ whiteSpace: 'nowrap' }}>
                    {formatDateTime(entry.at, deskTimeZone)}
                  </Table.Td>
                  <Table.Td>{entry.actorEmail ?? <Text span c="dimmed" size="sm">system</Text>}</Table.Td>
                  <Table.Td className="numeric">{entry.action}</Table.Td>
                  <Table.Td>
                    {entry.subjectType}
                    {entry.subjectId && <Text span c="dimmed" size="sm"> #{entry.subjectId}</Text>}
                  </Table.Td>
                  <Table.Td>{entry.reason ?? <Text span c="dimmed" size="sm">—</Text>}</Table.Td>
                  <Table.Td ta="right">
                    {hasChange && (
                      <Button size="compact-xs" variant="subtle" aria-expanded={open} onClick={() => toggle(entry.id)}>
                        {open ? 'Hide change' : 'Show change'}
                      </Button>
                    )}
                  </Table.Td>
                </Table.Tr>
                {open && hasChange && (
                  <Table.Tr>
                    <Table.Td colSpan={6}>
                      <AuditChange entry={entry} />
                    </Table.Td>
                  </Table.Tr>
                )}
              </Fragment>
            );
          })}
        </Table.Tbody>
      </Table>
    </Table.ScrollContainer>
  );
}
