import { Entity, Enum, Index, ManyToOne, PrimaryKey, Property } from '@mikro-orm/core';
import { REFIT_JOB_STATES, REFIT_TRIGGERS, type RefitJobState, type RefitTrigger } from '@morrowline/shared';
import { Zone } from '../../zones/entities/zone.entity';

/**
 * A refit of one zone, stored before it runs (queued) and moved through running to done or
 * failed. `activeZoneId` holds the zone's id while the job is queued or running and is null
 * after: its unique index is what keeps a zone from ever having two jobs at once, even across
 * concurrent requests.
 */
@Entity({ tableName: 'refit_jobs' })
@Index({ properties: ['state'] })
@Index({ properties: ['createdAt'] })
export class RefitJob {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @ManyToOne(() => Zone, { deleteRule: 'restrict' })
  zone!: Zone;

  @Property({ type: 'integer', unsigned: true, nullable: true, unique: true })
  activeZoneId: number | null = null;

  @Enum({ items: [...REFIT_TRIGGERS], type: 'string', length: 16 })
  trigger!: RefitTrigger;

  @Enum({ items: ['full', 'update'], type: 'string', length: 8 })
  mode!: 'full' | 'update';

  @Property({ type: 'text', nullable: true })
  reason: string | null = null;

  @Enum({ items: [...REFIT_JOB_STATES], type: 'string', length: 16 })
  state: RefitJobState = 'queued';

  @Property({ type: 'integer' })
  progress: number = 0;

  @Property({ type: 'string', length: 120 })
  stage: string = 'waiting for a worker';

  @Property({ type: 'text', nullable: true })
  message: string | null = null;

  @Property({ type: 'integer', nullable: true })
  requestedById: number | null = null;

  @Property({ type: 'string', length: 254, nullable: true })
  requestedByEmail: string | null = null;

  @Property({ type: 'datetime', length: 3 })
  createdAt: Date = new Date();

  @Property({ type: 'datetime', length: 3, nullable: true })
  startedAt: Date | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  finishedAt: Date | null = null;

  @Property({ type: 'integer', nullable: true })
  modelVersionId: number | null = null;

  @Property({ type: 'integer', nullable: true })
  forecastRunId: number | null = null;

  @Property({ type: 'boolean' })
  promoted: boolean = false;
}
