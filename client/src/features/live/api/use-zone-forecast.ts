import type { ForecastRunDto, LatestForecastsDto, ReadingSeriesDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { api } from '../../../lib/api-client';
import { emptyForecastLine, type ForecastLine } from '../model/forecast-line';
import { hourIndex } from '../model/hours';
import { weekEarlierLine } from '../model/week-earlier-line';
import { latestForecastsKey } from './live-keys';

export interface ZoneForecast {
  line: ForecastLine;
  /** What the line is, in words for the chart's caption. */
  source: string;
}

/**
 * A server run laid out on the hours of the readings series. A run starts after the last reading
 * it used, so the hours before it (the past days on the chart) take `before`: the week-earlier
 * value, which is also what the deviation alerts compare against.
 */
export function runToLine(run: ForecastRunDto, series: ReadingSeriesDto, before?: ForecastLine): ForecastLine {
  const length = series.hours.length;
  const line = emptyForecastLine(length);
  const firstRunHour = run.hours.length > 0 ? Date.parse(run.hours[0]) : Infinity;
  if (before) {
    for (let i = 0; i < length && Date.parse(series.hours[i]) < firstRunHour; i++) {
      line.mean[i] = before.mean[i];
      line.lower80[i] = before.lower80[i];
      line.upper80[i] = before.upper80[i];
      line.lower95[i] = before.lower95[i];
      line.upper95[i] = before.upper95[i];
    }
  }
  const fromMs = Date.parse(series.from);
  run.hours.forEach((hour, k) => {
    const i = hourIndex(hour, fromMs, length);
    if (i < 0) return;
    line.mean[i] = run.mean[k];
    line.lower80[i] = run.lower80[k];
    line.upper80[i] = run.upper80[k];
    line.lower95[i] = run.lower95[k];
    line.upper95[i] = run.upper95[k];
  });
  return line;
}

export function describeRun(run: ForecastRunDto): string {
  // The server serves only issued runs as the latest; should a replay ever arrive, it says so.
  if (run.origin === 'replayed') return `Replayed forecast (worked out afterwards as of ${run.issuedAt.slice(0, 16).replace('T', ' ')} UTC; not issued by the desk then)`;
  if (run.method === 'arima') return `Model forecast issued ${run.issuedAt.slice(0, 16).replace('T', ' ')} UTC`;
  return run.fallbackReason ? `Seasonal-naive stand-in (${run.fallbackReason})` : 'Seasonal-naive stand-in: same hour one week earlier';
}

/**
 * The current forecast per zone, on the hours of `series`, from GET /api/forecasts/latest (a zone
 * without a model gets the server's seasonal-naive stand-in run). The hours before the run show
 * the week-earlier line computed here from the readings.
 *
 * `displayFrom` is where the chart starts; `originIndex` the first hour of `series` without a
 * reading yet (where the week-earlier line's error history ends).
 */
export function useZoneForecast(series: ReadingSeriesDto | undefined, displayFrom: string, originIndex: number) {
  const zones = series?.zones.map((z) => z.zone) ?? [];
  const to = series?.to ?? '';
  const latest = useQuery({
    queryKey: latestForecastsKey(zones, displayFrom, to),
    queryFn: ({ signal }) => api.get<LatestForecastsDto>('/forecasts/latest', { signal, query: { zone: zones.join(','), from: displayFrom, to } }),
    enabled: zones.length > 0,
    staleTime: 10 * 60_000,
  });

  const forecasts = useMemo(() => {
    const out = new Map<string, ZoneForecast>();
    if (!series) return out;
    for (const zone of series.zones) {
      const run = latest.data?.zones.find((r) => r.zone === zone.zone);
      out.set(
        zone.zone,
        run
          ? { line: runToLine(run, series, weekEarlierLine(zone.mw, originIndex)), source: `${describeRun(run)}; hours before it show the same hour one week earlier` }
          : { line: emptyForecastLine(series.hours.length), source: latest.isPending ? 'Loading the forecast…' : 'No forecast for this zone' },
      );
    }
    return out;
  }, [series, latest.data, latest.isPending, originIndex]);

  return { forecasts, error: latest.isError ? latest.error : null };
}
