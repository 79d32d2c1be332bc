import { Injectable } from '@nestjs/common';
import { HOUR_MS, type OperatingDay } from '@morrowline/shared';
import { ScheduleRevisionsRepository } from '../schedules/schedule-revisions.repository';
import type { DaySource } from './accuracy-report';

/**
 * The published schedule in force for a zone and operating day: its latest published revision
 * (state published; a superseded one only counts if no later revision was published). Its
 * adjusted MW are matched to the day's hours by UTC hour start.
 */
@Injectable()
export class ScheduleInForce {
  constructor(private readonly revisions: ScheduleRevisionsRepository) {}

  /** Per operating day (yyyy-MM-dd), the revision's adjusted MW aligned with the day's hours. */
  async forDays(zoneId: number, days: readonly OperatingDay[]): Promise<Map<string, DaySource>> {
    const out = new Map<string, DaySource>();
    if (days.length === 0) return out;
    const revisions = await this.revisions.publishedBetween(zoneId, days[0].date, days[days.length - 1].date);
    const byDay = new Map(days.map((d) => [d.date, d]));
    for (const r of revisions) {
      const day = byDay.get(r.operatingDay);
      if (!day || out.has(r.operatingDay)) continue; // newest revision first
      const values = day.labels.map(() => null as number | null);
      for (const hour of r.hours) {
        const i = (Date.parse(hour.intervalStartUtc) - day.start) / HOUR_MS;
        if (Number.isInteger(i) && i >= 0 && i < values.length && hour.adjustedMw !== null && Number.isFinite(hour.adjustedMw)) values[i] = hour.adjustedMw;
      }
      out.set(r.operatingDay, { id: r.id, at: r.publishedAt!.getTime(), revision: r.revision, values });
    }
    return out;
  }

  /** Changes whenever a revision of these zones is published (part of the report cache key). */
  async stamp(zoneIds: readonly number[]): Promise<string> {
    const last = await this.revisions.lastPublished(zoneIds);
    return last ? `${last.id}@${last.publishedAt!.getTime()}` : '0';
  }
}
