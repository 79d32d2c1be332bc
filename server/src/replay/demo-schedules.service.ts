import type { EntityManager } from '@mikro-orm/mariadb';
import { DateTime } from 'luxon';
import type { AuthUser } from '../common/auth-user';
import { toForecastRunDto, type ForecastsService } from '../forecasts/forecasts.service';
import type { ReadingsRepository } from '../readings/readings.repository';
import { ScheduleRevision } from '../schedules/entities/schedule-revision.entity';
import { gateClosureAt, operatingDayBounds } from '@morrowline/shared';
import type { SchedulesService } from '../schedules/schedules.service';
import { User } from '../users/entities/user.entity';
import { Zone } from '../zones/entities/zone.entity';
import { adjustmentValue, type DemoScheduleStory } from './demo-schedule-stories';
import { gateForecastAt } from './replay-timeline';

const HOUR_MS = 3_600_000;
const MINUTE_MS = 60_000;

export interface DemoScheduleOutcome {
  zone: string;
  operatingDay: string;
  /** The published revision's id, or null with why the story was left out. */
  revisionId: number | null;
  adjustments: number;
  skipped: string | null;
}

/**
 * Makes the demo scenario's published schedules through the schedule workflow itself (draft,
 * adjustments, submission, approval = publication, its e-mails), each step as of its time on the
 * day before the operating day, so the revisions, the audit trail and Accuracy read them as the
 * operators' and supervisors' work. A zone and day that already has a schedule is left alone.
 */
export class DemoSchedulesService {
  constructor(
    private readonly em: EntityManager,
    private readonly schedules: SchedulesService,
    private readonly forecasts: ForecastsService,
    private readonly readings: ReadingsRepository,
    /** Minute past the hour of the desk's forecast update (FORECAST_UPDATE_MINUTE). */
    private readonly updateMinute: number,
  ) {}

  async make(stories: readonly DemoScheduleStory[], now: number, log: (line: string) => void): Promise<DemoScheduleOutcome[]> {
    const out: DemoScheduleOutcome[] = [];
    for (const story of stories) {
      const outcome = await this.tell(story, now);
      out.push(outcome);
      log(
        outcome.revisionId === null
          ? `  schedule ${story.zone} ${outcome.operatingDay}: left out (${outcome.skipped})`
          : `  schedule ${story.zone} ${outcome.operatingDay}: published ${outcome.adjustments ? `with ${outcome.adjustments} adjustment${outcome.adjustments === 1 ? '' : 's'}` : 'as the model'}`,
      );
    }
    return out;
  }

  private async tell(story: DemoScheduleStory, now: number): Promise<DemoScheduleOutcome> {
    const em = this.em.fork();
    const zone = await em.findOne(Zone, { code: story.zone, active: true });
    const day = zone ? DateTime.fromMillis(now, { zone: zone.timeZone }).startOf('day').minus({ days: story.daysAgo }).toISODate()! : '';
    const skip = (why: string): DemoScheduleOutcome => ({ zone: story.zone, operatingDay: day, revisionId: null, adjustments: 0, skipped: why });
    if (!zone) return skip('no such active zone');
    if ((await em.count(ScheduleRevision, { zone: zone.id, operatingDay: day })) > 0) return skip('the day already has a schedule');
    const [operator, approver] = [await this.user(em, story.operator, ['operator', 'supervisor']), await this.user(em, story.approver, ['supervisor'])];
    if (!operator || !approver) return skip('its operator or supervisor is not an active user');

    // the story's minutes after the forecast update, squeezed if need be to end before the gate closure
    const updated = gateForecastAt(day, zone.timeZone, zone.gateClosure, this.updateMinute);
    const gate = gateClosureAt(day, zone.timeZone, zone.gateClosure);
    const squeeze = Math.min(1, Math.max(0, gate - updated - MINUTE_MS) / (story.approveMinute * MINUTE_MS));
    const at = (minute: number) => new Date(updated + Math.round(minute * squeeze * MINUTE_MS));
    const { from, to } = operatingDayBounds(day, zone.timeZone);
    const run = await this.forecasts.runAsOf(zone.id, at(story.draftMinute));
    if (!run || toForecastRunDto(run, zone.code, from, to).hours.length < Math.round((to - from) / HOUR_MS)) return skip('no forecast covered the day at the time');

    const draft = await this.schedules.createDraft(operator, day, zone.code, at(story.draftMinute));
    const actualAt = new Map((await this.readings.range([zone.id], from, to)).map((r) => [r.hourStart, r.mw]));
    const month = DateTime.fromMillis(from, { zone: zone.timeZone }).month;
    let made = 0;
    for (const a of story.adjustments) {
      const fromHour = draft.hours.findIndex((h) => h.hourEnding === a.from);
      const toHour = draft.hours.findIndex((h) => h.hourEnding === a.to);
      if (fromHour < 0 || toHour < fromHour) continue;
      const hours = draft.hours.slice(fromHour, toHour + 1);
      const change = adjustmentValue(
        a.change,
        hours.map((h) => h.modelMw),
        hours.map((h) => actualAt.get(Date.parse(h.intervalStartUtc)) ?? null),
      );
      if (!change) continue;
      await this.schedules.adjust(operator, day, { zones: [zone.code], kind: change.kind, fromHour, toHour, value: change.value, reason: a.reason(change.value > 0, month) }, at(a.minute));
      made++;
    }
    await this.schedules.submit(operator, draft.id, story.submit.comment, at(story.submit.minute));
    const published = await this.schedules.approve(approver, draft.id, at(story.approveMinute));
    return { zone: zone.code, operatingDay: day, revisionId: published.id, adjustments: made, skipped: null };
  }

  private async user(em: EntityManager, email: string, roles: readonly string[]): Promise<AuthUser | null> {
    const user = await em.findOne(User, { email, active: true });
    return user && roles.includes(user.role) ? { id: user.id, email: user.email, name: user.name, role: user.role } : null;
  }
}
