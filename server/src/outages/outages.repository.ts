import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { Zone } from '../zones/entities/zone.entity';
import { Outage } from './entities/outage.entity';

/** What a new window holds; the repository adds nothing of its own. */
export type NewOutage = Omit<Outage, 'id'>;

/**
 * Outage windows as the service reads and writes them. Methods take an optional EntityManager so
 * a caller inside a transaction (with its audit entry) works through it; otherwise each call uses
 * a fork of its own.
 */
@Injectable()
export class OutagesRepository {
  constructor(private readonly em: EntityManager) {}

  /** Runs `work` in one transaction, its EntityManager handed to every call made inside. */
  transaction<T>(work: (tx: EntityManager) => Promise<T>): Promise<T> {
    return this.em.fork().transactional(work);
  }

  /** Windows of a zone (or all zones) overlapping [from, to), newest first, at most `limit`. */
  async list(filter: { zone?: string; from?: Date; to?: Date }, limit: number, em: EntityManager = this.em.fork()): Promise<Outage[]> {
    const where: Record<string, unknown> = {};
    if (filter.zone) where.zone = { code: filter.zone };
    if (filter.to) where.start = { $lt: filter.to };
    if (filter.from) where.$or = [{ end: null }, { end: { $gt: filter.from } }];
    return em.find(Outage, where, { populate: ['zone'], orderBy: { start: 'desc', id: 'desc' }, limit });
  }

  /** A zone's windows overlapping [from, to) ms, open ones included. */
  async overlapping(zone: string, from: number, to: number, em: EntityManager = this.em.fork()): Promise<Outage[]> {
    return em.find(Outage, { zone: { code: zone }, start: { $lt: new Date(to) }, $or: [{ end: null }, { end: { $gt: new Date(from) } }] });
  }

  async byId(id: number, em: EntityManager): Promise<Outage | null> {
    return em.findOne(Outage, { id }, { populate: ['zone'] });
  }

  async zoneByCode(code: string, em: EntityManager): Promise<Zone | null> {
    return em.findOne(Zone, { code });
  }

  /** Adds a window and writes it, so that it has its id. */
  async add(values: NewOutage, em: EntityManager): Promise<Outage> {
    const outage = em.create(Outage, values);
    await em.flush();
    return outage;
  }

  /** Writes the changes made to windows read through `em`. */
  async save(em: EntityManager): Promise<void> {
    await em.flush();
  }
}
