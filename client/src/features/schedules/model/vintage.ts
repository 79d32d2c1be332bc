import type { ScheduleHourSlot, ScheduleRevisionDto } from '@morrowline/shared';
import { formatDateTime } from '../../../lib/format';

const HOUR_MS = 3_600_000;

/** The operating day's [from, to) as UTC instants, from its hour slots. */
export function dayRange(slots: readonly ScheduleHourSlot[]): { from: string; to: string } {
  if (slots.length === 0) return { from: '', to: '' };
  return { from: slots[0].intervalStartUtc, to: new Date(Date.parse(slots[slots.length - 1].intervalStartUtc) + HOUR_MS).toISOString() };
}

/** "Revision 2 started from the forecast issued 2026-12-02 15:05 (America/Denver), run 41." */
export function vintageLine(revision: Pick<ScheduleRevisionDto, 'revision' | 'forecastRunId' | 'forecastIssuedAt'>, timeZone: string): string {
  if (revision.forecastRunId === null) return `Revision ${revision.revision} started from the week-earlier stand-in (no model forecast was stored).`;
  return `Revision ${revision.revision} started from the forecast issued ${formatDateTime(revision.forecastIssuedAt, timeZone)} (${timeZone}), run ${revision.forecastRunId}.`;
}

/** The revision's values differ from its run's model values: adjustments in force, or an older correction's start values. */
export function offModel(revision: Pick<ScheduleRevisionDto, 'hours' | 'adjustments'>): boolean {
  return revision.adjustments.some((a) => a.undoneAt === null) || revision.hours.some((h) => h.startMw !== h.modelMw);
}
