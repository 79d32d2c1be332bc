import { UniqueConstraintViolationException } from '@mikro-orm/mariadb';
import { BadRequestException, Inject, Injectable, Logger, NotFoundException, Optional, type OnApplicationShutdown } from '@nestjs/common';
import { HOUR_MS, type RefitJobDto, type RefitJobState, type RefitTrigger } from '@morrowline/shared';
import { AuditService, type Actor } from '../audit/audit.service';
import { ComputeService } from '../compute/compute.service';
import { DOMAIN_EVENTS } from '../events/domain-events';
import { DomainEventsPublisher } from '../events/domain-events.publisher';
import { forecastHorizon } from '../forecasts/forecast-horizon';
import { ForecastsService } from '../forecasts/forecasts.service';
import { ReadingsRepository } from '../readings/readings.repository';
import { Zone } from '../zones/entities/zone.entity';
import { ZonesRepository } from '../zones/zones.repository';
import { REFIT_BACKTEST_DAYS, type RefitPayload, type RefitResult } from './analysis/refit';
import type { ModelVersion } from './entities/model-version.entity';
import type { RefitJob } from './entities/refit-job.entity';
import { choiceOf, toRefitJobDto } from './model-dto';
import { modelVersionFields } from './model-version-fields';
import { ModelVersionsRepository } from './model-versions.repository';
import { decidePromotion } from './promotion-policy';
import { REFIT_DISPATCH, type RefitDispatch } from './refit-dispatch';
import { RefitQueue } from './refit-queue';
import { RefitJobsRepository } from './refit-jobs.repository';
import { repeatsVersion } from './unchanged-fit';
import { ZoneHistoryLoader, type ZoneHistory } from '../history/zone-history.loader';
import { ZoneWeatherLoader } from './zone-weather.loader';

/** Jobs in flight at once: the pool's threads plus one reading or storing meanwhile. */
const JOB_CONCURRENCY = 2;
export const INTERRUPTED = 'interrupted by a server restart';
/** Three weeks of hourly readings: what the weekly differencing and a short backtest need. */
export const FIRST_MODEL_MIN_HOURS = 21 * 24;

type JobMode = RefitJob['mode'];

/**
 * Refit jobs: stored first (queued), then run one zone at a time per job in the compute pool
 * (never on the event loop), their progress pushed to desks. A zone never has two jobs at once
 * (a second request answers the job already there). The new model version, any promotion and
 * the forecast run are written in one transaction after the fit succeeds, so a failure or a
 * restart mid-job leaves the model in service as it was; on start, jobs left queued or running
 * are marked failed.
 *
 * Whether a new model goes into service is the promotion policy (promotion-policy.ts); what a
 * version stores, model-version-fields.ts; when jobs start by themselves, RefitScheduler; the
 * in-process queue, RefitQueue.
 */
@Injectable()
export class RefitsService implements OnApplicationShutdown {
  private readonly logger = new Logger(RefitsService.name);
  private readonly queue = new RefitQueue((id) => this.run(id), JOB_CONCURRENCY, this.logger);

  constructor(
    private readonly jobs: RefitJobsRepository,
    private readonly versions: ModelVersionsRepository,
    private readonly zones: ZonesRepository,
    private readonly readings: ReadingsRepository,
    private readonly audit: AuditService,
    private readonly compute: ComputeService,
    private readonly events: DomainEventsPublisher,
    private readonly forecasts: ForecastsService,
    private readonly history: ZoneHistoryLoader,
    private readonly weather: ZoneWeatherLoader,
    @Optional() @Inject(REFIT_DISPATCH) private readonly dispatch: RefitDispatch | null = null,
  ) {}

  /** Whether jobs go to the cluster's queue (REDIS_URL) rather than this process's. */
  get clustered(): boolean {
    return this.dispatch !== null;
  }

  async onApplicationShutdown(): Promise<void> {
    await this.queue.stop();
  }

  /** Jobs left queued or running by a server that stopped: marked failed, nothing applied. */
  async recoverInterrupted(): Promise<number> {
    return this.jobs.fork().transactional(async (tx) => {
      const stale = await this.jobs.unfinished(tx);
      for (const job of stale) {
        job.state = 'failed';
        job.message = INTERRUPTED;
        job.activeZoneId = null;
        job.finishedAt = new Date();
        this.audit.stage(tx, null, { action: 'refit.fail', subjectType: 'refit', subjectId: job.id, after: { zone: job.zone.code, message: INTERRUPTED } });
      }
      await tx.flush();
      if (stale.length) this.logger.warn(`${stale.length} refit job(s) ${INTERRUPTED}: marked failed`);
      return stale.length;
    });
  }

  /** Starts (or finds) a job per zone; all active zones when no code is given. */
  async request(actor: Actor | null, zoneCode: string | undefined, reason: string | null, trigger: RefitTrigger = 'operator', mode: JobMode = 'full'): Promise<RefitJobDto[]> {
    let zones: Zone[];
    if (zoneCode) {
      const zone = await this.zones.byCode(zoneCode);
      if (!zone) throw new NotFoundException(`No zone with code ${zoneCode}`);
      if (!zone.active) throw new BadRequestException(`Zone ${zoneCode} is not active`);
      zones = [zone];
    } else zones = await this.zones.active();
    const out: RefitJobDto[] = [];
    for (const zone of zones) out.push(toRefitJobDto(await this.enqueue(zone, actor, reason, trigger, mode)));
    return out;
  }

  private async enqueue(zone: Zone, actor: Actor | null, reason: string | null, trigger: RefitTrigger, mode: JobMode): Promise<RefitJob> {
    const existing = await this.jobs.activeFor(zone.id);
    if (existing) return existing;
    let job: RefitJob;
    try {
      job = await this.jobs.fork().transactional(async (tx) => {
        const created = this.jobs.add(tx, {
          zone: tx.getReference(Zone, zone.id),
          activeZoneId: zone.id,
          trigger,
          mode,
          reason: reason?.trim() || null,
          requestedById: actor?.id ?? null,
          requestedByEmail: actor?.email ?? null,
          createdAt: new Date(),
          state: 'queued',
          progress: 0,
          stage: 'waiting for a worker',
          promoted: false,
        });
        await tx.flush();
        this.audit.stage(tx, actor, { action: 'refit.start', subjectType: 'refit', subjectId: created.id, after: { zone: zone.code, trigger, mode }, reason: created.reason });
        return created;
      });
    } catch (error) {
      // another request for the zone won the race: answer its job
      if (error instanceof UniqueConstraintViolationException) {
        const winner = await this.jobs.activeFor(zone.id);
        if (winner) return winner;
      }
      throw error;
    }
    job.zone = zone;
    this.broadcast(job);
    if (!this.dispatch) {
      this.queue.push(job.id);
      return job;
    }
    try {
      await this.dispatch.push({ refitJobId: job.id, zoneId: zone.id, mode, trigger });
    } catch (error) {
      // stored but never queued: the zone must not stay blocked by a job nobody will run
      await this.fail(job, `could not be queued: ${(error as Error).message}`);
    }
    return job;
  }

  async list(state: RefitJobState | undefined, zone: string | undefined, limit = 100): Promise<RefitJobDto[]> {
    const jobs = await this.jobs.list(state, zone, limit);
    return jobs.map(toRefitJobDto);
  }

  /** Resolves when no job is queued or running in this process (tests, shutdown). */
  async settled(): Promise<void> {
    await this.queue.settled();
  }

  /** What the scheduler starts: the nightly full refit, or the hourly update (and first models). */
  async scheduled(mode: JobMode): Promise<void> {
    try {
      if (mode === 'full') {
        await this.request(null, undefined, 'nightly refit', 'schedule', 'full');
        return;
      }
      const inService = await this.versions.inServiceOfActiveZones();
      for (const v of inService) await this.enqueue(v.zone, null, 'hourly forecast update', 'update', 'update');
      // Zones with no model yet get a full refit instead, once they have enough history for one.
      const served = new Set(inService.map((v) => v.zone.id));
      for (const zone of await this.zones.active()) {
        if (served.has(zone.id)) continue;
        if ((await this.readings.countOf(zone.id)) < FIRST_MODEL_MIN_HOURS) continue;
        await this.enqueue(zone, null, 'first model of the zone', 'first-model', 'full');
      }
    } catch (error) {
      this.logger.error(`scheduled ${mode} refit could not start: ${(error as Error).message}`);
    }
  }

  private broadcast(job: RefitJob): void {
    this.events.publish(DOMAIN_EVENTS.refitProgress, toRefitJobDto(job));
  }

  private async step(job: RefitJob, progress: number, stage: string, state: RefitJobState = 'running'): Promise<void> {
    const fields: Partial<RefitJob> = { progress, stage, state };
    if (state === 'running' && !job.startedAt) fields.startedAt = new Date();
    await this.jobs.progress(job.id, fields);
    Object.assign(job, fields);
    this.broadcast(job);
  }

  /**
   * Runs a job taken from the cluster's queue. A job found `running` is one whose worker died or
   * stalled mid-fit (BullMQ gave it to this worker after its lock ran out): it starts again from
   * the history. A finished one is left alone, so a retry after the result was stored applies
   * nothing twice; and `finish` locks the job's row and stores only while it is `running`, so two
   * workers that both reach the end store one model version and one forecast run.
   */
  async runFromQueue(id: number, beforeFit?: () => Promise<void>): Promise<void> {
    await this.run(id, true, beforeFit);
  }

  /**
   * Puts every unfinished job on the queue again (cluster mode, each hour before the forecast
   * update): a node that stopped between storing a job and queueing it would otherwise leave the
   * zone blocked. A job still in the queue is the same queue job (its id is the stored job's), so
   * this adds nothing for it. Answers how many were pushed.
   */
  async requeueUnfinished(): Promise<number> {
    if (!this.dispatch) return 0;
    const unfinished = await this.jobs.unfinished(this.jobs.fork());
    for (const job of unfinished) await this.dispatch.push({ refitJobId: job.id, zoneId: job.zone.id, mode: job.mode, trigger: job.trigger });
    return unfinished.length;
  }

  /** A job BullMQ gave up on (stalled too often): marked failed, so the zone can be refitted again. */
  async failFromQueue(id: number, message: string): Promise<void> {
    const job = await this.jobs.byId(id);
    if (job) await this.fail(job, message);
  }

  private async run(id: number, retryable = false, beforeFit?: () => Promise<void>): Promise<void> {
    const job = await this.jobs.byId(id);
    if (!job || !(job.state === 'queued' || (retryable && job.state === 'running'))) return;
    const started = Date.now();
    try {
      await this.step(job, 5, 'reading the history');
      const zone = job.zone;
      const inService = await this.versions.inService(zone.id);
      if (job.mode === 'update' && !inService) throw new Error('no model in service to update; a full refit is needed first');
      const history = await this.history.load(zone);
      if (!history) throw new Error(`zone ${zone.code} has no readings yet`);
      const horizon = forecastHorizon(history.lastHourMs, zone.timeZone);
      // the forecast is issued now: the temperature forecast vintages known now, none later.
      // A full refit decides the weather terms afresh; an update keeps those in service (none if it has none).
      const keptWeather = inService?.weather?.choice ?? undefined;
      const weather = job.mode === 'full' || keptWeather ? await this.weather.forRefit(zone, history, horizon, Date.now(), job.mode === 'update' ? keptWeather : undefined) : undefined;
      await this.step(job, 20, job.mode === 'full' ? 'choosing the differencing and ARMA orders' : 'refitting with the orders kept');
      await beforeFit?.();
      const payload: RefitPayload = {
        values: history.values,
        excluded: history.excluded,
        horizon,
        fixed: job.mode === 'update' && inService ? choiceOf(inService) : undefined,
        inService: job.mode === 'full' && inService ? choiceOf(inService) : null,
        // scored as it forecasts: with its weather terms when it has them
        inServiceWeather: job.mode === 'full' && inService?.weather?.used ? (inService.weather.choice ?? null) : null,
        backtestDays: REFIT_BACKTEST_DAYS,
        ...(weather ? { weather } : {}),
      };
      // the nightly batch may use every core (the batch pool); a refit someone waits for runs in the ordinary pool
      const nightly = (job.trigger === 'schedule' || job.trigger === 'first-model') && job.mode === 'full';
      const result = nightly ? await this.compute.runBatch('models.refit', payload) : await this.compute.run('models.refit', payload);
      await this.step(job, 85, 'storing the model version and forecast');
      await this.finish(job, history, result, inService?.id ?? null, Date.now() - started);
    } catch (error) {
      await this.fail(job, (error as Error).message || String(error));
    }
  }

  private async finish(job: RefitJob, history: ZoneHistory, result: RefitResult, scoredInServiceId: number | null, durationMs: number): Promise<void> {
    const zone = job.zone;
    const announced = await this.jobs.fork().transactional(async (tx) => {
      const current = await this.versions.lockInService(tx, zone.id);
      const row = await this.jobs.lockOrFail(tx, job.id);
      if (row.state !== 'running') throw new Error(`job is ${row.state}, not running`);
      const now = new Date();
      let promoted = false;
      let why: string;
      let version: ModelVersion | null = null;
      const fields = result.model && result.stored ? modelVersionFields({ ...result, model: result.model, stored: result.stored }, history, job, false, now, durationMs) : null;
      if (fields && current && job.mode === 'update' && repeatsVersion(current, fields)) {
        why = `nothing changed since version ${current.id} (same readings, same estimates); it stays in service and no new version is stored`;
      } else if (result.model && result.stored) {
        ({ promoted, why } = decidePromotion({
          inServiceId: current?.id ?? null,
          mode: job.mode,
          trigger: job.trigger,
          candidateMape: result.score?.mape ?? null,
          inServiceMape: current && current.id === scoredInServiceId ? (result.inServiceScore?.mape ?? null) : null,
          candidateOnWeather: result.score?.onForecastWeather ?? false,
          inServiceOnWeather: result.inServiceScore?.onForecastWeather ?? false,
        }));
        version = this.versions.add(tx, {
          zone: tx.getReference(Zone, zone.id),
          ...modelVersionFields({ ...result, model: result.model, stored: result.stored }, history, job, promoted, now, durationMs),
        });
        if (promoted && current) {
          current.status = 'retired';
          current.retiredAt = now;
        }
        await tx.flush();
        if (promoted && current && job.mode === 'full') {
          this.audit.stage(tx, null, { action: 'model.promote', subjectType: 'model', subjectId: version.id, before: { inService: current.id }, after: { inService: version.id }, reason: why });
        }
      } else why = `no model: ${result.fallbackReason ?? 'the fit failed'}; ${current ? `version ${current.id} stays in service` : 'seasonal naive stands in'}`;
      // the forecast of what is in service after this job
      let run = null;
      if (promoted && version) {
        run = this.forecasts.stage(tx, { zone, basedOnHour: history.lastHourMs, method: 'arima', fallbackReason: null, modelVersionId: version.id, firstHour: history.lastHourMs + HOUR_MS, forecast: result.forecast });
      } else if (!version && !current) {
        run = this.forecasts.stage(tx, { zone, basedOnHour: history.lastHourMs, method: 'seasonal-naive', fallbackReason: result.fallbackReason ?? 'the fit failed', modelVersionId: null, firstHour: history.lastHourMs + HOUR_MS, forecast: result.forecast });
      }
      await tx.flush();
      Object.assign(row, { state: 'done', progress: 100, stage: 'done', message: why, finishedAt: now, activeZoneId: null, modelVersionId: version?.id ?? null, forecastRunId: run?.id ?? null, promoted });
      this.audit.stage(tx, null, {
        action: 'refit.finish',
        subjectType: 'refit',
        subjectId: job.id,
        after: { zone: zone.code, modelVersionId: version?.id ?? null, promoted, backtestMape: result.score?.mape ?? null, baselineMape: result.score?.baselineMape ?? null, durationMs },
        reason: why,
      });
      await tx.flush();
      Object.assign(job, { state: row.state, progress: 100, stage: row.stage, message: why, finishedAt: now, activeZoneId: null, modelVersionId: row.modelVersionId, forecastRunId: row.forecastRunId, promoted });
      return run;
    });
    this.broadcast(job);
    if (announced) this.forecasts.announce(announced, zone.code);
  }

  private async fail(job: RefitJob, message: string): Promise<void> {
    const now = new Date();
    try {
      await this.jobs.fork().transactional(async (tx) => {
        const row = await this.jobs.lock(tx, job.id);
        if (!row || row.state === 'done' || row.state === 'failed') return;
        Object.assign(row, { state: 'failed', message, finishedAt: now, activeZoneId: null });
        this.audit.stage(tx, null, { action: 'refit.fail', subjectType: 'refit', subjectId: job.id, after: { zone: job.zone.code, message } });
        await tx.flush();
      });
    } catch (error) {
      this.logger.error(`refit job ${job.id} failed (${message}) and could not be marked so: ${(error as Error).message}`);
      return;
    }
    Object.assign(job, { state: 'failed', message, finishedAt: now, activeZoneId: null });
    this.broadcast(job);
    this.logger.warn(`refit job ${job.id} (${job.zone.code}) failed: ${message}`);
  }
}
