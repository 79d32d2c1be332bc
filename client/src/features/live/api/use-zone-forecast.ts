import type { ForecastRunDto, LatestForecastsDto, ReadingSeriesDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { api } from '../../../lib/api-client';
import { emptyForecastLine, type ForecastLine } from '../model/forecast-line';
import { hourIndex } from '../model/hours';
import { latestForecastsKey } from './live-keys';

export interface ZoneForecast {
  line: ForecastLine;
  /** What the line is, in words for the chart's caption. */
  source: string;
}

/**
 * A server run laid out on the hours of the readings series. Hours the run does not cover stay
 * empty: the latest run is its own line, and nothing (last week's load, the committed numbers)
 * is filled in before it.
 */
export function runToLine(run: ForecastRunDto, series: ReadingSeriesDto): ForecastLine {
  const length = series.hours.length;
  const line = emptyForecastLine(length);
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
 * The latest run per zone, on the hours of `series`, from GET /api/forecasts/latest for every
 * active zone (a zone without a model gets the server's seasonal-naive stand-in run, named as
 * such). `zones` only keys the query (see useReadingsSeries). `displayFrom` is where the chart starts.
 */
export function useZoneForecast(zones: readonly string[], series: ReadingSeriesDto | undefined, displayFrom: string) {
  const to = series?.to ?? '';
  const latest = useQuery({
    queryKey: latestForecastsKey(zones, displayFrom, to),
    queryFn: ({ signal }) => api.get<LatestForecastsDto>('/forecasts/latest', { signal, query: { from: displayFrom, to } }),
    enabled: zones.length > 0 && to !== '',
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
          ? { line: runToLine(run, series), source: describeRun(run) }
          : { line: emptyForecastLine(series.hours.length), source: latest.isPending ? 'Loading the forecast…' : 'No forecast for this zone' },
      );
    }
    return out;
  }, [series, latest.data, latest.isPending]);

  return { forecasts, error: latest.isError ? latest.error : null };
}
