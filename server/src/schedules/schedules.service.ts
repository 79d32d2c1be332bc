import { UniqueConstraintViolationException } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import {
  formatLocalTime,
  formatUtcTime,
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
import { ZonesRepository } from '../zones/zones.repository';
import type { ScheduleAdjustment } from './entities/schedule-adjustment.entity';
import type { ScheduleRevision } from './entities/schedule-revision.entity';
import { REVISION_RELATIONS, toAdjustmentDto, toRevisionDto } from './schedule-dto';
import { layForecast, type LaidForecast } from './schedule-forecast-layout';
import { ScheduleNotifier } from './schedule-notifier';
import { revisionKey, ScheduleRevisionsRepository } from './schedule-revisions.repository';
import { stateAfter, transitionRefusal, type ScheduleAction } from './schedule-transitions';

const key = (zone: Zone, day: string) => revisionKey(zone.id, day);

/** The latest stored run when it was issued after the run the revision started from (see ZoneScheduleDto.newerForecast). */
export function newerForecast(revision: Pick<ScheduleRevision, 'forecastRunId' | 'forecastIssuedAt'> | undefined, latest: Pick<LaidForecast, 'runId' | 'issuedAt' | 'replayed'>): ZoneScheduleDto['newerForecast'] {
  if (!revision || latest.runId === null || latest.replayed || latest.runId === revision.forecastRunId) return null;
  if (revision.forecastIssuedAt && Date.parse(latest.issuedAt) <= revision.forecastIssuedAt.getTime()) return null;
  return { runId: latest.runId, issuedAt: latest.issuedAt, revisionRunId: revision.forecastRunId, revisionIssuedAt: revision.forecastIssuedAt?.toISOString() ?? null };
}
const at = (r: ScheduleRevision) => ({ state: r.state, revision: r.revision, zone: r.zone.code, operatingDay: r.operatingDay });

/**
 * The day-ahead schedule workflow: drafts from the latest forecast, adjustments (replayed from the
 * start values on every change), back to the model, a fresh start from a newer forecast run,
 * submission, return, approval = publication, corrections that carry the adjustments forward.
 * Every change is one transaction with its audit entry; desks are told after it commits.
 */
@Injectable()
export class SchedulesService {
  constructor(
    private readonly revisionsRepo: ScheduleRevisionsRepository,
    private readonly zoneRows: ZonesRepository,
    private readonly audit: AuditService,
    private readonly events: DomainEventsPublisher,
    private readonly forecasts: ForecastsService,
    private readonly notifier: ScheduleNotifier,
  ) {}

  private checkDay(day: string): void {
    if (!isOperatingDay(day)) throw new BadRequestException(`"${day}" is not an operating day (yyyy-MM-dd)`);
  }

  private zones(em: EntityManager, codes?: readonly string[]): Promise<Zone[]> {
    return this.zoneRows.activeByCodes(codes, em);
  }

  private async dto(em: EntityManager, revision: ScheduleRevision): Promise<ScheduleRevisionDto> {
    await em.populate(revision, [...REVISION_RELATIONS]);
    return toRevisionDto(revision, await this.revisionsRepo.adjustmentsOf(em, [revision]));
  }

  private announce(action: DeskScheduleEvent['action'], r: ScheduleRevisionDto): void {
    this.events.publish(DOMAIN_EVENTS.scheduleChanged, { action, zone: r.zone, operatingDay: r.operatingDay, revisionId: r.id, revision: r.revision, state: r.state });
  }

  /**
   * The latest forecast (stored run, or the seasonal-naive stand-in) laid onto the day's hours; with
   * `asOf` (work replayed as of a past time, never HTTP) the run the desk had then.
   */
  private async forecastHours(zone: Zone, day: string, slots: ScheduleHourSlot[], asOf?: Date): Promise<LaidForecast> {
    const { from, to } = operatingDayBounds(day, zone.timeZone);
    const past = asOf ? await this.forecasts.runAsOf(zone.id, asOf) : null;
    if (asOf && !past) throw new ConflictException(`No forecast run of ${zone.code} had been stored by ${formatUtcTime(asOf)}`);
    const run = past ? toForecastRunDto(past, zone.code, from, to) : (await this.forecasts.latest([zone.code], new Date(from), new Date(to))).zones[0];
    return layForecast(run, slots);
  }

  async day(day: string, codes: readonly string[] | undefined, now = new Date()): Promise<DayScheduleDto> {
    this.checkDay(day);
    const em = this.revisionsRepo.fork();
    const zones = await this.zones(em, codes);
    const revisions = await this.revisionsRepo.current(em, zones.map((z) => z.id), day);
    const adjustments = await this.revisionsRepo.adjustmentsOf(em, revisions);
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
        newerForecast: newerForecast(working ?? published, forecast),
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
    const em = this.revisionsRepo.fork();
    const [zone] = await this.zones(em, [code]);
    const existing = await this.revisionsRepo.working(em, zone.id, day);
    if (existing) return this.dto(em, existing);
    if (await this.revisionsRepo.isPublished(em, zone.id, day)) {
      throw new ConflictException(`The ${code} schedule for ${day} is published; a change is a correction (a new revision with a reason)`);
    }
    const slots = operatingDaySlots(day, zone.timeZone);
    const forecast = await this.forecastHours(zone, day, slots, asOf);
    try {
      const dto = await em.transactional(async (tx) => {
        const revision = await this.addDraft(tx, zone, day, user, {
          forecastRunId: forecast.runId,
          forecastIssuedAt: new Date(forecast.issuedAt),
          forecastReplayed: forecast.replayed,
          hours: forecast.hours,
          createdAt: asOf ?? new Date(),
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
      const other = await this.revisionsRepo.working(this.revisionsRepo.fork(), zone.id, day);
      if (!other) throw err;
      return this.dto(this.revisionsRepo.fork(), other);
    }
  }

  /** The next revision of the zone's day, as a draft on the given forecast (a first draft or a correction). */
  private async addDraft(
    tx: EntityManager,
    zone: Zone,
    day: string,
    user: AuthUser,
    source: Pick<ScheduleRevision, 'forecastRunId' | 'forecastIssuedAt' | 'forecastReplayed' | 'hours' | 'createdAt'> & { correctionReason?: string },
  ): Promise<ScheduleRevision> {
    const last = await this.revisionsRepo.lastNumber(tx, zone.id, day);
    return this.revisionsRepo.add(tx, {
      zone: tx.getReference(Zone, zone.id),
      operatingDay: day,
      revision: last + 1,
      state: 'draft',
      workingKey: key(zone, day),
      publishedKey: null,
      createdBy: tx.getReference(User, user.id),
      late: false,
      ...source,
    });
  }

  /** Refuses (409) an action the workflow does not allow from the revision's state (schedule-transitions.ts). */
  private allowed(revision: ScheduleRevision, action: ScheduleAction): void {
    const refusal = transitionRefusal(action, at(revision));
    if (refusal) throw new ConflictException(refusal);
  }

  /**
   * The zone/day's working revision, locked for the rest of the transaction, for adjustments (one
   * or a batch). Refused (409) when there is none — published, so a correction is needed, or never
   * drafted — or when its state allows no adjustment (submitted).
   */
  private async adjustableRevision(tx: EntityManager, zone: Zone, day: string): Promise<ScheduleRevision> {
    const revision = await this.revisionsRepo.lockWorking(tx, zone.id, day);
    if (!revision) {
      const published = await this.revisionsRepo.isPublished(tx, zone.id, day);
      throw published
        ? new ConflictException(`The ${zone.code} schedule for ${day} is published and cannot be changed; start a correction`)
        : new ConflictException(`There is no ${zone.code} draft for ${day}; start one first`);
    }
    await tx.populate(revision, ['zone']);
    this.allowed(revision, 'adjust');
    return revision;
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
    const result = await this.revisionsRepo.fork().transactional(async (tx) => {
      const zones = await this.zones(tx, codes);
      const made: ScheduleAdjustment[] = [];
      const revisions: ScheduleRevision[] = [];
      for (const zone of zones) {
        const revision = await this.adjustableRevision(tx, zone, day);
        if (request.toHour >= revision.hours.length) {
          throw new BadRequestException(`${zone.code} ${day} has ${revision.hours.length} hours (0..${revision.hours.length - 1}); toHour ${request.toHour} is outside it`);
        }
        const active = (await this.revisionsRepo.activeAdjustments(tx, revision.id)).map((a) => ({ ...a }));
        this.replay(revision, [...active, request], (m) => new BadRequestException(m));
        const adjustment = this.revisionsRepo.addAdjustment(tx, {
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

  /**
   * One "add" per hour on a zone's draft, added together (a weather what-if turned into
   * adjustments): one transaction, so all are added or none; one audit entry naming them; one
   * batch (the first adjustment's id), undone together by `undoBatch`. Refused like a single
   * adjustment when there is no draft, or the schedule is submitted or published.
   */
  async addBatch(user: AuthUser, day: string, zoneCode: string, hours: ReadonlyArray<{ hour: number; value: number }>, reason: string, source: Record<string, string | number | null>): Promise<AdjustmentResultDto> {
    this.checkDay(day);
    if (!hours.length) throw new BadRequestException('No hour of the what-if changes the load by 0.1 MW or more: there is nothing to add');
    const result = await this.revisionsRepo.fork().transactional(async (tx) => {
      const [zone] = await this.zones(tx, [zoneCode]);
      const revision = await this.adjustableRevision(tx, zone, day);
      const items = hours.map((h) => ({ kind: 'add' as const, fromHour: h.hour, toHour: h.hour, value: h.value }));
      for (const it of items) {
        if (!Number.isInteger(it.fromHour) || it.fromHour < 0 || it.fromHour >= revision.hours.length) throw new BadRequestException(`${zone.code} ${day} has ${revision.hours.length} hours; hour ${it.fromHour} is outside it`);
      }
      const active = (await this.revisionsRepo.activeAdjustments(tx, revision.id)).map((a) => ({ ...a }));
      this.replay(revision, [...active, ...items], (m) => new BadRequestException(m));
      const at = new Date();
      const made = items.map((it) => this.revisionsRepo.addAdjustment(tx, { revision, zoneCode: zone.code, ...it, reason, by: tx.getReference(User, user.id), at }));
      await tx.flush();
      const batchId = made[0].id;
      for (const a of made) a.batchId = batchId;
      this.audit.stage(tx, user, {
        action: 'schedule.adjust-batch',
        subjectType: 'schedule',
        subjectId: revision.id,
        after: {
          zone: zone.code,
          operatingDay: day,
          revision: revision.revision,
          batchId,
          adjustments: made.length,
          hours: made.map((a) => revision.hours[a.fromHour].hourEnding).join(','),
          totalMwh: Math.round(items.reduce((s, it) => s + it.value, 0) * 10) / 10,
          ...source,
        },
        reason,
      });
      await tx.flush();
      await tx.populate(made, ['by']);
      return { adjustments: made.map(toAdjustmentDto), revisions: [await this.dto(tx, revision)] };
    });
    for (const r of result.revisions) this.announce('adjust', r);
    return result;
  }

  /** Undoes every adjustment of a batch still in force, together, audited once. */
  async undoBatch(user: AuthUser, batchId: number): Promise<ScheduleRevisionDto> {
    const dto = await this.revisionsRepo.fork().transactional(async (tx) => {
      const first = await this.revisionsRepo.adjustment(tx, batchId);
      if (!first || first.batchId !== batchId) throw new NotFoundException(`No batch of schedule adjustments ${batchId}`);
      const revision = await this.revisionsRepo.lockOf(tx, first);
      await tx.populate(revision, ['zone']);
      this.allowed(revision, 'undo');
      const all = await this.revisionsRepo.activeAdjustments(tx, revision.id);
      const batch = all.filter((a) => a.batchId === batchId);
      if (!batch.length) throw new ConflictException(`The adjustments of batch ${batchId} are already undone`);
      const rest = all.filter((a) => a.batchId !== batchId).map((a) => ({ ...a }));
      this.replay(revision, rest, (m) => new ConflictException(`Undoing batch ${batchId} would leave ${m}; undo the later adjustment first`));
      const now = new Date();
      for (const a of batch) {
        a.undoneAt = now;
        a.undoneBy = tx.getReference(User, user.id);
      }
      this.audit.stage(tx, user, {
        action: 'schedule.adjust-batch-undo',
        subjectType: 'schedule',
        subjectId: revision.id,
        after: { zone: revision.zone.code, operatingDay: revision.operatingDay, revision: revision.revision, batchId, adjustments: batch.length },
        reason: first.reason,
      });
      await tx.flush();
      return this.dto(tx, revision);
    });
    this.announce('adjust-undo', dto);
    return dto;
  }

  async undo(user: AuthUser, id: number): Promise<ScheduleRevisionDto> {
    const dto = await this.revisionsRepo.fork().transactional(async (tx) => {
      const adjustment = await this.revisionsRepo.adjustment(tx, id);
      if (!adjustment) throw new NotFoundException(`No schedule adjustment ${id}`);
      const revision = await this.revisionsRepo.lockOf(tx, adjustment);
      await tx.populate(revision, ['zone']);
      this.allowed(revision, 'undo');
      if (adjustment.undoneAt) throw new ConflictException(`Adjustment ${id} is already undone`);
      const rest = (await this.revisionsRepo.activeAdjustments(tx, revision.id, id)).map((a) => ({ ...a }));
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
    const revision = await this.revisionsRepo.lock(tx, id);
    if (!revision) throw new NotFoundException(`No schedule revision ${id}`);
    return revision;
  }

  async submit(user: AuthUser, id: number, comment: string | undefined, now = new Date()): Promise<ScheduleRevisionDto> {
    const dto = await this.revisionsRepo.fork().transactional(async (tx) => {
      const revision = await this.lockRevision(tx, id);
      this.allowed(revision, 'submit');
      const missing = revision.hours.filter((h) => h.adjustedMw === null).map((h) => h.hourEnding);
      if (missing.length) throw new BadRequestException(`${revision.zone.code} ${revision.operatingDay} has no value for ${missing.join(', ')}; set those hours first`);
      const gate = new Date(gateClosureAt(revision.operatingDay, revision.zone.timeZone, revision.zone.gateClosure));
      const late = now >= gate;
      if (late && !may(user.role, 'supervise')) {
        throw new ForbiddenException(`Gate closure for ${revision.zone.code} ${revision.operatingDay} passed at ${formatLocalTime(gate, revision.zone.timeZone)}; only a supervisor may submit now, and it is marked late`);
      }
      revision.state = stateAfter('submit', revision.state);
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
    const dto = await this.revisionsRepo.fork().transactional(async (tx) => {
      const revision = await this.lockRevision(tx, id);
      this.allowed(revision, 'return');
      revision.state = stateAfter('return', revision.state);
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
    const { dto, zoneName, timeZone } = await this.revisionsRepo.fork().transactional(async (tx) => {
      const revision = await this.lockRevision(tx, id);
      this.allowed(revision, 'approve');
      if (revision.submittedBy?.id === user.id) throw new ForbiddenException('A supervisor cannot approve a schedule they submitted; another supervisor must approve it');
      const k = key(revision.zone, revision.operatingDay);
      const previous = await this.revisionsRepo.lockPublished(tx, revision.zone.id, revision.operatingDay);
      const now = asOf ?? new Date();
      if (previous) {
        previous.state = stateAfter('supersede', previous.state);
        previous.publishedKey = null;
        previous.supersededAt = now;
        await tx.flush();
      }
      revision.state = stateAfter('approve', revision.state);
      revision.workingKey = null;
      revision.publishedKey = k;
      revision.publishedBy = tx.getReference(User, user.id);
      revision.publishedAt = now;
      const after = { zone: revision.zone.code, operatingDay: revision.operatingDay, revision: revision.revision, late: revision.late, supersedes: previous?.revision ?? null };
      this.audit.stage(tx, user, { action: 'schedule.approve', subjectType: 'schedule', subjectId: id, after, reason: revision.correctionReason, at: asOf });
      this.audit.stage(tx, user, { action: 'schedule.publish', subjectType: 'schedule', subjectId: id, after, reason: revision.correctionReason, at: asOf });
      await tx.flush();
      return { dto: await this.dto(tx, revision), zoneName: revision.zone.name, timeZone: revision.zone.timeZone };
    });
    this.announce('publish', dto);
    const mailed = await this.notifier.publication(user, dto, { name: zoneName, timeZone });
    if (mailed) this.announce('mail', mailed);
    return mailed ?? dto;
  }

  async correction(user: AuthUser, day: string, code: string, reason: string): Promise<ScheduleRevisionDto> {
    this.checkDay(day);
    try {
      const dto = await this.revisionsRepo.fork().transactional(async (tx) => {
        const [zone] = await this.zones(tx, [code]);
        const published = await this.revisionsRepo.lockPublished(tx, zone.id, day);
        if (!published) throw new ConflictException(`There is no published ${code} schedule for ${day} to correct`);
        const working = await this.revisionsRepo.working(tx, zone.id, day);
        if (working) throw new ConflictException(`Revision ${working.revision} of ${code} ${day} is already being worked on (${working.state})`);
        // The correction keeps the published revision's run and start values and carries its
        // adjustments forward with their reasons, so the values start as published and each
        // earlier change stays explained and can be undone.
        const carried = await this.revisionsRepo.activeAdjustments(tx, published.id);
        const revision = await this.addDraft(tx, zone, day, user, {
          forecastRunId: published.forecastRunId,
          forecastIssuedAt: published.forecastIssuedAt,
          forecastReplayed: published.forecastReplayed,
          hours: published.hours.map((h) => ({ ...h })),
          createdAt: new Date(),
          correctionReason: reason,
        });
        await tx.flush();
        for (const a of carried) {
          this.revisionsRepo.addAdjustment(tx, {
            revision,
            zoneCode: a.zoneCode,
            kind: a.kind,
            fromHour: a.fromHour,
            toHour: a.toHour,
            value: a.value,
            reason: a.reason,
            by: a.by,
            at: a.at,
            carriedFromRevision: a.carriedFromRevision ?? published.revision,
          });
        }
        await tx.populate(revision, ['zone']);
        this.replay(revision, carried, (m) => new ConflictException(`The published adjustments no longer apply: ${m}`));
        await tx.flush();
        this.audit.stage(tx, user, {
          action: 'schedule.correction',
          subjectType: 'schedule',
          subjectId: revision.id,
          after: { zone: code, operatingDay: day, revision: revision.revision, correcting: published.revision, carriedAdjustments: carried.length },
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

  /**
   * Back to the model: every adjustment in force on the working revision is undone (kept in the
   * list, struck through, each with who undid it) and the hours go back to the model values of the
   * revision's forecast run.
   */
  async backToModel(user: AuthUser, id: number): Promise<ScheduleRevisionDto> {
    const dto = await this.revisionsRepo.fork().transactional(async (tx) => {
      const revision = await this.lockRevision(tx, id);
      this.allowed(revision, 'undo');
      const active = await this.revisionsRepo.activeAdjustments(tx, revision.id);
      const atModel = revision.hours.every((h) => h.startMw === h.modelMw);
      if (active.length === 0 && atModel) throw new ConflictException(`Revision ${revision.revision} of ${revision.zone.code} ${revision.operatingDay} already shows the model values`);
      const now = new Date();
      for (const a of active) {
        a.undoneAt = now;
        a.undoneBy = tx.getReference(User, user.id);
      }
      revision.hours = revision.hours.map((h) => ({ ...h, startMw: h.modelMw, adjustedMw: h.modelMw }));
      this.audit.stage(tx, user, {
        action: 'schedule.back-to-model',
        subjectType: 'schedule',
        subjectId: id,
        after: { zone: revision.zone.code, operatingDay: revision.operatingDay, revision: revision.revision, undoneAdjustments: active.map((a) => a.id), forecastRunId: revision.forecastRunId },
      });
      await tx.flush();
      return this.dto(tx, revision);
    });
    this.announce('back-to-model', dto);
    return dto;
  }

  /**
   * Start again from the latest forecast run: the working revision takes the latest run's model
   * values as its start values and the adjustments in force are applied again on them, in order
   * (refused, naming the hour, when one no longer applies: undo it first).
   */
  async restartFromLatest(user: AuthUser, id: number): Promise<ScheduleRevisionDto> {
    const em = this.revisionsRepo.fork();
    const current = await this.revisionsRepo.byId(em, id, true);
    if (!current) throw new NotFoundException(`No schedule revision ${id}`);
    const forecast = await this.forecastHours(current.zone, current.operatingDay, operatingDaySlots(current.operatingDay, current.zone.timeZone));
    if (forecast.runId === null) throw new ConflictException(`No forecast run of ${current.zone.code} is stored to start again from`);
    const dto = await this.revisionsRepo.fork().transactional(async (tx) => {
      const revision = await this.lockRevision(tx, id);
      this.allowed(revision, 'adjust');
      if (revision.forecastRunId === forecast.runId) throw new ConflictException(`Revision ${revision.revision} of ${revision.zone.code} ${revision.operatingDay} already starts from the latest run (${forecast.runId})`);
      const before = { forecastRunId: revision.forecastRunId, forecastIssuedAt: revision.forecastIssuedAt?.toISOString() ?? null };
      revision.forecastRunId = forecast.runId;
      revision.forecastIssuedAt = new Date(forecast.issuedAt);
      revision.forecastReplayed = forecast.replayed;
      revision.hours = forecast.hours;
      const active = (await this.revisionsRepo.activeAdjustments(tx, revision.id)).map((a) => ({ ...a }));
      this.replay(revision, active, (m) => new ConflictException(`An adjustment in force does not apply to the latest run: ${m}; undo it first`));
      this.audit.stage(tx, user, {
        action: 'schedule.restart',
        subjectType: 'schedule',
        subjectId: id,
        before,
        after: { zone: revision.zone.code, operatingDay: revision.operatingDay, revision: revision.revision, forecastRunId: forecast.runId, forecastIssuedAt: forecast.issuedAt, adjustmentsReapplied: active.length },
      });
      await tx.flush();
      return this.dto(tx, revision);
    });
    this.announce('restart', dto);
    return dto;
  }

  async revisions(day: string, code: string): Promise<ScheduleRevisionDto[]> {
    this.checkDay(day);
    const em = this.revisionsRepo.fork();
    const [zone] = await this.zones(em, [code]);
    const rows = await this.revisionsRepo.ofDay(em, zone.id, day);
    const adjustments = await this.revisionsRepo.adjustmentsOf(em, rows);
    return rows.map((r) => toRevisionDto(r, adjustments));
  }

  async revision(id: number): Promise<ScheduleRevisionDto> {
    const em = this.revisionsRepo.fork();
    const revision = await this.revisionsRepo.byId(em, id);
    if (!revision) throw new NotFoundException(`No schedule revision ${id}`);
    return this.dto(em, revision);
  }

  /** A revision for export, with the publisher's e-mail; only published (or since superseded) ones. */
  async forExport(id: number): Promise<{ revision: ScheduleRevisionDto; publishedByEmail: string }> {
    const em = this.revisionsRepo.fork();
    const revision = await this.revisionsRepo.byId(em, id, true);
    if (!revision) throw new NotFoundException(`No schedule revision ${id}`);
    if (!revision.publishedBy || (revision.state !== 'published' && revision.state !== 'superseded')) {
      throw new ConflictException(`Revision ${revision.revision} of ${revision.zone.code} ${revision.operatingDay} is ${revision.state}; only published schedules are exported`);
    }
    return { revision: await this.dto(em, revision), publishedByEmail: revision.publishedBy.email };
  }
}
