import { ConflictException, Injectable, Logger, NotFoundException, type BeforeApplicationShutdown } from '@nestjs/common';
import { OnEvent } from '@nestjs/event-emitter';
import { HOUR_MS, type AlertDto, type AlertState, type CommittedBasis, type DeskScheduleEvent } from '@morrowline/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../common/auth-user';
import { DOMAIN_EVENTS, type ReadingsStored } from '../events/domain-events';
import { DomainEventsPublisher } from '../events/domain-events.publisher';
import { CommittedLoadService } from '../live/committed-load.service';
import { ReadingsService } from '../readings/readings.service';
import type { Zone } from '../zones/entities/zone.entity';
import { ZonesRepository } from '../zones/zones.repository';
import { AlertsRepository } from './alerts.repository';
import { deviationRuns } from './deviation';
import type { DeviationAlert } from './entities/deviation-alert.entity';

/**
 * Only hours this recent raise alerts: an alert is for the desk on shift, not for a backfill of
 * last month's history (which would bury today's alerts under old ones).
 */
export const ALERT_LOOKBACK_HOURS = 48;

export function toAlertDto(alert: DeviationAlert): AlertDto {
  return {
    id: alert.id,
    zone: alert.zone.code,
    start: alert.start.toISOString(),
    end: alert.end.toISOString(),
    peakDeviationPct: Math.round(alert.peakDeviationPct * 100) / 100,
    comparedWith: alert.comparedWith,
    committedMw: alert.committedMw === null ? null : Math.round(alert.committedMw * 10) / 10,
    thresholdPct: alert.thresholdPct,
    consecutiveHours: alert.consecutiveHours,
    state: alert.state,
    raisedAt: alert.raisedAt.toISOString(),
    acknowledgedAt: alert.acknowledgedAt ? alert.acknowledgedAt.toISOString() : null,
    acknowledgedBy: alert.acknowledgedByEmail,
    acknowledgedByName: alert.acknowledgedByName,
    comment: alert.comment,
  };
}

/** Where the peak of a run was measured against, and the committed MW there. */
interface PeakHour {
  basis: CommittedBasis | null;
  committedMw: number | null;
}

/**
 * Deviation alerts. After each stored batch (the readings-stored event) the hours it touched are
 * compared with what the zone committed to for them (CommittedLoadService: the published
 * schedule, else the day-ahead forecast issued by gate closure); a run of the zone's N consecutive
 * hours beyond its threshold raises an alert, announced at once. Hours with nothing committed
 * raise none: a later run or last week's load is not what the desk promised. Evaluations run one
 * at a time, off the ingest path.
 */
@Injectable()
export class AlertsService implements BeforeApplicationShutdown {
  private readonly logger = new Logger(AlertsService.name);
  private readonly pending = new Map<number, Set<number>>();
  private running: Promise<void> | null = null;
  /** Looks again at recent hours started by events, until they have queued their evaluation. */
  private readonly reviews = new Set<Promise<void>>();

  constructor(
    private readonly alerts: AlertsRepository,
    private readonly zones: ZonesRepository,
    private readonly readings: ReadingsService,
    private readonly audit: AuditService,
    private readonly events: DomainEventsPublisher,
    private readonly committed: CommittedLoadService,
  ) {}

  /**
   * Notes the hours of a stored batch to look at; the evaluation follows as soon as the previous
   * one is done. Called while the readings are published, so it only queues.
   */
  @OnEvent(DOMAIN_EVENTS.readingsStored)
  enqueue(stored: ReadingsStored, now = Date.now()): void {
    const since = Math.floor(now / HOUR_MS) * HOUR_MS - ALERT_LOOKBACK_HOURS * HOUR_MS;
    for (const zone of stored.zones) {
      for (const hour of zone.hours) {
        const hourStart = Date.parse(hour);
        if (hourStart < since) continue;
        let hours = this.pending.get(zone.zoneId);
        if (!hours) this.pending.set(zone.zoneId, (hours = new Set()));
        hours.add(hourStart);
      }
    }
    if (this.pending.size > 0 && !this.running) this.running = this.drain();
  }

  /**
   * Looks again at the recent hours (ALERT_LOOKBACK_HOURS up to now) of these zones, every active
   * one when none are named. Readings are judged when they arrive, against what was committed
   * then; when the committed numbers come later (a schedule published for hours already read,
   * the first start's replay of day-ahead forecasts over the backfilled weeks) the same hours are
   * judged again, so a card never shows a deviation beyond the threshold that no alert names.
   * Widening an existing alert is idempotent, so looking twice raises nothing twice.
   */
  async reviewRecent(zoneCodes?: readonly string[], now = Date.now()): Promise<void> {
    const zones = (await this.zones.active()).filter((z) => !zoneCodes || zoneCodes.includes(z.code));
    const last = Math.floor(now / HOUR_MS) * HOUR_MS;
    const hours: string[] = [];
    for (let h = last - ALERT_LOOKBACK_HOURS * HOUR_MS; h < last; h += HOUR_MS) hours.push(new Date(h).toISOString());
    this.enqueue({ zones: zones.map((z) => ({ zoneId: z.id, zone: z.code, hours, mw: [] })), receivedAt: new Date(now).toISOString() }, now);
  }

  /** A schedule published (or corrected) for a day whose hours have been read already. */
  @OnEvent(DOMAIN_EVENTS.scheduleChanged)
  onScheduleChanged(event: DeskScheduleEvent): void {
    if (event.action !== 'publish' && event.action !== 'correction') return;
    // Not awaited by the publisher, so its failure (the database gone a moment, the server
    // closing) is logged here rather than left as an unhandled rejection, and shutdown waits for it.
    const review = this.reviewRecent([event.zone]).catch((error: unknown) =>
      this.logger.error(`looking again at ${event.zone}'s recent hours failed: ${(error as Error).message}`),
    );
    this.reviews.add(review);
    void review.finally(() => this.reviews.delete(review));
  }

  /** Resolves when every evaluation asked for so far has finished (tests, shutdown). */
  async settled(): Promise<void> {
    while (this.reviews.size > 0 || this.running) {
      await Promise.all(this.reviews);
      if (this.running) await this.running;
    }
  }

  /** The database pool closes after this: evaluations in hand finish first. */
  async beforeApplicationShutdown(): Promise<void> {
    await this.settled();
  }

  private async drain(): Promise<void> {
    try {
      while (this.pending.size > 0) {
        const [zoneId, hours] = this.pending.entries().next().value as [number, Set<number>];
        this.pending.delete(zoneId);
        try {
          await this.evaluate(zoneId, [...hours]);
        } catch (error) {
          this.logger.error(`alert evaluation for zone ${zoneId} failed: ${(error as Error).message}`);
        }
      }
    } finally {
      this.running = null;
    }
  }

  private async evaluate(zoneId: number, hours: number[]): Promise<void> {
    const zone = await this.zones.byId(zoneId);
    if (!zone || !zone.active) return;
    const n = zone.alertConsecutiveHours;
    const from = Math.min(...hours) - (n - 1) * HOUR_MS;
    const to = Math.max(...hours) + n * HOUR_MS;
    const count = (to - from) / HOUR_MS;
    const actual = new Array<number | null>(count).fill(null);
    for (const row of await this.readings.rows(zoneId, from, to)) actual[(row.hourStart - from) / HOUR_MS] = row.mw;
    const committed = await this.committed.forZone(zone, from, to);
    for (const run of deviationRuns(actual, committed.committed, zone.alertThresholdPct, n)) {
      const peak = { basis: committed.basis[run.peakIndex], committedMw: committed.committed[run.peakIndex] };
      await this.raise(zone, new Date(from + run.start * HOUR_MS), new Date(from + run.end * HOUR_MS), run.peakPct, peak);
    }
  }

  /** Opens an alert for the window, or widens the one it touches. */
  private async raise(zone: Zone, start: Date, end: Date, peakPct: number, peak: PeakHour): Promise<void> {
    const alert = await this.alerts.transaction(async (tx) => {
      const existing = await this.alerts.touching(tx, zone.id, start, end);
      if (existing) {
        const wider = start < existing.start || end > existing.end || Math.abs(peakPct) > Math.abs(existing.peakDeviationPct);
        if (!wider) return null;
        if (start < existing.start) existing.start = start;
        if (end > existing.end) existing.end = end;
        if (Math.abs(peakPct) > Math.abs(existing.peakDeviationPct)) {
          existing.peakDeviationPct = peakPct;
          existing.comparedWith = peak.basis;
          existing.committedMw = peak.committedMw;
        }
        return existing;
      }
      const created = await this.alerts.add(tx, {
        zone,
        start,
        end,
        peakDeviationPct: peakPct,
        comparedWith: peak.basis,
        committedMw: peak.committedMw,
        thresholdPct: zone.alertThresholdPct,
        consecutiveHours: zone.alertConsecutiveHours,
        state: 'open',
        raisedAt: new Date(),
        acknowledgedAt: null,
        acknowledgedById: null,
        acknowledgedByEmail: null,
        acknowledgedByName: null,
        comment: null,
      });
      this.audit.stage(tx, null, { action: 'alert.raise', subjectType: 'alert', subjectId: created.id, after: toAlertDto(created) });
      return created;
    });
    if (alert) this.events.publish(DOMAIN_EVENTS.alertRaised, toAlertDto(alert));
  }

  /** Open alerts by their hours, newest first; acknowledged ones (the history) newest acknowledgement first. */
  async list(state?: AlertState, zone?: string, limit = 200): Promise<AlertDto[]> {
    return (await this.alerts.list(state, zone, limit)).map(toAlertDto);
  }

  async acknowledge(actor: AuthUser, id: number, comment?: string): Promise<AlertDto> {
    const dto = await this.alerts.transaction(async (tx) => {
      const alert = await this.alerts.lock(tx, id);
      if (!alert) throw new NotFoundException(`No alert with id ${id}`);
      if (alert.state === 'acknowledged') throw new ConflictException(`Alert ${id} was already acknowledged by ${alert.acknowledgedByEmail ?? 'someone'}`);
      const before = toAlertDto(alert);
      alert.state = 'acknowledged';
      alert.acknowledgedAt = new Date();
      alert.acknowledgedById = actor.id;
      alert.acknowledgedByEmail = actor.email;
      alert.acknowledgedByName = actor.name;
      alert.comment = comment?.trim() || null;
      const after = toAlertDto(alert);
      this.audit.stage(tx, actor, { action: 'alert.acknowledge', subjectType: 'alert', subjectId: alert.id, before, after, reason: alert.comment });
      return after;
    });
    this.events.publish(DOMAIN_EVENTS.alertAcknowledged, dto);
    return dto;
  }
}
