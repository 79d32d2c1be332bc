import { EntityManager, LockMode, type FilterQuery, type RequiredEntityData } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { AlertState } from '@morrowline/shared';
import { DeviationAlert } from './entities/deviation-alert.entity';

/**
 * Deviation alerts. Methods that take part in a workflow's transaction take it (`tx`); the
 * service owns the transaction and its audit entry.
 */
@Injectable()
export class AlertsRepository {
  constructor(private readonly em: EntityManager) {}

  /** Runs `work` in a transaction of its own. */
  transaction<T>(work: (tx: EntityManager) => Promise<T>): Promise<T> {
    return this.em.fork().transactional(work);
  }

  /** The zone's newest alert whose window touches [start, end], if any. */
  async touching(tx: EntityManager, zoneId: number, start: Date, end: Date): Promise<DeviationAlert | null> {
    return tx.findOne(DeviationAlert, { zone: zoneId, start: { $lte: end }, end: { $gte: start } }, { populate: ['zone'], orderBy: { start: 'desc' } });
  }

  /** A new alert, written at once so that it has its id for the audit entry. */
  async add(tx: EntityManager, data: RequiredEntityData<DeviationAlert>): Promise<DeviationAlert> {
    const alert = tx.create(DeviationAlert, data);
    await tx.flush();
    return alert;
  }

  /** An alert locked until the transaction ends, with its zone. */
  async lock(tx: EntityManager, id: number): Promise<DeviationAlert | null> {
    const alert = await tx.findOne(DeviationAlert, { id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (alert) await tx.populate(alert, ['zone']);
    return alert;
  }

  /**
   * Alerts, in the state asked for (every state when none), of one zone or all. Open ones by
   * their hours, newest first; acknowledged ones (the history) by when they were acknowledged.
   */
  async list(state: AlertState | undefined, zone: string | undefined, limit: number): Promise<DeviationAlert[]> {
    const where: FilterQuery<DeviationAlert> = {};
    if (state) where.state = state;
    if (zone) where.zone = { code: zone };
    const orderBy = state === 'acknowledged' ? { acknowledgedAt: 'desc', id: 'desc' } as const : { start: 'desc', id: 'desc' } as const;
    return this.em.fork().find(DeviationAlert, where, { populate: ['zone'], orderBy, limit });
  }
}
