import { Box, Group, Text } from '@mantine/core';
import { useElementSize } from '@mantine/hooks';
import { useMemo } from 'react';
import type uPlot from 'uplot';
import { ChartNumbers } from './ChartNumbers';
import UplotReact from 'uplot-react';
import 'uplot/dist/uPlot.min.css';

/** Colours from the theme's palette (uPlot draws on canvas and needs literal colours). */
export const CHART_COLORS = {
  load: '#0f7683',
  second: '#d16700',
  third: '#5151b5',
  band: '#8498b1',
  grid: 'rgba(132,152,177,0.25)',
  axis: '#6682a3',
} as const;

const MONO = '11px "JetBrains Mono", ui-monospace, monospace';

export function axis(extra: Partial<uPlot.Axis> = {}): uPlot.Axis {
  return { stroke: CHART_COLORS.axis, grid: { stroke: CHART_COLORS.grid, width: 1 }, ticks: { stroke: CHART_COLORS.grid, width: 1 }, font: MONO, ...extra };
}

interface UplotChartProps {
  title: string;
  /** options without width/height: the chart takes its container's width */
  options: Omit<uPlot.Options, 'width' | 'height'>;
  data: uPlot.AlignedData;
  height?: number;
  testId?: string;
  caption?: string;
  /**
   * Show a key of the lines under the chart (a swatch and a name each) in place of the chart
   * library's own legend, whose "time: -- load: --" row reads as broken before the cursor moves.
   */
  seriesKey?: boolean;
  /** How an x value reads in the chart's table of numbers; by default the x series' own formatter. */
  formatX?: (x: number) => string;
}

type ValueFormatter = (u: uPlot | null, value: number | null, seriesIndex: number, index: number) => string;

/** A value as the chart's own legend would show it, else with three significant decimals at most. */
function formatted(series: uPlot.Series, value: number | null, seriesIndex: number, index: number): string {
  if (value === null || value === undefined) return '—';
  if (typeof series.value === 'function') return (series.value as unknown as ValueFormatter)(null, value, seriesIndex, index);
  return Math.abs(value) < 10 ? value.toFixed(3) : value.toFixed(1);
}

/** The chart's table of numbers: the x column, then every named series, one row per x value. */
export function chartRows(options: Pick<uPlot.Options, 'series'>, data: uPlot.AlignedData, formatX?: (x: number) => string): string[][] {
  const named = options.series.map((s, i) => ({ s, i })).filter(({ s, i }) => i > 0 && typeof s.label === 'string' && s.label !== '');
  return Array.from(data[0], (x, row) => [
    formatX ? formatX(x) : formatted(options.series[0] ?? {}, x, 0, row),
    ...named.map(({ s, i }) => formatted(s, (data[i]?.[row] ?? null) as number | null, i, row)),
  ]);
}

/** The named lines of a chart, in the desk's type, under the chart. */
function SeriesKey({ series }: { series: readonly uPlot.Series[] }) {
  const named = series.slice(1).filter((s) => typeof s.label === 'string' && s.label !== '');
  return (
    <Group gap="md" mt={4} data-testid="chart-key" component="ul" p={0} m={0} style={{ listStyle: 'none' }}>
      {named.map((s) => (
        <Group key={String(s.label)} gap={6} component="li" wrap="nowrap">
          <Box w={14} h={3} style={{ background: typeof s.stroke === 'string' ? s.stroke : CHART_COLORS.axis, borderRadius: 2 }} />
          <Text size="xs" c="dimmed">
            {String(s.label)}
          </Text>
        </Group>
      ))}
    </Group>
  );
}

/** A uPlot chart sized to its container, with a title above it. */
export function UplotChart({ title, options, data, height = 220, testId, caption, seriesKey = false, formatX }: UplotChartProps) {
  const { ref, width } = useElementSize();
  const full = useMemo(
    () => ({ ...options, ...(seriesKey ? { legend: { show: false } } : {}), width: Math.max(200, Math.floor(width)), height }) as uPlot.Options,
    [options, width, height, seriesKey],
  );
  return (
    <Box data-testid={testId} role="figure" aria-label={title}>
      <Text size="sm" fw={600} mb={4}>
        {title}
      </Text>
      <Box ref={ref} style={{ minHeight: height }} role="img" aria-label={`Chart: ${title}. Its numbers are in the table under it.`}>
        {width > 0 && <UplotReact options={full} data={data} />}
      </Box>
      {seriesKey && <SeriesKey series={options.series} />}
      {caption && (
        <Text size="xs" c="dimmed" mt={2}>
          {caption}
        </Text>
      )}
      <ChartNumbers
        title={title}
        columns={[String(options.series[0]?.label ?? 'x'), ...options.series.slice(1).filter((s) => typeof s.label === 'string' && s.label !== '').map((s) => String(s.label))]}
        rows={() => chartRows(options, data, formatX)}
      />
    </Box>
  );
}
