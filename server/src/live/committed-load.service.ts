import { BadRequestException, Injectable } from '@nestjs/common';
import { COMMITTED_MAX_HOURS, gateClosureAt, HOUR_MS, operatingDayOf, operatingDays, type CommittedLoadDto, type ZoneCommittedDto } from '@morrowline/shared';
import { modelFor } from '../accuracy/accuracy.service';
import { ScheduleInForce } from '../accuracy/schedule-in-force';
import { MAX_HORIZON_HOURS } from '../forecasts/forecast-horizon';
import { ForecastRunsRepository } from '../forecasts/forecast-runs.repository';
import type { Zone } from '../zones/entities/zone.entity';
import { ZonesRepository } from '../zones/zones.repository';
import { layCommitted, type CommittedDay } from './committed-hours';

/**
 * What each zone committed to, hour by hour: the published schedule in force (ScheduleInForce),
 * else the day-ahead forecast, i.e. the newest model run issued before the operating day's gate
 * closure that covers the whole day (modelFor, the rule the accuracy report scores by). Read by
 * the live view and by the deviation alerts, so both measure against the same numbers.
 */
@Injectable()
export class CommittedLoadService {
  constructor(
    private readonly zones: ZonesRepository,
    private readonly runs: ForecastRunsRepository,
    private readonly schedules: ScheduleInForce,
  ) {}

  /** GET /api/live/committed: the zones asked for (every active one when none), on whole hours [from, to). */
  async load(codes: readonly string[] | undefined, from: Date, to: Date): Promise<CommittedLoadDto> {
    const start = Math.floor(from.getTime() / HOUR_MS) * HOUR_MS;
    const end = Math.ceil(to.getTime() / HOUR_MS) * HOUR_MS;
    if (!(start < end)) throw new BadRequestException('from must be before to');
    if ((end - start) / HOUR_MS > COMMITTED_MAX_HOURS) throw new BadRequestException(`The range may span at most ${COMMITTED_MAX_HOURS} hours`);
    const zones = await this.zones.activeByCodes(codes && [...new Set(codes)]);
    const out: ZoneCommittedDto[] = [];
    for (const zone of zones) out.push(await this.forZone(zone, start, end));
    const hours = Array.from({ length: (end - start) / HOUR_MS }, (_, i) => new Date(start + i * HOUR_MS).toISOString());
    return { from: new Date(start).toISOString(), to: new Date(end).toISOString(), hours, zones: out };
  }

  /** One zone's committed numbers on the whole hours [from, to) (epoch ms on hour boundaries). */
  async forZone(zone: Zone, from: number, to: number): Promise<ZoneCommittedDto> {
    const days = operatingDays(operatingDayOf(from, zone.timeZone), operatingDayOf(to - HOUR_MS, zone.timeZone), zone.timeZone);
    const first = days[0];
    const last = days[days.length - 1];
    const [schedules, runs] = await Promise.all([
      this.schedules.forDays(zone.id, days),
      this.runs.issuedBefore(zone.id, new Date(gateClosureAt(last.date, zone.timeZone, zone.gateClosure)), new Date(first.start - MAX_HORIZON_HOURS * HOUR_MS), new Date(last.start)),
    ]);
    const committedDays: CommittedDay[] = days.map((day) => ({
      day,
      schedule: schedules.get(day.date) ?? null,
      dayAhead: modelFor(day, runs, gateClosureAt(day.date, zone.timeZone, zone.gateClosure)),
    }));
    const laid = layCommitted(from, (to - from) / HOUR_MS, committedDays);
    return {
      zone: zone.code,
      ...laid,
      days: committedDays.map(({ day, schedule, dayAhead }) => ({
        operatingDay: day.date,
        gateClosureAt: new Date(gateClosureAt(day.date, zone.timeZone, zone.gateClosure)).toISOString(),
        schedule: schedule && schedule.revision !== null ? { revisionId: schedule.id, revision: schedule.revision, publishedAt: new Date(schedule.at).toISOString() } : null,
        dayAhead: dayAhead ? { runId: dayAhead.id, issuedAt: new Date(dayAhead.at).toISOString(), replayed: dayAhead.replayed ?? false } : null,
      })),
    };
  }
}
