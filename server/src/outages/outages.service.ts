import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { ceilHour, floorHour, HOUR_MS, parseInstant, type CreateOutageRequest, type OutageDto, type UpdateOutageRequest } from '@morrowline/shared';
import { AuditService, type Actor } from '../audit/audit.service';
import type { Outage } from './entities/outage.entity';
import { excludedHourSet } from './outage-hours';
import { OutagesRepository } from './outages.repository';

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

/**
 * A time of a window by the one time parser (offset required, real date, in the window). The DTO
 * has checked it already; this keeps the service as strict for any other caller (the replay).
 */
function instant(text: string, field: string): number {
  const parsed = parseInstant(text, field);
  if (!parsed.ok) throw new BadRequestException(parsed.message);
  return parsed.value;
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
    private readonly outages: OutagesRepository,
    private readonly audit: AuditService,
  ) {}

  async list(zone: string | undefined, from: Date | undefined, to: Date | undefined): Promise<OutageDto[]> {
    const rows = await this.outages.list({ zone, from, to }, 1000);
    return rows.map(toOutageDto);
  }

  async create(actor: Actor, request: CreateOutageRequest): Promise<OutageDto> {
    const start = floorHour(instant(request.start, 'start'));
    const end = request.end ? ceilHour(instant(request.end, 'end')) : null;
    checkWindow(start, end);
    return this.outages.transaction(async (tx) => {
      const zone = await this.outages.zoneByCode(request.zone, tx);
      if (!zone) throw new NotFoundException(`No zone with code ${request.zone}`);
      const outage = await this.outages.add(
        {
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
        },
        tx,
      );
      const dto = toOutageDto(outage);
      this.audit.stage(tx, actor, { action: 'outage.create', subjectType: 'outage', subjectId: outage.id, after: dto, reason: dto.note });
      return dto;
    });
  }

  async update(actor: Actor, id: number, request: UpdateOutageRequest): Promise<OutageDto> {
    return this.outages.transaction(async (tx) => {
      const outage = await this.outages.byId(id, tx);
      if (!outage) throw new NotFoundException(`No outage window ${id}`);
      const before = toOutageDto(outage);
      const start = request.start !== undefined ? floorHour(instant(request.start, 'start')) : outage.start.getTime();
      const end = request.end !== undefined ? (request.end === null ? null : ceilHour(instant(request.end, 'end'))) : (outage.end?.getTime() ?? null);
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
      await this.outages.save(tx);
      return after;
    });
  }

  async close(actor: Actor, id: number, endIso: string | undefined, reason: string | undefined): Promise<OutageDto> {
    return this.outages.transaction(async (tx) => {
      const outage = await this.outages.byId(id, tx);
      if (!outage) throw new NotFoundException(`No outage window ${id}`);
      if (outage.end !== null && outage.closedAt !== null) throw new ConflictException(`Outage window ${id} is already closed`);
      const before = toOutageDto(outage);
      const end = endIso ? ceilHour(instant(endIso, 'end')) : (outage.end?.getTime() ?? ceilHour(Date.now()));
      checkWindow(outage.start.getTime(), end);
      outage.end = new Date(end);
      outage.closedAt = new Date();
      outage.closedByEmail = actor.email;
      outage.updatedAt = new Date();
      const after = toOutageDto(outage);
      this.audit.stage(tx, actor, { action: 'outage.close', subjectType: 'outage', subjectId: id, before, after, reason: reason?.trim() || null });
      await this.outages.save(tx);
      return after;
    });
  }

  /** UTC hour starts (ms) in [from, to) a zone's windows exclude; an open window runs to now. */
  async excludedHours(zone: string, from: number, to: number): Promise<Set<number>> {
    const rows = await this.outages.overlapping(zone, from, to);
    return excludedHourSet(
      rows.map((r) => ({ start: r.start.getTime(), end: r.end?.getTime() ?? null })),
      from,
      to,
      ceilHour(Date.now()),
    );
  }
}
