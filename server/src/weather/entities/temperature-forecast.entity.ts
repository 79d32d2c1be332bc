import { Entity, Index, ManyToOne, PrimaryKey, Property, Unique } from '@mikro-orm/core';
import { WeatherStation } from './weather-station.entity';

/**
 * One value of a temperature forecast vintage: station, issue time, hour, member. Insert only:
 * a vintage is never overwritten (a resend of the same value is a repeat, a different value for
 * the same key is refused), so any past forecast can be rebuilt from what was known when it was
 * made.
 */
@Entity({ tableName: 'temperature_forecasts' })
@Unique({ name: 'temperature_forecasts_vintage_unique', properties: ['station', 'issuedAt', 'hourStart', 'member'] })
@Index({ name: 'temperature_forecasts_hour_index', properties: ['station', 'hourStart', 'issuedAt'] })
export class TemperatureForecast {
  @PrimaryKey({ type: 'bigint', autoincrement: true })
  id!: string;

  @ManyToOne(() => WeatherStation, { deleteRule: 'restrict' })
  station!: WeatherStation;

  @Property({ type: 'datetime', length: 3 })
  issuedAt!: Date;

  @Property({ type: 'datetime', length: 0 })
  hourStart!: Date;

  /** Ensemble member or quantile label; '' for the central (deterministic) forecast. */
  @Property({ type: 'string', length: 16, default: '' })
  member: string = '';

  @Property({ type: 'double' })
  tempC!: number;

  @Property({ type: 'string', length: 160 })
  source!: string;

  @Property({ type: 'datetime', length: 3 })
  receivedAt: Date = new Date();
}
