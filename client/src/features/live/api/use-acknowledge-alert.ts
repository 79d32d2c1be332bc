import type { AlertDto } from '@morrowline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { notifyFailure, notifySuccess } from '../../../lib/notify';
import { useZones } from '../../zones';
import { withoutAlert } from '../model/alert-list';
import { alertHistoryKey, openAlertsKey } from './live-keys';

/** POST /api/alerts/:id/acknowledge (operator, supervisor). */
export function useAcknowledgeAlert() {
  const queryClient = useQueryClient();
  const zones = useZones();
  return useMutation({
    mutationFn: ({ id, comment }: { id: number; comment: string }) =>
      api.post<AlertDto>(`/alerts/${id}/acknowledge`, comment.trim() ? { comment: comment.trim() } : {}),
    // Said here, not at the call: the row (and its button) leaves the list the moment this succeeds.
    onSuccess: (alert) => {
      queryClient.setQueryData<AlertDto[]>(openAlertsKey, (list) => (list ? withoutAlert(list, alert.id) : list));
      void queryClient.invalidateQueries({ queryKey: alertHistoryKey });
      notifySuccess(`Alert for ${zones.data?.find((z) => z.code === alert.zone)?.name ?? alert.zone} acknowledged.`);
    },
    // Someone else may have acknowledged it first (409): the list is re-read either way.
    onError: (error) => {
      notifyFailure('The alert could not be acknowledged', error);
      return queryClient.invalidateQueries({ queryKey: openAlertsKey });
    },
  });
}
