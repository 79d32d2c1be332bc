import { DateTime } from 'luxon';
import { HOUR_MS, hourEndingLabel, type AlertDto } from '@morrowline/shared';

/** "05-12 HE14–HE16 (3 h)": the alert's hours in the zone's own hour-ending terms. */
export function alertHours(alert: AlertDto, timeZone: string): string {
  const start = Date.parse(alert.start);
  const lastStart = Date.parse(alert.end) - HOUR_MS;
  const hours = Math.round((Date.parse(alert.end) - start) / HOUR_MS);
  const day = (t: number) => DateTime.fromMillis(t, { zone: timeZone }).toFormat('LL-dd');
  const first = `${day(start)} ${hourEndingLabel(start, timeZone)}`;
  const last = day(lastStart) === day(start) ? hourEndingLabel(lastStart, timeZone) : `${day(lastStart)} ${hourEndingLabel(lastStart, timeZone)}`;
  return `${first}–${last} (${hours} h)`;
}
