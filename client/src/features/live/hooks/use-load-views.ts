import { DEMO_TIME_ZONE, operatingDayOf, operatingDayStart } from '@morrowline/shared';
import { useEffect, useMemo } from 'react';
import { useZones } from '../../zones';
import { useCommittedLoad } from '../api/use-committed-load';
import { useFeedStatus } from '../api/use-feed-status';
import { useReadingsSeries } from '../api/use-readings-series';
import { useZoneForecast } from '../api/use-zone-forecast';
import { liveWindow } from '../model/live-window';
import { systemView, zoneViews } from '../model/zone-view';
import { useCurrentHour } from './use-current-hour';

/** How long after a fetch that missed a new zone the series is asked for again (the server's zone list is cached for 5 s). */
const ZONE_CATCH_UP_MS = 6_000;

/**
 * The system total and every active zone as the live view and the wall display show them, over
 * the last three operating days and the coming one. Zones switched off, added or renamed while a
 * screen is open never break it: the server is asked for every active zone, and the views are of
 * the zones both sides know. Everything in it moves with the live channel (useLiveUpdates).
 */
export function useLoadViews() {
  const zones = useZones();
  const status = useFeedStatus();
  const nowHour = useCurrentHour();

  const activeZones = useMemo(() => (zones.data ?? []).filter((z) => z.active), [zones.data]);
  const inactiveZones = useMemo(() => (zones.data ?? []).filter((z) => !z.active), [zones.data]);
  const timeZone = activeZones[0]?.timeZone ?? DEMO_TIME_ZONE;
  // The window moves on at local midnight only: the key stays put within a day.
  const today = operatingDayOf(nowHour, timeZone);
  const window = useMemo(() => liveWindow(operatingDayStart(today, timeZone), timeZone), [today, timeZone]);
  const codes = useMemo(() => activeZones.map((z) => z.code), [activeZones]);
  const series = useReadingsSeries(codes, window.displayFrom, window.to);
  const { forecasts, error: forecastError } = useZoneForecast(codes, series.data, window.displayFrom);
  const committed = useCommittedLoad(codes, series.data, window.displayFrom, window.to);

  // A zone the server knows and the desk's list does not was added a moment ago: read the list again.
  const unknownZone = series.data?.zones.some((z) => !codes.includes(z.zone)) ?? false;
  const refetchZones = zones.refetch;
  useEffect(() => {
    if (unknownZone) void refetchZones();
  }, [unknownZone, refetchZones]);
  // And one the list has and the series lacks: the server's zone cache has not seen it yet; ask again shortly.
  const missingZone = series.data ? codes.some((code) => !series.data.zones.some((z) => z.zone === code)) : false;
  const refetchSeries = series.refetch;
  useEffect(() => {
    if (!missingZone) return;
    const timer = setTimeout(() => void refetchSeries(), ZONE_CATCH_UP_MS);
    return () => clearTimeout(timer);
  }, [missingZone, refetchSeries, series.dataUpdatedAt]);

  const views = useMemo(() => {
    if (!series.data) return [];
    const perZone = zoneViews({ series: series.data, zones: activeZones, committed: committed.lines, latestRuns: forecasts, status: status.data, nowHour });
    return [systemView({ views: perZone, series: series.data, inactive: inactiveZones, nowHour }), ...perZone];
  }, [series.data, activeZones, inactiveZones, committed.lines, forecasts, status.data, nowHour]);
  const thresholds = useMemo(() => new Map(activeZones.map((z) => [z.code, z.alertThresholdPct])), [activeZones]);

  return { zones, activeZones, timeZone, window, series, forecastError, committed, views, thresholds, nowHour };
}
