import { DESK_EVENTS, type RefitJobDto } from '@morrowline/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { deskSocket, useDeskConnectionState, useDeskEvent, type DeskSocket } from '../../../lib/desk-socket';
import { modelsPrefix, modelVersionsKey, refitJobsKey } from '../api/refit-keys';
import { mergeJobs } from '../model/refit-jobs';

/**
 * Writes each refit progress event into the job list; when a job ends with a new version, that
 * zone's versions are fetched again. After a dropped connection (its server node went down and
 * the desk came back through another) the jobs and versions are fetched again: a job may have
 * finished on a worker while no event could reach this desk.
 */
export function useRefitProgress(socket: DeskSocket = deskSocket): void {
  const queryClient = useQueryClient();
  const connection = useDeskConnectionState(socket);
  const wasConnected = useRef(false);

  useEffect(() => {
    if (connection !== 'connected') return;
    if (wasConnected.current) void queryClient.invalidateQueries({ queryKey: modelsPrefix });
    wasConnected.current = true;
  }, [connection, queryClient]);

  useDeskEvent(DESK_EVENTS.refitProgress, (job) => {
    const before = queryClient.getQueryData<RefitJobDto[]>(refitJobsKey)?.find((j) => j.id === job.id);
    queryClient.setQueryData<RefitJobDto[]>(refitJobsKey, (list) => mergeJobs(list ?? [], job));
    if (job.state === 'done' && before?.state !== 'done') void queryClient.invalidateQueries({ queryKey: modelVersionsKey(job.zone) });
  }, socket);
}
