import { Entity, Enum, Index, ManyToOne, PrimaryKey, Property } from '@mikro-orm/core';
import type { AlertState } from '@morrowline/shared';
import { Zone } from '../../zones/entities/zone.entity';

/**
 * Actual load off the forecast by more than the zone's threshold for at least its number of
 * consecutive hours. A later deviating hour right after the window extends it.
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

  /** Signed percent of forecast with the largest magnitude in the window. */
  @Property({ type: 'double' })
  peakDeviationPct!: number;

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

  @Property({ type: 'text', nullable: true })
  comment: string | null = null;
}
