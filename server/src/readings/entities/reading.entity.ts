import { Entity, Enum, ManyToOne, PrimaryKey, PrimaryKeyProp, Property } from '@mikro-orm/core';
import type { ReadingQuality } from '@morrowline/shared';
import { Zone } from '../../zones/entities/zone.entity';

export const READING_QUALITIES = ['good', 'estimated', 'suspect'] as const;

/**
 * The stored hourly load of a zone: one row per (zone, UTC hour start), the latest value sent.
 * Earlier values that were replaced live in ReadingRevision. Written by ReadingsService's
 * batched upsert (raw SQL), read through the ORM or raw SQL.
 */
@Entity({ tableName: 'readings' })
export class Reading {
  [PrimaryKeyProp]?: ['zone', 'hourStart'];

  @ManyToOne(() => Zone, { primary: true, deleteRule: 'restrict', updateRule: 'cascade' })
  zone!: Zone;

  /** Start of the hour, UTC. */
  @PrimaryKey({ type: 'datetime', length: 0 })
  hourStart!: Date;

  /** Average load over the hour in MW (= MWh for the hour). */
  @Property({ type: 'double' })
  mw!: number;

  @Enum({ items: [...READING_QUALITIES], type: 'string', length: 16 })
  quality: ReadingQuality = 'good';

  /** Where it came from: "feed:<key name>" or "csv:<user e-mail>". */
  @Property({ type: 'string', length: 160 })
  source!: string;

  @Property({ type: 'datetime', length: 3 })
  receivedAt: Date = new Date();

  /**
   * What orders values of this hour: microseconds since the epoch when the value was produced
   * (see FeedReading.version). A value is applied only over a lower version. 0 for rows stored
   * before versions existed. A string: bigint columns can exceed a double's exact range.
   */
  @Property({ type: 'bigint', unsigned: true, default: 0 })
  version: string = '0';
}
