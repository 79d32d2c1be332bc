import type { BacktestReportDto, ModelReportDto, StationarityReportDto } from '@morrowline/shared';
import { useMutation, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { workbenchKeys } from './workbench-keys';

/** GET /api/workbench/:zone/stationarity */
export function useStationarity(zone: string | null, weeks: number) {
  return useQuery({
    queryKey: workbenchKeys.stationarity(zone ?? '', weeks),
    queryFn: ({ signal }) => api.get<StationarityReportDto>(`/workbench/${encodeURIComponent(zone!)}/stationarity`, { query: { weeks }, signal }),
    enabled: !!zone,
    staleTime: 5 * 60_000,
    retry: false,
  });
}

/** GET /api/workbench/:zone/model */
export function useModelReport(zone: string | null, weeks: number) {
  return useQuery({
    queryKey: workbenchKeys.model(zone ?? '', weeks),
    queryFn: ({ signal }) => api.get<ModelReportDto>(`/workbench/${encodeURIComponent(zone!)}/model`, { query: { weeks }, signal }),
    enabled: !!zone,
    staleTime: 5 * 60_000,
    retry: false,
  });
}

/** POST /api/workbench/:zone/backtest (operator, supervisor). */
export function useRunBacktest() {
  return useMutation({
    mutationFn: ({ zone, days }: { zone: string; days: number }) => api.post<BacktestReportDto>(`/workbench/${encodeURIComponent(zone)}/backtest`, { days }),
  });
}
