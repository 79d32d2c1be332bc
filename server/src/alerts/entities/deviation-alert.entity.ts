import { Entity, Enum, Index, ManyToOne, PrimaryKey, Property } from '@mikro-orm/core';
import type { AlertState, CommittedBasis } from '@morrowline/shared';
import { Zone } from '../../zones/entities/zone.entity';

/**
 * Actual load off what was committed (published schedule, else day-ahead forecast) by more than
 * the zone's threshold for at least its number of consecutive hours. A later deviating hour right
 * after the window extends it.
 */
@Entity({ tableName: 'deviation_alerts' })
@Index({ properties: ['zone', 'start'] })
@Index({ properties: ['state'] })
export class DeviationAlert {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @ManyToOne(() => Zone, { deleteRule: 'restrict' })
  zone!: Zone;

  /** First deviating hour start (UTC). */
  @Property({ type: 'datetime', length: 0 })
  start!: Date;

  /** End of the last deviating hour (UTC, exclusive). */
  @Property({ type: 'datetime', length: 0 })
  end!: Date;

  /** Signed percent of the committed MW with the largest magnitude in the window. */
  @Property({ type: 'double' })
  peakDeviationPct!: number;

  /** What the peak hour was measured against (null on alerts raised before this was kept). */
  @Property({ type: 'string', length: 16, nullable: true })
  comparedWith: CommittedBasis | null = null;

  /** The committed MW of the peak hour. */
  @Property({ type: 'double', nullable: true })
  committedMw: number | null = null;

  /** The zone's settings when the alert was raised. */
  @Property({ type: 'double' })
  thresholdPct!: number;

  @Property({ type: 'integer' })
  consecutiveHours!: number;

  @Enum({ items: ['open', 'acknowledged'], type: 'string', length: 16 })
  state: AlertState = 'open';

  @Property({ type: 'datetime', length: 3 })
  raisedAt: Date = new Date();

  @Property({ type: 'datetime', length: 3, nullable: true })
  acknowledgedAt: Date | null = null;

  @Property({ type: 'integer', nullable: true })
  acknowledgedById: number | null = null;

  @Property({ type: 'string', length: 254, nullable: true })
  acknowledgedByEmail: string | null = null;

  /** The acknowledger's name at the time, for the alert history. */
  @Property({ type: 'string', length: 120, nullable: true })
  acknowledgedByName: string | null = null;

  @Property({ type: 'text', nullable: true })
  comment: string | null = null;
}
