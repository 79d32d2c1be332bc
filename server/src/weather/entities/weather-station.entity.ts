import { Entity, PrimaryKey, Property } from '@mikro-orm/core';

/** A weather station whose temperatures the desk stores; zones take their temperature from one or several. */
@Entity({ tableName: 'weather_stations' })
export class WeatherStation {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  /** Same rule as a zone code (shared/src/zone-code.ts); feeds and CSV files name the station by it. */
  @Property({ type: 'string', length: 32, unique: true })
  code!: string;

  @Property({ type: 'string', length: 120 })
  name!: string;

  /** IANA time zone of the station's site. */
  @Property({ type: 'string', length: 64 })
  timeZone!: string;

  @Property({ type: 'double', nullable: true })
  latitude: number | null = null;

  @Property({ type: 'double', nullable: true })
  longitude: number | null = null;

  @Property({ type: 'double', nullable: true })
  elevationM: number | null = null;

  @Property({ type: 'datetime', length: 3 })
  createdAt: Date = new Date();
}
