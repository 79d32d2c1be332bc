import { EntityManager, type FilterQuery } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { AuditEntry } from './entities/audit-entry.entity';

/** The append-only audit trail's table: entries are added (in the caller's unit of work) and read, never changed. */
@Injectable()
export class AuditRepository {
  constructor(private readonly em: EntityManager) {}

  /** A fresh unit of work for an entry written on its own. */
  fork(): EntityManager {
    return this.em.fork();
  }

  /** Adds an entry to the unit of work of `em` (written on its flush). */
  add(em: EntityManager, data: Omit<AuditEntry, 'id'>): AuditEntry {
    const entry = em.create(AuditEntry, data);
    em.persist(entry);
    return entry;
  }

  /** Entries in [from, to) whose action starts with one of the prefixes, oldest first (at most 2000). */
  async between(from: Date, to: Date, actionPrefixes: readonly string[]): Promise<AuditEntry[]> {
    return this.em.fork().find(
      AuditEntry,
      { at: { $gte: from, $lt: to }, $or: actionPrefixes.map((prefix) => ({ action: { $like: `${prefix}%` } })) },
      { orderBy: { at: 'asc', id: 'asc' }, limit: 2000 },
    );
  }

  /** One page of the entries that match, newest first, and how many match in all. */
  async page(where: Record<string, unknown>, limit: number, offset: number): Promise<[AuditEntry[], number]> {
    return this.em.fork().findAndCount(AuditEntry, where as FilterQuery<AuditEntry>, { orderBy: { at: 'desc', id: 'desc' }, limit, offset });
  }
}
