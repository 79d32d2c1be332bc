import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { pickActiveZones } from './active-zones';
import { Zone } from './entities/zone.entity';

/**
 * Zones as the other features read them. Methods take an optional EntityManager so a caller
 * inside a transaction reads through it; otherwise each call uses a fork of its own.
 */
@Injectable()
export class ZonesRepository {
  constructor(private readonly em: EntityManager) {}

  /** Every active zone, by code. */
  async active(em: EntityManager = this.em.fork()): Promise<Zone[]> {
    return em.find(Zone, { active: true }, { orderBy: { code: 'asc' } });
  }

  /** The active zones with these codes, in the order asked (all when none); a 400 for a code that names none. */
  async activeByCodes(codes: readonly string[] | undefined, em: EntityManager = this.em.fork()): Promise<Zone[]> {
    if (!codes || codes.length === 0) return this.active(em);
    const found = await em.find(Zone, { code: { $in: [...codes] }, active: true });
    return pickActiveZones(found, codes);
  }

  /** A zone by code, active or not; null when there is none. */
  async byCode(code: string, em: EntityManager = this.em.fork()): Promise<Zone | null> {
    return em.findOne(Zone, { code });
  }

  async byId(id: number, em: EntityManager = this.em.fork()): Promise<Zone | null> {
    return em.findOne(Zone, { id });
  }

  /** A zone by id; MikroORM's NotFoundError when there is none (an id the caller already holds). */
  async byIdOrFail(id: number, em: EntityManager = this.em.fork()): Promise<Zone> {
    return em.findOneOrFail(Zone, { id });
  }

  async all(em: EntityManager = this.em.fork()): Promise<Zone[]> {
    return em.find(Zone, {}, { orderBy: { code: 'asc' } });
  }
}
