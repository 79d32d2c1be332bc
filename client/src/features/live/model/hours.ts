import { HOUR_MS } from '@morrowline/shared';

/** Index of an hour in a series that starts at `fromMs`, or -1 when outside [0, length). */
export function hourIndex(hour: string | number, fromMs: number, length: number): number {
  const t = typeof hour === 'number' ? hour : Date.parse(hour);
  const i = (t - fromMs) / HOUR_MS;
  return Number.isInteger(i) && i >= 0 && i < length ? i : -1;
}
