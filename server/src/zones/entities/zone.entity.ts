import { Entity, PrimaryKey, Property } from '@mikro-orm/core';

/** A load zone: the unit readings, models, forecasts and schedules belong to. */
@Entity({ tableName: 'zones' })
export class Zone {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @Property({ type: 'string', length: 32, unique: true })
  code!: string;

  @Property({ type: 'string', length: 120 })
  name!: string;

  /** IANA time zone; the operating day runs between its local midnights. */
  @Property({ type: 'string', length: 64 })
  timeZone!: string;

  @Property({ type: 'double' })
  alertThresholdPct: number = 5;

  @Property({ type: 'integer' })
  alertConsecutiveHours: number = 2;

  /** "HH:mm" local time on the day before the operating day. */
  @Property({ type: 'string', length: 5 })
  gateClosure: string = '10:00';

  @Property({ type: 'double' })
  minPlausibleMw: number = 0;

  @Property({ type: 'double' })
  maxPlausibleMw: number = 1000;

  @Property({ type: 'boolean' })
  active: boolean = true;

  @Property({ type: 'datetime', length: 3 })
  createdAt: Date = new Date();

  @Property({ type: 'datetime', length: 3, onUpdate: () => new Date() })
  updatedAt: Date = new Date();
}
