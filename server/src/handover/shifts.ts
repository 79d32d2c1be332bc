import { DateTime } from 'luxon';
import type { ShiftDto } from '@morrowline/shared';

/**
 * The shift pattern: local start times ("06:00,14:00,22:00") in the desk's time zone. Shifts are
 * computed from wall-clock times each day, so a shift that spans a daylight-saving change is an
 * hour shorter or longer, as the people working it experience it.
 */
export interface ShiftPattern {
  starts: string[];
  timeZone: string;
}

const SHIFT_NAMES_BY_COUNT: Record<number, string[]> = {
  2: ['Day', 'Night'],
  3: ['Early', 'Late', 'Night'],
};

function shiftName(pattern: ShiftPattern, index: number): string {
  return SHIFT_NAMES_BY_COUNT[pattern.starts.length]?.[index] ?? `Shift ${index + 1}`;
}

function startOn(day: DateTime, hhmm: string): DateTime {
  const [hour, minute] = hhmm.split(':').map(Number);
  return day.set({ hour, minute, second: 0, millisecond: 0 });
}

/** The shift that contains `at`, and its neighbours by offset (-1 = previous). */
export function shiftAt(pattern: ShiftPattern, at: Date, offset = 0): ShiftDto {
  const local = DateTime.fromJSDate(at, { zone: pattern.timeZone });
  // Candidate starts from yesterday to tomorrow, in order; the last one not after `at` is ours.
  const candidates: { start: DateTime; index: number }[] = [];
  for (const dayOffset of [-2, -1, 0, 1, 2]) {
    const day = local.plus({ days: dayOffset }).startOf('day');
    pattern.starts.forEach((hhmm, index) => candidates.push({ start: startOn(day, hhmm), index }));
  }
  candidates.sort((a, b) => a.start.toMillis() - b.start.toMillis());
  let position = -1;
  for (let i = 0; i < candidates.length; i++) if (candidates[i].start <= local) position = i;
  const chosen = candidates[position + offset];
  const next = candidates[position + offset + 1];
  const label = `${shiftName(pattern, chosen.index)} ${chosen.start.toFormat('ccc d LLL HH:mm')}–${next.start.toFormat('HH:mm')}`;
  return { label, start: chosen.start.toUTC().toISO()!, end: next.start.toUTC().toISO()!, timeZone: pattern.timeZone };
}
