import { Entity, Enum, Index, ManyToOne, PrimaryKey, Property } from '@mikro-orm/core';
import { SCHEDULE_ADJUSTMENT_KINDS, type ScheduleAdjustmentKind } from '@morrowline/shared';
import { User } from '../../users/entities/user.entity';
import { ScheduleRevision } from './schedule-revision.entity';

/** One adjustment of a revision, kept when undone (undoneAt set) so the history stays readable. */
@Entity({ tableName: 'schedule_adjustments' })
export class ScheduleAdjustment {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @ManyToOne(() => ScheduleRevision, { deleteRule: 'restrict' })
  revision!: ScheduleRevision;

  @Property({ type: 'string', length: 32 })
  zoneCode!: string;

  @Enum({ items: [...SCHEDULE_ADJUSTMENT_KINDS], type: 'string', length: 8 })
  kind!: ScheduleAdjustmentKind;

  /** Hour positions in the operating day, 0-based, inclusive. */
  @Property({ type: 'integer' })
  fromHour!: number;

  @Property({ type: 'integer' })
  toHour!: number;

  /** MW for set and add, percent for scale. */
  @Property({ type: 'double' })
  value!: number;

  @Property({ type: 'text' })
  reason!: string;

  @ManyToOne(() => User)
  by!: User;

  @Property({ type: 'datetime', length: 3 })
  at: Date = new Date();

  @Property({ type: 'datetime', length: 3, nullable: true })
  undoneAt: Date | null = null;

  @ManyToOne(() => User, { nullable: true })
  undoneBy: User | null = null;

  /** Set when a correction carried it forward: the revision it was first made on (its reason, author and time kept). */
  @Property({ type: 'integer', nullable: true })
  carriedFromRevision: number | null = null;

  /** Added together with others in one request (a weather what-if): the id of the batch's first adjustment; undone together. */
  @Index({ name: 'schedule_adjustments_batch_id_index' })
  @Property({ type: 'integer', unsigned: true, nullable: true })
  batchId: number | null = null;
}
