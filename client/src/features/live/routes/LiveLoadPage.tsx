import { Card, Loader, Stack, Text, Title } from '@mantine/core';
import { HOUR_MS, may, operatingDayOf, operatingDayStart } from '@morrowline/shared';
import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { PageHeader } from '../../../components/PageHeader';
import { useSignedInUser } from '../../auth';
import { outageHoursOf, useOutages } from '../../outages';
import { latestObserved, useWeatherStatus, useZoneWeather } from '../../weather';
import { AlertHistory } from '../components/AlertHistory';
import { AlertsPanel } from '../components/AlertsPanel';
import { ConnectionBadge } from '../components/ConnectionBadge';
import { DaySummaryLine } from '../components/DaySummaryLine';
import { IncompleteNote } from '../components/IncompleteNote';
import { LeftOutNote } from '../components/LeftOutNote';
import { LoadChart } from '../components/LoadChart';
import { TemperaturePanel } from '../components/TemperaturePanel';
import { ZoneStrip } from '../components/ZoneStrip';
import { daySummary } from '../model/day-summary';
import { useLoadViews } from '../hooks/use-load-views';
import { nowIndexOf, SYSTEM } from '../model/zone-view';

/**
 * The live view: every zone and the system total as cards, the chosen one charted over the last
 * three operating days and the coming one (actual load, the published schedule, the day-ahead
 * forecast and the latest run), today's energy and peak, the open deviation alerts and the alert
 * history. Everything on it moves with the live channel; the address keeps the chosen zone
 * (?zone=HARROW). The views come from useLoadViews, which the wall display shares.
 */
export function LiveLoadPage() {
  const user = useSignedInUser();
  const [params, setParams] = useSearchParams();
  const { zones, activeZones, timeZone, window, series, forecastError, committed, views, thresholds, nowHour } = useLoadViews();
  const codes = useMemo(() => activeZones.map((z) => z.code), [activeZones]);
  const weather = useZoneWeather(codes, window.displayFrom, window.to);
  const weatherStatus = useWeatherStatus();
  const temperatures = useMemo(() => latestObserved(weather.data), [weather.data]);

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
