import { DESK_EVENTS, type AlertDto, type FeedStatusDto, type LatestForecastsDto, type ReadingSeriesDto } from '@morrowline/shared';
import { notifications, notificationsStore } from '@mantine/notifications';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { deskSocket, useDeskConnectionState, useDeskEvent, type DeskSocket } from '../../../lib/desk-socket';
import { useZones } from '../../zones';
import { alertHistoryKey, committedLoadPrefix, feedStatusKey, latestForecastsPrefix, openAlertsKey, readingsSeriesPrefix } from '../api/live-keys';
import { withAlert, withoutAlert } from '../model/alert-list';
import { ALERT_NOTICE_ID, alertNotice, type NoticeAlert } from '../model/alert-notice';
import { applyDeskReadings, applyDeskReadingsToStatus } from '../model/apply-desk-readings';

/** The zones a cached latest-forecasts query asked for (its key's last element). */
function zonesOfKey(queryKey: readonly unknown[]): string[] {
  const params = queryKey[latestForecastsPrefix.length] as { zones?: string } | undefined;
  return params?.zones ? params.zones.split(',') : [];
}

/**
 * Writes what the live channel brings into the query cache: readings into every cached series and
 * the feed status, alerts into the open list (with a notification when one is raised), new
 * forecast runs into the latest forecasts of the queries that asked for that zone. The committed
 * numbers are fetched again when a schedule is published or a run is issued (a run issued before
 * gate closure becomes the next day's day-ahead forecast), and the alert history when an alert is
 * acknowledged. After a dropped connection what was pushed while it was down is lost, so the live
 * queries are fetched again once it is back.
 *
 * Mounted once in the signed-in layout, not on the live page: an operator on the refits or
 * schedules screen still sees a deviation alert, and the live view is current when they return.
 */
export function useLiveUpdates(socket: DeskSocket = deskSocket): void {
  const queryClient = useQueryClient();
  const zones = useZones();
  const zoneName = (code: string) => zones.data?.find((z) => z.code === code)?.name ?? code;
  const connection = useDeskConnectionState(socket);
  const wasConnected = useRef(false);
  // the alerts the one deviation notice carries while it is up (oldest first)
  const inNotice = useRef(new Map<number, NoticeAlert>());
  const noticeUp = () => notificationsStore.getState().notifications.some((n) => n.id === ALERT_NOTICE_ID);

  useEffect(() => {
    if (connection !== 'connected') return;
    if (wasConnected.current) {
      for (const queryKey of [readingsSeriesPrefix, feedStatusKey, openAlertsKey, alertHistoryKey, latestForecastsPrefix, committedLoadPrefix]) void queryClient.invalidateQueries({ queryKey });
    }
    wasConnected.current = true;
  }, [connection, queryClient]);

  useDeskEvent(DESK_EVENTS.readings, (event) => {
    queryClient.setQueriesData<ReadingSeriesDto>({ queryKey: readingsSeriesPrefix }, (series) => (series ? applyDeskReadings(series, event) : series));
    queryClient.setQueryData<FeedStatusDto[]>(feedStatusKey, (status) => (status ? applyDeskReadingsToStatus(status, event) : status));
  }, socket);

  useDeskEvent(DESK_EVENTS.alertRaised, (alert: AlertDto) => {
    const known = queryClient.getQueryData<AlertDto[]>(openAlertsKey)?.some((a) => a.id === alert.id) ?? false;
    queryClient.setQueryData<AlertDto[]>(openAlertsKey, (list) => withAlert(list ?? [], alert));
    // one notice for every alert raised while it is up (a fresh demo raises several at once);
    // closed by the operator, the next alert starts a new one
    const up = noticeUp();
    if (!up) inNotice.current.clear();
    inNotice.current.delete(alert.id);
    inNotice.current.set(alert.id, { alert, widened: known });
    const notice = {
      id: ALERT_NOTICE_ID,
      color: 'ember',
      ...alertNotice([...inNotice.current.values()], zoneName),
      autoClose: false,
      // Top centre: clear of the user's name and sign-out (top right) and of the alert list's
      // Acknowledge form (lower down), which a notification in a corner would cover.
      position: 'top-center' as const,
    };
    if (up) notifications.update(notice);
    else notifications.show(notice);
  }, socket);

  useDeskEvent(DESK_EVENTS.alertAcknowledged, (alert: AlertDto) => {
    queryClient.setQueryData<AlertDto[]>(openAlertsKey, (list) => (list ? withoutAlert(list, alert.id) : list));
    void queryClient.invalidateQueries({ queryKey: alertHistoryKey });
    if (inNotice.current.delete(alert.id) && noticeUp()) {
      if (inNotice.current.size === 0) notifications.hide(ALERT_NOTICE_ID);
      else notifications.update({ id: ALERT_NOTICE_ID, color: 'ember', ...alertNotice([...inNotice.current.values()], zoneName), autoClose: false, position: 'top-center' });
    }
  }, socket);

  useDeskEvent(DESK_EVENTS.schedule, (event) => {
    if (event.action === 'publish') void queryClient.invalidateQueries({ queryKey: committedLoadPrefix });
  }, socket);

  useDeskEvent(DESK_EVENTS.forecast, (run) => {
    for (const [queryKey, latest] of queryClient.getQueriesData<LatestForecastsDto>({ queryKey: latestForecastsPrefix })) {
      if (!latest || !zonesOfKey(queryKey).includes(run.zone)) continue;
      queryClient.setQueryData<LatestForecastsDto>(queryKey, { zones: [...latest.zones.filter((z) => z.zone !== run.zone), run] });
    }
    void queryClient.invalidateQueries({ queryKey: committedLoadPrefix });
  }, socket);
}
