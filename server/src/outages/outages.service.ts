import { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { ceilHour, floorHour, HOUR_MS, type CreateOutageRequest, type OutageDto, type UpdateOutageRequest } from '@morrowline/shared';
import { AuditService, type Actor } from '../audit/audit.service';
import { Zone } from '../zones/entities/zone.entity';
import { Outage } from './entities/outage.entity';
import { excludedHourSet } from './outage-hours';

/** The longest window one may mark (a longer one is almost certainly a typing error). */
const MAX_WINDOW_DAYS = 92;

export function toOutageDto(o: Outage): OutageDto {
  return {
    id: o.id,
    zone: o.zone.code,
    kind: o.kind,
    start: o.start.toISOString(),
    end: o.end ? o.end.toISOString() : null,
    note: o.note,
    createdBy: o.createdByEmail,
    createdAt: o.createdAt.toISOString(),
    updatedAt: o.updatedAt.toISOString(),
    closedAt: o.closedAt ? o.closedAt.toISOString() : null,
    closedBy: o.closedByEmail,
  };
}

function checkWindow(start: number, end: number | null): void {
  if (end !== null && !(start < end)) throw new BadRequestException('The window is empty: its end must be after its start');
  if (end !== null && end - start > MAX_WINDOW_DAYS * 24 * HOUR_MS) throw new BadRequestException(`A window may span at most ${MAX_WINDOW_DAYS} days`);
  if (start > Date.now() + 7 * 24 * HOUR_MS) throw new BadRequestException('A window may start at most a week ahead');
}

/**
 * Outage and bad-data windows: marked, edited and closed by operators (each change audited in
 * the same transaction), and the excluded hours the models and the workbench leave out.
 */
@Injectable()
export class OutagesService {
  constructor(
    private readonly em: EntityManager,
    private readonly audit: AuditService,
  ) {}

  async list(zone: string | undefined, from: Date | undefined, to: Date | undefined): Promise<OutageDto[]> {
    const where: Record<string, unknown> = {};
    if (zone) where.zone = { code: zone };
    if (to) where.start = { $lt: to };
    if (from) where.$or = [{ end: null }, { end: { $gt: from } }];
    const rows = await this.em.fork().find(Outage, where, { populate: ['zone'], orderBy: { start: 'desc', id: 'desc' }, limit: 1000 });
    return rows.map(toOutageDto);
  }

  async create(actor: Actor, request: CreateOutageRequest): Promise<OutageDto> {
    const start = floorHour(Date.parse(request.start));
    const end = request.end ? ceilHour(Date.parse(request.end)) : null;
    checkWindow(start, end);
    return this.em.fork().transactional(async (tx) => {
      const zone = await tx.findOne(Zone, { code: request.zone });
      if (!zone) throw new NotFoundException(`No zone with code ${request.zone}`);
      const outage = tx.create(Outage, {
        zone,
        kind: request.kind,
        start: new Date(start),
        end: end === null ? null : new Date(end),
        note: request.note.trim(),
        createdByEmail: actor.email,
        createdAt: new Date(),
        updatedAt: new Date(),
        closedAt: null,
        closedByEmail: null,
      });
      await tx.flush();
      const dto = toOutageDto(outage);
      this.audit.stage(tx, actor, { action: 'outage.create', subjectType: 'outage', subjectId: outage.id, after: dto, reason: dto.note });
      return dto;
    });
  }

  async update(actor: Actor, id: number, request: UpdateOutageRequest): Promise<OutageDto> {
    return this.em.fork().transactional(async (tx) => {
      const outage = await tx.findOne(Outage, { id }, { populate: ['zone'] });
      if (!outage) throw new NotFoundException(`No outage window ${id}`);
      const before = toOutageDto(outage);
      const start = request.start !== undefined ? floorHour(Date.parse(request.start)) : outage.start.getTime();
      const end = request.end !== undefined ? (request.end === null ? null : ceilHour(Date.parse(request.end))) : (outage.end?.getTime() ?? null);
      checkWindow(start, end);
      if (request.kind) outage.kind = request.kind;
      if (request.note !== undefined) outage.note = request.note.trim();
      outage.start = new Date(start);
      outage.end = end === null ? null : new Date(end);
      if (end === null) {
        outage.closedAt = null;
        outage.closedByEmail = null;
      }
      outage.updatedAt = new Date();
      const after = toOutageDto(outage);
      this.audit.stage(tx, actor, { action: 'outage.update', subjectType: 'outage', subjectId: id, before, after, reason: request.reason.trim() });
      await tx.flush();
      return after;
    });
  }

  async close(actor: Actor, id: number, endIso: string | undefined, reason: string | undefined): Promise<OutageDto> {
    return this.em.fork().transactional(async (tx) => {
      const outage = await tx.findOne(Outage, { id }, { populate: ['zone'] });
      if (!outage) throw new NotFoundException(`No outage window ${id}`);
      if (outage.end !== null && outage.closedAt !== null) throw new ConflictException(`Outage window ${id} is already closed`);
      const before = toOutageDto(outage);
      const end = endIso ? ceilHour(Date.parse(endIso)) : (outage.end?.getTime() ?? ceilHour(Date.now()));
      checkWindow(outage.start.getTime(), end);
      outage.end = new Date(end);
      outage.closedAt = new Date();
      outage.closedByEmail = actor.email;
      outage.updatedAt = new Date();
      const after = toOutageDto(outage);
      this.audit.stage(tx, actor, { action: 'outage.close', subjectType: 'outage', subjectId: id, before, after, reason: reason?.trim() || null });
      await tx.flush();
      return after;
    });
  }

  /** UTC hour starts (ms) in [from, to) a zone's windows exclude; an open window runs to now. */
  async excludedHours(zone: string, from: number, to: number): Promise<Set<number>> {
    const rows = await this.em.fork().find(Outage, { zone: { code: zone }, start: { $lt: new Date(to) }, $or: [{ end: null }, { end: { $gt: new Date(from) } }] });
    return excludedHourSet(
      rows.map((r) => ({ start: r.start.getTime(), end: r.end?.getTime() ?? null })),
      from,
      to,
      ceilHour(Date.now()),
    );
  }
}
