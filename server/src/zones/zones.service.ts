import { EntityManager, UniqueConstraintViolationException } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import type { CreateZoneRequest, UpdateZoneRequest, ZoneDto } from '@morrowline/shared';
import { AuditService, type Actor } from '../audit/audit.service';
import { DOMAIN_EVENTS } from '../events/domain-events';
import { DomainEventsPublisher } from '../events/domain-events.publisher';
import { Zone } from './entities/zone.entity';

export function toZoneDto(zone: Zone): ZoneDto {
  return {
    id: zone.id,
    code: zone.code,
    name: zone.name,
    timeZone: zone.timeZone,
    alertThresholdPct: zone.alertThresholdPct,
    alertConsecutiveHours: zone.alertConsecutiveHours,
    gateClosure: zone.gateClosure,
    minPlausibleMw: zone.minPlausibleMw,
    maxPlausibleMw: zone.maxPlausibleMw,
    active: zone.active,
  };
}

function checkRange(min: number, max: number): void {
  if (!(min < max)) throw new BadRequestException(`The plausible range is empty: minimum ${min} MW is not below maximum ${max} MW`);
}

@Injectable()
export class ZonesService {
  constructor(
    private readonly em: EntityManager,
    private readonly audit: AuditService,
    private readonly events: DomainEventsPublisher,
  ) {}

  /** Told once the change is committed: the readings' cached zone list is dropped at once. */
  private changed(zone: ZoneDto): void {
    this.events.publish(DOMAIN_EVENTS.zoneChanged, { zoneId: zone.id, code: zone.code, active: zone.active });
  }

  async list(): Promise<ZoneDto[]> {
    const zones = await this.em.fork().find(Zone, {}, { orderBy: { code: 'asc' } });
    return zones.map(toZoneDto);
  }

  async getByCode(code: string): Promise<Zone> {
    const zone = await this.em.fork().findOne(Zone, { code });
    if (!zone) throw new NotFoundException(`No zone with code ${code}`);
    return zone;
  }

  /**
   * Zone names tell zones apart on every screen and in the shift log, so two zones may not share
   * one. Compared trimmed and without regard to case ("Millrace" and "millrace " are one name).
   */
  private async refuseTakenName(em: EntityManager, name: string, exceptId: number | null): Promise<void> {
    const wanted = name.trim().toLowerCase();
    const zones = await em.find(Zone, {}, { fields: ['id', 'name', 'code'] });
    const taken = zones.find((zone) => zone.id !== exceptId && zone.name.trim().toLowerCase() === wanted);
    if (taken) throw new ConflictException(`Zone ${taken.code} is already called "${taken.name}"; choose another name`);
  }

  async create(actor: Actor, request: CreateZoneRequest): Promise<ZoneDto> {
    checkRange(request.minPlausibleMw, request.maxPlausibleMw);
    const em = this.em.fork();
    await this.refuseTakenName(em, request.name, null);
    const zone = em.create(Zone, { ...request, active: request.active ?? true, createdAt: new Date(), updatedAt: new Date() });
    try {
      await em.transactional(async (tx) => {
        tx.persist(zone);
        await tx.flush();
        this.audit.stage(tx, actor, { action: 'zone.create', subjectType: 'zone', subjectId: zone.code, after: toZoneDto(zone) });
      });
    } catch (error) {
      if (error instanceof UniqueConstraintViolationException) throw new ConflictException(`A zone with code ${request.code} already exists`);
      throw error;
    }
    const created = toZoneDto(zone);
    this.changed(created);
    return created;
  }

  async update(actor: Actor, id: number, request: UpdateZoneRequest): Promise<ZoneDto> {
    const updated = await this.em.fork().transactional(async (tx) => {
      const zone = await tx.findOne(Zone, { id });
      if (!zone) throw new NotFoundException(`No zone with id ${id}`);
      const before = toZoneDto(zone);
      const { reason, ...changes } = request;
      checkRange(changes.minPlausibleMw ?? zone.minPlausibleMw, changes.maxPlausibleMw ?? zone.maxPlausibleMw);
      if (changes.name !== undefined) await this.refuseTakenName(tx, changes.name, zone.id);
      tx.assign(zone, changes);
      const after = toZoneDto(zone);
      this.audit.stage(tx, actor, { action: 'zone.update', subjectType: 'zone', subjectId: zone.code, before, after, reason: reason ?? null });
      return after;
    });
    this.changed(updated);
    return updated;
  }
}
