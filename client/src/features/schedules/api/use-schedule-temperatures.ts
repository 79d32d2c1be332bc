import type { ZoneScheduleDto } from '@morrowline/shared';
import { useMemo } from 'react';
import { formatDateTime } from '../../../lib/format';
import { alignedTemperatures, useZoneWeather } from '../../weather';
import type { HourTemperature } from '../components/ScheduleTable';
import { shownRevision, type ScheduleRow } from '../model/rows';

const HOUR_MS = 3_600_000;

/**
 * The temperature forecast beside each hour of a zone's schedule: the forecast as known when the
 * model forecast behind the schedule was issued (never one issued later, which its forecaster
 * could not have seen), with its issue time. Without a model forecast, the latest.
 */
export function useScheduleTemperatures(zone: ZoneScheduleDto, rows: readonly ScheduleRow[]): { hours: HourTemperature[] | undefined; note: string | null } {
  const asOf = shownRevision(zone)?.forecastIssuedAt ?? zone.forecast?.issuedAt ?? null;
  const from = rows[0]?.intervalStartUtc ?? '';
  const last = rows[rows.length - 1]?.intervalStartUtc;
  const to = last ? new Date(Date.parse(last) + HOUR_MS).toISOString() : '';
  const weather = useZoneWeather([zone.zone], from, to, asOf);
  return useMemo(() => {
    if (!weather.data) return { hours: undefined, note: weather.isError ? 'The temperature forecast could not be loaded' : null };
    const aligned = alignedTemperatures(weather.data, zone.zone, rows.map((r) => r.intervalStartUtc));
    const hours = rows.map((_, i) => ({ tempC: aligned.forecastC[i], issuedAt: aligned.issuedAt[i] }));
    const note = asOf
      ? `Temperature forecast as known when the model forecast was issued (${formatDateTime(asOf, zone.timeZone)}).`
      : 'Latest temperature forecast (no model forecast for this day yet).';
    return { hours, note };
  }, [weather.data, weather.isError, zone.zone, zone.timeZone, rows, asOf]);
}
