import { Badge, Button, Table } from '@mantine/core';
import type { ZoneDto } from '@morrowline/shared';
import { formatMw, formatPercent } from '../../../lib/format';

interface ZonesTableProps {
  zones: ZoneDto[];
  onEdit: (zone: ZoneDto) => void;
}

export function ZonesTable({ zones, onEdit }: ZonesTableProps) {
  return (
    <Table.ScrollContainer minWidth={860}>
      <Table aria-label="Zones">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Code</Table.Th>
            <Table.Th>Name</Table.Th>
            <Table.Th>Time zone</Table.Th>
            <Table.Th>Alert when</Table.Th>
            <Table.Th>Gate closure</Table.Th>
            <Table.Th>Plausible load</Table.Th>
            <Table.Th>Status</Table.Th>
            <Table.Th aria-label="Actions" />
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {zones.map((zone) => (
            <Table.Tr key={zone.id}>
              <Table.Td className="numeric" fw={500}>{zone.code}</Table.Td>
              <Table.Td>{zone.name}</Table.Td>
              <Table.Td>{zone.timeZone}</Table.Td>
              <Table.Td className="numeric">
                {formatPercent(zone.alertThresholdPct)} for {zone.alertConsecutiveHours} h
              </Table.Td>
              <Table.Td className="numeric">{zone.gateClosure}</Table.Td>
              <Table.Td className="numeric">
                {formatMw(zone.minPlausibleMw)} – {formatMw(zone.maxPlausibleMw)}
              </Table.Td>
              <Table.Td>
                {zone.active ? <Badge color="tide" variant="dot">Active</Badge> : <Badge color="gray" variant="outline">Inactive</Badge>}
              </Table.Td>
              <Table.Td ta="right">
                <Button size="compact-xs" variant="light" onClick={() => onEdit(zone)}>
                  Edit
                </Button>
              </Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </Table.ScrollContainer>
  );
}
