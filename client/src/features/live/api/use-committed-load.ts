import type { CommittedLoadDto, ReadingSeriesDto } from '@morrowline/shared';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { api } from '../../../lib/api-client';
import { committedOnSeries, type CommittedLine } from '../model/committed-line';
import { committedLoadKey } from './live-keys';

/**
 * GET /api/live/committed over the range, laid out on the readings series: per zone the published
 * schedule, the day-ahead forecast and which of them was committed. Fetched again when a schedule
 * is published or a run is issued (the live updates invalidate it).
 */
export function useCommittedLoad(zones: readonly string[], series: ReadingSeriesDto | undefined, from: string, to: string) {
  const query = useQuery({
    queryKey: committedLoadKey(zones, from, to),
    queryFn: ({ signal }) => api.get<CommittedLoadDto>('/live/committed', { signal, query: { from, to } }),
    enabled: zones.length > 0,
    placeholderData: keepPreviousData,
    staleTime: 10 * 60_000,
  });
  const lines = useMemo(() => {
    const out = new Map<string, CommittedLine>();
    if (!series || !query.data) return out;
    const fromMs = Date.parse(series.from);
    for (const zone of query.data.zones) out.set(zone.zone, committedOnSeries(zone, query.data.hours, fromMs, series.hours.length));
    return out;
  }, [series, query.data]);
  return { lines, isPending: query.isPending, error: query.isError ? query.error : null };
}
