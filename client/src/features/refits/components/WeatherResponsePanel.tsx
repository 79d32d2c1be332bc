import { Badge, Card, Group, Loader, SimpleGrid, Stack, Table, Text, Title } from '@mantine/core';
import { calendarEffects, responseBandBasis, temperatureResponseCurve, type ModelVersionDto } from '@morrowline/shared';
import { useMemo } from 'react';
import type uPlot from 'uplot';
import { axis, CHART_COLORS, UplotChart } from '../../../components/UplotChart';
import { formatDateTime, formatPercent } from '../../../lib/format';
import { FORECAST_BAND_COLORS } from '../../../lib/forecast-bands';
import { useModelVersions } from '../api/use-refits';
import { weatherVerdict } from '../model/weather-rows';

const hidden = { show: true, points: { show: false }, stroke: 'transparent', width: 0 } as const;

/** MW against °C at a steady temperature, with its 95 % band, from the version's stored response. */
function ResponseChart({ version }: { version: ModelVersionDto }) {
  const w = version.weather!;
  const curve = useMemo(() => temperatureResponseCurve(w), [w]);
  const data = useMemo<uPlot.AlignedData>(() => [curve.map((p) => p.temperatureC), curve.map((p) => p.mw), curve.map((p) => p.upper95), curve.map((p) => p.lower95)], [curve]);
  const options = useMemo<Omit<uPlot.Options, 'width' | 'height'>>(
    () => ({
      scales: { x: { time: false } },
      cursor: { drag: { x: false, y: false } },
      series: [
        { label: 'Temperature (°C)', value: (_u, v) => (v === null ? '—' : `${v.toFixed(1)} °C`) },
        { label: 'Load from the temperature (MW)', stroke: CHART_COLORS.load, width: 2, value: (_u, v) => (v === null ? '—' : `${v.toFixed(1)} MW`) },
        { ...hidden, label: '95 % upper (MW)' },
        { ...hidden, label: '95 % lower (MW)' },
      ],
      bands: [{ series: [2, 3], fill: FORECAST_BAND_COLORS.band95 }],
      axes: [axis({ label: '°C', size: 40 }), axis({ label: 'MW', size: 60 })],
    }),
    [],
  );
  return (
    <UplotChart
      title={`Temperature response of version ${version.id}`}
      options={options}
      data={data}
      height={200}
      testId="temperature-response-chart"
      seriesKey
      caption={`Load added at a steady temperature, mean over the day; heating below ${w.terms.heatBelow} °C, cooling above ${w.terms.coolAbove} °C. ${bandWords(responseBandBasis(w))}`}
    />
  );
}

/** How far the band can be trusted, said plainly. */
export function bandWords(basis: 'covariance' | 'independent'): string {
  return basis === 'covariance'
    ? 'Band: ±1.96 standard errors of the curve, from the joint covariance of the coefficients.'
    : 'Band: ±1.96 standard errors with the coefficients taken as independent, because this version does not store their covariance. The terms of neighbouring parts of the day and the lagged temperature move together, so the true band may be narrower or wider than drawn; read it as a rough guide.';
}

/** The zone's model in service: how its load answers the temperature and the calendar. */
export function WeatherResponsePanel({ zone, zoneName, timeZone }: { zone: string; zoneName: string; timeZone: string }) {
  const versions = useModelVersions(zone);
  const version = versions.data?.find((v) => v.status === 'in-service') ?? null;
  const w = version?.weather ?? null;
  const effects = w?.used ? calendarEffects(w) : [];
  return (
    <Card withBorder padding="md" data-testid="weather-response">
      <Title order={4} mb="xs">Weather and calendar in the model of {zoneName}</Title>
      {versions.isPending && <Loader size="sm" />}
      {versions.data && !version && <Text size="sm">No model in service yet.</Text>}
      {version && (
        <Stack gap="sm">
          <Group gap="xs">
            <Badge variant="light" color={w?.used ? 'tide' : 'slate'} data-testid="weather-used">{w?.used ? 'with weather' : 'without weather'}</Badge>
            <Text size="sm" data-testid="weather-verdict">Version {version.id}. {weatherVerdict(w)}</Text>
          </Group>
          {w?.vintageIssuedAt && <Text size="xs" c="dimmed">Its forecast used the temperature forecast issued {formatDateTime(w.vintageIssuedAt, timeZone)}, the latest known when it was issued.</Text>}
          {w?.used && w.terms.temperature && (
            <SimpleGrid cols={{ base: 1, lg: 2 }}>
              <ResponseChart version={version} />
              <CalendarEffects effects={effects} />
            </SimpleGrid>
          )}
          {w?.used && !w.terms.temperature && <CalendarEffects effects={effects} />}
          {w && w.candidates.length > 0 && (
            <Table aria-label="Weather terms tried" withTableBorder verticalSpacing={4} data-testid="weather-candidates">
              <Table.Thead>
                <Table.Tr><Table.Th>Terms tried (backtest over {w.selectionDays} days, issued on forecast weather)</Table.Th><Table.Th ta="right">MAPE</Table.Th></Table.Tr>
              </Table.Thead>
              <Table.Tbody>
                {w.candidates.map((c) => (
                  <Table.Tr key={c.label}><Table.Td>{c.label}</Table.Td><Table.Td ff="monospace" ta="right">{formatPercent(c.mape, 2)}</Table.Td></Table.Tr>
                ))}
                <Table.Tr><Table.Td c="dimmed">same hour one week earlier</Table.Td><Table.Td ff="monospace" ta="right">{formatPercent(w.baselineMape, 2)}</Table.Td></Table.Tr>
              </Table.Tbody>
            </Table>
          )}
        </Stack>
      )}
    </Card>
  );
}

function CalendarEffects({ effects }: { effects: ReturnType<typeof calendarEffects> }) {
  return (
    <Stack gap={4}>
      <Text size="sm" fw={600}>Calendar effects</Text>
      {effects.length === 0 && <Text size="sm" c="dimmed">No calendar terms: no holiday or bridge day in the history, or they did not earn their place.</Text>}
      {effects.length > 0 && (
        <Table aria-label="Calendar effects" withTableBorder verticalSpacing={4} data-testid="calendar-effects">
          <Table.Thead>
            <Table.Tr><Table.Th>Day</Table.Th><Table.Th ta="right">MW each hour</Table.Th><Table.Th ta="right">± 95 %</Table.Th></Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {effects.map((e) => (
              <Table.Tr key={e.label}>
                <Table.Td>{e.label}</Table.Td>
                <Table.Td ff="monospace" ta="right">{e.mw >= 0 ? '+' : '−'}{Math.abs(e.mw).toFixed(1)}</Table.Td>
                <Table.Td ff="monospace" ta="right">{e.halfWidth95.toFixed(1)}</Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      )}
    </Stack>
  );
}
