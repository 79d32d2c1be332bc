import { LockMode, UniqueConstraintViolationException } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import {
  EDITABLE_SCHEDULE_STATES,
  gateClosureAt,
  isOperatingDay,
  may,
  operatingDayBounds,
  operatingDaySlots,
  SCHEDULE_CAUTION,
  replayAdjustments,
  type AdjustmentResultDto,
  type CreateScheduleAdjustmentRequest,
  type DayScheduleDto,
  type DeskScheduleEvent,
  type ScheduleAdjustmentDto,
  type ScheduleHourDto,
  type ScheduleHourSlot,
  type ScheduleRevisionDto,
  type ZoneScheduleDto,
} from '@morrowline/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../common/auth-user';
import { DOMAIN_EVENTS } from '../events/domain-events';
import { DomainEventsPublisher } from '../events/domain-events.publisher';
import { ForecastsService, toForecastRunDto } from '../forecasts/forecasts.service';
import { User } from '../users/entities/user.entity';
import { Zone } from '../zones/entities/zone.entity';
import { ScheduleAdjustment } from './entities/schedule-adjustment.entity';
import { ScheduleRevision } from './entities/schedule-revision.entity';
import { ScheduleNotifier } from './schedule-notifier';

const USERS = ['zone', 'createdBy', 'submittedBy', 'returnedBy', 'publishedBy'] as const;
const ref = (u: User | null) => (u ? { id: u.id, name: u.name } : null);
const iso = (d: Date | null) => (d ? d.toISOString() : null);
const key = (zone: Zone, day: string) => `${zone.id}:${day}`;

function toAdjustmentDto(a: ScheduleAdjustment): ScheduleAdjustmentDto {
  return {
    id: a.id,
    revisionId: a.revision.id,
    zone: a.zoneCode,
    kind: a.kind,
    fromHour: a.fromHour,
    toHour: a.toHour,
    value: a.value,
    reason: a.reason,
    by: { id: a.by.id, name: a.by.name },
    at: a.at.toISOString(),
    undoneAt: iso(a.undoneAt),
    undoneBy: ref(a.undoneBy),
  };
}

export function toRevisionDto(r: ScheduleRevision, adjustments: ScheduleAdjustment[]): ScheduleRevisionDto {
  return {
    id: r.id,
    zone: r.zone.code,
    operatingDay: r.operatingDay,
    revision: r.revision,
    state: r.state,
    forecastRunId: r.forecastRunId,
    forecastIssuedAt: iso(r.forecastIssuedAt),
    forecastReplayed: r.forecastReplayed,
    hours: r.hours,
    adjustments: adjustments.filter((a) => a.revision.id === r.id).map(toAdjustmentDto),
    createdBy: { id: r.createdBy.id, name: r.createdBy.name },
    createdAt: r.createdAt.toISOString(),
    submittedBy: ref(r.submittedBy),
    submittedAt: iso(r.submittedAt),
    submitComment: r.submitComment,
    late: r.late,
    returnedBy: ref(r.returnedBy),
    returnedAt: iso(r.returnedAt),
    returnComment: r.returnComment,
    publishedBy: ref(r.publishedBy),
    publishedAt: iso(r.publishedAt),
    supersededAt: iso(r.supersededAt),
    correctionReason: r.correctionReason,
    mail: r.mailOutcome,
  };
}

/**
 * The day-ahead schedule workflow: drafts from the latest forecast, adjustments (replayed from the
 * start values on every change), submission, return, approval = publication, corrections.
 * Every change is one transaction with its audit entry; desks are told after it commits.
 */
@Injectable()
export class SchedulesService {
  constructor(
    private readonly em: EntityManager,
    private readonly audit: AuditService,
    private readonly events: DomainEventsPublisher,
    private readonly forecasts: ForecastsService,
    private readonly notifier: ScheduleNotifier,
  ) {}

  private checkDay(day: string): void {
    if (!isOperatingDay(day)) throw new BadRequestException(`"${day}" is not an operating day (yyyy-MM-dd)`);
  }

  private async zones(em: EntityManager, codes?: readonly string[]): Promise<Zone[]> {
    if (!codes || codes.length === 0) return em.find(Zone, { active: true }, { orderBy: { code: 'asc' } });
    const found = await em.find(Zone, { code: { $in: [...codes] }, active: true });
    return codes.map((code) => {
      const zone = found.find((z) => z.code === code);
      if (!zone) throw new BadRequestException(`No active zone with code ${code}`);
      return zone;
    });
  }

  private async adjustmentsOf(em: EntityManager, revisions: ScheduleRevision[]): Promise<ScheduleAdjustment[]> {
    if (revisions.length === 0) return [];
    return em.find(ScheduleAdjustment, { revision: { $in: revisions.map((r) => r.id) } }, { populate: ['by', 'undoneBy'], orderBy: { id: 'asc' } });
  }

  private async dto(em: EntityManager, revision: ScheduleRevision): Promise<ScheduleRevisionDto> {
    await em.populate(revision, [...USERS]);
    return toRevisionDto(revision, await this.adjustmentsOf(em, [revision]));
  }

  private announce(action: DeskScheduleEvent['action'], r: ScheduleRevisionDto): void {
    this.events.publish(DOMAIN_EVENTS.scheduleChanged, { action, zone: r.zone, operatingDay: r.operatingDay, revisionId: r.id, revision: r.revision, state: r.state });
  }

  /**
   * The latest forecast (stored run, or the seasonal-naive stand-in) laid onto the day's hours; with
   * `asOf` (work replayed as of a past time, never HTTP) the run the desk had then.
   */
  private async forecastHours(zone: Zone, day: string, slots: ScheduleHourSlot[], asOf?: Date): Promise<{ runId: number | null; issuedAt: string; replayed: boolean; hours: ScheduleHourDto[] }> {
    const { from, to } = operatingDayBounds(day, zone.timeZone);
    const past = asOf ? await this.forecasts.runAsOf(zone.id, asOf) : null;
    if (asOf && !past) throw new ConflictException(`No forecast run of ${zone.code} had been stored by ${asOf.toISOString()}`);
    const run = past ? toForecastRunDto(past, zone.code, from, to) : (await this.forecasts.latest([zone.code], new Date(from), new Date(to))).zones[0];
    const at = new Map(run.hours.map((h, i) => [Date.parse(h), i]));
    const hours = slots.map((s) => {
      const i = at.get(Date.parse(s.intervalStartUtc));
      const v = (a: number[]) => (i === undefined ? null : Math.round(a[i] * 10) / 10);
      const modelMw = v(run.mean);
      return { ...s, modelMw, lower80: v(run.lower80), upper80: v(run.upper80), lower95: v(run.lower95), upper95: v(run.upper95), startMw: modelMw, adjustedMw: modelMw };
    });
    return { runId: run.id, issuedAt: run.issuedAt, replayed: run.origin === 'replayed', hours };
  }

  async day(day: string, codes: readonly string[] | undefined, now = new Date()): Promise<DayScheduleDto> {
    this.checkDay(day);
    const em = this.em.fork();
    const zones = await this.zones(em, codes);
    const revisions = await em.find(
      ScheduleRevision,
      { zone: { $in: zones.map((z) => z.id) }, operatingDay: day, $or: [{ workingKey: { $ne: null } }, { publishedKey: { $ne: null } }] },
      { populate: [...USERS] },
    );
    const adjustments = await this.adjustmentsOf(em, revisions);
    const out: ZoneScheduleDto[] = [];
    for (const zone of zones) {
      const slots = operatingDaySlots(day, zone.timeZone);
      const gate = new Date(gateClosureAt(day, zone.timeZone, zone.gateClosure));
      const working = revisions.find((r) => r.zone.id === zone.id && r.workingKey !== null);
      const published = revisions.find((r) => r.zone.id === zone.id && r.publishedKey !== null);
      const forecast = await this.forecastHours(zone, day, slots);
      out.push({
        zone: zone.code,
        zoneName: zone.name,
        timeZone: zone.timeZone,
        operatingDay: day,
        slots,
        gateClosureAt: gate.toISOString(),
        secondsToGateClosure: Math.round((gate.getTime() - now.getTime()) / 1000),
        gateClosed: now >= gate,
        forecast: forecast.hours.some((h) => h.modelMw !== null) ? { runId: forecast.runId, issuedAt: forecast.issuedAt, hours: forecast.hours } : null,
        working: working ? toRevisionDto(working, adjustments) : null,
        published: published ? toRevisionDto(published, adjustments) : null,
      });
    }
    return { operatingDay: day, serverTime: now.toISOString(), caution: SCHEDULE_CAUTION, zones: out };
  }

  /**
   * Starts the zone/day's draft from the latest forecast; answers the working revision if there is one.
   * `asOf` is only for work replayed as of a past time (src/replay): the draft is made then, from the
   * forecast the desk had then. HTTP callers never pass it.
   */
  async createDraft(user: AuthUser, day: string, code: string, asOf?: Date): Promise<ScheduleRevisionDto> {
    this.checkDay(day);
    const em = this.em.fork();
    const [zone] = await this.zones(em, [code]);
    const existing = await em.findOne(ScheduleRevision, { workingKey: key(zone, day) });
    if (existing) return this.dto(em, existing);
    if (await em.count(ScheduleRevision, { publishedKey: key(zone, day) })) {
      throw new ConflictException(`The ${code} schedule for ${day} is published; a change is a correction (a new revision with a reason)`);
    }
    const slots = operatingDaySlots(day, zone.timeZone);
    const forecast = await this.forecastHours(zone, day, slots, asOf);
    try {
      const dto = await em.transactional(async (tx) => {
        const last = await tx.findOne(ScheduleRevision, { zone: zone.id, operatingDay: day }, { orderBy: { revision: 'desc' } });
        const revision = tx.create(ScheduleRevision, {
          zone: tx.getReference(Zone, zone.id),
          operatingDay: day,
          revision: (last?.revision ?? 0) + 1,
          state: 'draft',
          workingKey: key(zone, day),
          publishedKey: null,
          forecastRunId: forecast.runId,
          forecastIssuedAt: new Date(forecast.issuedAt),
          forecastReplayed: forecast.replayed,
          hours: forecast.hours,
          createdBy: tx.getReference(User, user.id),
          createdAt: asOf ?? new Date(),
          late: false,
        });
        await tx.flush();
        this.audit.stage(tx, user, {
          action: 'schedule.draft',
          subjectType: 'schedule',
          subjectId: revision.id,
          after: { zone: code, operatingDay: day, revision: revision.revision, forecastRunId: forecast.runId, hoursWithoutForecast: forecast.hours.filter((h) => h.modelMw === null).length },
          at: asOf,
        });
        await tx.flush();
        return this.dto(tx, revision);
      });
      this.announce('draft', dto);
      return dto;
    } catch (err) {
      if (!(err instanceof UniqueConstraintViolationException)) throw err;
      const other = await this.em.fork().findOne(ScheduleRevision, { workingKey: key(zone, day) });
      if (!other) throw err;
      return this.dto(this.em.fork(), other);
    }
  }

  private editable(revision: ScheduleRevision, what: string): void {
    if (EDITABLE_SCHEDULE_STATES.includes(revision.state)) return;
    const where = `revision ${revision.revision} of ${revision.zone.code} ${revision.operatingDay}`;
    if (revision.state === 'submitted') throw new ConflictException(`Cannot ${what} ${where}: it is submitted; a supervisor must return it first`);
    throw new ConflictException(`Cannot ${what} ${where}: it is ${revision.state} and cannot be changed; a change is a correction (a new revision)`);
  }

  /** Recomputes adjustedMw from startMw and the active adjustments; throws on an impossible result. */
  private replay(revision: ScheduleRevision, active: { kind: ScheduleAdjustment['kind']; fromHour: number; toHour: number; value: number }[], refuse: (message: string) => Error): void {
    const result = replayAdjustments(revision.hours.map((h) => h.startMw), active, revision.hours.map((h) => h.hourEnding));
    if (!result.ok) throw refuse(`${revision.zone.code}: ${result.message}`);
    revision.hours = revision.hours.map((h, i) => ({ ...h, adjustedMw: result.values[i] }));
  }

  /** `asOf`: only for work replayed as of a past time (src/replay); HTTP callers never pass it. */
  async adjust(user: AuthUser, day: string, request: CreateScheduleAdjustmentRequest, asOf?: Date): Promise<AdjustmentResultDto> {
    this.checkDay(day);
    const codes = [...new Set(request.zones)];
    if (request.fromHour > request.toHour) throw new BadRequestException('fromHour must not be after toHour');
    const result = await this.em.fork().transactional(async (tx) => {
      const zones = await this.zones(tx, codes);
      const made: ScheduleAdjustment[] = [];
      const revisions: ScheduleRevision[] = [];
      for (const zone of zones) {
        const revision = await tx.findOne(ScheduleRevision, { zone: zone.id, operatingDay: day, workingKey: { $ne: null } }, { lockMode: LockMode.PESSIMISTIC_WRITE });
        if (!revision) {
          const published = await tx.count(ScheduleRevision, { publishedKey: key(zone, day) });
          throw published
            ? new ConflictException(`The ${zone.code} schedule for ${day} is published and cannot be changed; start a correction`)
            : new ConflictException(`There is no ${zone.code} draft for ${day}; start one first`);
        }
        await tx.populate(revision, ['zone']);
        this.editable(revision, 'adjust');
        if (request.toHour >= revision.hours.length) {
          throw new BadRequestException(`${zone.code} ${day} has ${revision.hours.length} hours (0..${revision.hours.length - 1}); toHour ${request.toHour} is outside it`);
        }
        const active = (await tx.find(ScheduleAdjustment, { revision: revision.id, undoneAt: null }, { orderBy: { id: 'asc' } })).map((a) => ({ ...a }));
        this.replay(revision, [...active, request], (m) => new BadRequestException(m));
        const adjustment = tx.create(ScheduleAdjustment, {
          revision,
          zoneCode: zone.code,
          kind: request.kind,
          fromHour: request.fromHour,
          toHour: request.toHour,
          value: request.value,
          reason: request.reason,
          by: tx.getReference(User, user.id),
          at: asOf ?? new Date(),
        });
        await tx.flush();
        this.audit.stage(tx, user, {
          action: 'schedule.adjust',
          subjectType: 'schedule',
          subjectId: revision.id,
          after: {
            zone: zone.code,
            operatingDay: day,
            revision: revision.revision,
            adjustmentId: adjustment.id,
            kind: request.kind,
            hours: `${revision.hours[request.fromHour].hourEnding}..${revision.hours[request.toHour].hourEnding}`,
            value: request.value,
          },
          reason: request.reason,
          at: asOf,
        });
        made.push(adjustment);
        revisions.push(revision);
      }
      await tx.flush();
      await tx.populate(made, ['by']);
      const dtos = [];
      for (const r of revisions) dtos.push(await this.dto(tx, r));
      return { adjustments: made.map(toAdjustmentDto), revisions: dtos };
    });
    for (const r of result.revisions) this.announce('adjust', r);
    return result;
  }

  async undo(user: AuthUser, id: number): Promise<ScheduleRevisionDto> {
    const dto = await this.em.fork().transactional(async (tx) => {
      const adjustment = await tx.findOne(ScheduleAdjustment, { id });
      if (!adjustment) throw new NotFoundException(`No schedule adjustment ${id}`);
      const revision = await tx.findOneOrFail(ScheduleRevision, { id: adjustment.revision.id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
      await tx.populate(revision, ['zone']);
      this.editable(revision, 'undo an adjustment of');
      if (adjustment.undoneAt) throw new ConflictException(`Adjustment ${id} is already undone`);
      const rest = (await tx.find(ScheduleAdjustment, { revision: revision.id, undoneAt: null, id: { $ne: id } }, { orderBy: { id: 'asc' } })).map((a) => ({ ...a }));
      this.replay(revision, rest, (m) => new ConflictException(`Undoing adjustment ${id} would leave ${m}; undo the later adjustment first`));
      adjustment.undoneAt = new Date();
      adjustment.undoneBy = tx.getReference(User, user.id);
      this.audit.stage(tx, user, {
        action: 'schedule.adjust-undo',
        subjectType: 'schedule',
        subjectId: revision.id,
        after: { zone: revision.zone.code, operatingDay: revision.operatingDay, revision: revision.revision, adjustmentId: id, kind: adjustment.kind, value: adjustment.value },
        reason: adjustment.reason,
      });
      await tx.flush();
      return this.dto(tx, revision);
    });
    this.announce('adjust-undo', dto);
    return dto;
  }

  private async lockRevision(tx: EntityManager, id: number): Promise<ScheduleRevision> {
    const revision = await tx.findOne(ScheduleRevision, { id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!revision) throw new NotFoundException(`No schedule revision ${id}`);
    await tx.populate(revision, [...USERS]);
    return revision;
  }

  async submit(user: AuthUser, id: number, comment: string | undefined, now = new Date()): Promise<ScheduleRevisionDto> {
    const dto = await this.em.fork().transactional(async (tx) => {
      const revision = await this.lockRevision(tx, id);
      this.editable(revision, 'submit');
      const missing = revision.hours.filter((h) => h.adjustedMw === null).map((h) => h.hourEnding);
      if (missing.length) throw new BadRequestException(`${revision.zone.code} ${revision.operatingDay} has no value for ${missing.join(', ')}; set those hours first`);
      const gate = new Date(gateClosureAt(revision.operatingDay, revision.zone.timeZone, revision.zone.gateClosure));
      const late = now >= gate;
      if (late && !may(user.role, 'supervise')) {
        throw new ForbiddenException(`Gate closure for ${revision.zone.code} ${revision.operatingDay} passed at ${gate.toISOString()}; only a supervisor may submit now, and it is marked late`);
      }
      revision.state = 'submitted';
      revision.submittedBy = tx.getReference(User, user.id);
      revision.submittedAt = now;
      revision.submitComment = comment?.trim() || null;
      revision.late = late;
      this.audit.stage(tx, user, {
        action: 'schedule.submit',
        subjectType: 'schedule',
        subjectId: id,
        after: { zone: revision.zone.code, operatingDay: revision.operatingDay, revision: revision.revision, late, gateClosureAt: gate.toISOString() },
        reason: revision.submitComment,
        at: now,
      });
      await tx.flush();
      return this.dto(tx, revision);
    });
    this.announce('submit', dto);
    return dto;
  }

  async returnToOperators(user: AuthUser, id: number, comment: string): Promise<ScheduleRevisionDto> {
    const dto = await this.em.fork().transactional(async (tx) => {
      const revision = await this.lockRevision(tx, id);
      if (revision.state !== 'submitted') throw new ConflictException(`Only a submitted schedule can be returned; revision ${revision.revision} of ${revision.zone.code} ${revision.operatingDay} is ${revision.state}`);
      revision.state = 'returned';
      revision.returnedBy = tx.getReference(User, user.id);
      revision.returnedAt = new Date();
      revision.returnComment = comment;
      this.audit.stage(tx, user, { action: 'schedule.return', subjectType: 'schedule', subjectId: id, after: { zone: revision.zone.code, operatingDay: revision.operatingDay, revision: revision.revision }, reason: comment });
      await tx.flush();
      return this.dto(tx, revision);
    });
    this.announce('return', dto);
    return dto;
  }

  /**
   * Approval publishes; the e-mails go out after the publication has committed and cannot undo it.
   * `asOf`: only for work replayed as of a past time (src/replay); HTTP callers never pass it.
   */
  async approve(user: AuthUser, id: number, asOf?: Date): Promise<ScheduleRevisionDto> {
    const { dto, zoneName } = await this.em.fork().transactional(async (tx) => {
      const revision = await this.lockRevision(tx, id);
      if (revision.state !== 'submitted') {
        throw new ConflictException(
          revision.state === 'published' || revision.state === 'superseded'
            ? `Revision ${revision.revision} of ${revision.zone.code} ${revision.operatingDay} is already ${revision.state}; it cannot be changed`
            : `Revision ${revision.revision} of ${revision.zone.code} ${revision.operatingDay} is ${revision.state}; it must be submitted before it is approved`,
        );
      }
      if (revision.submittedBy?.id === user.id) throw new ForbiddenException('A supervisor cannot approve a schedule they submitted; another supervisor must approve it');
      const k = key(revision.zone, revision.operatingDay);
      const previous = await tx.findOne(ScheduleRevision, { publishedKey: k }, { lockMode: LockMode.PESSIMISTIC_WRITE });
      const now = asOf ?? new Date();
      if (previous) {
        previous.state = 'superseded';
        previous.publishedKey = null;
        previous.supersededAt = now;
        await tx.flush();
      }
      revision.state = 'published';
      revision.workingKey = null;
      revision.publishedKey = k;
      revision.publishedBy = tx.getReference(User, user.id);
      revision.publishedAt = now;
      const after = { zone: revision.zone.code, operatingDay: revision.operatingDay, revision: revision.revision, late: revision.late, supersedes: previous?.revision ?? null };
      this.audit.stage(tx, user, { action: 'schedule.approve', subjectType: 'schedule', subjectId: id, after, reason: revision.correctionReason, at: asOf });
      this.audit.stage(tx, user, { action: 'schedule.publish', subjectType: 'schedule', subjectId: id, after, reason: revision.correctionReason, at: asOf });
      await tx.flush();
      return { dto: await this.dto(tx, revision), zoneName: revision.zone.name };
    });
    this.announce('publish', dto);
    const mailed = await this.notifier.publication(user, dto, zoneName);
    if (mailed) this.announce('mail', mailed);
    return mailed ?? dto;
  }

  async correction(user: AuthUser, day: string, code: string, reason: string): Promise<ScheduleRevisionDto> {
    this.checkDay(day);
    try {
      const dto = await this.em.fork().transactional(async (tx) => {
        const [zone] = await this.zones(tx, [code]);
        const published = await tx.findOne(ScheduleRevision, { publishedKey: key(zone, day) }, { lockMode: LockMode.PESSIMISTIC_WRITE });
        if (!published) throw new ConflictException(`There is no published ${code} schedule for ${day} to correct`);
        const working = await tx.findOne(ScheduleRevision, { workingKey: key(zone, day) });
        if (working) throw new ConflictException(`Revision ${working.revision} of ${code} ${day} is already being worked on (${working.state})`);
        const last = await tx.findOneOrFail(ScheduleRevision, { zone: zone.id, operatingDay: day }, { orderBy: { revision: 'desc' } });
        const revision = tx.create(ScheduleRevision, {
          zone: tx.getReference(Zone, zone.id),
          operatingDay: day,
          revision: last.revision + 1,
          state: 'draft',
          workingKey: key(zone, day),
          publishedKey: null,
          forecastRunId: published.forecastRunId,
          forecastIssuedAt: published.forecastIssuedAt,
          forecastReplayed: published.forecastReplayed,
          hours: published.hours.map((h) => ({ ...h, startMw: h.adjustedMw })),
          createdBy: tx.getReference(User, user.id),
          createdAt: new Date(),
          late: false,
          correctionReason: reason,
        });
        await tx.flush();
        this.audit.stage(tx, user, {
          action: 'schedule.correction',
          subjectType: 'schedule',
          subjectId: revision.id,
          after: { zone: code, operatingDay: day, revision: revision.revision, correcting: published.revision },
          reason,
        });
        await tx.flush();
        return this.dto(tx, revision);
      });
      this.announce('correction', dto);
      return dto;
    } catch (err) {
      if (err instanceof UniqueConstraintViolationException) throw new ConflictException(`${code} ${day} is already being corrected`);
      throw err;
    }
  }

  async revisions(day: string, code: string): Promise<ScheduleRevisionDto[]> {
    this.checkDay(day);
    const em = this.em.fork();
    const [zone] = await this.zones(em, [code]);
    const rows = await em.find(ScheduleRevision, { zone: zone.id, operatingDay: day }, { populate: [...USERS], orderBy: { revision: 'desc' } });
    const adjustments = await this.adjustmentsOf(em, rows);
    return rows.map((r) => toRevisionDto(r, adjustments));
  }

  async revision(id: number): Promise<ScheduleRevisionDto> {
    const em = this.em.fork();
    const revision = await em.findOne(ScheduleRevision, { id });
    if (!revision) throw new NotFoundException(`No schedule revision ${id}`);
    return this.dto(em, revision);
  }

  /** A revision for export, with the publisher's e-mail; only published (or since superseded) ones. */
  async forExport(id: number): Promise<{ revision: ScheduleRevisionDto; publishedByEmail: string }> {
    const em = this.em.fork();
    const revision = await em.findOne(ScheduleRevision, { id }, { populate: [...USERS] });
    if (!revision) throw new NotFoundException(`No schedule revision ${id}`);
    if (!revision.publishedBy || (revision.state !== 'published' && revision.state !== 'superseded')) {
      throw new ConflictException(`Revision ${revision.revision} of ${revision.zone.code} ${revision.operatingDay} is ${revision.state}; only published schedules are exported`);
    }
    return { revision: await this.dto(em, revision), publishedByEmail: revision.publishedBy.email };
  }
}
