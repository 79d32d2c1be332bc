import { useMemo } from 'react';
import uPlot from 'uplot';
import { axis, UplotChart } from '../../../components/UplotChart';

/** Literal colours (uPlot draws on canvas): model in teal, schedule in amber. */
export const ACCURACY_COLORS = { model: '#0f7683', schedule: '#d16700' } as const;

interface BarChartProps {
  title: string;
  /** x values, then one array per series. */
  data: [number[], ...(number | null)[][]];
  series: { label: string; color: string }[];
  /** Label of an x value on the axis and in the legend. */
  xLabel: (x: number) => string;
  /** What the x values are, in the legend ("Day", "Hour ending"). */
  xName: string;
  unit: string;
  height?: number;
  testId?: string;
  caption?: string;
}

/** Grouped bars, one group per x value (days or hours ending), sized to the container's width. */
export function BarChart({ title, data, series, xLabel, xName, unit, height = 240, testId, caption }: BarChartProps) {
  const options = useMemo<Omit<uPlot.Options, 'width' | 'height'>>(() => {
    const groups = series.length;
    return {
      // Bars grow from zero, so the y range always includes it.
      scales: { x: { time: false, range: (_u, min, max) => [min - 0.6, max + 0.6] }, y: { range: (_u, min, max) => [Math.min(0, min * 1.1), Math.max(0, max * 1.1) || 1] } },
      legend: { show: true },
      cursor: { drag: { x: false, y: false } },
      series: [
        { label: xName, value: (_u, v) => (v == null ? '' : xLabel(v)) },
        ...series.map((s, i) => ({
          label: s.label,
          stroke: s.color,
          fill: `${s.color}cc`,
          fillTo: 0,
          width: 1,
          points: { show: false },
          // Side by side: each series' bars start at x − 0.4 + i × width (x-scale units).
          paths: uPlot.paths.bars!({ disp: { x0: { unit: 1, values: (u: uPlot) => (u.data[0] as number[]).map((x) => x - 0.4 + (i * 0.8) / groups) }, size: { unit: 1, values: () => [0.8 / groups] } } as never }),
          value: (_u: uPlot, v: number | null) => (v == null ? '—' : `${v.toFixed(2)} ${unit}`),
        })),
      ],
      axes: [
        axis({ values: (_u, splits) => splits.map((v) => (Number.isInteger(v) && v >= data[0][0] && v <= data[0][data[0].length - 1] ? xLabel(v) : '')), incrs: [1, 2, 3, 4, 6, 7, 14] }),
        axis({ size: 64, label: unit, labelSize: 14, values: (_u, splits) => splits.map((v) => v.toFixed(1)) }),
      ],
    };
  }, [series, xLabel, xName, unit, data]);
  return <UplotChart title={title} options={options} data={data as uPlot.AlignedData} height={height} testId={testId} caption={caption} />;
}
