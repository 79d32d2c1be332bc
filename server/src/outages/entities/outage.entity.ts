import { Entity, Enum, Index, ManyToOne, PrimaryKey, Property } from '@mikro-orm/core';
import { OUTAGE_KINDS, type OutageKind } from '@morrowline/shared';
import { Zone } from '../../zones/entities/zone.entity';

/**
 * A window of a zone's hours that is not normal load (an outage, or bad meter data). Its hours
 * are excluded from training. Start and end are on the hour; an open window has no end yet.
 */
@Entity({ tableName: 'outages' })
@Index({ properties: ['zone', 'start'] })
export class Outage {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @ManyToOne(() => Zone, { deleteRule: 'restrict' })
  zone!: Zone;

  @Enum({ items: [...OUTAGE_KINDS], type: 'string', length: 16 })
  kind!: OutageKind;

  /** First excluded hour start (UTC). */
  @Property({ type: 'datetime', length: 0 })
  start!: Date;

  /** End, exclusive (UTC); null while still open. */
  @Property({ type: 'datetime', length: 0, nullable: true })
  end: Date | null = null;

  @Property({ type: 'text' })
  note!: string;

  @Property({ type: 'string', length: 254, nullable: true })
  createdByEmail: string | null = null;

  @Property({ type: 'datetime', length: 3 })
  createdAt: Date = new Date();

  @Property({ type: 'datetime', length: 3 })
  updatedAt: Date = new Date();

  @Property({ type: 'datetime', length: 3, nullable: true })
  closedAt: Date | null = null;

  @Property({ type: 'string', length: 254, nullable: true })
  closedByEmail: string | null = null;
}
