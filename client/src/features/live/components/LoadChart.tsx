import { Box, Group, Text } from '@mantine/core';
import { useElementSize } from '@mantine/hooks';
import { useMemo, useRef, useState } from 'react';
import uPlot from 'uplot';
import UplotReact from 'uplot-react';
import 'uplot/dist/uPlot.min.css';
import type { LoadView } from '../model/zone-view';
import { hourEndingSplits, hourEndingTick } from './chart-axis';
import { CHART_COLORS } from './chart-colors';
import { ChartLegend } from './ChartLegend';
import { CommittedSources } from './CommittedSources';
import { HoverReadout } from './HoverReadout';
import { forecastBands, forecastBandSeries } from '../../../lib/forecast-bands';
import { ChartNumbers } from '../../../components/ChartNumbers';
import { loadChartRows, LOAD_CHART_COLUMNS } from './load-chart-rows';

const HOUR_S = 3600;
const HEIGHT = 340;

interface LoadChartProps {
  view: LoadView;
  /** UTC hour starts of the series, and the first one shown. */
  hours: readonly string[];
  displayFrom: number;
  nowHour: number;
  /** Hours inside an outage or bad-data window, on the series' hours; shaded grey. */
  excluded?: readonly boolean[];
}

/**
 * Actual load beside what was committed (the published schedule and the day-ahead forecast) and
 * the latest run with its 80 % and 95 % bands, on an hour-ending axis in the zone's time zone.
 * Missing hours are gaps (null, never drawn across); incomplete system hours are shaded; a
 * vertical line marks the start of the current hour.
 */
export function LoadChart({ view, hours, displayFrom, nowHour, excluded }: LoadChartProps) {
  const { ref, width } = useElementSize();
  const [hover, setHover] = useState<number | null>(null);
  const first = Math.max(0, hours.findIndex((h) => Date.parse(h) >= displayFrom));
  const incompleteRef = useRef<boolean[]>([]);
  incompleteRef.current = view.incomplete.slice(first);

  const data = useMemo<uPlot.AlignedData>(() => {
    const cut = (values: readonly (number | null)[]) => values.slice(first) as (number | null)[];
    const x = hours.slice(first).map((h) => Date.parse(h) / 1000 + HOUR_S);
    const f = view.latestRun;
    const c = view.committed;
    return [x, cut(f.upper95), cut(f.lower95), cut(f.upper80), cut(f.lower80), cut(f.mean), cut(c.dayAhead), cut(c.schedule), cut(view.actual)];
  }, [view, hours, first]);

  const options = useMemo<uPlot.Options>(() => {
    const tz = view.timeZone;
    // Points sit at their hour's end: the line at the current hour's start has every ended hour to its left.
    const nowX = nowHour / 1000;
    // Windows change rarely; a change makes a new chart with the new shading.
    const excludedFlags = excluded?.slice(first) ?? [];
    const step = width < 700 ? 12 : 6;
    return {
      width: Math.max(320, width),
      height: HEIGHT,
      legend: { show: false },
      cursor: { points: { size: 6 }, drag: { x: false, y: false } },
      scales: { x: { time: false } },
      series: [
        {},
        ...forecastBandSeries(),
        { label: 'Latest run', stroke: CHART_COLORS.latestRun, width: 1.5, dash: [6, 4], points: { show: false } },
        { label: 'Day-ahead forecast', stroke: CHART_COLORS.dayAhead, width: 1.5, points: { show: false } },
        { label: 'Published schedule', stroke: CHART_COLORS.schedule, width: 2, points: { show: false } },
        { label: 'Actual load', stroke: CHART_COLORS.actual, width: 2, points: { show: false } },
      ],
      bands: forecastBands(),
      axes: [
        {
          stroke: CHART_COLORS.axis,
          grid: { stroke: CHART_COLORS.grid },
          ticks: { stroke: CHART_COLORS.grid },
          size: 48,
          splits: (u) => hourEndingSplits(u.scales.x.min ?? 0, u.scales.x.max ?? 0, tz, step),
          values: (_u, splits) => splits.map((t) => hourEndingTick(t, tz, step)),
        },
        { stroke: CHART_COLORS.axis, grid: { stroke: CHART_COLORS.grid }, ticks: { stroke: CHART_COLORS.grid }, label: 'MW', size: 60 },
      ],
      hooks: {
        setCursor: [(u) => setHover(u.cursor.idx ?? null)],
        drawAxes: [
          (u) => {
            const { ctx, bbox } = u;
            const xs = u.data[0];
            ctx.save();
            const shade = (flags: readonly boolean[], color: string) => {
              ctx.fillStyle = color;
              flags.forEach((flag, i) => {
                if (!flag || i >= xs.length) return;
                const left = u.valToPos(xs[i] - HOUR_S, 'x', true);
                const right = u.valToPos(xs[i], 'x', true);
                ctx.fillRect(left, bbox.top, right - left, bbox.height);
              });
            };
            shade(excludedFlags, CHART_COLORS.excluded);
            shade(incompleteRef.current, CHART_COLORS.incomplete);
            const x = u.valToPos(nowX, 'x', true);
            if (x >= bbox.left && x <= bbox.left + bbox.width) {
              ctx.strokeStyle = CHART_COLORS.now;
              ctx.lineWidth = 1.5 * devicePixelRatio;
              ctx.setLineDash([4 * devicePixelRatio, 4 * devicePixelRatio]);
              ctx.beginPath();
              ctx.moveTo(x, bbox.top);
              ctx.lineTo(x, bbox.top + bbox.height);
              ctx.stroke();
            }
            ctx.restore();
          },
        ],
      },
    };
  }, [width, view.timeZone, nowHour, excluded, first]);

  const hoverIndex = hover === null ? null : first + hover;
  const drawn = (values: readonly (number | null)[]) => values.slice(first).some((v) => v !== null);
  return (
    <Box>
      <Group justify="space-between" align="flex-start" mb={4} wrap="wrap">
        <ChartLegend
          hasSchedule={drawn(view.committed.schedule)}
          hasDayAhead={drawn(view.committed.dayAhead)}
          hasLatestRun={drawn(view.latestRun.mean)}
          showIncomplete={view.incomplete.slice(first).some(Boolean)}
          showExcluded={excluded?.slice(first).some(Boolean) ?? false}
        />
        <HoverReadout view={view} hours={hours} index={hoverIndex} />
      </Group>
      <Box ref={ref} data-testid="load-chart" aria-label={`Load chart: ${view.name}. Its numbers are in the table under it.`} role="img">
        {width > 0 && <UplotReact options={options} data={data} />}
      </Box>
      <ChartNumbers title={`Load of ${view.name}, hour by hour`} columns={LOAD_CHART_COLUMNS} rows={() => loadChartRows(view, hours, first)} testId="load-chart-numbers" />
      <CommittedSources view={view} />
      <Text size="xs" c="dimmed" mt={4}>
        Forecast: {view.latestRunSource} — the latest run, dashed with its bands; deviation is measured against what was committed, not against it. Hour ending in {view.timeZone}; hours left of the dashed grey line are over.
      </Text>
    </Box>
  );
}
