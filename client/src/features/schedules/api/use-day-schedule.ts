import type { DayScheduleDto, ScheduleRevisionDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { scheduleKeys } from './schedule-keys';

/** GET /api/schedules/:day?zone=A,B (every desk role): the day's forecast, working and published revision per zone. */
export function useDaySchedule(day: string, zones: readonly string[]) {
  return useQuery({
    queryKey: scheduleKeys.day(day, zones),
    queryFn: ({ signal }) => api.get<DayScheduleDto>(`/schedules/${day}`, { signal, query: { zone: zones.join(',') } }),
    enabled: day !== '' && zones.length > 0,
  });
}

/** GET /api/schedules/:day/:zone/revisions: every revision, newest first. */
export function useRevisionHistory(day: string, zone: string, enabled: boolean) {
  return useQuery({
    queryKey: scheduleKeys.revisions(day, zone),
    queryFn: ({ signal }) => api.get<ScheduleRevisionDto[]>(`/schedules/${day}/${zone}/revisions`, { signal }),
    enabled,
  });
}
