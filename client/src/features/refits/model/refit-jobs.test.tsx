import { DESK_EVENTS, type RefitJobDto } from '@morrowline/shared';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook } from '@testing-library/react';
import type { ReactNode } from 'react';
import { describe, expect, it } from 'vitest';
import { createDeskSocket } from '../../../lib/desk-socket';
import { createSessionStore } from '../../../lib/session-store';
import { fakeSocketFactory } from '../../../test/fake-socket';
import { modelCompareKey, modelVersionsKey, refitJobsKey } from '../api/refit-keys';
import { useRefitProgress } from '../hooks/use-refit-progress';
import { mergeJobs } from './refit-jobs';

function job(id: number, changes: Partial<RefitJobDto> = {}): RefitJobDto {
  return {
    id, zone: 'QUARRY', trigger: 'operator', mode: 'full', reason: 'after the Quarry Hill feeder outage', state: 'queued', progress: 0, stage: 'waiting for a worker',
    message: null, requestedBy: 'ines.marlow@tallowmere.example', createdAt: '2026-07-14T15:00:00Z', startedAt: null, finishedAt: null, modelVersionId: null, forecastRunId: null, promoted: false,
    ...changes,
  };
}

/** useRefitProgress on a desk socket whose server side the test drives. */
function renderRefitProgress() {
  const sessionStore = createSessionStore({ storage: window.sessionStorage });
  sessionStore.start('token', 3600);
  const { connect, opened } = fakeSocketFactory();
  const socket = createDeskSocket({ sessionStore, connect: connect as never });
  const queryClient = new QueryClient();
  const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
  renderHook(() => useRefitProgress(socket), { wrapper });
  return { queryClient, server: opened[0].socket };
}

describe('refit job list from progress events', () => {
  it('adds a new job at the top and moves a known one on in place', () => {
    let list = mergeJobs([job(3, { state: 'done', progress: 100 })], job(4));
    expect(list.map((j) => j.id)).toEqual([4, 3]);
    list = mergeJobs(list, job(4, { state: 'running', progress: 40, stage: 'choosing the orders' }));
    expect(list).toHaveLength(2);
    expect(list[0]).toMatchObject({ id: 4, state: 'running', progress: 40, stage: 'choosing the orders' });
    list = mergeJobs(list, job(4, { state: 'done', progress: 100, modelVersionId: 9 }));
    expect(list[0]).toMatchObject({ state: 'done', progress: 100, modelVersionId: 9 });
  });

  it('ignores an event that arrives after a later one, so the bar never runs backwards', () => {
    const running = mergeJobs([], job(4, { state: 'running', progress: 60 }));
    expect(mergeJobs(running, job(4, { state: 'running', progress: 30 }))[0].progress).toBe(60);
    expect(mergeJobs(running, job(4, { state: 'queued' }))[0].state).toBe('running');
    const failed = mergeJobs(running, job(4, { state: 'failed', progress: 60, message: 'the worker stopped' }));
    expect(failed[0]).toMatchObject({ state: 'failed', message: 'the worker stopped' });
    expect(mergeJobs(failed, job(4, { state: 'running', progress: 80 }))[0].state).toBe('failed');
  });

  it('writes socket events into the cached list and refetches the zone’s versions once a job is done', () => {
    const { queryClient, server } = renderRefitProgress();
    queryClient.setQueryData<RefitJobDto[]>(refitJobsKey, []);
    queryClient.setQueryData(modelVersionsKey('QUARRY'), []);

    act(() => server.emitFromServer(DESK_EVENTS.refitProgress, job(5, { state: 'running', progress: 35 })));
    expect(queryClient.getQueryData<RefitJobDto[]>(refitJobsKey)?.[0]).toMatchObject({ id: 5, progress: 35 });
    expect(queryClient.getQueryState(modelVersionsKey('QUARRY'))?.isInvalidated).toBe(false);

    act(() => server.emitFromServer(DESK_EVENTS.refitProgress, job(5, { state: 'done', progress: 100, modelVersionId: 12 })));
    expect(queryClient.getQueryData<RefitJobDto[]>(refitJobsKey)?.[0]).toMatchObject({ state: 'done', progress: 100 });
    expect(queryClient.getQueryState(modelVersionsKey('QUARRY'))?.isInvalidated).toBe(true);
  });

  it('fetches the jobs and versions again on the first connection: a job that ended before the handshake sent its last event to nobody', () => {
    const { queryClient, server } = renderRefitProgress();
    // what the screen fetched while the socket was still connecting
    queryClient.setQueryData<RefitJobDto[]>(refitJobsKey, [job(6, { state: 'running', progress: 20 })]);
    queryClient.setQueryData(modelVersionsKey('QUARRY'), []);
    queryClient.setQueryData(modelCompareKey(12), { candidate: 12 });
    expect(queryClient.getQueryState(refitJobsKey)?.isInvalidated).toBe(false);
    act(() => server.fire('connect'));
    expect(queryClient.getQueryState(refitJobsKey)?.isInvalidated).toBe(true);
    expect(queryClient.getQueryState(modelVersionsKey('QUARRY'))?.isInvalidated).toBe(true);
    // a comparison is not the list of what exists; it waits for a dropped connection
    expect(queryClient.getQueryState(modelCompareKey(12))?.isInvalidated).toBe(false);
  });

  it('fetches everything of the screen again after the connection dropped and came back (a job may have ended meanwhile)', () => {
    const { queryClient, server } = renderRefitProgress();
    act(() => server.fire('connect'));
    queryClient.setQueryData<RefitJobDto[]>(refitJobsKey, [job(6, { state: 'running', progress: 20 })]);
    queryClient.setQueryData(modelVersionsKey('QUARRY'), []);
    queryClient.setQueryData(modelCompareKey(12), { candidate: 12 });
    act(() => server.fire('disconnect'));
    expect(queryClient.getQueryState(refitJobsKey)?.isInvalidated).toBe(false);
    act(() => server.fire('connect'));
    expect(queryClient.getQueryState(refitJobsKey)?.isInvalidated).toBe(true);
    expect(queryClient.getQueryState(modelVersionsKey('QUARRY'))?.isInvalidated).toBe(true);
    expect(queryClient.getQueryState(modelCompareKey(12))?.isInvalidated).toBe(true);
  });
});
