import { ATTENTION_TEXT } from '../../../lib/text-colors';
import { Table, Text } from '@mantine/core';
import { formatMw } from '../../../lib/format';
import { formatTemperature } from '../../weather';
import type { ScheduleRow } from '../model/rows';

function signed(mw: number | null): string {
  if (mw === null) return '—';
  if (mw === 0) return '0.0';
  return `${mw > 0 ? '+' : '−'}${Math.abs(mw).toFixed(1)}`;
}

function band(row: ScheduleRow): string {
  if (row.lower80 === null || row.upper80 === null) return '—';
  return `${row.lower80.toFixed(1)} – ${row.upper80.toFixed(1)}`;
}

/** A row's temperature forecast and the issue time of the vintage it comes from. */
export interface HourTemperature {
  tempC: number | null;
  issuedAt: string | null;
}

interface ScheduleTableProps {
  rows: readonly ScheduleRow[];
  label: string;
  showBand?: boolean;
  /** Per row, the temperature forecast known when the model forecast was issued (a column when given). */
  temperatures?: readonly HourTemperature[];
  /** Shows an issue time in the zone's time zone. */
  formatIssued?: (iso: string) => string;
}

/**
 * One row per hour ending: model MW, its 80 % band, the adjusted MW and the difference, and when
 * given the temperature forecast of the hour with its issue time.
 */
export function ScheduleTable({ rows, label, showBand = true, temperatures, formatIssued = (iso) => iso }: ScheduleTableProps) {
  return (
    <Table aria-label={label} striped withTableBorder stickyHeader ff="monospace" fz="sm" data-testid="schedule-table">
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Hour</Table.Th>
          <Table.Th ta="right">Model</Table.Th>
          {showBand && <Table.Th ta="right">80 % band (MW)</Table.Th>}
          <Table.Th ta="right">Adjusted</Table.Th>
          <Table.Th ta="right">Difference (MW)</Table.Th>
          {temperatures && <Table.Th ta="right">Temperature forecast</Table.Th>}
          {temperatures && <Table.Th>Issued</Table.Th>}
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {rows.map((row) => {
          const changed = row.differenceMw !== null && row.differenceMw !== 0;
          return (
            <Table.Tr key={row.index} data-testid={`hour-${row.hourEnding}`}>
              <Table.Td>{row.hourEnding}</Table.Td>
              <Table.Td ta="right">{formatMw(row.modelMw)}</Table.Td>
              {showBand && <Table.Td ta="right"><Text span inherit c="dimmed">{band(row)}</Text></Table.Td>}
              <Table.Td ta="right" fw={changed ? 700 : undefined}>{formatMw(row.adjustedMw)}</Table.Td>
              <Table.Td ta="right" c={changed ? ATTENTION_TEXT : 'dimmed'}>{signed(row.differenceMw)}</Table.Td>
              {temperatures && (
                <Table.Td ta="right" data-testid="hour-temperature">
                  {formatTemperature(temperatures[row.index]?.tempC)}
                </Table.Td>
              )}
              {temperatures && (
                <Table.Td>
                  <Text span inherit c="dimmed">{temperatures[row.index]?.issuedAt ? formatIssued(temperatures[row.index].issuedAt!) : '—'}</Text>
                </Table.Td>
              )}
            </Table.Tr>
          );
        })}
      </Table.Tbody>
    </Table>
  );
}
