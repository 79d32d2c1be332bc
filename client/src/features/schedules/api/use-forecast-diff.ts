import type { ForecastDiffDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { schedulesKey } from './schedule-keys';

/** GET /api/forecasts/runs/:from/diff?against=:to&from=&to= — how the forecast moved over the operating day. */
export function useForecastDiff(fromRun: number | null, toRun: number | null, range: { from: string; to: string }) {
  return useQuery({
    queryKey: [...schedulesKey, 'forecast-diff', fromRun, toRun, range.from, range.to],
    queryFn: ({ signal }) => api.get<ForecastDiffDto>(`/forecasts/runs/${fromRun}/diff`, { signal, query: { against: String(toRun), from: range.from, to: range.to } }),
    enabled: fromRun !== null && toRun !== null,
    staleTime: Infinity,
  });
}
