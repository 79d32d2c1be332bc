import { DESK_EVENTS, type RefitJobDto } from '@morrowline/shared';
import { useQueryClient } from '@tanstack/react-query';
import { deskSocket, useDeskEvent, type DeskSocket } from '../../../lib/desk-socket';
import { modelVersionsKey, refitJobsKey } from '../api/refit-keys';
import { mergeJobs } from '../model/refit-jobs';

/**
 * Writes each refit progress event into the job list; when a job ends with a new version, that
 * zone's versions are fetched again.
 */
export function useRefitProgress(socket: DeskSocket = deskSocket): void {
  const queryClient = useQueryClient();
  useDeskEvent(DESK_EVENTS.refitProgress, (job) => {
    const before = queryClient.getQueryData<RefitJobDto[]>(refitJobsKey)?.find((j) => j.id === job.id);
    queryClient.setQueryData<RefitJobDto[]>(refitJobsKey, (list) => mergeJobs(list ?? [], job));
    if (job.state === 'done' && before?.state !== 'done') void queryClient.invalidateQueries({ queryKey: modelVersionsKey(job.zone) });
  }, socket);
}
