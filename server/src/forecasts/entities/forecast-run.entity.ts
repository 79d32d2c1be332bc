import { Entity, Enum, Index, ManyToOne, PrimaryKey, Property, type Opt } from '@mikro-orm/core';
import { FORECAST_ORIGINS, type ForecastMethod, type ForecastOrigin } from '@morrowline/shared';
import { Zone } from '../../zones/entities/zone.entity';

/**
 * One forecast a fit or update produced for a zone: consecutive hours from `firstHour`, the
 * means and bands as JSON arrays in one row. A run is written once, never changed, and always
 * read whole (at most a few dozen hours), so a child table of hourly rows would only add a
 * thousand-row insert per refit and a join per read.
 */
@Entity({ tableName: 'forecast_runs' })
@Index({ properties: ['zone', 'issuedAt'] })
export class ForecastRun {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @ManyToOne(() => Zone, { deleteRule: 'restrict' })
  zone!: Zone;

  @Property({ type: 'datetime', length: 3 })
  issuedAt: Date = new Date();

  /**
   * issued: the desk made it at issuedAt. replayed: made at the installation's first start as the
   * desk would have issued it at issuedAt (src/replay); never served as the live forecast.
   */
  @Enum({ items: [...FORECAST_ORIGINS], type: 'string', length: 16, default: 'issued' })
  origin: Opt<ForecastOrigin> = 'issued';

  /** The last reading hour (UTC start) the run used. */
  @Property({ type: 'datetime', length: 0, nullable: true })
  basedOnHour: Date | null = null;

  @Enum({ items: ['arima', 'seasonal-naive'], type: 'string', length: 16 })
  method!: ForecastMethod;

  @Property({ type: 'text', nullable: true })
  fallbackReason: string | null = null;

  @Property({ type: 'integer', nullable: true })
  modelVersionId: number | null = null;

  /** UTC start of the first forecast hour; element i is the hour firstHour + i h. */
  @Property({ type: 'datetime', length: 0 })
  firstHour!: Date;

  @Property({ type: 'json' })
  mean!: number[];

  @Property({ type: 'json' })
  lower80!: number[];

  @Property({ type: 'json' })
  upper80!: number[];

  @Property({ type: 'json' })
  lower95!: number[];

  @Property({ type: 'json' })
  upper95!: number[];
}
