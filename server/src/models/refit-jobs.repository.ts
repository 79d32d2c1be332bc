import { EntityManager, LockMode, type RequiredEntityData } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { RefitJobState } from '@morrowline/shared';
import { RefitJob } from './entities/refit-job.entity';

/** Refit jobs. Methods with a `tx` read and write inside the caller's transaction. */
@Injectable()
export class RefitJobsRepository {
  constructor(private readonly em: EntityManager) {}

  /** A fresh unit of work for a transaction the caller runs. */
  fork(): EntityManager {
    return this.em.fork();
  }

  /** Jobs left queued or running, with their zones. */
  async unfinished(tx: EntityManager): Promise<RefitJob[]> {
    return tx.find(RefitJob, { state: { $in: ['queued', 'running'] } }, { populate: ['zone'] });
  }

  /** The zone's job that is queued or running; null when there is none. */
  async activeFor(zoneId: number): Promise<RefitJob | null> {
    return this.em.fork().findOne(RefitJob, { activeZoneId: zoneId }, { populate: ['zone'] });
  }

  async byId(id: number): Promise<RefitJob | null> {
    return this.em.fork().findOne(RefitJob, { id }, { populate: ['zone'] });
  }

  /** Newest first, filtered by state and zone code. */
  async list(state: RefitJobState | undefined, zoneCode: string | undefined, limit: number): Promise<RefitJob[]> {
    const where: Record<string, unknown> = {};
    if (state) where.state = state;
    if (zoneCode) where.zone = { code: zoneCode };
    return this.em.fork().find(RefitJob, where, { populate: ['zone'], orderBy: { id: 'desc' }, limit });
  }

  /** Moves a job that is still queued or running on (progress, stage, state); a finished one is left alone. */
  async progress(id: number, fields: Partial<RefitJob>): Promise<void> {
    await this.em.fork().nativeUpdate(RefitJob, { id, state: { $in: ['queued', 'running'] } }, fields);
  }

  async lock(tx: EntityManager, id: number): Promise<RefitJob | null> {
    return tx.findOne(RefitJob, { id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  }

  async lockOrFail(tx: EntityManager, id: number): Promise<RefitJob> {
    return tx.findOneOrFail(RefitJob, { id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  }

  /** A new job in the transaction's unit of work (written on the caller's flush). */
  add(tx: EntityManager, data: RequiredEntityData<RefitJob>): RefitJob {
    return tx.create(RefitJob, data);
  }
}
