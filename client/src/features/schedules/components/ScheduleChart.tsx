import { Box, Group, Text } from '@mantine/core';
import { useElementSize } from '@mantine/hooks';
import { useMemo } from 'react';
import type uPlot from 'uplot';
import UplotReact from 'uplot-react';
import 'uplot/dist/uPlot.min.css';
import type { ScheduleRow } from '../model/rows';
import { SCHEDULE_COLORS } from './chart-colors';
import { forecastBands, forecastBandSeries, FORECAST_BAND_COLORS } from '../../../lib/forecast-bands';
import { ChartNumbers } from '../../../components/ChartNumbers';

const mw = (value: number | null) => (value === null ? '—' : value.toFixed(1));
const band = (lower: number | null, upper: number | null) => (lower === null || upper === null ? '—' : `${mw(lower)} – ${mw(upper)}`);

const HEIGHT = 300;

function Swatch({ color, dashed, block }: { color: string; dashed?: boolean; block?: boolean }) {
  return (
    <Box
      component="span"
      style={{ display: 'inline-block', width: 18, height: block ? 10 : 0, background: block ? color : undefined, borderTop: block ? undefined : `2px ${dashed ? 'dashed' : 'solid'} ${color}` }}
    />
  );
}

/**
 * The adjusted line over the model's, with the model's 80 % and 95 % bands. The x axis is the
 * position in the operating day, labelled with the server's hour-ending labels, so a 23- or
 * 25-hour day draws its own number of points with no gap or overlap.
 */
export function ScheduleChart({ rows, title, lineLabel }: { rows: readonly ScheduleRow[]; title: string; /** what the solid line is (model/legend.ts) */ lineLabel: string }) {
  const { ref, width } = useElementSize();
  const labels = useMemo(() => rows.map((row) => row.hourEnding), [rows]);
  const hasBands = rows.some((row) => row.upper80 !== null);

  const data = useMemo<uPlot.AlignedData>(
    () => [
      rows.map((_, i) => i),
      rows.map((r) => r.upper95),
      rows.map((r) => r.lower95),
      rows.map((r) => r.upper80),
      rows.map((r) => r.lower80),
      rows.map((r) => r.modelMw),
      rows.map((r) => r.adjustedMw),
    ],
    [rows],
  );

  const options = useMemo<uPlot.Options>(() => {
    const every = width < 700 ? 4 : 2;
    return {
      width: Math.max(320, width),
      height: HEIGHT,
      legend: { show: false },
      cursor: { points: { size: 6 }, drag: { x: false, y: false } },
      scales: { x: { time: false } },
      series: [
        {},
        ...forecastBandSeries(),
        { label: 'Model forecast', stroke: SCHEDULE_COLORS.model, width: 1.5, dash: [6, 4], points: { show: false } },
        { label: lineLabel, stroke: SCHEDULE_COLORS.adjusted, width: 2.5, points: { show: true, size: 4 } },
      ],
      bands: forecastBands(),
      axes: [
        {
          stroke: SCHEDULE_COLORS.axis,
          grid: { stroke: SCHEDULE_COLORS.grid },
          ticks: { stroke: SCHEDULE_COLORS.grid },
          splits: () => labels.map((_, i) => i).filter((i) => (i + 1) % every === 0),
          values: (_u, splits) => splits.map((i) => labels[i] ?? ''),
        },
        { stroke: SCHEDULE_COLORS.axis, grid: { stroke: SCHEDULE_COLORS.grid }, ticks: { stroke: SCHEDULE_COLORS.grid }, label: 'MW', size: 60 },
      ],
    };
  }, [width, labels, lineLabel]);

  return (
    <Box>
      <Group gap="md" mb={4} data-testid="schedule-chart-legend">
        <Group gap={6}><Swatch color={SCHEDULE_COLORS.adjusted} /><Text size="xs">{lineLabel}</Text></Group>
        <Group gap={6}><Swatch color={SCHEDULE_COLORS.model} dashed /><Text size="xs">Model forecast</Text></Group>
        {hasBands && <Group gap={6}><Swatch color={FORECAST_BAND_COLORS.band80} block /><Text size="xs">80 % band</Text></Group>}
        {hasBands && <Group gap={6}><Swatch color={FORECAST_BAND_COLORS.band95} block /><Text size="xs">95 % band</Text></Group>}
      </Group>
      <Box ref={ref} data-testid="schedule-chart" role="img" aria-label={`Schedule chart: ${title}. Its numbers are in the table under it.`}>
        {width > 0 && <UplotReact options={options} data={data} />}
      </Box>
      <ChartNumbers
        title={`Schedule of ${title}`}
        columns={['Hour ending', `${lineLabel}, MW`, 'Model forecast, MW', '80 % band, MW', '95 % band, MW']}
        rows={() => rows.map((r) => [r.hourEnding, mw(r.adjustedMw), mw(r.modelMw), band(r.lower80, r.upper80), band(r.lower95, r.upper95)])}
        testId="schedule-chart-numbers"
      />
    </Box>
  );
}
