import { Card, Loader, Stack, Text, Title } from '@mantine/core';
import { DEMO_TIME_ZONE, may, operatingDayOf, operatingDayStart } from '@morrowline/shared';
import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { PageHeader } from '../../../components/PageHeader';
import { useSignedInUser } from '../../auth';
import { outageHoursOf, useOutages } from '../../outages';
import { useZones } from '../../zones';
import { useFeedStatus } from '../api/use-feed-status';
import { useReadingsSeries } from '../api/use-readings-series';
import { useZoneForecast } from '../api/use-zone-forecast';
import { AlertsPanel } from '../components/AlertsPanel';
import { ConnectionBadge } from '../components/ConnectionBadge';
import { IncompleteNote } from '../components/IncompleteNote';
import { LoadChart } from '../components/LoadChart';
import { ZoneStrip } from '../components/ZoneStrip';
import { useCurrentHour } from '../hooks/use-current-hour';
import { liveWindow } from '../model/live-window';
import { nowIndexOf, SYSTEM, systemView, zoneViews } from '../model/zone-view';

/**
 * The live view: every zone and the system total as cards, the chosen one charted over the last
 * three operating days and the coming one, and the open deviation alerts. Everything on it moves
 * with the live channel; the address keeps the chosen zone (?zone=HARROW).
 */
export function LiveLoadPage() {
  const user = useSignedInUser();
  const zones = useZones();
  const status = useFeedStatus();
  const nowHour = useCurrentHour();
  const [params, setParams] = useSearchParams();

  const activeZones = useMemo(() => (zones.data ?? []).filter((z) => z.active), [zones.data]);
  const timeZone = activeZones[0]?.timeZone ?? DEMO_TIME_ZONE;
  // The window moves on at local midnight only: the key stays put within a day.
  const today = operatingDayOf(nowHour, timeZone);
  const window = useMemo(() => liveWindow(operatingDayStart(today, timeZone), timeZone), [today, timeZone]);
  const codes = useMemo(() => activeZones.map((z) => z.code), [activeZones]);
  const series = useReadingsSeries(codes, window.historyFrom, window.to);
  const originIndex = series.data ? nowIndexOf(series.data, nowHour) + 1 : 0;
  const { forecasts, error: forecastError } = useZoneForecast(series.data, window.displayFrom, originIndex);

  const views = useMemo(() => {
    if (!series.data) return [];
    const perZone = zoneViews({ series: series.data, zones: activeZones, forecasts, status: status.data, nowHour });
    return [systemView(perZone, series.data, nowHour), ...perZone];
  }, [series.data, activeZones, forecasts, status.data, nowHour]);
  const thresholds = useMemo(() => new Map(activeZones.map((z) => [z.code, z.alertThresholdPct])), [activeZones]);

  const requested = params.get('zone') ?? SYSTEM;
  const selected = views.find((v) => v.key === requested) ?? views[0];
  // The chosen zone's outage and bad-data windows, shaded on its chart (none for the system total).
  const outages = useOutages(selected && selected.key !== SYSTEM ? selected.key : null);
  const excluded = useMemo(() => (series.data && outages.data ? outageHoursOf(series.data.hours, outages.data) : undefined), [series.data, outages.data]);
  const mayAcknowledge = may(user.role, 'forecast');

  return (
    <>
      <PageHeader title="Live load" description="Actual load against the current forecast, per zone and for the system, as readings arrive." actions={<ConnectionBadge />} />
      <Stack gap="md">
        {(zones.isError || series.isError) && <ErrorNotice error={zones.error ?? series.error} onRetry={() => void (zones.isError ? zones.refetch() : series.refetch())} />}
        {forecastError && <ErrorNotice title="The forecast could not be loaded" error={forecastError} />}
        {(zones.isPending || series.isPending) && !series.isError && <Loader />}
        {zones.data && activeZones.length === 0 && <Text c="dimmed">No active zones: an administrator adds them under Zones.</Text>}
        {views.length > 0 && (
          <ZoneStrip views={views} hours={series.data?.hours ?? []} selected={selected.key} thresholds={thresholds} onSelect={(key) => setParams(key === SYSTEM ? {} : { zone: key })} />
        )}
        {selected && series.data && (
          <Card withBorder padding="md">
            <Title order={4} mb="xs" data-testid="chart-title">{selected.name}</Title>
            <IncompleteNote view={selected} />
            <LoadChart view={selected} hours={series.data.hours} displayFrom={Date.parse(window.displayFrom)} nowHour={nowHour} excluded={selected.key === SYSTEM ? undefined : excluded} />
          </Card>
        )}
        {zones.data && <AlertsPanel zones={activeZones} mayAcknowledge={mayAcknowledge} />}
      </Stack>
    </>
  );
}
