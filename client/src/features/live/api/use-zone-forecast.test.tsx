import type { ForecastRunDto, ReadingSeriesDto } from '@morrowline/shared';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { describe, expect, it } from 'vitest';
import { mockApi } from '../../../test/mock-api';
import { useZoneForecast } from './use-zone-forecast';

const HOUR_MS = 3_600_000;
const from = Date.parse('2026-05-01T00:00:00Z');
const length = 168 + 48;
const hours = Array.from({ length }, (_, i) => new Date(from + i * HOUR_MS).toISOString());
const mw = hours.map((_, i) => (i < 168 + 24 ? 100 + (i % 24) : null));
const series: ReadingSeriesDto = {
  from: hours[0],
  to: new Date(from + length * HOUR_MS).toISOString(),
  hours,
  zones: [{ zone: 'MILLRACE', mw, quality: mw.map((v) => (v === null ? null : 'good')), lastHour: hours[168 + 23], lastReceivedAt: null }],
};

function wrapper({ children }: { children: ReactNode }) {
  return <QueryClientProvider client={new QueryClient()}>{children}</QueryClientProvider>;
}

describe('useZoneForecast', () => {
  it('shows the server’s seasonal-naive stand-in for a zone without a model, as such', async () => {
    // The server's stand-in repeats the same hours one week earlier.
    const week = Array.from({ length: 24 }, (_, k) => mw[24 + k] as number);
    const standIn: ForecastRunDto = {
      id: null, zone: 'MILLRACE', issuedAt: '2026-05-08T23:10:00Z', basedOnHour: null, method: 'seasonal-naive', fallbackReason: 'no model yet', modelVersionId: null, origin: 'issued',
      hours: hours.slice(168 + 24, 168 + 48), mean: week, lower80: week, upper80: week, lower95: week, upper95: week,
    };
    mockApi({ 'GET /api/forecasts/latest': () => ({ body: { zones: [standIn] } }) });
    const { result } = renderHook(() => useZoneForecast(['MILLRACE'], series, hours[168]), { wrapper });
    await waitFor(() => expect(result.current.forecasts.get('MILLRACE')?.source).toMatch(/^Seasonal-naive stand-in/));
    const line = result.current.forecasts.get('MILLRACE')!.line;
    expect(line.mean[168 + 30]).toBe(mw[30]); // the same hour a week earlier
    expect(result.current.error).toBeNull();
  });

  it('makes no forecast up for a zone the server has no run for', async () => {
    mockApi({ 'GET /api/forecasts/latest': () => ({ body: { zones: [] } }) });
    const { result } = renderHook(() => useZoneForecast(['MILLRACE'], series, hours[168]), { wrapper });
    await waitFor(() => expect(result.current.forecasts.get('MILLRACE')?.source).toBe('No forecast for this zone'));
    const line = result.current.forecasts.get('MILLRACE')!.line;
    expect(line.mean.every((v) => v === null)).toBe(true);
    expect(result.current.error).toBeNull();
  });

  it('uses the server’s run once it answers, laid out on the series’ hours', async () => {
    const run: ForecastRunDto = {
      id: 3, zone: 'MILLRACE', issuedAt: '2026-05-08T23:10:00Z', basedOnHour: hours[168 + 23], origin: 'issued', method: 'arima', fallbackReason: null, modelVersionId: 9,
      hours: [hours[168 + 24], hours[168 + 25]], mean: [111, 112], lower80: [105, 106], upper80: [117, 118], lower95: [101, 102], upper95: [121, 122],
    };
    mockApi({ 'GET /api/forecasts/latest': () => ({ body: { zones: [run] } }) });
    const { result } = renderHook(() => useZoneForecast(['MILLRACE'], series, hours[168]), { wrapper });
    await waitFor(() => expect(result.current.forecasts.get('MILLRACE')?.source).toMatch(/^Model forecast/));
    const line = result.current.forecasts.get('MILLRACE')!.line;
    expect(line.mean[168 + 24]).toBe(111);
    expect(line.upper95[168 + 25]).toBe(122);
    expect(line.mean[168 + 30]).toBeNull(); // after the run: nothing made up
    expect(line.mean[168 + 5]).toBeNull(); // before the run: nothing either, never last week's load
  });
});
