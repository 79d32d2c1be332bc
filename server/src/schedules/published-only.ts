import { ForbiddenException } from '@nestjs/common';
import { may, type DayScheduleDto, type Role, type ScheduleRevisionDto } from '@morrowline/shared';

/**
 * Viewers read published schedules only (README's role table): the drafts, submissions and
 * returned revisions behind them are the forecasting roles' work in progress (readDeskWork).
 * These cut a schedule answer down to what the caller's role may see.
 */
export function seesDrafts(role: Role): boolean {
  return may(role, 'readDeskWork');
}

function isPublished(revision: ScheduleRevisionDto): boolean {
  return revision.state === 'published' || revision.state === 'superseded';
}

export function dayFor(role: Role, day: DayScheduleDto): DayScheduleDto {
  if (seesDrafts(role)) return day;
  return { ...day, zones: day.zones.map((zone) => ({ ...zone, working: null })) };
}

export function revisionsFor(role: Role, revisions: ScheduleRevisionDto[]): ScheduleRevisionDto[] {
  return seesDrafts(role) ? revisions : revisions.filter(isPublished);
}

export function revisionFor(role: Role, revision: ScheduleRevisionDto): ScheduleRevisionDto {
  if (seesDrafts(role) || isPublished(revision)) return revision;
  throw new ForbiddenException(`Your role (${role}) sees published schedules only; revision ${revision.revision} of ${revision.zone} ${revision.operatingDay} is ${revision.state}`);
}
