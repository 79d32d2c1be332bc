import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { SpecialDay } from './entities/special-day.entity';

/** The holiday and special-day calendar. */
@Injectable()
export class SpecialDaysRepository {
  constructor(private readonly em: EntityManager) {}

  fork(): EntityManager {
    return this.em.fork();
  }

  /** Days in [from, to] (local days, inclusive), with their zones. */
  between(from: string, to: string, em: EntityManager = this.em.fork()): Promise<SpecialDay[]> {
    return em.find(SpecialDay, { day: { $gte: from, $lte: to } }, { populate: ['zones'], orderBy: { day: 'asc', name: 'asc' } });
  }

  byId(id: number, em: EntityManager): Promise<SpecialDay | null> {
    return em.findOne(SpecialDay, { id }, { populate: ['zones'] });
  }

  count(em: EntityManager = this.em.fork()): Promise<number> {
    return em.count(SpecialDay, {});
  }
}
