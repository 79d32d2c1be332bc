import { Entity, Enum, Index, PrimaryKey, Property, Unique } from '@mikro-orm/core';
import type { ReadingQuality } from '@morrowline/shared';
import { READING_QUALITIES } from './reading.entity';

/**
 * A value that a later reading for the same (zone, hour) replaced: kept so that history can be
 * explained. Written when a later version replaced a different value, and when a value arrived
 * after a later version was already stored (it never became the stored value).
 */
@Entity({ tableName: 'reading_revisions' })
@Index({ properties: ['zoneId', 'hourStart'] })
@Unique({ properties: ['zoneId', 'hourStart', 'version'] })
export class ReadingRevision {
  @PrimaryKey({ type: 'bigint', autoincrement: true })
  id!: string;

  @Property({ type: 'integer', unsigned: true })
  zoneId!: number;

  @Property({ type: 'datetime', length: 0 })
  hourStart!: Date;

  @Property({ type: 'double' })
  mw!: number;

  @Enum({ items: [...READING_QUALITIES], type: 'string', length: 16 })
  quality!: ReadingQuality;

  @Property({ type: 'string', length: 160 })
  source!: string;

  /** When the replaced value had arrived. */
  @Property({ type: 'datetime', length: 3 })
  receivedAt!: Date;

  /** When the later value replaced it. */
  @Property({ type: 'datetime', length: 3 })
  replacedAt!: Date;

  /** Source of the value that replaced it. */
  @Property({ type: 'string', length: 160 })
  replacedBy!: string;

  /** The replaced value's version (see Reading.version); null for revisions kept before versions existed. */
  @Property({ type: 'bigint', unsigned: true, nullable: true })
  version: string | null = null;
}
