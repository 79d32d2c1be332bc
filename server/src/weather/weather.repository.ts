import { EntityManager, type Knex } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { VersionClock } from '@morrowline/shared';
import { fromSqlDateTime, sqlDateTime } from '../readings/readings.repository';
import { WeatherStation } from './entities/weather-station.entity';
import { ZoneStationWeight } from './entities/zone-station-weight.entity';
import type { VintageValue } from './vintages';
import type { ValidForecast, ValidObservation } from './weather-validation';

const CHUNK = 1000;
const DEADLOCK_ERRNOS = new Set([1213, 1205]);

export type VersionedObservation = ValidObservation & { version?: number | null };

export interface ObservationRow {
  stationId: number;
  hourStart: number;
  tempC: number;
}

export interface ForecastRow {
  stationId: number;
  issuedAt: number;
  hourStart: number;
  member: string;
  tempC: number;
}

export interface ForecastStoreOutcome {
  /** Values accepted: new ones and repeats of a stored value. */
  stored: number;
  /** Indexes (into the values passed) of values refused because a different value holds the key. */
  conflicts: { index: number; storedTempC: number }[];
}

function sqlDateTime3(ms: number): string {
  return new Date(ms).toISOString().slice(0, 23).replace('T', ' ');
}

function unwrap<T>(result: unknown): T[] {
  if (Array.isArray(result) && Array.isArray(result[0])) return result[0] as T[];
  if (Array.isArray(result)) return result as T[];
  return [];
}

/**
 * Weather stations, zone weights, observed temperature and temperature forecast vintages.
 *
 * Writes are applied strictly in the order store calls are made (one chain), each call in one
 * transaction, whole or not at all, and resolve only after the commit: the ack a feed gets means
 * the values are on disk. Observations follow the readings' rule (the highest version of a
 * (station, hour) is kept, a value without a version is the latest when stored); forecast vintages
 * are insert-only.
 */
@Injectable()
export class WeatherRepository {
  private chain: Promise<unknown> = Promise.resolve();
  private readonly clock = new VersionClock();

  constructor(private readonly em: EntityManager) {}

  fork(): EntityManager {
    return this.em.fork();
  }

  stations(em: EntityManager = this.em.fork()): Promise<WeatherStation[]> {
    return em.find(WeatherStation, {}, { orderBy: { code: 'asc' } });
  }

  stationByCode(code: string, em: EntityManager = this.em.fork()): Promise<WeatherStation | null> {
    return em.findOne(WeatherStation, { code });
  }

  weights(em: EntityManager = this.em.fork()): Promise<ZoneStationWeight[]> {
    return em.find(ZoneStationWeight, {}, { populate: ['zone', 'station'], orderBy: { zone: { code: 'asc' }, station: { code: 'asc' } } });
  }

  /** Replaces a zone's weights in the caller's transaction. */
  async replaceWeights(tx: EntityManager, zoneId: number, weights: { station: WeatherStation; weight: number }[]): Promise<void> {
    await tx.nativeDelete(ZoneStationWeight, { zone: zoneId });
    for (const w of weights) tx.create(ZoneStationWeight, { zone: zoneId, station: w.station, weight: w.weight });
    await tx.flush();
  }

  /** Runs `work` after every write queued before it (the order of calls is the order of application). */
  private inOrder<T>(work: () => Promise<T>): Promise<T> {
    const next = this.chain.then(() => this.withDeadlockRetry(work));
    this.chain = next.catch(() => undefined);
    return next;
  }

  private async withDeadlockRetry<T>(work: () => Promise<T>): Promise<T> {
    for (let attempt = 1; ; attempt++) {
      try {
        return await work();
      } catch (error) {
        const errno = (error as { errno?: number }).errno;
        if (attempt >= 5 || errno === undefined || !DEADLOCK_ERRNOS.has(errno)) throw error;
        await new Promise((resolve) => setTimeout(resolve, 20 * attempt));
      }
    }
  }

  /** Stores observed temperatures, all or none; the upsert applies a value only over a lower version. */
  storeObservations(values: readonly VersionedObservation[], source: string): Promise<{ stored: number; changed: ObservationRow[] }> {
    return this.inOrder(() => this.em.getKnex().transaction((trx) => this.writeObservations(trx, values, source)));
  }

  /**
   * A feed's weather batch: its observations and its forecast values in one transaction, so the
   * batch is stored whole or not at all.
   */
  storeBatch(observations: readonly VersionedObservation[], forecasts: readonly ValidForecast[], source: string): Promise<{ observed: number; forecast: ForecastStoreOutcome }> {
    return this.inOrder(() =>
      this.em.getKnex().transaction(async (trx) => {
        const observed = observations.length > 0 ? (await this.writeObservations(trx, observations, source)).stored : 0;
        const forecast = forecasts.length > 0 ? await this.writeForecasts(trx, forecasts, source) : { stored: 0, conflicts: [] };
        return { observed, forecast };
      }),
    );
  }

  private async writeObservations(trx: Knex.Transaction, values: readonly VersionedObservation[], source: string): Promise<{ stored: number; changed: ObservationRow[] }> {
    const now = Date.now();
    const current = await this.lockObservations(trx, values);
    const finals = new Map<string, { value: VersionedObservation; version: number }>();
    const changed = new Map<string, ObservationRow>();
    for (const v of values) {
      const key = `${v.stationId}|${v.hourStart}`;
      const before = current.get(key);
      // No version: the latest value at the moment it is stored (CSV uploads, unversioned feeds).
      const version = v.version ?? this.clock.nextAbove(before?.version ?? 0);
      if (before && version <= before.version) continue;
      current.set(key, { tempC: v.tempC, version });
      finals.set(key, { value: v, version });
      if (!before || before.tempC !== v.tempC) changed.set(key, { stationId: v.stationId, hourStart: v.hourStart, tempC: v.tempC });
    }
    const rows = [...finals.values()];
    for (let i = 0; i < rows.length; i += CHUNK) {
      const part = rows.slice(i, i + CHUNK);
      await trx.raw(
        `insert into temperature_observations (station_id, hour_start, temp_c, source, received_at, version) values ${part.map(() => '(?,?,?,?,?,?)').join(',')}
         on duplicate key update
           temp_c = if(values(version) > version, values(temp_c), temp_c),
           source = if(values(version) > version, values(source), source),
           received_at = if(values(version) > version, values(received_at), received_at),
           version = greatest(version, values(version))`,
        part.flatMap(({ value, version }) => [value.stationId, sqlDateTime(value.hourStart), value.tempC, source, sqlDateTime3(now), String(version)]),
      );
    }
    return { stored: values.length, changed: [...changed.values()] };
  }

  private async lockObservations(trx: Knex.Transaction, values: readonly VersionedObservation[]): Promise<Map<string, { tempC: number; version: number }>> {
    const byStation = new Map<number, number[]>();
    for (const v of values) (byStation.get(v.stationId) ?? byStation.set(v.stationId, []).get(v.stationId)!).push(v.hourStart);
    const current = new Map<string, { tempC: number; version: number }>();
    for (const [stationId, hours] of byStation) {
      const first = Math.min(...hours);
      const last = Math.max(...hours);
      const rows = unwrap<{ hour_start: unknown; temp_c: number; version: unknown }>(
        await trx.raw('select hour_start, temp_c, version from temperature_observations where station_id = ? and hour_start between ? and ? for update', [stationId, sqlDateTime(first), sqlDateTime(last)]),
      );
      for (const row of rows) current.set(`${stationId}|${fromSqlDateTime(row.hour_start)}`, { tempC: Number(row.temp_c), version: Number(row.version) });
    }
    return current;
  }

  /**
   * Stores forecast values, all or none. A value whose key (station, issue time, hour, member) is
   * stored already is a repeat when the temperature is the same, and a conflict otherwise: a
   * vintage is never overwritten, so a conflict is reported and the stored value stays.
   */
  storeForecasts(values: readonly ValidForecast[], source: string): Promise<ForecastStoreOutcome> {
    return this.inOrder(() => this.em.getKnex().transaction((trx) => this.writeForecasts(trx, values, source)));
  }

  private async writeForecasts(trx: Knex.Transaction, values: readonly ValidForecast[], source: string): Promise<ForecastStoreOutcome> {
    const now = Date.now();
    const stored = new Map<string, number>();
    const vintages = new Map<string, { stationId: number; issuedAt: number }>();
    for (const v of values) vintages.set(`${v.stationId}|${v.issuedAt}`, { stationId: v.stationId, issuedAt: v.issuedAt });
    for (const { stationId, issuedAt } of vintages.values()) {
      const rows = unwrap<{ hour_start: unknown; member: string; temp_c: number }>(
        await trx.raw('select hour_start, member, temp_c from temperature_forecasts where station_id = ? and issued_at = ? for update', [stationId, sqlDateTime3(issuedAt)]),
      );
      for (const row of rows) stored.set(`${stationId}|${issuedAt}|${fromSqlDateTime(row.hour_start)}|${row.member}`, Number(row.temp_c));
    }
    const conflicts: ForecastStoreOutcome['conflicts'] = [];
    const inserts: ValidForecast[] = [];
    values.forEach((v, index) => {
      const key = `${v.stationId}|${v.issuedAt}|${v.hourStart}|${v.member}`;
      const held = stored.get(key);
      if (held === undefined) {
        stored.set(key, v.tempC);
        inserts.push(v);
      } else if (held !== v.tempC) {
        conflicts.push({ index, storedTempC: held });
      }
    });
    for (let i = 0; i < inserts.length; i += CHUNK) {
      const part = inserts.slice(i, i + CHUNK);
      await trx.raw(
        `insert into temperature_forecasts (station_id, issued_at, hour_start, member, temp_c, source, received_at) values ${part.map(() => '(?,?,?,?,?,?,?)').join(',')}`,
        part.flatMap((v) => [v.stationId, sqlDateTime3(v.issuedAt), sqlDateTime(v.hourStart), v.member, v.tempC, source, sqlDateTime3(now)]),
      );
    }
    return { stored: values.length - conflicts.length, conflicts };
  }

  /** Observed temperatures of some stations in [from, to). */
  async observations(stationIds: readonly number[], from: number, to: number): Promise<ObservationRow[]> {
    if (stationIds.length === 0) return [];
    const rows = unwrap<{ station_id: number; hour_start: unknown; temp_c: number }>(
      await this.em
        .getKnex()
        .raw(
          `select station_id, hour_start, temp_c from temperature_observations where station_id in (${stationIds.map(() => '?').join(',')}) and hour_start >= ? and hour_start < ? order by station_id, hour_start`,
          [...stationIds, sqlDateTime(from), sqlDateTime(to)],
        ),
    );
    return rows.map((r) => ({ stationId: r.station_id, hourStart: fromSqlDateTime(r.hour_start), tempC: Number(r.temp_c) }));
  }

  /**
   * Central forecast values of some stations for hours in [from, to) from vintages issued at or
   * before `asOf`: the query itself never reads a later vintage (and vintages.knownAt picks the
   * newest of these per hour).
   */
  async forecastsIssuedBy(stationIds: readonly number[], from: number, to: number, asOf: number): Promise<VintageValue[]> {
    if (stationIds.length === 0) return [];
    const rows = unwrap<{ station_id: number; hour_start: unknown; issued_at: unknown; temp_c: number }>(
      await this.em
        .getKnex()
        .raw(
          `select station_id, hour_start, issued_at, temp_c from temperature_forecasts
           where station_id in (${stationIds.map(() => '?').join(',')}) and hour_start >= ? and hour_start < ? and issued_at <= ? and member = ''`,
          [...stationIds, sqlDateTime(from), sqlDateTime(to), sqlDateTime3(asOf)],
        ),
    );
    return rows.map((r) => ({ stationId: r.station_id, hourStart: fromSqlDateTime(r.hour_start), issuedAt: fromSqlDateTime(r.issued_at), tempC: Number(r.temp_c) }));
  }

  /** Every value (all members) of vintages of a station issued in [from, to), for the download. */
  async forecastsIssuedBetween(stationId: number, from: number, to: number): Promise<ForecastRow[]> {
    const rows = unwrap<{ issued_at: unknown; hour_start: unknown; member: string; temp_c: number }>(
      await this.em
        .getKnex()
        .raw('select issued_at, hour_start, member, temp_c from temperature_forecasts where station_id = ? and issued_at >= ? and issued_at < ? order by issued_at, hour_start, member', [
          stationId,
          sqlDateTime3(from),
          sqlDateTime3(to),
        ]),
    );
    return rows.map((r) => ({ stationId, issuedAt: fromSqlDateTime(r.issued_at), hourStart: fromSqlDateTime(r.hour_start), member: r.member, tempC: Number(r.temp_c) }));
  }

  /** Per station: the latest observed hour and the latest issue time. */
  async latest(): Promise<Map<number, { lastObservedHour: number | null; lastIssuedAt: number | null }>> {
    const knex = this.em.getKnex();
    const observed = unwrap<{ station_id: number; last: unknown }>(await knex.raw('select station_id, max(hour_start) as last from temperature_observations group by station_id'));
    const issued = unwrap<{ station_id: number; last: unknown }>(await knex.raw('select station_id, max(issued_at) as last from temperature_forecasts group by station_id'));
    const out = new Map<number, { lastObservedHour: number | null; lastIssuedAt: number | null }>();
    for (const row of observed) out.set(row.station_id, { lastObservedHour: fromSqlDateTime(row.last), lastIssuedAt: null });
    for (const row of issued) out.set(row.station_id, { lastObservedHour: out.get(row.station_id)?.lastObservedHour ?? null, lastIssuedAt: fromSqlDateTime(row.last) });
    return out;
  }
}
