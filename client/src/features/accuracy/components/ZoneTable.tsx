import { ATTENTION_TEXT, BETTER_TEXT } from '../../../lib/text-colors';
import { Table, Text } from '@mantine/core';
import type { AccuracyZoneDto } from '@morrowline/shared';
import { signedMw } from '../model/accuracy-data';

const pct = (v: number | null) => (v === null ? '—' : `${v.toFixed(2)} %`);
const diff = (v: number | null) => (v === null ? '—' : `${v > 0 ? '+' : v < 0 ? '−' : ''}${Math.abs(v).toFixed(2)} pts`);

/** One row per zone and one for the system total: model and schedule side by side. */
export function ZoneTable({ zones, system }: { zones: AccuracyZoneDto[]; system: AccuracyZoneDto }) {
  const rows = zones.length > 1 ? [...zones, system] : zones;
  return (
    <Table.ScrollContainer minWidth={900}>
      <Table striped withTableBorder fz="sm" data-testid="accuracy-zones" aria-label="Accuracy per zone">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Zone</Table.Th>
            <Table.Th ta="right">Days scored</Table.Th>
            <Table.Th ta="right">Model MAPE</Table.Th>
            <Table.Th ta="right">Schedule MAPE</Table.Th>
            <Table.Th ta="right">Model MAE</Table.Th>
            <Table.Th ta="right">Model bias</Table.Th>
            <Table.Th ta="right">Schedule bias</Table.Th>
            <Table.Th ta="right">Model peak error</Table.Th>
            <Table.Th ta="right">Adjustments (schedule − model)</Table.Th>
            <Table.Th ta="right">Replayed model forecasts</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody ff="monospace">
          {rows.map((z) => (
            <Table.Tr key={z.zone} fw={z.zone === 'SYSTEM' ? 600 : undefined}>
              <Table.Td ff="text">{z.zone === 'SYSTEM' ? 'System total' : `${z.zoneName} (${z.zone})`}</Table.Td>
              <Table.Td ta="right">
                {z.daysScored} / {z.days.length}
              </Table.Td>
              <Table.Td ta="right">{pct(z.model.mape)}</Table.Td>
              <Table.Td ta="right">{pct(z.schedule.mape)}</Table.Td>
              <Table.Td ta="right">{z.model.mae === null ? '—' : `${z.model.mae.toFixed(1)} MW`}</Table.Td>
              <Table.Td ta="right">{signedMw(z.model.bias)}</Table.Td>
              <Table.Td ta="right">{signedMw(z.schedule.bias)}</Table.Td>
              <Table.Td ta="right">{signedMw(z.model.peakErrorMw)}</Table.Td>
              <Table.Td ta="right">
                <Text span inherit c={z.comparison.difference === null ? undefined : z.comparison.difference < 0 ? BETTER_TEXT : z.comparison.difference > 0 ? ATTENTION_TEXT : undefined}>
                  {diff(z.comparison.difference)}
                </Text>
              </Table.Td>
              <Table.Td ta="right" data-testid="accuracy-zone-replayed">{z.daysReplayed === 0 ? '—' : `${z.daysReplayed} of ${z.days.length} days`}</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </Table.ScrollContainer>
  );
}
