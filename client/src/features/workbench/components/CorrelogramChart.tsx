import { useMemo } from 'react';
import uPlot from 'uplot';
import type { Correlogram } from '@morrowline/shared';
import { correlogramData, correlogramRange } from '../chart-data';
import { axis, CHART_COLORS, UplotChart } from '../../../components/UplotChart';

interface CorrelogramChartProps {
  title: string;
  correlogram: Correlogram;
  color?: string;
  height?: number;
  testId?: string;
}

/** ACF or PACF as bars by lag, with the ±1.96/√n band as dashed lines. */
export function CorrelogramChart({ title, correlogram, color = CHART_COLORS.load, height = 180, testId }: CorrelogramChartProps) {
  const data = useMemo(() => correlogramData(correlogram.values, correlogram.band), [correlogram]);
  const options = useMemo<Omit<uPlot.Options, 'width' | 'height'>>(() => {
    const bars = uPlot.paths.bars!({ size: [0.7, 6], align: 0 });
    const band = { stroke: CHART_COLORS.band, width: 1, dash: [4, 4], points: { show: false } };
    return {
      scales: { x: { time: false }, y: { range: correlogramRange(correlogram.values, correlogram.band) } },
      legend: { show: false },
      cursor: { points: { show: false } },
      series: [
        { label: 'lag' },
        { label: title, stroke: color, fill: color, paths: bars, points: { show: false } },
        { label: '+band', ...band },
        { label: '−band', ...band },
      ],
      axes: [axis({ values: (_u: uPlot, splits: number[]) => splits.map((v) => `${v}`) }), axis({ size: 44, values: (_u: uPlot, splits: number[]) => splits.map((v) => v.toFixed(1)) })],
    };
  }, [title, color, correlogram]);
  return (
    <UplotChart
      title={title}
      options={options}
      data={data}
      height={height}
      testId={testId}
      caption={`lags in hours; dashed lines ±${correlogram.band.toFixed(3)} (±1.96/√n): bars inside them are indistinguishable from noise`}
    />
  );
}
