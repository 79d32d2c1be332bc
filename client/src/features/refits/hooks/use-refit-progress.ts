import { DESK_EVENTS, type RefitJobDto } from '@morrowline/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { deskSocket, useDeskConnectionState, useDeskEvent, type DeskSocket } from '../../../lib/desk-socket';
import { modelsPrefix, modelVersionsKey, modelVersionsPrefix, refitJobsKey } from '../api/refit-keys';
import { mergeJobs } from '../model/refit-jobs';

/**
 * Writes each refit progress event into the job list; when a job ends with a new version, that
 * zone's versions are fetched again. Whenever the channel comes up the jobs and versions are
 * fetched again, since a job may have ended while no event could reach this desk: on the first
 * connection, one that ended between the screen's first fetch and the socket's handshake (its
 * last event went to nobody, and the screen would show it running until reloaded); after a
 * dropped connection (its server node went down and the desk came back through another),
 * everything of the screen, comparisons included.
 */
export function useRefitProgress(socket: DeskSocket = deskSocket): void {
  const queryClient = useQueryClient();
  const connection = useDeskConnectionState(socket);
  const wasConnected = useRef(false);

  useEffect(() => {
    if (connection !== 'connected') return;
    if (wasConnected.current) void queryClient.invalidateQueries({ queryKey: modelsPrefix });
    else {
      void queryClient.invalidateQueries({ queryKey: refitJobsKey });
      void queryClient.invalidateQueries({ queryKey: modelVersionsPrefix });
    }
    wasConnected.current = true;
  }, [connection, queryClient]);

  useDeskEvent(DESK_EVENTS.refitProgress, (job) => {
    const before = queryClient.getQueryData<RefitJobDto[]>(refitJobsKey)?.find((j) => j.id === job.id);
    queryClient.setQueryData<RefitJobDto[]>(refitJobsKey, (list) => mergeJobs(list ?? [], job));
    if (job.state === 'done' && before?.state !== 'done') void queryClient.invalidateQueries({ queryKey: modelVersionsKey(job.zone) });
  }, socket);
}
