import { Box, Text } from '@mantine/core';
import { useElementSize } from '@mantine/hooks';
import { useMemo } from 'react';
import type uPlot from 'uplot';
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
}

/** A uPlot chart sized to its container, with a title above it. */
export function UplotChart({ title, options, data, height = 220, testId, caption }: UplotChartProps) {
  const { ref, width } = useElementSize();
  const full = useMemo(() => ({ ...options, width: Math.max(200, Math.floor(width)), height }) as uPlot.Options, [options, width, height]);
  return (
    <Box data-testid={testId} role="figure" aria-label={title}>
      <Text size="sm" fw={600} mb={4}>
        {title}
      </Text>
      <Box ref={ref} style={{ minHeight: height }}>
        {width > 0 && <UplotReact options={full} data={data} />}
      </Box>
      {caption && (
        <Text size="xs" c="dimmed" mt={2}>
          {caption}
        </Text>
      )}
    </Box>
  );
}
