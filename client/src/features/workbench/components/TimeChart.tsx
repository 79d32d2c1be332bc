import { formatLocalTime } from '@morrowline/shared';
import { useMemo } from 'react';
import type uPlot from 'uplot';
import { timeSeriesData } from '../chart-data';
import { axis, UplotChart } from '../../../components/UplotChart';

export interface TimeSeriesLine {
  label: string;
  values: readonly (number | null)[];
  color: string;
  width?: number;
}

interface TimeChartProps {
  title: string;
  times: readonly string[];
  lines: TimeSeriesLine[];
  unit: string;
  timeZone: string;
  height?: number;
  testId?: string;
  caption?: string;
}

/** Hourly lines over time, the axis in the zone's own time. */
export function TimeChart({ title, times, lines, unit, timeZone, height, testId, caption }: TimeChartProps) {
  const data = useMemo(() => timeSeriesData(times, ...lines.map((l) => l.values)), [times, lines]);
  const options = useMemo<Omit<uPlot.Options, 'width' | 'height'>>(
    () => ({
      tzDate: (ts: number) => uPlotTz(ts, timeZone),
      scales: { x: { time: true } },
      cursor: { drag: { x: true, y: false } },
      series: [{ label: 'time' }, ...lines.map((l) => ({ label: l.label, stroke: l.color, width: l.width ?? 1.25, points: { show: false }, value: (_: uPlot, v: number | null) => (v == null ? '—' : `${v.toFixed(1)} ${unit}`) }))],
      axes: [axis(), axis({ size: 60, values: (_u: uPlot, splits: number[]) => splits.map((v) => v.toFixed(0)), label: unit, labelSize: 14 })],
    }),
    [lines, unit, timeZone],
  );
  return <UplotChart title={title} options={options} data={data} height={height} testId={testId} caption={caption} seriesKey formatX={(x) => formatLocalTime(x * 1000, timeZone)} />;
}

/** A Date whose local fields show the zone's wall-clock time (uPlot formats local fields). */
function uPlotTz(ts: number, timeZone: string): Date {
  const date = new Date(ts * 1000);
  const parts = new Intl.DateTimeFormat('en-US', { timeZone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit' }).formatToParts(date);
  const get = (type: string) => Number(parts.find((p) => p.type === type)?.value ?? 0);
  return new Date(get('year'), get('month') - 1, get('day'), get('hour'), get('minute'), get('second'));
}
