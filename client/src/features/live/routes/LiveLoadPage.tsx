import { Card, Loader, Stack, Text, Title } from '@mantine/core';
import { DEMO_TIME_ZONE, HOUR_MS, may, operatingDayOf, operatingDayStart } from '@morrowline/shared';
import { useEffect, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { PageHeader } from '../../../components/PageHeader';
import { useSignedInUser } from '../../auth';
import { outageHoursOf, useOutages } from '../../outages';
import { latestObserved, useWeatherStatus, useZoneWeather } from '../../weather';
import { useZones } from '../../zones';
import { useCommittedLoad } from '../api/use-committed-load';
import { useFeedStatus } from '../api/use-feed-status';
import { useReadingsSeries } from '../api/use-readings-series';
import { useZoneForecast } from '../api/use-zone-forecast';
import { AlertHistory } from '../components/AlertHistory';
import { AlertsPanel } from '../components/AlertsPanel';
import { ConnectionBadge } from '../components/ConnectionBadge';
import { DaySummaryLine } from '../components/DaySummaryLine';
import { IncompleteNote } from '../components/IncompleteNote';
import { LeftOutNote } from '../components/LeftOutNote';
import { LoadChart } from '../components/LoadChart';
import { TemperaturePanel } from '../components/TemperaturePanel';
import { ZoneStrip } from '../components/ZoneStrip';
import { useCurrentHour } from '../hooks/use-current-hour';
import { daySummary } from '../model/day-summary';
import { liveWindow } from '../model/live-window';
import { nowIndexOf, SYSTEM, systemView, zoneViews } from '../model/zone-view';

/** How long after a fetch that missed a new zone the series is asked for again (the server's zone list is cached for 5 s). */
const ZONE_CATCH_UP_MS = 6_000;

/**
 * The live view: every zone and the system total as cards, the chosen one charted over the last
 * three operating days and the coming one (actual load, the published schedule, the day-ahead
 * forecast and the latest run), today's energy and peak, the open deviation alerts and the alert
 * history. Everything on it moves with the live channel; the address keeps the chosen zone
 * (?zone=HARROW). Zones switched off, added or renamed while it is open never break it: the
 * server is asked for every active zone, and the page shows the zones both sides know.
 */
export function LiveLoadPage() {
  const user = useSignedInUser();
  const zones = useZones();
  const status = useFeedStatus();
  const nowHour = useCurrentHour();
  const [params, setParams] = useSearchParams();

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
  const weather = useZoneWeather(codes, window.displayFrom, window.to);
  const weatherStatus = useWeatherStatus();
  const temperatures = useMemo(() => latestObserved(weather.data), [weather.data]);

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

  const requested = params.get('zone') ?? SYSTEM;
  const selected = views.find((v) => v.key === requested) ?? views[0];
  // The chosen zone's outage and bad-data windows, shaded on its chart (none for the system total).
  const outages = useOutages(selected && selected.key !== SYSTEM ? selected.key : null);
  const excluded = useMemo(() => (series.data && outages.data ? outageHoursOf(series.data.hours, outages.data) : undefined), [series.data, outages.data]);
  const mayAcknowledge = may(user.role, 'forecast');

  const summary = useMemo(() => {
    if (!selected || !series.data) return null;
    const from = Date.parse(series.data.from);
    const dayStart = (Date.parse(window.todayFrom) - from) / HOUR_MS;
    const dayEnd = (operatingDayStart(operatingDayOf(Date.parse(window.todayFrom) + 36 * HOUR_MS, timeZone), timeZone) - from) / HOUR_MS;
    return daySummary(selected.actual, selected.committed.committed, selected.committed.basis, dayStart, dayEnd, nowIndexOf(series.data, nowHour));
  }, [selected, series.data, window.todayFrom, timeZone, nowHour]);

  return (
    <>
      <PageHeader title="Live load" description="Actual load against what was committed (the published schedule, else the day-ahead forecast), per zone and for the system, as readings arrive." actions={<ConnectionBadge />} />
      <Stack gap="md">
        {(zones.isError || series.isError) && <ErrorNotice error={zones.error ?? series.error} onRetry={() => void (zones.isError ? zones.refetch() : series.refetch())} />}
        {forecastError && <ErrorNotice title="The latest run could not be loaded" error={forecastError} />}
        {committed.error && <ErrorNotice title="The schedule and day-ahead forecast could not be loaded" error={committed.error} />}
        {(zones.isPending || series.isPending) && !series.isError && <Loader />}
        {zones.data && activeZones.length === 0 && <Text c="dimmed">No active zones: an administrator adds them under Zones.</Text>}
        {views.length > 0 && (
          <ZoneStrip views={views} hours={series.data?.hours ?? []} selected={selected.key} thresholds={thresholds} onSelect={(key) => setParams(key === SYSTEM ? {} : { zone: key })} temperatures={temperatures} />
        )}
        {selected && series.data && (
          <Card withBorder padding="md">
            <Title order={4} mb="xs" data-testid="chart-title">{selected.name}</Title>
            {summary && <DaySummaryLine summary={summary} hours={series.data.hours} timeZone={selected.timeZone} />}
            <LeftOutNote view={selected} />
            <IncompleteNote view={selected} first={0} />
            <LoadChart view={selected} hours={series.data.hours} displayFrom={Date.parse(window.displayFrom)} nowHour={nowHour} excluded={selected.key === SYSTEM ? undefined : excluded} />
            {selected.key !== SYSTEM && (
              <TemperaturePanel
                zone={selected.key}
                timeZone={selected.timeZone}
                hours={series.data.hours}
                displayFrom={Date.parse(window.displayFrom)}
                nowHour={nowHour}
                weather={weather.data}
                status={weatherStatus.data}
              />
            )}
          </Card>
        )}
        {zones.data && <AlertsPanel zones={activeZones} mayAcknowledge={mayAcknowledge} />}
        {zones.data && <AlertHistory zones={zones.data} />}
      </Stack>
    </>
  );
}
