import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { UniqueConstraintViolationException } from '@mikro-orm/mariadb';
import {
  HOUR_MS,
  OBSERVED_STALE_AFTER_HOURS,
  weightedTemperature,
  type AccuracyTemperatureDto,
  type CreateWeatherStationRequest,
  type WeatherRejection,
  type WeatherStationDto,
  type WeatherStatusDto,
  type ZoneStationsDto,
  type ZoneStationWeightsRequest,
  type ZoneWeatherSeriesDto,
} from '@morrowline/shared';
import { AuditService, type Actor } from '../audit/audit.service';
import type { AppConfig } from '../config/configuration';
import { ZonesRepository } from '../zones/zones.repository';
import { WeatherStation } from './entities/weather-station.entity';
import { temperatureScore } from './temperature-score';
import { knownAt, vintageKey } from './vintages';
import { validateForecast, validateObservation, type StationRef, type ValidForecast, type WeatherContext } from './weather-validation';
import { WeatherRepository, type ForecastStoreOutcome, type VersionedObservation } from './weather.repository';
import { checkVersion } from '../readings/reading-version';

/** Longest range one series request may ask for (as readings). */
export const MAX_WEATHER_HOURS = 24 * 92;

export interface WeatherIngestOptions {
  /** "feed:<name>" or "csv:<e-mail>". */
  source: string;
  allowedStation?: string | null;
}

export interface WeatherIngestResult {
  stored: number;
  rejected: WeatherRejection[];
}

/** One zone's stations and normalised weights. */
interface ZoneStations {
  zoneId: number;
  zone: string;
  stationIds: number[];
  weights: number[];
}

/**
 * Weather: stations and the zones' weights over them (admin, audited), the ingest of observed
 * temperature and forecast vintages (feed socket and CSV), the zones' temperature series as known
 * at a time, and whether each station's weather is keeping up.
 */
@Injectable()
export class WeatherService {
  private readonly forecastStaleHours: number;

  constructor(
    private readonly repository: WeatherRepository,
    private readonly zones: ZonesRepository,
    private readonly audit: AuditService,
    config: ConfigService,
  ) {
    this.forecastStaleHours = config.getOrThrow<AppConfig>('app').weather.forecastStaleHours;
  }

  async stations(): Promise<WeatherStationDto[]> {
    const [stations, weights] = await Promise.all([this.repository.stations(), this.repository.weights()]);
    return stations.map((s) => toStationDto(s, weights.filter((w) => w.station.id === s.id).map((w) => ({ zone: w.zone.code, weight: w.weight }))));
  }

  async createStation(actor: Actor, request: CreateWeatherStationRequest): Promise<WeatherStationDto> {
    try {
      return await this.repository.fork().transactional(async (tx) => {
        const station = tx.create(WeatherStation, {
          code: request.code,
          name: request.name,
          timeZone: request.timeZone,
          latitude: request.latitude ?? null,
          longitude: request.longitude ?? null,
          elevationM: request.elevationM ?? null,
          createdAt: new Date(),
        });
        await tx.flush();
        this.audit.stage(tx, actor, { action: 'weather.station.create', subjectType: 'weather-station', subjectId: station.code, after: toStationDto(station, []) });
        return toStationDto(station, []);
      });
    } catch (error) {
      if (error instanceof UniqueConstraintViolationException) throw new ConflictException(`A weather station with code ${request.code} exists already`);
      throw error;
    }
  }

  async zoneStations(): Promise<ZoneStationsDto[]> {
    const weights = await this.repository.weights();
    const byZone = new Map<string, ZoneStationsDto>();
    for (const w of weights) {
      const entry = byZone.get(w.zone.code) ?? byZone.set(w.zone.code, { zone: w.zone.code, stations: [] }).get(w.zone.code)!;
      entry.stations.push({ station: w.station.code, weight: w.weight });
    }
    return [...byZone.values()];
  }

  /** Sets which stations make a zone's temperature and with what weights; audited with the weights before and after. */
  async setZoneStations(actor: Actor, zoneCode: string, request: ZoneStationWeightsRequest): Promise<ZoneStationsDto> {
    const codes = request.stations.map((s) => s.station);
    if (new Set(codes).size !== codes.length) throw new BadRequestException('A station may appear once in a zone\'s weights');
    return this.repository.fork().transactional(async (tx) => {
      const zone = await this.zones.byCode(zoneCode, tx);
      if (!zone) throw new NotFoundException(`No zone with code ${zoneCode}`);
      const stations = await this.repository.stations(tx);
      const byCode = new Map(stations.map((s) => [s.code, s]));
      const unknown = codes.filter((c) => !byCode.has(c));
      if (unknown.length > 0) throw new BadRequestException(`No weather station with code ${unknown.join(', ')}`);
      const before = (await this.repository.weights(tx)).filter((w) => w.zone.id === zone.id).map((w) => ({ station: w.station.code, weight: w.weight }));
      const after = request.stations.map((s) => ({ station: s.station, weight: s.weight }));
      await this.repository.replaceWeights(
        tx,
        zone.id,
        request.stations.map((s) => ({ station: byCode.get(s.station)!, weight: s.weight })),
      );
      this.audit.stage(tx, actor, { action: 'weather.zone-stations.set', subjectType: 'zone', subjectId: zone.code, before, after });
      await tx.flush();
      return { zone: zone.code, stations: after };
    });
  }

  private async stationRefs(): Promise<Map<string, StationRef>> {
    const stations = await this.repository.stations();
    return new Map(stations.map((s) => [s.code, { id: s.id, code: s.code }]));
  }

  private checkObservations(raws: readonly unknown[], context: WeatherContext): { valid: VersionedObservation[]; rejected: WeatherRejection[] } {
    const valid: VersionedObservation[] = [];
    const rejected: WeatherRejection[] = [];
    raws.forEach((raw, index) => {
      const checked = validateObservation(raw, context);
      if (!checked.ok) return rejected.push({ list: 'observations', index, reason: checked.reason, message: checked.message });
      const version = checkVersion(raw, context.now);
      if (!version.ok) return rejected.push({ list: 'observations', index, reason: 'malformed', message: version.message });
      valid.push({ ...checked.value, version: version.version });
    });
    return { valid, rejected };
  }

  private checkForecasts(raws: readonly unknown[], context: WeatherContext): { valid: ValidForecast[]; indexes: number[]; rejected: WeatherRejection[] } {
    const valid: ValidForecast[] = [];
    const indexes: number[] = [];
    const rejected: WeatherRejection[] = [];
    raws.forEach((raw, index) => {
      const checked = validateForecast(raw, context);
      if (!checked.ok) return rejected.push({ list: 'forecasts', index, reason: checked.reason, message: checked.message });
      valid.push(checked.value);
      indexes.push(index);
    });
    return { valid, indexes, rejected };
  }

  /** The refusals of values that would have overwritten a stored vintage. */
  private conflicts(outcome: ForecastStoreOutcome, valid: ValidForecast[], indexes: number[]): WeatherRejection[] {
    return outcome.conflicts.map((conflict) => {
      const v = valid[conflict.index];
      return {
        list: 'forecasts' as const,
        index: indexes[conflict.index],
        reason: 'vintage-exists' as const,
        message: `${v.station} issued ${new Date(v.issuedAt).toISOString()} already holds ${conflict.storedTempC} °C for ${new Date(v.hourStart).toISOString()}${v.member ? ` (${v.member})` : ''}; a vintage is never overwritten: issue a new one`,
      };
    });
  }

  private async context(options: WeatherIngestOptions): Promise<WeatherContext> {
    return { stations: await this.stationRefs(), now: Date.now(), allowedStation: options.allowedStation };
  }

  /** Validates observed temperatures and stores the valid ones in one transaction (whole or not at all). */
  async ingestObservations(raws: readonly unknown[], options: WeatherIngestOptions): Promise<WeatherIngestResult> {
    const { valid, rejected } = this.checkObservations(raws, await this.context(options));
    if (valid.length === 0) return { stored: 0, rejected };
    const outcome = await this.repository.storeObservations(valid, options.source);
    return { stored: outcome.stored, rejected };
  }

  /** Validates forecast values and stores the valid ones in one transaction; a value that would overwrite a vintage is refused. */
  async ingestForecasts(raws: readonly unknown[], options: WeatherIngestOptions): Promise<WeatherIngestResult> {
    const { valid, indexes, rejected } = this.checkForecasts(raws, await this.context(options));
    if (valid.length === 0) return { stored: 0, rejected };
    const outcome = await this.repository.storeForecasts(valid, options.source);
    return { stored: outcome.stored, rejected: [...rejected, ...this.conflicts(outcome, valid, indexes)].sort((a, b) => a.index - b.index) };
  }

  /** A feed's weather batch: observations and forecasts checked, the valid ones of both stored in one transaction. */
  async ingestBatch(observations: readonly unknown[], forecasts: readonly unknown[], options: WeatherIngestOptions): Promise<WeatherIngestResult> {
    const context = await this.context(options);
    const observed = this.checkObservations(observations, context);
    const forecast = this.checkForecasts(forecasts, context);
    const rejected = [...observed.rejected, ...forecast.rejected];
    if (observed.valid.length + forecast.valid.length === 0) return { stored: 0, rejected };
    const outcome = await this.repository.storeBatch(observed.valid, forecast.valid, options.source);
    rejected.push(...this.conflicts(outcome.forecast, forecast.valid, forecast.indexes));
    rejected.sort((a, b) => (a.list === b.list ? a.index - b.index : a.list === 'observations' ? -1 : 1));
    return { stored: outcome.observed + outcome.forecast.stored, rejected };
  }

  private async zoneStationsFor(codes: readonly string[] | undefined): Promise<ZoneStations[]> {
    const zones = await this.zones.activeByCodes(codes);
    const weights = await this.repository.weights();
    return zones.map((zone) => {
      const own = weights.filter((w) => w.zone.id === zone.id);
      return { zoneId: zone.id, zone: zone.code, stationIds: own.map((w) => w.station.id), weights: own.map((w) => w.weight) };
    });
  }

  /**
   * Per zone and hour in [from, to): observed temperature and the temperature forecast as known
   * at `asOf` (default now), each the weighted average of the zone's stations.
   */
  async zoneSeries(codes: readonly string[] | undefined, from?: Date, to?: Date, asOf?: Date): Promise<ZoneWeatherSeriesDto> {
    const now = Date.now();
    const known = asOf?.getTime() ?? now;
    const end = Math.ceil((to?.getTime() ?? now + 7 * 24 * HOUR_MS) / HOUR_MS) * HOUR_MS;
    const start = Math.floor((from?.getTime() ?? now - 48 * HOUR_MS) / HOUR_MS) * HOUR_MS;
    if (!(start < end)) throw new BadRequestException('from must be before to');
    if ((end - start) / HOUR_MS > MAX_WEATHER_HOURS) throw new BadRequestException(`The range may span at most ${MAX_WEATHER_HOURS} hours`);
    const zones = await this.zoneStationsFor(codes);
    const stationIds = [...new Set(zones.flatMap((z) => z.stationIds))];
    const [observed, forecasts] = await Promise.all([this.repository.observations(stationIds, start, end), this.repository.forecastsIssuedBy(stationIds, start, end, known)]);
    const observedBy = new Map(observed.map((o) => [vintageKey(o.stationId, o.hourStart), o.tempC]));
    const forecastBy = knownAt(forecasts, known);
    const count = (end - start) / HOUR_MS;
    const hours = Array.from({ length: count }, (_, i) => start + i * HOUR_MS);
    return {
      from: new Date(start).toISOString(),
      to: new Date(end).toISOString(),
      hours: hours.map((h) => new Date(h).toISOString()),
      asOf: new Date(known).toISOString(),
      zones: zones.map((z) => {
        let latest = 0;
        const forecastIssuedAt: (string | null)[] = [];
        const forecastC = hours.map((h) => {
          const values = z.stationIds.map((id) => forecastBy.get(vintageKey(id, h)));
          const temp = weightedTemperature(values.map((v) => v?.tempC), z.weights);
          const issued = temp === null ? 0 : Math.max(...values.map((v) => v!.issuedAt));
          latest = Math.max(latest, issued);
          forecastIssuedAt.push(temp === null ? null : new Date(issued).toISOString());
          return temp;
        });
        return {
          zone: z.zone,
          observedC: hours.map((h) => weightedTemperature(z.stationIds.map((id) => observedBy.get(vintageKey(id, h))), z.weights)),
          forecastC,
          forecastIssuedAt,
          latestIssuedAt: latest > 0 ? new Date(latest).toISOString() : null,
        };
      }),
    };
  }

  /**
   * A zone's temperature forecast error per day: for each span, the forecast as known at its
   * `asOf` against the observed temperature. Null when the zone has no stations (or is unknown).
   */
  async forecastErrors(zoneCode: string, spans: readonly { from: number; to: number; asOf: number }[]): Promise<(AccuracyTemperatureDto | null)[]> {
    if (spans.length === 0) return [];
    const [zone] = (await this.zoneStationsFor(undefined)).filter((z) => z.zone === zoneCode);
    if (!zone || zone.stationIds.length === 0) return spans.map(() => null);
    const from = Math.min(...spans.map((s) => s.from));
    const to = Math.max(...spans.map((s) => s.to));
    const latest = Math.max(...spans.map((s) => s.asOf));
    const [observed, forecasts] = await Promise.all([this.repository.observations(zone.stationIds, from, to), this.repository.forecastsIssuedBy(zone.stationIds, from, to, latest)]);
    const observedBy = new Map(observed.map((o) => [vintageKey(o.stationId, o.hourStart), o.tempC]));
    return spans.map((span) => {
      const known = knownAt(forecasts, span.asOf);
      const hours: number[] = [];
      for (let h = span.from; h < span.to; h += HOUR_MS) hours.push(h);
      const score = temperatureScore(
        hours.map((h) => weightedTemperature(zone.stationIds.map((id) => observedBy.get(vintageKey(id, h))), zone.weights)),
        hours.map((h) => weightedTemperature(zone.stationIds.map((id) => known.get(vintageKey(id, h))?.tempC), zone.weights)),
      );
      return { asOf: new Date(span.asOf).toISOString(), ...score };
    });
  }

  /** Per station: latest observed hour and latest forecast, and whether either has gone quiet. */
  async status(now = Date.now()): Promise<WeatherStatusDto[]> {
    const [stations, weights, latest] = await Promise.all([this.repository.stations(), this.repository.weights(), this.repository.latest()]);
    return stations.map((s) => {
      const last = latest.get(s.id);
      const observedHour = last?.lastObservedHour ?? null;
      const issuedAt = last?.lastIssuedAt ?? null;
      return {
        station: s.code,
        zones: weights.filter((w) => w.station.id === s.id).map((w) => w.zone.code),
        lastObservedHour: observedHour === null ? null : new Date(observedHour).toISOString(),
        lastIssuedAt: issuedAt === null ? null : new Date(issuedAt).toISOString(),
        observedStale: observedHour === null || now - (observedHour + HOUR_MS) > OBSERVED_STALE_AFTER_HOURS * HOUR_MS,
        forecastStale: issuedAt === null || now - issuedAt > this.forecastStaleHours * HOUR_MS,
        forecastStaleAfterHours: this.forecastStaleHours,
      };
    });
  }

  async stationByCode(code: string): Promise<WeatherStation> {
    const station = await this.repository.stationByCode(code);
    if (!station) throw new BadRequestException(`No weather station with code ${code}`);
    return station;
  }
}

export function toStationDto(s: WeatherStation, zones: { zone: string; weight: number }[]): WeatherStationDto {
  return { id: s.id, code: s.code, name: s.name, timeZone: s.timeZone, latitude: s.latitude, longitude: s.longitude, elevationM: s.elevationM, zones };
}
