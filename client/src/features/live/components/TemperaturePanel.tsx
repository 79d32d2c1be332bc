import { Group, Stack, Text } from '@mantine/core';
import type { WeatherStatusDto, ZoneWeatherSeriesDto } from '@morrowline/shared';
import { useMemo } from 'react';
import type uPlot from 'uplot';
import { axis, CHART_COLORS, UplotChart } from '../../../components/UplotChart';
import { formatDateTime } from '../../../lib/format';
import { alignedTemperatures, formatTemperature, zoneWeatherState } from '../../weather';
import { hourEndingSplits, hourEndingTick } from './chart-axis';
import { WeatherFeedBadge } from './WeatherFeedBadge';

const HOUR_S = 3600;

interface TemperaturePanelProps {
  zone: string;
  timeZone: string;
  /** The load chart's UTC hour starts and its first hour shown: the temperatures sit on the same hour-ending axis. */
  hours: readonly string[];
  displayFrom: number;
  nowHour: number;
  weather: ZoneWeatherSeriesDto | undefined;
  status: readonly WeatherStatusDto[] | undefined;
}

/**
 * The zone's temperature under its load: observed (its stations' weighted average) and the
 * latest temperature forecast, hour ending, on an axis of its own in °C; the latest observed
 * value, the forecast's issue time, and whether the weather feed keeps up.
 */
export function TemperaturePanel({ zone, timeZone, hours, displayFrom, nowHour, weather, status }: TemperaturePanelProps) {
  const first = Math.max(0, hours.findIndex((h) => Date.parse(h) >= displayFrom));
  const shown = useMemo(() => hours.slice(first), [hours, first]);
  const aligned = useMemo(() => alignedTemperatures(weather, zone, shown), [weather, zone, shown]);
  const state = zoneWeatherState(status, zone);
  const lastObserved = aligned.observedC.reduce<{ at: number; value: number } | null>((last, v, i) => (v === null ? last : { at: i, value: v }), null);
  const issuedAt = weather?.zones.find((z) => z.zone === zone)?.latestIssuedAt ?? null;

  const data = useMemo<uPlot.AlignedData>(() => [shown.map((h) => Date.parse(h) / 1000 + HOUR_S), aligned.forecastC, aligned.observedC], [shown, aligned]);
  const options = useMemo<Omit<uPlot.Options, 'width' | 'height'>>(
    () => ({
      scales: { x: { time: true } },
      cursor: { drag: { x: false, y: false } },
      series: [
        {},
        { label: 'Temperature forecast (°C)', stroke: CHART_COLORS.second, width: 1.5, dash: [6, 4], spanGaps: false },
        { label: 'Observed temperature (°C)', stroke: CHART_COLORS.third, width: 2, spanGaps: false },
      ],
      axes: [
        axis({ splits: (_u, _i, min, max) => hourEndingSplits(min, max, timeZone, 12), values: (_u, splits) => splits.map((t) => hourEndingTick(t, timeZone, 12)), size: 40 }),
        axis({ label: '°C', size: 50 }),
      ],
      hooks: {
        draw: [
          (u) => {
            // The start of the current hour, as on the load chart.
            const x = u.valToPos(nowHour / 1000, 'x', true);
            const ctx = u.ctx;
            ctx.save();
            ctx.strokeStyle = CHART_COLORS.axis;
            ctx.setLineDash([2, 3]);
            ctx.beginPath();
            ctx.moveTo(x, u.bbox.top);
            ctx.lineTo(x, u.bbox.top + u.bbox.height);
            ctx.stroke();
            ctx.restore();
          },
        ],
      },
    }),
    [timeZone, nowHour],
  );

  return (
    <Stack gap={4} mt="sm" data-testid="temperature-panel">
      <Group gap="sm" wrap="wrap">
        <Text size="sm" data-testid="temperature-now">
          Observed {formatTemperature(lastObserved?.value)}
          {lastObserved && ` (hour ending ${formatDateTime(new Date(Date.parse(shown[lastObserved.at]) + HOUR_S * 1000).toISOString(), timeZone)})`}
        </Text>
        <Text size="sm" c="dimmed" data-testid="temperature-forecast-issued">
          {issuedAt ? `Temperature forecast issued ${formatDateTime(issuedAt, timeZone)}` : 'No temperature forecast'}
        </Text>
        <WeatherFeedBadge state={state} />
      </Group>
      <UplotChart title="Temperature" options={options} data={data} height={150} testId="temperature-chart" seriesKey />
    </Stack>
  );
}
