import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { UniqueConstraintViolationException, type EntityManager } from '@mikro-orm/mariadb';
import type { SpecialDayDto, SpecialDayPatch, SpecialDayRequest } from '@morrowline/shared';
import { AuditService, type Actor } from '../audit/audit.service';
import type { Zone } from '../zones/entities/zone.entity';
import { ZonesRepository } from '../zones/zones.repository';
import { SpecialDay } from './entities/special-day.entity';
import { SpecialDaysRepository } from './special-days.repository';

export function toSpecialDayDto(day: SpecialDay): SpecialDayDto {
  return { id: day.id, day: day.day, name: day.name, kind: day.kind, zones: day.zones.getItems().map((z) => z.code).sort() };
}

/** The holiday and special-day calendar: read by every desk, kept by supervisors and admins, every change audited. */
@Injectable()
export class CalendarService {
  constructor(
    private readonly days: SpecialDaysRepository,
    private readonly zones: ZonesRepository,
    private readonly audit: AuditService,
  ) {}

  async list(from?: string, to?: string): Promise<SpecialDayDto[]> {
    const year = new Date().getUTCFullYear();
    const first = from ?? `${year}-01-01`;
    const last = to ?? `${year + 1}-12-31`;
    if (first > last) throw new BadRequestException('from must not be after to');
    return (await this.days.between(first, last)).map(toSpecialDayDto);
  }

  private async zonesFor(tx: EntityManager, codes: readonly string[] | undefined): Promise<Zone[]> {
    if (!codes || codes.length === 0) return [];
    if (new Set(codes).size !== codes.length) throw new BadRequestException('zones names a zone twice');
    const found: Zone[] = [];
    for (const code of codes) {
      const zone = await this.zones.byCode(code, tx);
      if (!zone) throw new BadRequestException(`No zone with code ${code}`);
      found.push(zone);
    }
    return found;
  }

  async create(actor: Actor, request: SpecialDayRequest): Promise<SpecialDayDto> {
    return this.unique(request, () =>
      this.days.fork().transactional(async (tx) => {
        const zones = await this.zonesFor(tx, request.zones);
        const day = tx.create(SpecialDay, { day: request.day, name: request.name.trim(), kind: request.kind, createdAt: new Date(), updatedAt: new Date() });
        day.zones.set(zones);
        await tx.flush();
        const after = toSpecialDayDto(day);
        this.audit.stage(tx, actor, { action: 'calendar.day.create', subjectType: 'special-day', subjectId: day.id, after });
        return after;
      }),
    );
  }

  async update(actor: Actor, id: number, patch: SpecialDayPatch & { reason?: string }): Promise<SpecialDayDto> {
    return this.unique(patch, () =>
      this.days.fork().transactional(async (tx) => {
        const day = await this.days.byId(id, tx);
        if (!day) throw new NotFoundException(`No special day with id ${id}`);
        const before = toSpecialDayDto(day);
        if (patch.day !== undefined) day.day = patch.day;
        if (patch.name !== undefined) day.name = patch.name.trim();
        if (patch.kind !== undefined) day.kind = patch.kind;
        if (patch.zones !== undefined) day.zones.set(await this.zonesFor(tx, patch.zones));
        day.updatedAt = new Date();
        await tx.flush();
        const after = toSpecialDayDto(day);
        this.audit.stage(tx, actor, { action: 'calendar.day.update', subjectType: 'special-day', subjectId: id, before, after, reason: patch.reason ?? null });
        return after;
      }),
    );
  }

  async remove(actor: Actor, id: number, reason?: string): Promise<void> {
    await this.days.fork().transactional(async (tx) => {
      const day = await this.days.byId(id, tx);
      if (!day) throw new NotFoundException(`No special day with id ${id}`);
      const before = toSpecialDayDto(day);
      tx.remove(day);
      this.audit.stage(tx, actor, { action: 'calendar.day.delete', subjectType: 'special-day', subjectId: id, before, reason: reason ?? null });
    });
  }

  private async unique<T>(request: { day?: string; name?: string }, work: () => Promise<T>): Promise<T> {
    try {
      return await work();
    } catch (error) {
      if (error instanceof UniqueConstraintViolationException) throw new ConflictException(`The calendar already has ${request.name ?? 'a day of that name'} on ${request.day ?? 'that day'}`);
      throw error;
    }
  }
}
