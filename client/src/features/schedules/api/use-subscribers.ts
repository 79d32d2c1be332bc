import type { CreateScheduleSubscriberRequest, ScheduleSubscriberDto } from '@morrowline/shared';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { scheduleKeys } from './schedule-keys';

/** GET /api/schedules/subscribers (supervisor): who is e-mailed on publication. */
export function useSubscribers(enabled: boolean) {
  return useQuery({
    queryKey: scheduleKeys.subscribers,
    queryFn: ({ signal }) => api.get<ScheduleSubscriberDto[]>('/schedules/subscribers', { signal }),
    enabled,
  });
}

export function useAddSubscriber() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: CreateScheduleSubscriberRequest) => api.post<ScheduleSubscriberDto>('/schedules/subscribers', request),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: scheduleKeys.subscribers }),
  });
}

/** DELETE deactivates; the entry stays for the record. */
export function useRemoveSubscriber() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete<ScheduleSubscriberDto>(`/schedules/subscribers/${id}`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: scheduleKeys.subscribers }),
  });
}
