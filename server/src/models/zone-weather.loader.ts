import { Injectable } from '@nestjs/common';
import { DateTime } from 'luxon';
import { HOUR_MS } from '@morrowline/shared';
import type { WeatherChoice } from '@morrowline/engine';
import { CalendarService } from '../calendar/calendar.service';
import type { ZoneHistory } from '../history/zone-history.loader';
import { WeatherRepository } from '../weather/weather.repository';
import type { Zone } from '../zones/entities/zone.entity';
import type { RefitWeather } from './analysis/refit';
import { zoneWeatherInputs } from './analysis/zone-weather-inputs';

/**
 * Share of the history's hours that must have an observed zone temperature before a refit tries
 * the weather terms: with less, the degree terms would be estimated on a few weeks and the
 * backtest's origins would mostly lack the temperature they need.
 */
export const MIN_OBSERVED_SHARE = 0.75;

/**
 * A zone's weather and calendar for a refit, read as known at the forecast's issue time: the
 * temperature forecast values come from vintages issued at or before it only (the repository's
 * query never reads a later one), the observed temperature of the history's hours, the special
 * days of the history and the forecast. Undefined when the zone has no stations or too little
 * observed temperature: the refit then runs without weather as before.
 */
@Injectable()
export class ZoneWeatherLoader {
  constructor(
    private readonly weather: WeatherRepository,
    private readonly calendar: CalendarService,
  ) {}

  async forRefit(zone: Zone, history: ZoneHistory, horizon: number, issuedAtMs: number, fixed?: WeatherChoice): Promise<RefitWeather | undefined> {
    const own = (await this.weather.weights()).filter((w) => w.zone.id === zone.id);
    if (own.length === 0) return undefined;
    const stationIds = own.map((w) => w.station.id);
    const hours = history.values.length;
    const end = history.lastHourMs + HOUR_MS;
    const localDay = (ms: number) => DateTime.fromMillis(ms, { zone: zone.timeZone }).toISODate()!;
    const [observed, forecasts, specialDays] = await Promise.all([
      this.weather.observations(stationIds, history.firstHourMs, end),
      this.weather.forecastsIssuedBy(stationIds, history.firstHourMs, end + horizon * HOUR_MS, issuedAtMs),
      this.calendar.list(localDay(history.firstHourMs - 24 * HOUR_MS), localDay(end + (horizon + 24) * HOUR_MS)),
    ]);
    const inputs = zoneWeatherInputs({
      zone: zone.code,
      timeZone: zone.timeZone,
      firstHourMs: history.firstHourMs,
      hours,
      horizon,
      stationIds,
      weights: own.map((w) => w.weight),
      observed,
      forecasts,
      specialDays,
    });
    if (inputs.observedHours < MIN_OBSERVED_SHARE * hours) return undefined;
    return {
      firstHourMs: history.firstHourMs,
      temperature: inputs.temperature,
      vintages: inputs.vintages,
      calendar: inputs.calendar,
      issuedAt: (issuedAtMs - history.firstHourMs) / HOUR_MS,
      ...(fixed ? { fixed } : {}),
    };
  }
}
