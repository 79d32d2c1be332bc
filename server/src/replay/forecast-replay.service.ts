import type { EntityManager } from '@mikro-orm/mariadb';
import type { AuditService } from '../audit/audit.service';
import type { ComputeService } from '../compute/compute.service';
import { ForecastRun } from '../forecasts/entities/forecast-run.entity';
import { MAX_HORIZON_HOURS } from '../forecasts/forecast-horizon';
import type { ForecastsService } from '../forecasts/forecasts.service';
import { FIRST_MODEL_MIN_HOURS } from '../models/refits.service';
import { TRAINING_HOURS } from '../history/zone-history.loader';
import type { OutagesService } from '../outages/outages.service';
import type { ReadingsRepository } from '../readings/readings.repository';
import { operatingDaySlots } from '@morrowline/shared';
import { Zone } from '../zones/entities/zone.entity';
import { ReadingsTimeline } from './history-cut';
import { replaySteps, type ReplayRoutine, type ReplayStep } from './replay-timeline';
import { replayZone, type ReplayedForecast } from './zone-replay';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;
/** Days replayed at most per zone (the demo backfills six weeks, of which three are training). */
export const REPLAY_MAX_DAYS = 56;

export interface ZoneReplaySummary {
  zone: string;
  /** Days with a replayed run stored by this call. */
  stored: number;
  /** Days that already had one (an interrupted replay) or an issued run covering them. */
  kept: number;
  /** Days (with enough history) that got no run: the fit or update failed, as it can at the desk. */
  failed: number;
  first: string | null;
  last: string | null;
}

type IssuedSpan = { issuedAt: number; from: number; to: number };

/**
 * Replays the desk's daily forecasting over the history a zone already has (see zoneReplay), in
 * the compute pool's batch threads, and stores each day's forecast as a run with origin
 * 'replayed' and issuedAt the time the desk would have issued it. A day that already has a
 * replayed run, or a run the desk really issued before its gate closure, is left as it is, so a
 * replay that was interrupted can run again and an installation with its own history keeps it.
 */
export class ForecastReplayService {
  constructor(
    private readonly em: EntityManager,
    private readonly readings: ReadingsRepository,
    private readonly outages: OutagesService,
    private readonly forecasts: ForecastsService,
    private readonly compute: ComputeService,
    private readonly audit: AuditService,
    private readonly routine: ReplayRoutine,
  ) {}

  /** The zones' replays, two (the batch pool's threads) at a time; `log` gets a line per zone and week. */
  async replay(zones: readonly Zone[], now: number, log: (line: string) => void): Promise<ZoneReplaySummary[]> {
    const out: ZoneReplaySummary[] = [];
    const queue = [...zones];
    const worker = async () => {
      for (let zone = queue.shift(); zone; zone = queue.shift()) out.push(await this.replayOne(zone, now, log));
    };
    await Promise.all(Array.from({ length: Math.max(1, Math.min(this.compute.batchSize, zones.length)) }, worker));
    return zones.map((z) => out.find((s) => s.zone === z.code)!);
  }

  private async replayOne(zone: Zone, now: number, log: (line: string) => void): Promise<ZoneReplaySummary> {
    const summary: ZoneReplaySummary = { zone: zone.code, stored: 0, kept: 0, failed: 0, first: null, last: null };
    const since = now - REPLAY_MAX_DAYS * DAY_MS - TRAINING_HOURS * HOUR_MS - 2 * DAY_MS;
    const rows = await this.readings.range([zone.id], since, now + HOUR_MS);
    if (rows.length === 0) {
      log(`  ${zone.code}: no readings, nothing to replay`);
      return summary;
    }
    const until = Math.min(now, rows[rows.length - 1].hourStart + HOUR_MS);
    const steps = replaySteps(Math.max(rows[0].hourStart, now - REPLAY_MAX_DAYS * DAY_MS), until, zone.timeZone, zone.gateClosure, this.routine);
    if (steps.length === 0) return summary;
    const excluded = await this.outages.excludedHours(zone.code, rows[0].hourStart, until);
    const timeline = new ReadingsTimeline(rows, excluded);
    // the replay starts where the zone first had enough readings for a model
    const firstFit = steps.findIndex((s) => timeline.countAt(s.issuedAt) >= FIRST_MODEL_MIN_HOURS);
    if (firstFit < 0) {
      log(`  ${zone.code}: fewer than ${FIRST_MODEL_MIN_HOURS} hours of readings, nothing to replay yet`);
      return summary;
    }
    const todo = steps.slice(firstFit);
    const { replayed, issued } = await this.storedRuns(zone, todo);
    const covered = (step: ReplayStep) => issued.some((r) => r.issuedAt < step.gateClosureAt && coversDay(r, zone, step.day));
    const open = todo.filter((s) => !replayed.has(s.issuedAt) && !covered(s));
    summary.kept = todo.length - open.length;
    if (open.length === 0) {
      log(`  ${zone.code}: already replayed (${todo.length} days)`);
      return summary;
    }
    log(`  ${zone.code}: replaying ${todo.length} operating days, ${todo[0].day} to ${todo[todo.length - 1].day}`);
    let done = 0;
    await replayZone({ timeline, timeZone: zone.timeZone, steps: todo, minHours: FIRST_MODEL_MIN_HOURS }, (payload) => this.compute.runBatch('models.refit', payload), async (step, forecast) => {
      done++;
      if (!open.includes(step)) return;
      if (forecast) {
        await this.store(zone, forecast);
        summary.stored++;
        summary.first ??= step.day;
        summary.last = step.day;
      } else summary.failed++;
      if (done % 7 === 0 && done < todo.length) log(`  ${zone.code}: ${done} of ${todo.length} days`);
    });
    await this.audit.record(null, {
      action: 'forecast.replay',
      subjectType: 'zone',
      subjectId: zone.code,
      after: { ...summary },
      reason: 'forecasts replayed over the history the zone was given: each day as the desk would have issued it before its gate closure, from the readings it had then',
    });
    log(`  ${zone.code}: ${summary.stored} days replayed${summary.failed ? `, ${summary.failed} without a forecast (the fit failed)` : ''}${summary.kept ? `, ${summary.kept} already there` : ''}`);
    return summary;
  }

  /** Issue times of the zone's replayed runs, and the spans of the runs it issued itself. */
  private async storedRuns(zone: Zone, steps: readonly ReplayStep[]): Promise<{ replayed: Set<number>; issued: IssuedSpan[] }> {
    const em = this.em.fork();
    const from = new Date(steps[0].issuedAt - MAX_HORIZON_HOURS * HOUR_MS);
    const to = new Date(steps[steps.length - 1].gateClosureAt);
    const runs = await em.find(ForecastRun, { zone: zone.id, issuedAt: { $gte: from, $lte: to } }, { fields: ['issuedAt', 'origin', 'firstHour', 'mean'] });
    const replayed = new Set(runs.filter((r) => r.origin === 'replayed').map((r) => r.issuedAt.getTime()));
    const issued = runs.filter((r) => r.origin === 'issued').map((r) => ({ issuedAt: r.issuedAt.getTime(), from: r.firstHour.getTime(), to: r.firstHour.getTime() + r.mean.length * HOUR_MS }));
    return { replayed, issued };
  }

  private async store(zone: Zone, f: ReplayedForecast): Promise<void> {
    await this.em.fork().transactional(async (tx) => {
      this.forecasts.stage(tx, {
        zone: tx.getReference(Zone, zone.id),
        basedOnHour: f.basedOnHour,
        method: f.method,
        fallbackReason: f.fallbackReason,
        modelVersionId: null,
        firstHour: f.firstHour,
        forecast: f.forecast,
        replayedAt: f.issuedAt,
      });
      await tx.flush();
    });
  }
}

function coversDay(run: IssuedSpan, zone: Zone, day: string): boolean {
  const slots = operatingDaySlots(day, zone.timeZone);
  return run.from <= Date.parse(slots[0].intervalStartUtc) && run.to >= Date.parse(slots[slots.length - 1].intervalStartUtc) + HOUR_MS;
}
