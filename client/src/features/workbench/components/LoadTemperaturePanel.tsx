import { Card, Group, Text, Title } from '@mantine/core';
import { HOUR_MS, type ReadingSeriesDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { CHART_COLORS } from '../../../components/UplotChart';
import { api } from '../../../lib/api-client';
import { HOUR_GROUPS, loadTemperaturePoints, useZoneWeather, type HourGroup } from '../../weather';

const GROUP_COLORS: Record<HourGroup, string> = { night: CHART_COLORS.third, morning: CHART_COLORS.load, afternoon: CHART_COLORS.second, evening: '#a2367a' };
const WIDTH = 640;
const HEIGHT = 300;
const PAD = { left: 56, right: 12, top: 12, bottom: 36 };

/**
 * The zone's hourly load against its observed temperature over the weeks analysed, one dot an
 * hour, coloured by time of day: heating and cooling show as the arms of the cloud. (The model
 * does not use temperature yet, so no fitted response is drawn.)
 */
export function LoadTemperaturePanel({ zone, weeks, timeZone }: { zone: string; weeks: number; timeZone: string }) {
  const to = useMemo(() => new Date(Math.floor(Date.now() / HOUR_MS) * HOUR_MS).toISOString(), []);
  const from = useMemo(() => new Date(Date.parse(to) - Math.min(weeks * 7, 92) * 24 * HOUR_MS).toISOString(), [to, weeks]);
  const readings = useQuery({
    queryKey: ['readings', 'series', 'workbench', { zone, from, to }],
    queryFn: ({ signal }) => api.get<ReadingSeriesDto>('/readings', { signal, query: { zone, from, to } }),
  });
  const weather = useZoneWeather([zone], from, to, to);
  const points = useMemo(() => loadTemperaturePoints(readings.data, weather.data, zone, timeZone), [readings.data, weather.data, zone, timeZone]);

  const scale = useMemo(() => {
    if (points.length === 0) return null;
    const t = points.map((p) => p.tempC);
    const m = points.map((p) => p.mw);
    const [t0, t1] = [Math.floor(Math.min(...t)), Math.ceil(Math.max(...t))];
    const [m0, m1] = [Math.floor(Math.min(...m)), Math.ceil(Math.max(...m))];
    const x = (v: number) => PAD.left + ((v - t0) / Math.max(1, t1 - t0)) * (WIDTH - PAD.left - PAD.right);
    const y = (v: number) => HEIGHT - PAD.bottom - ((v - m0) / Math.max(1, m1 - m0)) * (HEIGHT - PAD.top - PAD.bottom);
    return { x, y, t0, t1, m0, m1 };
  }, [points]);

  return (
    <Card withBorder padding="md" data-testid="load-temperature">
      <Title order={4}>Load against temperature</Title>
      <Text size="sm" c="dimmed" mb="xs">
        Each dot is an hour of the last {Math.min(weeks * 7, 92)} days: its load and the zone&apos;s observed temperature (its stations&apos; weighted average), by time of day.
      </Text>
      {!scale && <Text size="sm" c="dimmed">{readings.isPending || weather.isPending ? 'Loading…' : 'No hour has both a reading and an observed temperature yet.'}</Text>}
      {scale && (
        <svg viewBox={`0 0 ${WIDTH} ${HEIGHT}`} width="100%" role="img" aria-label={`Load against temperature, ${points.length} hours`} style={{ maxWidth: WIDTH }}>
          <line x1={PAD.left} y1={HEIGHT - PAD.bottom} x2={WIDTH - PAD.right} y2={HEIGHT - PAD.bottom} stroke={CHART_COLORS.axis} />
          <line x1={PAD.left} y1={PAD.top} x2={PAD.left} y2={HEIGHT - PAD.bottom} stroke={CHART_COLORS.axis} />
          <text x={PAD.left} y={HEIGHT - 8} fontSize={11} fill={CHART_COLORS.axis}>{scale.t0} °C</text>
          <text x={WIDTH - PAD.right} y={HEIGHT - 8} fontSize={11} fill={CHART_COLORS.axis} textAnchor="end">{scale.t1} °C</text>
          <text x={PAD.left - 6} y={HEIGHT - PAD.bottom} fontSize={11} fill={CHART_COLORS.axis} textAnchor="end">{scale.m0} MW</text>
          <text x={PAD.left - 6} y={PAD.top + 10} fontSize={11} fill={CHART_COLORS.axis} textAnchor="end">{scale.m1} MW</text>
          {points.map((p, i) => (
            <circle key={i} cx={scale.x(p.tempC)} cy={scale.y(p.mw)} r={2} fill={GROUP_COLORS[p.group]} fillOpacity={0.6} />
          ))}
        </svg>
      )}
      <Group gap="md" mt={4}>
        {HOUR_GROUPS.map((g) => (
          <Group key={g.key} gap={6}>
            <svg width={10} height={10} aria-hidden>
              <circle cx={5} cy={5} r={4} fill={GROUP_COLORS[g.key]} />
            </svg>
            <Text size="xs" c="dimmed">{g.label}</Text>
          </Group>
        ))}
      </Group>
    </Card>
  );
}
