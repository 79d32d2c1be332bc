import { describe, expect, it } from 'vitest';
import { correlogramData, correlogramRange, dailyMapeData, fmtNum, fmtP, lagsOutsideBand, timeSeriesData } from './chart-data';

describe('workbench chart data', () => {
  it('puts hour starts on a seconds axis and keeps gaps as null', () => {
    const data = timeSeriesData(['2026-03-01T00:00:00.000Z', '2026-03-01T01:00:00.000Z'], [210.5, null], [1, 2]);
    expect(data[0]).toEqual([1772323200, 1772326800]);
    expect(data[1]).toEqual([210.5, null]);
    expect(data[2]).toEqual([1, 2]);
  });

  it('lays a correlogram out from lag 1 with the band above and below', () => {
    const data = correlogramData([0.9, null, -0.2], 0.05);
    expect(data[0]).toEqual([1, 2, 3]);
    expect(data[1]).toEqual([0.9, null, -0.2]);
    expect(data[2]).toEqual([0.05, 0.05, 0.05]);
    expect(data[3]).toEqual([-0.05, -0.05, -0.05]);
  });

  it('lists the lags outside the band, strongest first', () => {
    expect(lagsOutsideBand([0.01, 0.5, -0.7, 0.02, 0.06], 0.05)).toEqual([
      { lag: 3, value: -0.7 },
      { lag: 2, value: 0.5 },
      { lag: 5, value: 0.06 },
    ]);
  });

  it('puts daily MAPE of model and baseline side by side', () => {
    expect(dailyMapeData([{ date: '2026-03-01', mape: 2.5, baselineMape: 4 }, { date: '2026-03-02', mape: null, baselineMape: 3 }])).toEqual([[0, 1], [2.5, null], [4, 3]]);
  });

  it('zooms a correlogram to its largest bar, between ±0.2 and ±1', () => {
    expect(correlogramRange([0.9, 0.5], 0.05)).toEqual([-1, 1]);
    expect(correlogramRange([0.03, -0.31], 0.05)).toEqual([-0.4, 0.4]);
    expect(correlogramRange([0.01], 0.05)).toEqual([-0.2, 0.2]);
  });

  it('drops the sign of a number that rounds to zero', () => {
    expect(fmtNum(-0.004, 1)).toBe('0.0');
    expect(fmtNum(-0.05, 1)).toBe('-0.1');
  });

  it('writes small p-values as a bound', () => {
    expect(fmtP(0.0004)).toBe('< 0.001');
    expect(fmtP(0.0456)).toBe('0.046');
    expect(fmtP(null)).toBe('—');
  });
});
