import { parseDecimal, WHAT_IF_MAX_SHIFT_C, type CreateScheduleAdjustmentRequest, type ScheduleHourSlot, type WeatherVintagesDto, type WeatherWhatIfDto } from '@morrowline/shared';
import { formatDateTime } from '../../../lib/format';

/** The shift as typed, read by the shared number parser; a message when it is not a shift the server takes. */
export function checkShift(text: string): string | null {
  const parsed = parseDecimal(text.trim(), 'The shift');
  if (!parsed.ok) return parsed.message;
  if (Math.abs(parsed.value) > WHAT_IF_MAX_SHIFT_C) return `The shift must be between −${WHAT_IF_MAX_SHIFT_C} and ${WHAT_IF_MAX_SHIFT_C} °C`;
  return null;
}

/**
 * The what-if as schedule adjustments: one "add" per hour of its change, rounded to 0.1 MW, on
 * the hours the schedule has (hours whose change rounds to 0 are left alone), each with the
 * operator's reason and what it came from.
 */
export function whatIfAdjustments(w: WeatherWhatIfDto, slots: readonly ScheduleHourSlot[], zone: string, reason: string, label: string): CreateScheduleAdjustmentRequest[] {
  const byStart = new Map(w.hours.map((h) => [Date.parse(h.hourStart), h]));
  const out: CreateScheduleAdjustmentRequest[] = [];
  for (const slot of slots) {
    const h = byStart.get(Date.parse(slot.intervalStartUtc));
    if (!h || h.changeMw === null) continue;
    const value = Math.round(h.changeMw * 10) / 10;
    if (value === 0) continue;
    out.push({ zones: [zone], kind: 'add', fromHour: slot.index, toHour: slot.index, value, reason: `${reason} (weather what-if: ${label})` });
  }
  return out;
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
