import { formatHourEnding, hourEndingNumber } from '@morrowline/shared';
import { DateTime } from 'luxon';

const HOUR_S = 3600;

/**
 * Ticks on the hour-ending axis. Points sit at the end of their hour, so a tick at time t is
 * labelled with the hour ending there: every `step` hour-ending numbers (HE06, HE12, HE18, HE24).
 */
export function hourEndingSplits(min: number, max: number, timeZone: string, step: number): number[] {
  const splits: number[] = [];
  for (let t = Math.ceil(min / HOUR_S) * HOUR_S; t <= max; t += HOUR_S) {
    const n = hourEndingNumber((t - HOUR_S) * 1000, timeZone);
    if (n % step === 0) splits.push(t);
  }
  return splits;
}

/**
 * "HE06", with the operating day ("Tue 05-12") under the first tick of each day only, so that
 * the dates do not run into each other.
 */
export function hourEndingTick(t: number, timeZone: string, step: number): string {
  const start = (t - HOUR_S) * 1000;
  const n = hourEndingNumber(start, timeZone);
  const label = formatHourEnding(n);
  if (n > step) return label;
  return `${label}\n${DateTime.fromMillis(start, { zone: timeZone }).toFormat('ccc LL-dd')}`;
}
