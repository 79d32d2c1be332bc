import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { HOUR_MS, isOperatingDay, operatingDayBounds, weightedTemperature, type AdjustmentResultDto, type WeatherVintagesDto, type WeatherWhatIfDto } from '@morrowline/shared';
import { CalendarService } from '../calendar/calendar.service';
import type { AuthUser } from '../common/auth-user';
import { SchedulesService } from '../schedules/schedules.service';
import { ForecastsService } from '../forecasts/forecasts.service';
import { knownAt, vintageKey, type VintageValue } from '../weather/vintages';
import { WeatherRepository } from '../weather/weather.repository';
import { ZonesRepository } from '../zones/zones.repository';
import { dayVintages } from './analysis/day-vintages';
import { responseChange, whatIfHours } from './analysis/weather-what-if';
import { zoneWeatherInputs } from './analysis/zone-weather-inputs';
import { ModelVersionsRepository } from './model-versions.repository';

/** Hours of observed temperature before the day that the recency terms read (24-hour mean, 3-hour lag). */
const LEAD_IN_HOURS = 48;

export type WhatIfChange = { shiftC: number } | { vintageMs: number };

const METHOD =
  'The model forecast plus the change of its temperature response between the two temperature paths, its coefficients and thresholds held as fitted; hours already observed when the forecast was made keep their observed temperature.';

/**
 * The day-ahead schedule's weather what-if: the load the model behind the day's latest forecast
 * would mean on a shifted temperature forecast, or on another vintage, beside the model forecast.
 * Nothing is stored; an operator who wants it turns it into an adjustment with a reason.
 */
@Injectable()
export class WeatherWhatIfService {
  constructor(
    private readonly zones: ZonesRepository,
    private readonly versions: ModelVersionsRepository,
    private readonly forecasts: ForecastsService,
    private readonly weather: WeatherRepository,
    private readonly calendar: CalendarService,
    private readonly schedules: SchedulesService,
  ) {}

  /**
   * The what-if, worked out again here from the stored forecast, response and vintages (never from
   * numbers the desk sends), as one "add" per hour on the zone's draft: added together or not at
   * all, one audit entry, undone together (SchedulesService.addBatch).
   */
  async adjust(user: AuthUser, day: string, code: string, change: WhatIfChange, reason: string): Promise<AdjustmentResultDto> {
    const w = await this.whatIf(day, code, change);
    const label = 'shiftC' in change ? `${change.shiftC > 0 ? '+' : change.shiftC < 0 ? '−' : ''}${Math.abs(change.shiftC)} °C` : `vintage issued ${w.whatIfVintageIssuedAt}`;
    const { from } = operatingDayBounds(day, (await this.zones.byCode(code))!.timeZone);
    return this.schedules.addBatch(user, day, w.zone, whatIfHours(w, from), `${reason} (weather what-if: ${label})`, {
      source: 'weather-what-if',
      shiftC: w.shiftC,
      whatIfVintageIssuedAt: w.whatIfVintageIssuedAt,
      forecastRunId: w.forecastRunId,
      modelVersionId: w.modelVersionId,
    });
  }

  /** The vintages known now for the day (issue times newest first), the one its latest forecast used marked. */
  async vintages(day: string, code: string, now = Date.now()): Promise<WeatherVintagesDto> {
    if (!isOperatingDay(day)) throw new BadRequestException(`"${day}" is not an operating day (yyyy-MM-dd)`);
    const zone = await this.zones.byCode(code);
    if (!zone || !zone.active) throw new NotFoundException(`No active zone with code ${code}`);
    const { from, to } = operatingDayBounds(day, zone.timeZone);
    const stationIds = (await this.weather.weights()).filter((x) => x.zone.id === zone.id).map((x) => x.station.id);
    const [run, values] = await Promise.all([this.forecasts.latest([zone.code], new Date(from), new Date(to)).then((r) => r.zones[0]), this.weather.forecastsIssuedBy(stationIds, from, to, now)]);
    const list = dayVintages(values, from, to, run?.hours.length ? Date.parse(run.issuedAt) : null);
    const used = list.find((v) => v.usedByForecast);
    return {
      zone: zone.code,
      operatingDay: day,
      forecastVintageIssuedAt: used ? new Date(used.issuedAt).toISOString() : null,
      vintages: list.map((v) => ({ issuedAt: new Date(v.issuedAt).toISOString(), hours: v.hours, usedByForecast: v.usedByForecast })),
    };
  }

  async whatIf(day: string, code: string, change: WhatIfChange, now = Date.now()): Promise<WeatherWhatIfDto> {
    if (!isOperatingDay(day)) throw new BadRequestException(`"${day}" is not an operating day (yyyy-MM-dd)`);
    const zone = await this.zones.byCode(code);
    if (!zone || !zone.active) throw new NotFoundException(`No active zone with code ${code}`);
    if ('vintageMs' in change && change.vintageMs > now) throw new BadRequestException('vintage must be an issue time that has passed');
    const { from, to } = operatingDayBounds(day, zone.timeZone);
    const run = (await this.forecasts.latest([zone.code], new Date(from), new Date(to))).zones[0];
    if (!run || run.modelVersionId === null || !run.hours.length) throw new ConflictException(`The latest forecast of ${zone.code} for ${day} is not a model's: there is no temperature response to shift`);
    const version = await this.versions.byId(run.modelVersionId);
    const w = version?.weather;
    if (!w || !w.used || !(w.terms.temperature || w.terms.recency)) throw new ConflictException(`The model behind the latest forecast of ${zone.code} (version ${run.modelVersionId}) forecasts without the temperature: a weather what-if does not move it`);

    const own = (await this.weather.weights()).filter((x) => x.zone.id === zone.id);
    const stationIds = own.map((x) => x.station.id);
    const weights = own.map((x) => x.weight);
    const first = from - LEAD_IN_HOURS * HOUR_MS;
    const hours = (to - first) / HOUR_MS;
    const runIssued = Date.parse(run.issuedAt);
    // the hours the model had observed when it forecast; later hours stand on the temperature forecast
    const knownUntil = run.basedOnHour ? Date.parse(run.basedOnHour) + HOUR_MS : runIssued;
    const asOf = 'vintageMs' in change ? Math.max(runIssued, change.vintageMs) : runIssued;
    const [observed, forecasts, specialDays] = await Promise.all([
      this.weather.observations(stationIds, first, Math.min(knownUntil, to)),
      this.weather.forecastsIssuedBy(stationIds, first, to, asOf),
      this.calendar.list(day, day),
    ]);
    const { temperature: obs, calendar } = zoneWeatherInputs({ zone: zone.code, timeZone: zone.timeZone, firstHourMs: first, hours, horizon: 0, stationIds, weights, observed, forecasts: [], specialDays });
    const path = (values: readonly VintageValue[], at: number): { path: Float64Array; issued: number | null } => {
      const known = knownAt(values, at);
      const p = Float64Array.from(obs);
      let issued: number | null = null;
      for (let i = 0; i < hours; i++) {
        const h = first + i * HOUR_MS;
        if (h < knownUntil && Number.isFinite(p[i])) continue;
        const vals = stationIds.map((id) => known.get(vintageKey(id, h)));
        const t = weightedTemperature(vals.map((v) => v?.tempC), weights);
        p[i] = t ?? NaN;
        if (t !== null && h >= from) issued = Math.max(issued ?? 0, ...vals.map((v) => v!.issuedAt));
      }
      return { path: p, issued };
    };
    const base = path(forecasts, runIssued);
    let alt: { path: Float64Array; issued: number | null };
    if ('shiftC' in change) {
      alt = { path: base.path.map((t, i) => (first + i * HOUR_MS >= knownUntil ? t + change.shiftC : t)), issued: base.issued };
    } else {
      // only a vintage that was issued, and covers the day, may be asked for: the list the desk offers
      const vintageMs = change.vintageMs;
      if (!forecasts.some((v) => v.issuedAt === vintageMs && v.hourStart >= from && v.hourStart < to)) {
        throw new NotFoundException(
          `No temperature forecast for ${zone.code} covering ${day} was issued at ${new Date(vintageMs).toISOString()}; choose one of the vintages known for the day (GET /api/schedules/${day}/${zone.code}/weather-vintages)`,
        );
      }
      alt = path(forecasts, vintageMs);
      if (alt.issued === null) throw new ConflictException(`No temperature forecast for ${zone.code} on ${day} had been issued by ${new Date(change.vintageMs).toISOString()}`);
    }
    const start = (from - first) / HOUR_MS;
    const delta = responseChange(w, base.path, alt.path, calendar, start, hours);
    const meanAt = new Map(run.hours.map((h, i) => [Date.parse(h), run.mean[i]]));
    const finite = (v: number): number | null => (Number.isFinite(v) ? Math.round(v * 100) / 100 : null);
    return {
      zone: zone.code,
      operatingDay: day,
      forecastRunId: run.id,
      modelVersionId: run.modelVersionId,
      shiftC: 'shiftC' in change ? change.shiftC : null,
      baseVintageIssuedAt: base.issued === null ? null : new Date(base.issued).toISOString(),
      whatIfVintageIssuedAt: alt.issued === null ? null : new Date(alt.issued).toISOString(),
      hours: Array.from({ length: hours - start }, (_, j) => {
        const h = from + j * HOUR_MS;
        const model = meanAt.get(h);
        const d = delta[j];
        const whatIf = model === undefined || !Number.isFinite(d) ? null : Math.max(0, model + d);
        return {
          hourStart: new Date(h).toISOString(),
          modelMw: model ?? null,
          temperatureC: finite(base.path[start + j]),
          whatIfTemperatureC: finite(alt.path[start + j]),
          whatIfMw: whatIf === null ? null : finite(whatIf),
          changeMw: whatIf === null || model === undefined ? null : finite(whatIf - model),
        };
      }),
      method: METHOD,
    };
  }
}
