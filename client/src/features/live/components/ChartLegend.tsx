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

function Entry({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <Group gap={6} wrap="nowrap">
      {children}
      <Text size="xs">{label}</Text>
    </Group>
  );
}

/** The chart's key, ours rather than uPlot's, so that the empty schedule slot can say so. */
export function ChartLegend({ showIncomplete, showExcluded = false }: { showIncomplete: boolean; showExcluded?: boolean }) {
  return (
    <Group gap="md" data-testid="chart-legend" wrap="wrap">
      <Entry label="Actual load"><Swatch color={CHART_COLORS.actual} /></Entry>
      <Entry label="Forecast"><Swatch color={CHART_COLORS.forecast} dashed /></Entry>
      <Entry label="80 % band"><Swatch color={FORECAST_BAND_COLORS.band80} block /></Entry>
      <Entry label="95 % band"><Swatch color={FORECAST_BAND_COLORS.band95} block /></Entry>
      <Entry label="Published schedule — none yet"><Swatch color={CHART_COLORS.schedule} /></Entry>
      {showExcluded && <Entry label="Outage or bad-data window: not normal load"><Swatch color="rgba(85, 112, 142, 0.4)" block /></Entry>}
      {showIncomplete && <Entry label="Incomplete: a zone did not report"><Swatch color="rgba(236, 130, 25, 0.35)" block /></Entry>}
    </Group>
  );
}
