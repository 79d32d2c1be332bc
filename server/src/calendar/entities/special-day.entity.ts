import { Collection, Entity, Enum, ManyToMany, PrimaryKey, Property, Unique } from '@mikro-orm/core';
import { SPECIAL_DAY_KINDS, type SpecialDayKind } from '@morrowline/shared';
import { Zone } from '../../zones/entities/zone.entity';

/** A day that runs unlike its weekday: a public holiday, a bridge day or a local event. */
@Entity({ tableName: 'special_days' })
@Unique({ name: 'special_days_day_name_unique', properties: ['day', 'name'] })
export class SpecialDay {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  /** Local calendar day, YYYY-MM-DD (a DATE column, read back as text). */
  @Property({ type: 'date' })
  day!: string;

  @Property({ type: 'string', length: 120 })
  name!: string;

  @Enum({ items: [...SPECIAL_DAY_KINDS], type: 'string', length: 16 })
  kind!: SpecialDayKind;

  /** The zones it applies to; none for every zone. */
  @ManyToMany(() => Zone, undefined, { pivotTable: 'special_day_zones', joinColumn: 'special_day_id', inverseJoinColumn: 'zone_id' })
  zones = new Collection<Zone>(this);

  @Property({ type: 'datetime', length: 3 })
  createdAt: Date = new Date();

  @Property({ type: 'datetime', length: 3 })
  updatedAt: Date = new Date();
}
