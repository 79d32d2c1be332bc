import { Alert, Button, Group, Paper, SegmentedControl, Stack, Table, Text, Title } from '@mantine/core';
import type { BacktestReportDto, BacktestScoresDto } from '@morrowline/shared';
import { useMemo, useState } from 'react';
import type uPlot from 'uplot';
import uPlotLib from 'uplot';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { useRunBacktest } from '../api/use-workbench';
import { dailyMapeData, fmtNum } from '../chart-data';
import { axis, CHART_COLORS, UplotChart } from '../../../components/UplotChart';

const METRICS: { key: keyof BacktestScoresDto; label: string; unit: string; pct?: boolean }[] = [
  { key: 'mape', label: 'MAPE', unit: '%' },
  { key: 'mae', label: 'MAE', unit: 'MW' },
  { key: 'rmse', label: 'RMSE', unit: 'MW' },
  { key: 'bias', label: 'Bias (forecast − actual)', unit: 'MW' },
  { key: 'peakError', label: 'Peak-hour error', unit: 'MW' },
  { key: 'coverage80', label: 'Hours inside the 80 % band', unit: '%', pct: true },
  { key: 'coverage95', label: 'Hours inside the 95 % band', unit: '%', pct: true },
];

function DailyMapeChart({ result }: { result: BacktestReportDto }) {
  const data = useMemo(() => dailyMapeData(result.perDay), [result]);
  const options = useMemo<Omit<uPlot.Options, 'width' | 'height'>>(() => {
    const labels = result.perDay.map((d) => d.date.slice(5));
    return {
      scales: { x: { time: false, range: [-0.6, result.perDay.length - 0.4] }, y: { range: (_u: uPlot, _min: number, max: number) => [0, Math.max(1, max * 1.15)] } },
      series: [
        { label: 'day', value: (_u: uPlot, i: number | null) => (i == null ? '' : (result.perDay[i]?.date ?? '')) },
        { label: 'model MAPE %', stroke: CHART_COLORS.load, fill: CHART_COLORS.load, paths: uPlotLib.paths.bars!({ size: [0.6, 40] }), points: { show: false } },
        { label: 'same hour last week MAPE %', stroke: CHART_COLORS.second, width: 2, points: { show: true, size: 6 } },
      ],
      axes: [axis({ values: (_u: uPlot, splits: number[]) => splits.map((i) => (Number.isInteger(i) ? (labels[i] ?? '') : '')) }), axis({ size: 44, label: '%', labelSize: 14 })],
    };
  }, [result]);
  return <UplotChart title="MAPE per operating day" options={options} data={data} height={220} testId="chart-backtest-daily" seriesKey />;
}

/** The rolling day-ahead backtest against the same hour last week. */
export function BacktestPanel({ zone, canRun }: { zone: string; canRun: boolean }) {
  const [days, setDays] = useState('14');
  const run = useRunBacktest();
  const result = run.data && run.data.zone === zone ? run.data : null;
  return (
    <Paper withBorder radius="md" p="md" data-testid="backtest-panel">
      <Stack gap="md">
        <Group justify="space-between" align="center">
          <Stack gap={2}>
            <Title order={3}>Backtest</Title>
            <Text size="sm" c="dimmed">
              For each of the last days: forecast the operating day from what was known before it, then compare with what came. The same hour last week is the baseline to beat.
            </Text>
          </Stack>
          <Group gap="sm">
            <SegmentedControl value={days} onChange={setDays} data={['7', '14', '28'].map((d) => ({ value: d, label: `${d} days` }))} aria-label="Days to backtest" disabled={run.isPending} />
            <Button onClick={() => run.mutate({ zone, days: Number(days) })} loading={run.isPending} disabled={!canRun}>
              Run backtest
            </Button>
          </Group>
        </Group>
        {!canRun && <Text size="sm" c="dimmed">Operators and supervisors may run the backtest.</Text>}
        {run.isPending && <Text size="sm">Refitting at every day of the backtest; this takes a little while…</Text>}
        {run.isError && <ErrorNotice title="The backtest did not run" error={run.error} />}
        {result && (
          <Stack gap="md" data-testid="backtest-result">
            <Alert color={result.improvement !== null && result.improvement > 0 ? 'tide' : 'ember'} variant="light">
              {result.summary}
            </Alert>
            <Text size="sm" c="dimmed" data-testid="backtest-issue-time">
              Each day forecast {result.issueTime}.
            </Text>
            <Table aria-label="Backtest scores" fz="sm" withTableBorder maw={640}>
              <Table.Thead>
                <Table.Tr>
                  <Table.Th>Over {result.perDay.length} days</Table.Th>
                  <Table.Th ta="right">Model</Table.Th>
                  <Table.Th ta="right">Same hour last week</Table.Th>
                </Table.Tr>
              </Table.Thead>
              <Table.Tbody>
                {METRICS.map((m) => {
                  const show = (v: number | null) => (v === null ? '—' : `${fmtNum(m.pct ? 100 * v : v, m.key === 'mape' ? 2 : 1)} ${m.unit}`);
                  return (
                    <Table.Tr key={m.key}>
                      <Table.Td>{m.label}</Table.Td>
                      <Table.Td ta="right" ff="monospace">{show(result.model[m.key])}</Table.Td>
                      <Table.Td ta="right" ff="monospace">{m.pct ? 'no band' : show(result.baseline[m.key])}</Table.Td>
                    </Table.Tr>
                  );
                })}
              </Table.Tbody>
            </Table>
            <DailyMapeChart result={result} />
          </Stack>
        )}
      </Stack>
    </Paper>
  );
}
