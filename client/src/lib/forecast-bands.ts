import type uPlot from 'uplot';

/**
 * A forecast's 80 % and 95 % intervals drawn the same way on every chart: four invisible series
 * (95 % upper, 95 % lower, 80 % upper, 80 % lower, at positions `first`…`first + 3` of the
 * chart's series) and the fills between each pair. One colour, two strengths, so the inner band
 * reads as the likelier one in both the light and the dark scheme.
 */
export const FORECAST_BAND_COLORS = {
  band80: 'rgba(81, 81, 181, 0.26)',
  band95: 'rgba(81, 81, 181, 0.13)',
} as const;

const hidden = { show: true, points: { show: false }, stroke: 'transparent', width: 0 } as const;

export function forecastBandSeries(): uPlot.Series[] {
  return [
    { ...hidden, label: '95 % upper' },
    { ...hidden, label: '95 % lower' },
    { ...hidden, label: '80 % upper' },
    { ...hidden, label: '80 % lower' },
  ];
}

export function forecastBands(first = 1): uPlot.Band[] {
  return [
    { series: [first, first + 1], fill: FORECAST_BAND_COLORS.band95 },
    { series: [first + 2, first + 3], fill: FORECAST_BAND_COLORS.band80 },
  ];
}
