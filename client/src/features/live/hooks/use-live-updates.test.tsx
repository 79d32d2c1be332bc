import { DESK_EVENTS, type AlertDto, type ForecastRunDto, type LatestForecastsDto, type ReadingSeriesDto } from '@morrowline/shared';
import { MantineProvider } from '@mantine/core';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook } from '@testing-library/react';
import type { ReactNode } from 'react';
import { describe, expect, it } from 'vitest';
import { createDeskSocket } from '../../../lib/desk-socket';
import { fakeSocketFactory } from '../../../test/fake-socket';
import { createSessionStore } from '../../../lib/session-store';
import { mockApi } from '../../../test/mock-api';
import { latestForecastsKey, openAlertsKey, readingsSeriesKey } from '../api/live-keys';
import { useLiveUpdates } from './use-live-updates';

const series: ReadingSeriesDto = {
  from: '2026-05-01T00:00:00.000Z',
  to: '2026-05-01T02:00:00.000Z',
  hours: ['2026-05-01T00:00:00.000Z', '2026-05-01T01:00:00.000Z'],
  zones: [{ zone: 'LANTERN', mw: [180, null], quality: ['good', null], lastHour: '2026-05-01T00:00:00.000Z', lastReceivedAt: null }],
};

const alert: AlertDto = {
  id: 7, zone: 'LANTERN', start: '2026-05-01T00:00:00.000Z', end: '2026-05-01T02:00:00.000Z', peakDeviationPct: 9.5, comparedWith: 'day-ahead', committedMw: 164.4, thresholdPct: 5,
  consecutiveHours: 2, state: 'open', raisedAt: '2026-05-01T02:00:03.000Z', acknowledgedAt: null, acknowledgedBy: null, acknowledgedByName: null, comment: null,
};

function setup() {
  const api = mockApi({ 'GET /api/zones': () => ({ body: [] }) });
  const sessionStore = createSessionStore({ storage: window.sessionStorage });
  sessionStore.start('token', 3600);
  const { connect, opened } = fakeSocketFactory();
  const socket = createDeskSocket({ sessionStore, connect: connect as never });
  const queryClient = new QueryClient();
  const wrapper = ({ children }: { children: ReactNode }) => (
    <MantineProvider env="test">
      <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>
    </MantineProvider>
  );
  renderHook(() => useLiveUpdates(socket), { wrapper });
  return { queryClient, server: opened[0].socket, api };
}

describe('useLiveUpdates', () => {
  it('writes a readings event into the cached series without refetching it', () => {
    const { queryClient, server, api } = setup();
    const key = readingsSeriesKey(['LANTERN'], series.from, series.to);
    queryClient.setQueryData(key, series);
    act(() => server.emitFromServer(DESK_EVENTS.readings, { zones: [{ zone: 'LANTERN', hours: ['2026-05-01T01:00:00Z'], mw: [191.2] }], receivedAt: '2026-05-01T02:00:01Z' }));
    const next = queryClient.getQueryData<ReadingSeriesDto>(key);
    expect(next?.zones[0].mw).toEqual([180, 191.2]);
    expect(queryClient.getQueryState(key)?.isInvalidated).toBe(false);
    expect(api.calls.some((call) => call.path.startsWith('/api/readings'))).toBe(false);
  });

  it('adds a raised alert to the open list and drops it once acknowledged', () => {
    const { queryClient, server } = setup();
    queryClient.setQueryData<AlertDto[]>(openAlertsKey, []);
    act(() => server.emitFromServer(DESK_EVENTS.alertRaised, alert));
    expect(queryClient.getQueryData<AlertDto[]>(openAlertsKey)?.map((a) => a.id)).toEqual([7]);
    act(() => server.emitFromServer(DESK_EVENTS.alertAcknowledged, { ...alert, state: 'acknowledged' }));
    expect(queryClient.getQueryData<AlertDto[]>(openAlertsKey)).toEqual([]);
  });

  it('puts a new forecast run only into the cached queries that asked for its zone', () => {
    const { queryClient, server } = setup();
    const run: ForecastRunDto = {
      id: 41, zone: 'LANTERN', issuedAt: '2026-05-01T02:00:05.000Z', basedOnHour: '2026-05-01T01:00:00.000Z', origin: 'issued', method: 'arima', fallbackReason: null,
      modelVersionId: 9, hours: ['2026-05-01T02:00:00.000Z'], mean: [188], lower80: [180], upper80: [196], lower95: [176], upper95: [200],
    };
    const standIn: ForecastRunDto = { ...run, id: null, method: 'seasonal-naive', fallbackReason: 'no model yet', modelVersionId: null };
    const both = latestForecastsKey(['LANTERN', 'HARROW'], series.from, series.to);
    const other = latestForecastsKey(['HARROW'], series.from, series.to);
    queryClient.setQueryData<LatestForecastsDto>(both, { zones: [standIn, { ...standIn, zone: 'HARROW' }] });
    queryClient.setQueryData<LatestForecastsDto>(other, { zones: [{ ...standIn, zone: 'HARROW' }] });
    act(() => server.emitFromServer(DESK_EVENTS.forecast, run));
    const next = queryClient.getQueryData<LatestForecastsDto>(both);
    expect(next?.zones.find((z) => z.zone === 'LANTERN')?.method).toBe('arima');
    expect(next?.zones.map((z) => z.zone).sort()).toEqual(['HARROW', 'LANTERN']);
    expect(queryClient.getQueryData<LatestForecastsDto>(other)?.zones.map((z) => z.zone)).toEqual(['HARROW']);
  });

  it('fetches the live queries again after the connection dropped and came back, not on the first connect', () => {
    const { queryClient, server } = setup();
    const key = readingsSeriesKey(['LANTERN'], series.from, series.to);
    queryClient.setQueryData(key, series);
    queryClient.setQueryData<AlertDto[]>(openAlertsKey, []);
    act(() => server.fire('connect'));
    expect(queryClient.getQueryState(key)?.isInvalidated).toBe(false);
    act(() => server.fire('disconnect'));
    act(() => server.fire('connect'));
    expect(queryClient.getQueryState(key)?.isInvalidated).toBe(true);
    expect(queryClient.getQueryState(openAlertsKey)?.isInvalidated).toBe(true);
  });
});
