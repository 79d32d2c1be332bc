import { Badge, Group, Table } from '@mantine/core';
import type { AccuracyDayDto, AccuracyZoneDto } from '@morrowline/shared';
import { dayStatus, signedMw } from '../model/accuracy-data';

const pct = (v: number | null | undefined) => (v === null || v === undefined ? '—' : `${v.toFixed(2)} %`);

/** "1.4 °C (+0.6)": the day's temperature forecast MAE and its bias, or a dash. */
export function temperatureError(t: AccuracyDayDto['temperature']): string {
  if (!t || t.maeC === null || t.biasC === null) return '—';
  const bias = Math.round(t.biasC * 10) / 10;
  return `${t.maeC.toFixed(1)} °C (${bias > 0 ? '+' : bias < 0 ? '−' : '±'}${Math.abs(bias).toFixed(1)})`;
}

/** What the badge means, on hover: a replay is never to be read as the forecast the desk issued. */
export const REPLAYED_TITLE = 'Replayed forecast: worked out when this installation first started, as the desk would have issued it before the gate closure from the readings it had then. Not a forecast the desk issued at the time.';

/** Every day of the range, scored or not, with why not. */
export function DayTable({ subject }: { subject: AccuracyZoneDto }) {
  return (
    <Table.ScrollContainer minWidth={940}>
      <Table striped withTableBorder fz="sm" data-testid="accuracy-days" aria-label="Accuracy per day">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Operating day</Table.Th>
            <Table.Th ta="right">Model MAPE</Table.Th>
            <Table.Th ta="right">Schedule MAPE</Table.Th>
            <Table.Th ta="right">Model bias</Table.Th>
            <Table.Th ta="right">Model peak error</Table.Th>
            <Table.Th>Peak hour</Table.Th>
            <Table.Th ta="right">Schedule − model</Table.Th>
            <Table.Th ta="right" title="The temperature forecast known when the model forecast was issued, against the observed temperature: mean absolute error (bias, + = forecast too warm)">
              Temperature forecast error
            </Table.Th>
            <Table.Th>Notes</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody ff="monospace">
          {subject.days.map((d) => (
            <Table.Tr key={d.operatingDay}>
              <Table.Td>{d.operatingDay}</Table.Td>
              <Table.Td ta="right" style={{ whiteSpace: 'nowrap' }}>
                {d.model?.replayed ? (
                  <Group gap={6} justify="flex-end" wrap="nowrap">
                    <Badge size="xs" variant="light" color="grape" ff="text" style={{ flexShrink: 0 }} data-testid="accuracy-replayed-badge" title={REPLAYED_TITLE}>
                      replayed
                    </Badge>
                    {pct(d.model?.score?.mape)}
                  </Group>
                ) : (
                  pct(d.model?.score?.mape)
                )}
              </Table.Td>
              <Table.Td ta="right">{pct(d.schedule?.score?.mape)}</Table.Td>
              <Table.Td ta="right">{signedMw(d.model?.score?.bias)}</Table.Td>
              <Table.Td ta="right">{signedMw(d.model?.score?.peakErrorMw)}</Table.Td>
              <Table.Td>{d.model?.peakHourEnding ?? d.schedule?.peakHourEnding ?? '—'}</Table.Td>
              <Table.Td ta="right">{d.adjustmentEffect === null ? '—' : `${d.adjustmentEffect > 0 ? '+' : d.adjustmentEffect < 0 ? '−' : ''}${Math.abs(d.adjustmentEffect).toFixed(2)} pts`}</Table.Td>
              <Table.Td ta="right" data-testid="accuracy-temperature-error">{temperatureError(d.temperature)}</Table.Td>
              <Table.Td ff="text">{dayStatus(d)}</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </Table.ScrollContainer>
  );
}
