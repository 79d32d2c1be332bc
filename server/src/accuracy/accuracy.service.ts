import { BadRequestException, Injectable } from '@nestjs/common';
import { ACCURACY_MAX_DAYS, dayCount, gateClosureAt, HOUR_MS, operatingDays, parseDay, type AccuracyReportDto, type OperatingDay } from '@morrowline/shared';
import { MAX_HORIZON_HOURS } from '../forecasts/forecast-horizon';
import { ForecastRunsRepository, type RunValues } from '../forecasts/forecast-runs.repository';
import { OutagesService } from '../outages/outages.service';
import { ReadingsRepository } from '../readings/readings.repository';
import type { Zone } from '../zones/entities/zone.entity';
import { ZonesRepository } from '../zones/zones.repository';
import { systemInput, zoneAccuracy, type DaySource, type ZoneInput } from './accuracy-report';
import { WeatherService } from '../weather/weather.service';
import { ScheduleInForce } from './schedule-in-force';

/** Reports kept; a changed key (new reading hour, run or publication) makes a new entry. */
const CACHE_ENTRIES = 64;
/** A revised older reading does not move the latest hour, so entries also age out. */
const CACHE_MS = 5 * 60_000;

/**
 * Accuracy after the fact, computed from stored readings, forecast runs and published schedule
 * revisions (no tables of its own; see shared/src/accuracy.ts for the definitions). The work is a
 * few thousand additions per zone, so it runs in the request; reports are cached per zones, range
 * and the latest stored reading hour (and the latest run and publication).
 */
@Injectable()
export class AccuracyService {
  private readonly cache = new Map<string, { at: number; report: AccuracyReportDto }>();

  constructor(
    private readonly forecastRuns: ForecastRunsRepository,
    private readonly zones: ZonesRepository,
    private readonly readings: ReadingsRepository,
    private readonly outages: OutagesService,
    private readonly schedules: ScheduleInForce,
    private readonly weather: WeatherService,
  ) {}

  async report(codes: readonly string[] | undefined, from: string, to: string, now = Date.now()): Promise<AccuracyReportDto> {
    // The one day parser, here rather than in the DTO so that its message is the answer's own.
    for (const [field, day] of [['from', from], ['to', to]] as const) {
      const parsed = parseDay(day, field);
      if (!parsed.ok) throw new BadRequestException(parsed.message);
    }
    if (to < from) throw new BadRequestException(`from (${from}) must not be after to (${to})`);
    const span = dayCount(from, to);
    if (span > ACCURACY_MAX_DAYS) throw new BadRequestException(`The range may span at most ${ACCURACY_MAX_DAYS} days; ${from} to ${to} is ${span}`);
    const zones = await this.resolveZones(codes);

    const ids = zones.map((z) => z.id);
    const latest = await this.readings.latest();
    const latestHour = Math.max(-1, ...ids.map((id) => latest.get(id)?.hourStart ?? -1));
    const stamp = await this.changeStamp(ids);
    const key = JSON.stringify([ids, from, to, latestHour, ...ids.map((id) => latest.get(id)?.receivedAt ?? 0), stamp]);
    const hit = this.cache.get(key);
    if (hit && now - hit.at < CACHE_MS) return hit.report;

    const inputs: ZoneInput[] = [];
    for (const zone of zones) inputs.push(await this.zoneInput(zone, from, to));
    const systemDays = operatingDays(from, to, zones[0].timeZone);
    const report: AccuracyReportDto = {
      from,
      to,
      latestReadingHour: latestHour >= 0 ? new Date(latestHour).toISOString() : null,
      computedAt: new Date(now).toISOString(),
      zones: inputs.map((input) => zoneAccuracy(input, now)),
      system: zoneAccuracy(systemInput(inputs, systemDays), now),
    };
    await this.addTemperatureErrors(report, zones);
    if (this.cache.size >= CACHE_ENTRIES) this.cache.delete(this.cache.keys().next().value!);
    this.cache.set(key, { at: now, report });
    return report;
  }

  /**
   * Beside each zone-day, the temperature forecast's error: the forecast known when the day's model
   * forecast was issued (else at the day's gate closure) against what was observed.
   */
  private async addTemperatureErrors(report: AccuracyReportDto, zones: Zone[]): Promise<void> {
    for (const entry of report.zones) {
      const zone = zones.find((z) => z.code === entry.zone);
      if (!zone) continue;
      const days = operatingDays(report.from, report.to, zone.timeZone);
      const spans = entry.days.map((d, i) => ({
        from: days[i].start,
        to: days[i].end,
        asOf: d.model ? Date.parse(d.model.at) : gateClosureAt(d.operatingDay, zone.timeZone, zone.gateClosure),
      }));
      const errors = await this.weather.forecastErrors(zone.code, spans);
      entry.days.forEach((d, i) => (d.temperature = errors[i]));
    }
  }

  private async resolveZones(codes: readonly string[] | undefined): Promise<Zone[]> {
    const zones = await this.zones.activeByCodes(codes && [...new Set(codes)]);
    if (zones.length === 0) throw new BadRequestException('There are no active zones');
    return zones;
  }

  /** Newest forecast run and schedule publication of the zones: part of the cache key. */
  private async changeStamp(zoneIds: number[]): Promise<string> {
    return `${await this.forecastRuns.newestId(zoneIds)}/${await this.schedules.stamp(zoneIds)}`;
  }

  private async zoneInput(zone: Zone, from: string, to: string): Promise<ZoneInput> {
    const days = operatingDays(from, to, zone.timeZone);
    const start = days[0].start;
    const end = days[days.length - 1].end;
    const [rows, excluded, runs, schedules] = await Promise.all([
      this.readings.range([zone.id], start, end),
      this.outages.excludedHours(zone.code, start, end),
      this.runs(zone, days),
      this.schedules.forDays(zone.id, days),
    ]);
    const actualAt = new Map<number, number>();
    for (const row of rows) if (!excluded.has(row.hourStart)) actualAt.set(row.hourStart, row.mw);
    return {
      code: zone.code,
      name: zone.name,
      timeZone: zone.timeZone,
      days,
      actual: days.map((day) => day.labels.map((_, h) => actualAt.get(day.start + h * HOUR_MS) ?? null)),
      model: days.map((day) => modelFor(day, runs, gateClosureAt(day.date, zone.timeZone, zone.gateClosure))),
      schedule: days.map((day) => schedules.get(day.date) ?? null),
    };
  }

  /** Runs that may cover some day of the range, issued before the last day's gate closure; newest first. */
  private async runs(zone: Zone, days: OperatingDay[]): Promise<RunValues[]> {
    const first = days[0];
    const last = days[days.length - 1];
    return this.forecastRuns.issuedBefore(zone.id, new Date(gateClosureAt(last.date, zone.timeZone, zone.gateClosure)), new Date(first.start - MAX_HORIZON_HOURS * HOUR_MS), new Date(last.start));
  }
}

/** The latest run issued before the day's gate closure whose hours cover the whole day. */
export function modelFor(day: OperatingDay, runsNewestFirst: readonly RunValues[], gate: number): DaySource | null {
  for (const run of runsNewestFirst) {
    if (run.issuedAt.getTime() >= gate) continue;
    const first = run.firstHour.getTime();
    const offset = (day.start - first) / HOUR_MS;
    if (offset < 0 || offset + day.labels.length > run.mean.length) continue;
    return {
      id: run.id,
      at: run.issuedAt.getTime(),
      revision: null,
      values: run.mean.slice(offset, offset + day.labels.length).map((v) => (Number.isFinite(v) ? v : null)),
      replayed: run.origin === 'replayed',
    };
  }
  return null;
}
