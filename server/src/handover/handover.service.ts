import { EntityManager, type FilterQuery } from '@mikro-orm/mariadb';
import { BadRequestException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import {
  PERMISSIONS,
  type CreateHandoverRequest,
  type CurrentShiftDto,
  type HandoverDraftDto,
  type HandoverItemDto,
  type HandoverNoteDto,
  type HandoverNoteWithEventsDto,
  type Page,
} from '@morrowline/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../common/auth-user';
import type { AppConfig } from '../config/configuration';
import { User } from '../users/entities/user.entity';
import { Zone } from '../zones/entities/zone.entity';
import { HandoverItem } from './entities/handover-item.entity';
import { HandoverNote } from './entities/handover-note.entity';
import { SHIFT_EVENT_PREFIXES, toShiftEvent, type ZoneNames } from './shift-events';
import { shiftAt, type ShiftPattern } from './shifts';

function toItemDto(item: HandoverItem): HandoverItemDto {
  return { id: item.id, kind: item.kind, zoneCode: item.zoneCode, text: item.text, status: item.status, carriedFromItemId: item.carriedFromItemId };
}

function toNoteDto(note: HandoverNote, timeZone: string): HandoverNoteDto {
  return {
    id: note.id,
    shift: { label: note.shiftLabel, start: note.shiftStart.toISOString(), end: note.shiftEnd.toISOString(), timeZone },
    author: { id: note.author.id, name: note.author.name },
    body: note.body,
    items: note.items.isInitialized() ? note.items.getItems().map(toItemDto) : [],
    createdAt: note.createdAt.toISOString(),
    acknowledgedBy: note.acknowledgedBy ? { id: note.acknowledgedBy.id, name: note.acknowledgedBy.name } : null,
    acknowledgedAt: note.acknowledgedAt ? note.acknowledgedAt.toISOString() : null,
    reply: note.reply,
  };
}

@Injectable()
export class HandoverService {
  private readonly pattern: ShiftPattern;

  constructor(
    private readonly em: EntityManager,
    private readonly audit: AuditService,
    config: ConfigService,
  ) {
    this.pattern = config.getOrThrow<AppConfig>('app').shifts;
  }

  async currentShift(now = new Date()): Promise<CurrentShiftDto> {
    const current = shiftAt(this.pattern, now);
    const previous = shiftAt(this.pattern, now, -1);
    const signIns = await this.audit.between(new Date(current.start), now, ['auth.login']);
    const ids = [...new Set(signIns.map((e) => e.actorId).filter((id): id is number => id !== null))];
    const users = ids.length
      ? await this.em.fork().find(User, { id: { $in: ids }, role: { $in: [...PERMISSIONS.forecast] }, active: true }, { orderBy: { name: 'asc' } })
      : [];
    return { current, previous, onShift: users.map((u) => ({ id: u.id, name: u.name, role: u.role })) };
  }

  /** Open items of the latest note, to carry on; the current shift's events so far. */
  async draft(now = new Date()): Promise<HandoverDraftDto> {
    const shift = shiftAt(this.pattern, now);
    const events = await this.audit.between(new Date(shift.start), now, SHIFT_EVENT_PREFIXES);
    const zoneNames = await this.zoneNames();
    return { shift, events: events.map((e) => toShiftEvent(e, zoneNames)), openItems: await this.openItems() };
  }

  /** Every zone's name by code, switched-off zones included: events name zones, not codes. */
  private async zoneNames(): Promise<ZoneNames> {
    const zones = await this.em.fork().find(Zone, {}, { fields: ['code', 'name'] });
    return new Map(zones.map((zone) => [zone.code, zone.name]));
  }

  /**
   * Items still open: marked open in some note and not yet carried on by a later item. A note
   * that leaves an open item out therefore does not close it; only an explicit "closed" does.
   */
  private async openItems(): Promise<HandoverItemDto[]> {
    const em = this.em.fork();
    const open = await em.find(HandoverItem, { status: 'open' }, { orderBy: { id: 'asc' } });
    if (open.length === 0) return [];
    const successors = await em.find(HandoverItem, { carriedFromItemId: { $in: open.map((i) => i.id) } });
    const carriedOn = new Set(successors.map((i) => i.carriedFromItemId));
    return open.filter((i) => !carriedOn.has(i.id)).map(toItemDto);
  }

  async create(author: AuthUser, request: CreateHandoverRequest, now = new Date()): Promise<HandoverNoteDto> {
    if (request.body.trim() === '' && request.items.length === 0) {
      throw new BadRequestException('A handover needs some text or at least one item');
    }
    const shift = shiftAt(this.pattern, now);
    return this.em.fork().transactional(async (tx) => {
      const carried = request.items.map((i) => i.carriedFromItemId).filter((id): id is number => id != null);
      if (carried.length) {
        const found = await tx.count(HandoverItem, { id: { $in: carried } });
        if (found !== new Set(carried).size) throw new BadRequestException('An item says it carries on an item that does not exist');
      }
      const note = tx.create(HandoverNote, {
        shiftStart: new Date(shift.start),
        shiftEnd: new Date(shift.end),
        shiftLabel: shift.label,
        author: tx.getReference(User, author.id),
        body: request.body,
        createdAt: now,
        acknowledgedBy: null,
        acknowledgedAt: null,
        reply: null,
      });
      for (const item of request.items) {
        note.items.add(
          tx.create(HandoverItem, {
            note,
            kind: item.kind,
            zoneCode: item.zoneCode ?? null,
            text: item.text.trim(),
            status: item.status,
            carriedFromItemId: item.carriedFromItemId ?? null,
          }),
        );
      }
      await tx.flush();
      this.audit.stage(tx, author, {
        action: 'handover.write',
        subjectType: 'handover',
        subjectId: note.id,
        after: { shift: shift.label, items: request.items.length, open: request.items.filter((i) => i.status === 'open').length },
      });
      await tx.populate(note, ['author']);
      return toNoteDto(note, this.pattern.timeZone);
    });
  }

  async acknowledge(user: AuthUser, id: number, reply: string | undefined): Promise<HandoverNoteDto> {
    return this.em.fork().transactional(async (tx) => {
      const note = await tx.findOne(HandoverNote, { id }, { populate: ['author', 'items', 'acknowledgedBy'] });
      if (!note) throw new NotFoundException(`No handover note ${id}`);
      if (note.author.id === user.id) throw new ForbiddenException('The incoming shift acknowledges a handover, not its author');
      if (note.acknowledgedAt) throw new BadRequestException(`Already acknowledged by ${note.acknowledgedBy?.name ?? 'someone'}`);
      note.acknowledgedBy = tx.getReference(User, user.id);
      note.acknowledgedAt = new Date();
      note.reply = reply?.trim() || null;
      this.audit.stage(tx, user, { action: 'handover.acknowledge', subjectType: 'handover', subjectId: id, after: { reply: note.reply } });
      await tx.flush();
      await tx.populate(note, ['acknowledgedBy']);
      return toNoteDto(note, this.pattern.timeZone);
    });
  }

  async get(id: number): Promise<HandoverNoteWithEventsDto> {
    const note = await this.em.fork().findOne(HandoverNote, { id }, { populate: ['author', 'items', 'acknowledgedBy'] });
    if (!note) throw new NotFoundException(`No handover note ${id}`);
    const events = await this.audit.between(note.shiftStart, note.createdAt, SHIFT_EVENT_PREFIXES);
    const zoneNames = await this.zoneNames();
    return { ...toNoteDto(note, this.pattern.timeZone), events: events.map((e) => toShiftEvent(e, zoneNames)) };
  }

  async pending(): Promise<HandoverNoteDto[]> {
    const notes = await this.em.fork().find(HandoverNote, { acknowledgedAt: null }, { orderBy: { createdAt: 'desc' }, populate: ['author', 'items'] });
    return notes.map((n) => toNoteDto(n, this.pattern.timeZone));
  }

  async search(query: { q?: string; zone?: string; from?: Date; to?: Date; limit: number; offset: number }): Promise<Page<HandoverNoteDto>> {
    const where: FilterQuery<HandoverNote> = {};
    const and: FilterQuery<HandoverNote>[] = [];
    if (query.from) and.push({ shiftStart: { $gte: query.from } });
    if (query.to) and.push({ shiftStart: { $lt: query.to } });
    if (query.zone) and.push({ items: { zoneCode: query.zone } });
    if (query.q) {
      const like = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      and.push({ $or: [{ body: { $like: like } }, { items: { text: { $like: like } } }, { reply: { $like: like } }] });
    }
    if (and.length) where.$and = and;
    const em = this.em.fork();
    const [notes, total] = await em.findAndCount(HandoverNote, where, {
      orderBy: { createdAt: 'desc', id: 'desc' },
      limit: query.limit,
      offset: query.offset,
      populate: ['author', 'acknowledgedBy'],
    });
    await em.populate(notes, ['items']);
    return { items: notes.map((n) => toNoteDto(n, this.pattern.timeZone)), total };
  }
}
