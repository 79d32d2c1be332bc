import { Entity, Enum, ManyToOne, PrimaryKey, Property } from '@mikro-orm/core';
import { HANDOVER_ITEM_KINDS, HANDOVER_ITEM_STATUSES, type HandoverItemKind, type HandoverItemStatus } from '@morrowline/shared';
import { HandoverNote } from './handover-note.entity';

/** One structured line of a note. An open item is offered again in the next note until closed. */
@Entity({ tableName: 'handover_items' })
export class HandoverItem {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @ManyToOne({ entity: () => HandoverNote })
  note!: HandoverNote;

  @Enum({ items: [...HANDOVER_ITEM_KINDS], type: 'string', length: 32 })
  kind!: HandoverItemKind;

  @Property({ type: 'string', length: 32, nullable: true })
  zoneCode: string | null = null;

  @Property({ type: 'text' })
  text!: string;

  @Enum({ items: [...HANDOVER_ITEM_STATUSES], type: 'string', length: 16 })
  status!: HandoverItemStatus;

  @Property({ type: 'integer', nullable: true })
  carriedFromItemId: number | null = null;
}
