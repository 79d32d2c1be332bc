import type { AccuracyReportDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { accuracyKeys } from './accuracy-keys';

/** GET /api/accuracy?zone=&from=&to= (viewer, operator, supervisor). */
export function useAccuracy(zones: readonly string[], from: string | null, to: string | null) {
  return useQuery({
    queryKey: accuracyKeys.report(zones, from ?? '', to ?? ''),
    queryFn: ({ signal }) => api.get<AccuracyReportDto>('/accuracy', { query: { zone: zones.length ? zones.join(',') : undefined, from: from!, to: to! }, signal }),
    enabled: !!from && !!to,
    staleTime: 60_000,
    retry: false,
  });
}
