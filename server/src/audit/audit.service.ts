import type { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { AuditEntryDto, Page } from '@morrowline/shared';
import { AuditRepository } from './audit.repository';
import type { AuditEntry } from './entities/audit-entry.entity';

/** Who did it; null for the system itself (schedules, start-up). */
export interface Actor {
  id: number;
  email: string;
}

export interface AuditRecord {
  action: string;
  subjectType: string;
  subjectId?: string | number | null;
  before?: unknown;
  after?: unknown;
  reason?: string | null;
  /** When it happened, if not now: only work replayed as of a past time passes it (src/replay). */
  at?: Date;
}

export interface AuditQuery {
  limit: number;
  offset: number;
  action?: string;
  subjectType?: string;
  subjectId?: string;
  actorId?: number;
  from?: Date;
  to?: Date;
}

/**
 * Writes and reads the append-only audit trail. Callers pass their own EntityManager when the
 * entry must commit or roll back with the change it describes.
 */
@Injectable()
export class AuditService {
  constructor(private readonly entries: AuditRepository) {}

  /** Adds an entry to the unit of work of `em` (flushed by the caller's transaction). */
  stage(em: EntityManager, actor: Actor | null, record: AuditRecord): AuditEntry {
    return this.entries.add(em, {
      at: record.at ?? new Date(),
      actorId: actor?.id ?? null,
      actorEmail: actor?.email ?? null,
      action: record.action,
      subjectType: record.subjectType,
      subjectId: record.subjectId == null ? null : String(record.subjectId),
      before: record.before ?? null,
      after: record.after ?? null,
      reason: record.reason ?? null,
    });
  }

  /** Writes one entry on its own. */
  async record(actor: Actor | null, record: AuditRecord): Promise<void> {
    const em = this.entries.fork();
    this.stage(em, actor, record);
    await em.flush();
  }

  /** Entries in [from, to) whose action starts with one of the prefixes (e.g. "alert."), oldest first. */
  async between(from: Date, to: Date, actionPrefixes: readonly string[]): Promise<AuditEntryDto[]> {
    return (await this.entries.between(from, to, actionPrefixes)).map(toAuditEntryDto);
  }

  async list(query: AuditQuery): Promise<Page<AuditEntryDto>> {
    const where: Record<string, unknown> = {};
    if (query.action) where.action = query.action;
    if (query.subjectType) where.subjectType = query.subjectType;
    if (query.subjectId) where.subjectId = query.subjectId;
    if (query.actorId) where.actorId = query.actorId;
    if (query.from || query.to) {
      where.at = { ...(query.from ? { $gte: query.from } : {}), ...(query.to ? { $lt: query.to } : {}) };
    }
    const [items, total] = await this.entries.page(where, query.limit, query.offset);
    return { items: items.map(toAuditEntryDto), total };
  }
}

export function toAuditEntryDto(entry: AuditEntry): AuditEntryDto {
  return {
    id: Number(entry.id),
    at: entry.at.toISOString(),
    actorId: entry.actorId,
    actorEmail: entry.actorEmail,
    action: entry.action,
    subjectType: entry.subjectType,
    subjectId: entry.subjectId,
    before: entry.before,
    after: entry.after,
    reason: entry.reason,
  };
}
