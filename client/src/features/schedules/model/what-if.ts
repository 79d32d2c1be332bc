import { parseDecimal, WHAT_IF_MAX_SHIFT_C, type WeatherVintagesDto } from '@morrowline/shared';
import { formatDateTime } from '../../../lib/format';

/** The shift as typed, read by the shared number parser; a message when it is not a shift the server takes. */
export function checkShift(text: string): string | null {
  const parsed = parseDecimal(text.trim(), 'The shift');
  if (!parsed.ok) return parsed.message;
  if (Math.abs(parsed.value) > WHAT_IF_MAX_SHIFT_C) return `The shift must be between −${WHAT_IF_MAX_SHIFT_C} and ${WHAT_IF_MAX_SHIFT_C} °C`;
  return null;
}

/**
 * The vintages known for the day as select options, newest first as the server lists them: the
 * issue time in the zone's time, how much of the day it covers, and which one the forecast used.
 */
export function vintageOptions(v: WeatherVintagesDto, timeZone: string): Array<{ value: string; label: string }> {
  return v.vintages.map((x) => ({
    value: x.issuedAt,
    label: `${formatDateTime(x.issuedAt, timeZone)}${x.hours < 23 ? ` (${x.hours} h of the day)` : ''}${x.usedByForecast ? ' — the forecast’s' : ''}`,
  }));
}
