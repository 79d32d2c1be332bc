import type { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import { HOUR_MS, type ForecastDiffDto, type ForecastRunDto, type ForecastRunSummaryDto, type LatestForecastsDto } from '@morrowline/shared';
import { diffRuns } from './forecast-diff';
import { DOMAIN_EVENTS } from '../events/domain-events';
import { DomainEventsPublisher } from '../events/domain-events.publisher';
import { floorAtZero, seasonalNaive, type IntervalForecast } from '@morrowline/engine';
import { OutagesService } from '../outages/outages.service';
import { ReadingsService } from '../readings/readings.service';
import type { Zone } from '../zones/entities/zone.entity';
import { ZonesRepository } from '../zones/zones.repository';
import { ForecastRun } from './entities/forecast-run.entity';
import { forecastHorizon } from './forecast-horizon';
import { ForecastRunsRepository } from './forecast-runs.repository';

/** History the seasonal-naive stand-in looks back over (it needs the same hour weeks earlier). */
export const STAND_IN_HISTORY_HOURS = 4 * 168;

export interface NewForecastRun {
  zone: Zone;
  basedOnHour: number | null;
  method: ForecastRun['method'];
  fallbackReason: string | null;
  modelVersionId: number | null;
  firstHour: number;
  forecast: IntervalForecast;
  /** Only for a replayed run: when the desk would have issued it (default: now, issued). */
  replayedAt?: number;
}

/** A stored number must never be NaN or negative load. */
const clean = (v: readonly number[]): number[] => v.map((x) => (Number.isFinite(x) ? Math.max(0, Math.round(x * 1000) / 1000) : 0));

export function toRunSummaryDto(run: ForecastRun, zone: string): ForecastRunSummaryDto {
  return {
    id: run.id,
    zone,
    issuedAt: run.issuedAt.toISOString(),
    origin: run.origin,
    basedOnHour: run.basedOnHour ? run.basedOnHour.toISOString() : null,
    method: run.method,
    modelVersionId: run.modelVersionId,
    firstHour: run.firstHour.toISOString(),
    hours: run.mean.length,
  };
}

export function toForecastRunDto(run: ForecastRun, zone: string, from?: number, to?: number): ForecastRunDto {
  const first = run.firstHour.getTime();
  let a = 0;
  let b = run.mean.length;
  if (from !== undefined) a = Math.max(0, Math.ceil((from - first) / HOUR_MS));
  if (to !== undefined) b = Math.min(b, Math.max(a, Math.ceil((to - first) / HOUR_MS)));
  return {
    id: run.id ?? null,
    zone,
    issuedAt: run.issuedAt.toISOString(),
    origin: run.origin,
    basedOnHour: run.basedOnHour ? run.basedOnHour.toISOString() : null,
    method: run.method,
    fallbackReason: run.fallbackReason,
    modelVersionId: run.modelVersionId,
    hours: Array.from({ length: b - a }, (_, i) => new Date(first + (a + i) * HOUR_MS).toISOString()),
    mean: run.mean.slice(a, b),
    lower80: run.lower80.slice(a, b),
    upper80: run.upper80.slice(a, b),
    lower95: run.lower95.slice(a, b),
    upper95: run.upper95.slice(a, b),
  };
}

/**
 * Forecast runs: stored by the refit jobs (inside their transaction), then announced, and read
 * as "the latest per zone". A zone without a run gets the weekly seasonal-naive stand-in from its
 * readings, with outage hours left out.
 */
@Injectable()
export class ForecastsService {
  constructor(
    private readonly stored: ForecastRunsRepository,
    private readonly zoneRows: ZonesRepository,
    private readonly readings: ReadingsService,
    private readonly outages: OutagesService,
    private readonly events: DomainEventsPublisher,
  ) {}

  /** Adds a run to a transaction's unit of work; the caller flushes and then calls `announce`. */
  stage(tx: EntityManager, run: NewForecastRun): ForecastRun {
    const f = floorAtZero(run.forecast);
    return this.stored.add(tx, {
      zone: run.zone,
      issuedAt: run.replayedAt === undefined ? new Date() : new Date(run.replayedAt),
      origin: run.replayedAt === undefined ? 'issued' : 'replayed',
      basedOnHour: run.basedOnHour === null ? null : new Date(run.basedOnHour),
      method: run.method,
      fallbackReason: run.fallbackReason,
      modelVersionId: run.modelVersionId,
      firstHour: new Date(run.firstHour),
      mean: clean(f.mean),
      lower80: clean(f.lower80),
      upper80: clean(f.upper80),
      lower95: clean(f.lower95),
      upper95: clean(f.upper95),
    });
  }

  /** Tells listeners of a stored run: call it after the transaction that staged the run has committed. */
  announce(run: ForecastRun, zone: string): void {
    this.events.publish(DOMAIN_EVENTS.forecastIssued, toForecastRunDto(run, zone));
  }

  /** The newest run the desk issued; replayed runs are history and never the live forecast. */
  async latestRun(zoneId: number): Promise<ForecastRun | null> {
    return this.stored.latestOf(zoneId);
  }

  /**
   * The newest run of any origin issued at or before `at` (what the desk had then): only for work
   * replayed as of a past time (src/replay), never for the live desk.
   */
  async runAsOf(zoneId: number, at: Date): Promise<ForecastRun | null> {
    return this.stored.asOf(zoneId, at);
  }

  /** A zone's stored runs with their issue times, newest first (the forecast vintages). */
  async runs(code: string, limit = 48): Promise<ForecastRunSummaryDto[]> {
    const [zone] = await this.readings.resolveZones([code]);
    return (await this.stored.listOf(zone.id, limit)).map((r) => toRunSummaryDto(r, zone.code));
  }

  /** How the forecast moved from one stored run to another of the same zone, hour by hour. */
  async diff(id: number, against: number, from?: Date, to?: Date): Promise<ForecastDiffDto> {
    if (from && to && from >= to) throw new BadRequestException('from must be before to');
    const [a, b] = await Promise.all([this.stored.byId(id), this.stored.byId(against)]);
    if (!a) throw new NotFoundException(`No forecast run ${id}`);
    if (!b) throw new NotFoundException(`No forecast run ${against}`);
    if (a.zone.id !== b.zone.id) throw new BadRequestException(`Runs ${id} (${a.zone.code}) and ${against} (${b.zone.code}) are of different zones`);
    const hour = (d?: Date) => (d ? Math.floor(d.getTime() / HOUR_MS) * HOUR_MS : undefined);
    const d = diffRuns({ firstHour: a.firstHour.getTime(), mean: a.mean }, { firstHour: b.firstHour.getTime(), mean: b.mean }, hour(from), to ? Math.ceil(to.getTime() / HOUR_MS) * HOUR_MS : undefined);
    return { zone: a.zone.code, from: toRunSummaryDto(a, a.zone.code), to: toRunSummaryDto(b, b.zone.code), ...d };
  }

  async latest(codes: readonly string[] | undefined, from?: Date, to?: Date): Promise<LatestForecastsDto> {
    const zones = await this.readings.resolveZones(codes);
    const out: ForecastRunDto[] = [];
    for (const zone of zones) {
      const run = await this.latestRun(zone.id);
      if (run) out.push(toForecastRunDto(run, zone.code, from?.getTime(), to?.getTime()));
      else out.push(await this.standIn(zone.id, zone.code, from?.getTime(), to?.getTime()));
    }
    return { zones: out };
  }

  /** The weekly seasonal-naive forecast from a zone's stored readings (never stored). */
  async standIn(zoneId: number, code: string, from?: number, to?: number): Promise<ForecastRunDto> {
    const zone = await this.zoneRows.byIdOrFail(zoneId);
    const last = (await this.readings.status()).find((s) => s.zone === code)?.lastHour;
    const reason = 'no model forecast stored for this zone yet: weekly seasonal naive from its readings';
    if (!last) {
      const run = Object.assign(new ForecastRun(), { id: null, method: 'seasonal-naive', fallbackReason: reason, modelVersionId: null, issuedAt: new Date(), basedOnHour: null, firstHour: new Date(Math.floor(Date.now() / HOUR_MS) * HOUR_MS), mean: [], lower80: [], upper80: [], lower95: [], upper95: [] });
      return toForecastRunDto(run as ForecastRun, code);
    }
    const lastMs = Date.parse(last);
    const start = lastMs - (STAND_IN_HISTORY_HOURS - 1) * HOUR_MS;
    const [rows, excluded] = await Promise.all([this.readings.rows(zoneId, start, lastMs + HOUR_MS), this.outages.excludedHours(code, start, lastMs + HOUR_MS)]);
    const history = new Float64Array(STAND_IN_HISTORY_HOURS).fill(NaN);
    for (const row of rows) if (!excluded.has(row.hourStart)) history[(row.hourStart - start) / HOUR_MS] = row.mw;
    const f = floorAtZero(seasonalNaive(history, forecastHorizon(lastMs, zone.timeZone)));
    const run = Object.assign(new ForecastRun(), {
      id: null,
      method: 'seasonal-naive' as const,
      fallbackReason: reason,
      modelVersionId: null,
      issuedAt: new Date(),
      basedOnHour: new Date(lastMs),
      firstHour: new Date(lastMs + HOUR_MS),
      mean: clean(f.mean),
      lower80: clean(f.lower80),
      upper80: clean(f.upper80),
      lower95: clean(f.lower95),
      upper95: clean(f.upper95),
    });
    return toForecastRunDto(run as ForecastRun, code, from, to);
  }
}
