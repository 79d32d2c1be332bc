import { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import type { CreateScheduleSubscriberRequest, ScheduleSubscriberDto } from '@morrowline/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../common/auth-user';
import { User } from '../users/entities/user.entity';
import { Zone } from '../zones/entities/zone.entity';
import { ScheduleSubscriber } from './entities/schedule-subscriber.entity';

function toDto(s: ScheduleSubscriber): ScheduleSubscriberDto {
  return {
    id: s.id,
    email: s.email,
    name: s.name,
    zones: s.zones,
    active: s.active,
    addedBy: s.addedBy ? { id: s.addedBy.id, name: s.addedBy.name } : null,
    addedAt: s.addedAt.toISOString(),
  };
}

/** The people publication e-mails go to, kept by supervisors. */
@Injectable()
export class ScheduleSubscribersService {
  constructor(
    private readonly em: EntityManager,
    private readonly audit: AuditService,
  ) {}

  async list(): Promise<ScheduleSubscriberDto[]> {
    const rows = await this.em.fork().find(ScheduleSubscriber, {}, { populate: ['addedBy'], orderBy: { active: 'desc', email: 'asc' } });
    return rows.map(toDto);
  }

  /** Adds a subscriber, or updates and reactivates the one with that e-mail. */
  async add(user: AuthUser, request: CreateScheduleSubscriberRequest): Promise<ScheduleSubscriberDto> {
    return this.em.fork().transactional(async (tx) => {
      const zones = request.zones?.length ? [...new Set(request.zones)] : null;
      if (zones) {
        const found = await tx.find(Zone, { code: { $in: zones } });
        const unknown = zones.filter((z) => !found.some((f) => f.code === z));
        if (unknown.length) throw new BadRequestException(`No zone with code ${unknown.join(', ')}`);
      }
      let subscriber = await tx.findOne(ScheduleSubscriber, { email: request.email }, { lockMode: undefined });
      const before = subscriber ? toDto(subscriber) : null;
      if (subscriber) {
        subscriber.name = request.name;
        subscriber.zones = zones;
        subscriber.active = true;
      } else {
        subscriber = tx.create(ScheduleSubscriber, { email: request.email, name: request.name, zones, active: true, addedBy: tx.getReference(User, user.id), addedAt: new Date() });
      }
      await tx.flush();
      this.audit.stage(tx, user, { action: 'schedule.subscriber-add', subjectType: 'schedule-subscriber', subjectId: subscriber.id, before, after: { email: subscriber.email, zones } });
      await tx.flush();
      await tx.populate(subscriber, ['addedBy']);
      return toDto(subscriber);
    });
  }

  async remove(user: AuthUser, id: number): Promise<ScheduleSubscriberDto> {
    return this.em.fork().transactional(async (tx) => {
      const subscriber = await tx.findOne(ScheduleSubscriber, { id }, { populate: ['addedBy'] });
      if (!subscriber) throw new NotFoundException(`No subscriber ${id}`);
      subscriber.active = false;
      this.audit.stage(tx, user, { action: 'schedule.subscriber-remove', subjectType: 'schedule-subscriber', subjectId: id, after: { email: subscriber.email } });
      await tx.flush();
      return toDto(subscriber);
    });
  }
}
