import { describe, expect, it } from 'vitest';
import { FORECAST_BAND_COLORS, forecastBands, forecastBandSeries } from './forecast-bands';

describe('forecast bands', () => {
  it('pairs the 95 % bounds and the 80 % bounds, in the order the series are laid out', () => {
    const labels = forecastBandSeries().map((s) => s.label);
    expect(labels).toEqual(['95 % upper', '95 % lower', '80 % upper', '80 % lower']);
    expect(forecastBands(1)).toEqual([
      { series: [1, 2], fill: FORECAST_BAND_COLORS.band95 },
      { series: [3, 4], fill: FORECAST_BAND_COLORS.band80 },
    ]);
    expect(forecastBands(3)[1].series).toEqual([5, 6]);
  });

  it('draws the bounds themselves invisibly: only the fills show', () => {
    for (const s of forecastBandSeries()) {
      expect(s.stroke).toBe('transparent');
      expect(s.width).toBe(0);
    }
  });
});
