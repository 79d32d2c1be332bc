import { Entity, Enum, Index, ManyToOne, PrimaryKey, Property, Unique, type Opt } from '@mikro-orm/core';
import { SCHEDULE_STATES, type ScheduleHourDto, type ScheduleMailOutcome, type ScheduleState } from '@morrowline/shared';
import { User } from '../../users/entities/user.entity';
import { Zone } from '../../zones/entities/zone.entity';

/**
 * One revision of a zone's day-ahead schedule for one operating day. The hours (23, 24 or 25) are
 * kept as JSON in the row: a revision is always read whole and, once published, never changed.
 * `workingKey` and `publishedKey` ("<zone id>:<day>") are set only while the revision is the
 * zone/day's working one or its published one, so the database itself allows one of each.
 */
@Entity({ tableName: 'schedule_revisions' })
@Unique({ properties: ['zone', 'operatingDay', 'revision'] })
@Index({ properties: ['operatingDay'] })
export class ScheduleRevision {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @ManyToOne(() => Zone, { deleteRule: 'restrict' })
  zone!: Zone;

  /** yyyy-MM-dd in the zone's time zone. */
  @Property({ type: 'string', length: 10 })
  operatingDay!: string;

  @Property({ type: 'integer' })
  revision!: number;

  @Enum({ items: [...SCHEDULE_STATES], type: 'string', length: 16 })
  state!: ScheduleState;

  @Property({ type: 'string', length: 48, nullable: true, unique: true })
  workingKey: string | null = null;

  @Property({ type: 'string', length: 48, nullable: true, unique: true })
  publishedKey: string | null = null;

  /** The stored forecast run the model values came from (null for the seasonal-naive stand-in). */
  @Property({ type: 'integer', nullable: true })
  forecastRunId: number | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  forecastIssuedAt: Date | null = null;

  /** The model values came from a replayed forecast run (ForecastRun.origin), not an issued one. */
  @Property({ type: 'boolean', default: false })
  forecastReplayed: Opt<boolean> = false;

  @Property({ type: 'json' })
  hours!: ScheduleHourDto[];

  @ManyToOne(() => User)
  createdBy!: User;

  @Property({ type: 'datetime', length: 3 })
  createdAt: Date = new Date();

  @ManyToOne(() => User, { nullable: true })
  submittedBy: User | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  submittedAt: Date | null = null;

  @Property({ type: 'text', nullable: true })
  submitComment: string | null = null;

  @Property({ type: 'boolean' })
  late: boolean = false;

  @ManyToOne(() => User, { nullable: true })
  returnedBy: User | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  returnedAt: Date | null = null;

  @Property({ type: 'text', nullable: true })
  returnComment: string | null = null;

  /** The approving supervisor: approval publishes. */
  @ManyToOne(() => User, { nullable: true })
  publishedBy: User | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  publishedAt: Date | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  supersededAt: Date | null = null;

  @Property({ type: 'text', nullable: true })
  correctionReason: string | null = null;

  @Property({ type: 'json', nullable: true })
  mailOutcome: ScheduleMailOutcome | null = null;
}
