import { Entity, ManyToOne, PrimaryKey, PrimaryKeyProp, Property } from '@mikro-orm/core';
import { WeatherStation } from './weather-station.entity';

/**
 * Observed temperature of a station for one hour (°C): one row per (station, UTC hour start), the
 * value with the highest version (the readings' ordering rule). Written by WeatherRepository's
 * upsert (raw SQL).
 */
@Entity({ tableName: 'temperature_observations' })
export class TemperatureObservation {
  [PrimaryKeyProp]?: ['station', 'hourStart'];

  @ManyToOne(() => WeatherStation, { primary: true, deleteRule: 'restrict' })
  station!: WeatherStation;

  @PrimaryKey({ type: 'datetime', length: 0 })
  hourStart!: Date;

  @Property({ type: 'double' })
  tempC!: number;

  @Property({ type: 'string', length: 160 })
  source!: string;

  @Property({ type: 'datetime', length: 3 })
  receivedAt: Date = new Date();

  @Property({ type: 'bigint', unsigned: true, default: 0 })
  version: string = '0';
}
