import { Collection, Entity, Index, ManyToOne, OneToMany, PrimaryKey, Property } from '@mikro-orm/core';
import { User } from '../../users/entities/user.entity';
import { HandoverItem } from './handover-item.entity';

/** A handover note: what the outgoing shift tells the incoming one. Not edited once handed over. */
@Entity({ tableName: 'handover_notes' })
export class HandoverNote {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @Index()
  @Property({ type: 'datetime', length: 3 })
  shiftStart!: Date;

  @Property({ type: 'datetime', length: 3 })
  shiftEnd!: Date;

  @Property({ type: 'string', length: 80 })
  shiftLabel!: string;

  @ManyToOne({ entity: () => User })
  author!: User;

  /** Free text; simple formatting (paragraphs, "- " lists, **bold**) is rendered by the client. */
  @Property({ type: 'text' })
  body!: string;

  @OneToMany({ entity: () => HandoverItem, mappedBy: 'note', orderBy: { id: 'asc' } })
  items = new Collection<HandoverItem>(this);

  @Index()
  @Property({ type: 'datetime', length: 3 })
  createdAt: Date = new Date();

  @ManyToOne({ entity: () => User, nullable: true })
  acknowledgedBy: User | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  acknowledgedAt: Date | null = null;

  @Property({ type: 'text', nullable: true })
  reply: string | null = null;
}
