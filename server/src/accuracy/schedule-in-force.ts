import { Injectable } from '@nestjs/common';
import type { DaySource } from './accuracy-report';
import type { OperatingDay } from './operating-days';

/**
 * The published schedule in force for a zone and operating day: the latest published revision.
 * Until the schedule revisions are stored there is none, and every day says "no schedule".
 */
@Injectable()
export class ScheduleInForce {
  /** Per operating day (yyyy-MM-dd), the revision's adjusted MW aligned with the day's hours. */
  forDays(zoneId: number, days: readonly OperatingDay[]): Promise<Map<string, DaySource>> {
    void zoneId;
    void days;
    return Promise.resolve(new Map());
  }

  /** Changes whenever a revision of these zones is published (cache key). */
  stamp(zoneIds: readonly number[]): Promise<string> {
    void zoneIds;
    return Promise.resolve('0');
  }
}
