import { BadRequestException, Injectable } from '@nestjs/common';
import {
  type BacktestReportDto,
  type ModelReportDto,
  type StationarityReportDto,
  gateClosureAt,
  HOUR_MS,
  operatingDayStarts,
  WORKBENCH_DEFAULT_WEEKS,
  WORKBENCH_MAX_LAG,
  WORKBENCH_MIN_HOURS,
} from '@morrowline/shared';
import { ComputeService } from '../compute/compute.service';
import { ZoneHistoryLoader } from '../history/zone-history.loader';
import type { Zone } from '../zones/entities/zone.entity';
import { ZonesService } from '../zones/zones.service';
import { ModelVersionsRepository } from '../models/model-versions.repository';
import { toWire } from './analysis/stationarity-analysis';
import { withModelInUse } from './analysis/verdict';

/** Results are kept this long for the same zone, range and latest reading. */
export const WORKBENCH_CACHE_MS = 5 * 60_000;
/** Hours of history each backtest fit may use (the engine's default window). */
const BACKTEST_WINDOW_HOURS = 8 * 168;

interface History {
  zone: string;
  timeZone: string;
  firstHourMs: number;
  lastHourMs: number;
  times: string[];
  /** MW with NaN for missing and excluded hours */
  values: Float64Array;
  excluded: number[];
  usable: number;
}

/**
 * The analysis workbench: a zone's history from the readings, hours marked as excluded taken
 * out, and the engine's analyses run in the compute pool. The differencing it suggests is the one
 * the zone's model in service uses (the refit's decision), with the tests' own pick beside it. Results are cached per zone, range
 * and latest reading hour, so a new reading gives a fresh analysis.
 */
@Injectable()
export class WorkbenchService {
  private readonly cache = new Map<string, { at: number; result: Promise<unknown> }>();

  constructor(
    private readonly zones: ZonesService,
    private readonly histories: ZoneHistoryLoader,
    private readonly compute: ComputeService,
    private readonly versions: ModelVersionsRepository,
  ) {}

  async stationarity(code: string, weeks = WORKBENCH_DEFAULT_WEEKS): Promise<StationarityReportDto> {
    const latest = await this.latestHour(code);
    const served = await this.versions.inService(latest.zone.id);
    const inUse = served ? { versionId: served.id, diff: served.differencing } : null;
    return this.cached(`stationarity|${code}|${weeks}|${latest.lastHourMs}|${inUse?.versionId ?? 0}`, async () => {
      const t0 = performance.now();
      const h = await this.history(latest, weeks * 168, `${weeks} weeks`);
      const out = await this.compute.run('workbench.stationarity', { values: h.values, maxLag: WORKBENCH_MAX_LAG });
      return {
        zone: h.zone,
        timeZone: h.timeZone,
        weeks,
        from: h.times[0],
        to: h.times[h.times.length - 1],
        hours: h.values.length,
        usableHours: h.usable,
        excludedHours: h.excluded.length,
        times: h.times,
        load: toWire(h.values, 3),
        ...out,
        verdict: withModelInUse(out.verdict, inUse),
        computedAt: new Date().toISOString(),
        computeMs: Math.round(performance.now() - t0),
      };
    });
  }

  async model(code: string, weeks = WORKBENCH_DEFAULT_WEEKS): Promise<ModelReportDto> {
    const latest = await this.latestHour(code);
    return this.cached(`model|${code}|${weeks}|${latest.lastHourMs}`, async () => {
      const t0 = performance.now();
      const h = await this.history(latest, weeks * 168, `${weeks} weeks`);
      const out = await this.compute.run('workbench.model', { values: h.values, excluded: h.excluded });
      return {
        zone: h.zone,
        weeks,
        from: h.times[0],
        to: h.times[h.times.length - 1],
        usableHours: h.usable,
        ...out,
        computedAt: new Date().toISOString(),
        computeMs: Math.round(performance.now() - t0),
      };
    });
  }

  async backtest(code: string, days: number): Promise<BacktestReportDto> {
    const latest = await this.latestHour(code);
    return this.cached(`backtest|${code}|${days}|${latest.lastHourMs}`, async () => {
      const t0 = performance.now();
      // each scored day needs the fitting window before it, plus the partial day at the end
      const h = await this.history(latest, BACKTEST_WINDOW_HOURS + (days + 1) * 24, `the ${days} days and the 8 weeks before them`, WORKBENCH_MIN_HOURS + days * 24);
      const { starts, dates } = operatingDayStarts(h.firstHourMs, h.values.length, h.timeZone);
      const zone = latest.zone;
      // each day's forecast from the hours that had ended by the gate closure the day before
      const origins = dates.map((date) => Math.floor((gateClosureAt(date, zone.timeZone, zone.gateClosure) - h.firstHourMs) / HOUR_MS));
      const out = await this.compute.run('workbench.backtest', {
        values: h.values,
        excluded: h.excluded,
        days,
        dayStarts: starts,
        dayDates: dates,
        origins,
        firstHourMs: h.firstHourMs,
      });
      return {
        zone: h.zone,
        timeZone: h.timeZone,
        days,
        issueTime: `at the ${zone.gateClosure} gate closure the day before (${zone.timeZone}), from the hours that had ended by then, with the model choice of the desk's refits`,
        ...out,
        computedAt: new Date().toISOString(),
        computeMs: Math.round(performance.now() - t0),
      };
    });
  }

  /** The zone (404 if unknown) and its latest stored hour (400 if it has no readings). */
  private async latestHour(code: string): Promise<{ zone: Zone; lastHourMs: number }> {
    const zone = await this.zones.getByCode(code);
    const lastHourMs = await this.histories.lastHour(zone);
    if (lastHourMs === null) {
      throw new BadRequestException(
        `Zone ${zone.code} has no readings yet; the workbench needs at least ${WORKBENCH_MIN_HOURS} hours (${WORKBENCH_MIN_HOURS / 168} weeks) of hourly load`,
      );
    }
    return { zone, lastHourMs };
  }

  /** `hours` hourly values ending at the latest reading, excluded hours as NaN; 400 when too few are usable. */
  private async history(latest: { zone: Zone; lastHourMs: number }, hours: number, span: string, needed = WORKBENCH_MIN_HOURS): Promise<History> {
    const { firstHourMs, values, excluded, usable } = await this.histories.ending(latest.zone, latest.lastHourMs, hours);
    if (usable < needed) {
      throw new BadRequestException(
        `Not enough history for zone ${latest.zone.code}: ${usable} hours with readings in ${span} up to ${new Date(latest.lastHourMs).toISOString().slice(0, 13)}:00Z; the analysis needs at least ${needed} (${(needed / 24).toFixed(0)} days)`,
      );
    }
    const times = Array.from({ length: values.length }, (_, i) => new Date(firstHourMs + i * HOUR_MS).toISOString());
    return { zone: latest.zone.code, timeZone: latest.zone.timeZone, firstHourMs, lastHourMs: latest.lastHourMs, times, values, excluded, usable };
  }

  private cached<T>(key: string, compute: () => Promise<T>): Promise<T> {
    const now = Date.now();
    for (const [k, v] of this.cache) if (now - v.at > WORKBENCH_CACHE_MS) this.cache.delete(k);
    const hit = this.cache.get(key);
    if (hit) return hit.result as Promise<T>;
    const result = compute();
    this.cache.set(key, { at: now, result });
    // a failure is not kept: the next request tries again
    result.catch(() => this.cache.delete(key));
    return result;
  }
}
