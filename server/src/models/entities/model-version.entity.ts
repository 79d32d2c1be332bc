import { Entity, Enum, Index, ManyToOne, PrimaryKey, Property } from '@mikro-orm/core';
import { MODEL_STATUSES, REFIT_TRIGGERS, type LjungBoxDto, type ModelCoefficientDto, type ModelStatus, type RefitTrigger } from '@morrowline/shared';
import { Zone } from '../../zones/entities/zone.entity';
import type { StoredModel, StoredWeather } from '../stored-model';

/**
 * One fit of a zone's model, kept for good: what was fitted, on which hours, how well it did and
 * whether it is in service. At most one version per zone is in service (ModelsService keeps it so
 * inside its transactions).
 */
@Entity({ tableName: 'model_versions' })
@Index({ properties: ['zone', 'status'] })
export class ModelVersion {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @ManyToOne(() => Zone, { deleteRule: 'restrict' })
  zone!: Zone;

  @Enum({ items: [...MODEL_STATUSES], type: 'string', length: 16 })
  status: ModelStatus = 'candidate';

  @Enum({ items: [...REFIT_TRIGGERS], type: 'string', length: 16 })
  trigger!: RefitTrigger;

  /** Differencing lags, e.g. [168] or [24, 168]. */
  @Property({ type: 'json' })
  differencing!: number[];

  @Property({ type: 'string', length: 64 })
  differencingLabel!: string;

  @Property({ type: 'integer' })
  p!: number;

  @Property({ type: 'integer' })
  q!: number;

  @Property({ type: 'json' })
  coefficients!: ModelCoefficientDto[];

  /** Natural parameters for forecasting with the coefficients held. */
  @Property({ type: 'json' })
  parameters!: StoredModel;

  @Property({ type: 'double' })
  sigma2!: number;

  @Property({ type: 'double' })
  loglik!: number;

  @Property({ type: 'double' })
  aic!: number;

  @Property({ type: 'double' })
  aicc!: number;

  @Property({ type: 'double' })
  bic!: number;

  @Property({ type: 'json' })
  ljungBox!: LjungBoxDto[];

  /** Residual ACF at lags 1..48, its band, lags outside it, largest magnitude. */
  @Property({ type: 'json' })
  residualAcf!: { lags: number[]; band: number; outside: number; maxAbs: number };

  @Property({ type: 'datetime', length: 0 })
  trainingFrom!: Date;

  /** End of the training window (exclusive). */
  @Property({ type: 'datetime', length: 0 })
  trainingTo!: Date;

  @Property({ type: 'integer' })
  trainingHours!: number;

  @Property({ type: 'integer' })
  excludedHours!: number;

  @Property({ type: 'integer' })
  backtestDays!: number;

  @Property({ type: 'double', nullable: true })
  backtestMape: number | null = null;

  @Property({ type: 'double', nullable: true })
  baselineMape: number | null = null;

  /** Share (0..1) of the backtest's hours inside the 80 % band. */
  @Property({ type: 'double', nullable: true })
  backtestCoverage80: number | null = null;

  /** Share (0..1) of the backtest's hours inside the 95 % band. */
  @Property({ type: 'double', nullable: true })
  backtestCoverage95: number | null = null;

  @Property({ type: 'json' })
  warnings: string[] = [];

  @Property({ type: 'string', length: 254, nullable: true })
  createdByEmail: string | null = null;

  @Property({ type: 'datetime', length: 3 })
  createdAt: Date = new Date();

  @Property({ type: 'integer' })
  durationMs!: number;

  @Property({ type: 'integer', nullable: true })
  jobId: number | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  promotedAt: Date | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  retiredAt: Date | null = null;

  /** Weather and calendar terms the refit tried (null: no observed temperature for the zone then). */
  @Property({ type: 'json', nullable: true })
  weather: StoredWeather | null = null;
}
