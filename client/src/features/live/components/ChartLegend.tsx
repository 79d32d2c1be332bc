import { Box, Group, Text } from '@mantine/core';
import { CHART_COLORS } from './chart-colors';
import { FORECAST_BAND_COLORS } from '../../../lib/forecast-bands';

function Swatch({ color, dashed, block }: { color: string; dashed?: boolean; block?: boolean }) {
  return (
    <Box
      component="span"
      style={{
        display: 'inline-block',
        width: 18,
        height: block ? 10 : 0,
        background: block ? color : undefined,
        borderTop: block ? undefined : `2px ${dashed ? 'dashed' : 'solid'} ${color}`,
      }}
    />
  );
}

function Entry({ label, testId, children }: { label: string; testId?: string; children: React.ReactNode }) {
  return (
    <Group gap={6} wrap="nowrap" data-testid={testId}>
      {children}
      <Text size="xs">{label}</Text>
    </Group>
  );
}

export interface LegendProps {
  /** Whether the shown hours have a published schedule, a day-ahead forecast, a latest run. */
  hasSchedule: boolean;
  hasDayAhead: boolean;
  hasLatestRun: boolean;
  showIncomplete: boolean;
  showExcluded?: boolean;
}

/** The chart's key, ours rather than uPlot's: it says which lines the shown days have and which they lack. */
export function ChartLegend({ hasSchedule, hasDayAhead, hasLatestRun, showIncomplete, showExcluded = false }: LegendProps) {
  return (
    <Group gap="md" data-testid="chart-legend" wrap="wrap">
      <Entry label="Actual load"><Swatch color={CHART_COLORS.actual} /></Entry>
      <Entry label={hasSchedule ? 'Published schedule' : 'Published schedule: none for these days'} testId="legend-schedule"><Swatch color={CHART_COLORS.schedule} /></Entry>
      <Entry label={hasDayAhead ? 'Day-ahead forecast (issued by gate closure)' : 'Day-ahead forecast: none for these days'} testId="legend-day-ahead"><Swatch color={CHART_COLORS.dayAhead} /></Entry>
      <Entry label={hasLatestRun ? 'Latest run' : 'Latest run: none'}><Swatch color={CHART_COLORS.latestRun} dashed /></Entry>
      {hasLatestRun && <Entry label="80 % band"><Swatch color={FORECAST_BAND_COLORS.band80} block /></Entry>}
      {hasLatestRun && <Entry label="95 % band"><Swatch color={FORECAST_BAND_COLORS.band95} block /></Entry>}
      {showExcluded && <Entry label="Outage or bad-data window: not normal load"><Swatch color="rgba(85, 112, 142, 0.4)" block /></Entry>}
      {showIncomplete && <Entry label="Incomplete: a zone did not report"><Swatch color="rgba(236, 130, 25, 0.35)" block /></Entry>}
    </Group>
  );
}
