import { DateTime } from 'luxon';
import { gateClosureAt } from '@morrowline/shared';

/**
 * When, in the desk's own routine, the forecast behind an operating day's schedule is made. The
 * desk refits every zone each night (REFIT_NIGHTLY_AT, desk time) and updates the forecast every
 * hour (FORECAST_UPDATE_MINUTE past the hour); operators draft, adjust and submit the schedule
 * before the gate closure from the forecast of the last update before it. A replay of a day
 * therefore runs the nightly refit before that update, then the update, and stores its forecast
 * as issued at the update's time.
 */
export interface ReplayRoutine {
  /** Minute past each hour of the forecast update. */
  updateMinute: number;
  /** Local time of the nightly full refit, in `deskTimeZone`. */
  nightly: { hour: number; minute: number };
  deskTimeZone: string;
}

export interface ReplayStep {
  /** The operating day (yyyy-MM-dd, the zone's time zone). */
  day: string;
  /** The last forecast update before the day's gate closure: the replayed run's issue time. */
  issuedAt: number;
  /** The nightly refit before it. */
  nightlyAt: number;
  gateClosureAt: number;
}

/** The last hourly forecast update strictly before the gate closure of `day`. */
export function gateForecastAt(day: string, timeZone: string, gateClosure: string, updateMinute: number): number {
  const gate = DateTime.fromMillis(gateClosureAt(day, timeZone, gateClosure), { zone: timeZone });
  let at = gate.set({ minute: updateMinute, second: 0, millisecond: 0 });
  if (at >= gate) at = at.minus({ hours: 1 });
  return at.toMillis();
}

/** The nightly refit strictly before `at`. */
export function nightlyRefitBefore(at: number, routine: ReplayRoutine): number {
  const local = DateTime.fromMillis(at, { zone: routine.deskTimeZone });
  let nightly = local.set({ hour: routine.nightly.hour, minute: routine.nightly.minute, second: 0, millisecond: 0 });
  if (nightly >= local) nightly = nightly.minus({ days: 1 }).set({ hour: routine.nightly.hour, minute: routine.nightly.minute });
  return nightly.toMillis();
}

/**
 * Every operating day from the one after `firstHourMs` (the zone's first reading) whose forecast
 * update fell at or before `until` (the present, or the end of the zone's latest reading if that is
 * earlier: a replay never uses readings that have not arrived). Oldest first.
 */
export function replaySteps(firstHourMs: number, until: number, timeZone: string, gateClosure: string, routine: ReplayRoutine): ReplayStep[] {
  const steps: ReplayStep[] = [];
  let day = DateTime.fromMillis(firstHourMs, { zone: timeZone }).startOf('day').plus({ days: 1 });
  for (;;) {
    const date = day.toISODate()!;
    const issuedAt = gateForecastAt(date, timeZone, gateClosure, routine.updateMinute);
    if (issuedAt > until) break;
    steps.push({ day: date, issuedAt, nightlyAt: nightlyRefitBefore(issuedAt, routine), gateClosureAt: gateClosureAt(date, timeZone, gateClosure) });
    day = day.plus({ days: 1 });
  }
  return steps;
}
