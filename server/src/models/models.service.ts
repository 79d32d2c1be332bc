import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { HOUR_MS } from '@morrowline/shared';
import type { ModelCompareDto, ModelVersionDto } from '@morrowline/shared';
import { AuditService, type Actor } from '../audit/audit.service';
import { ComputeService } from '../compute/compute.service';
import { forecastHorizon } from '../forecasts/forecast-horizon';
import { ForecastRunsRepository } from '../forecasts/forecast-runs.repository';
import { ForecastsService } from '../forecasts/forecasts.service';
import { TRAINING_HOURS } from '../history/zone-history';
import { COMPARE_DAYS, scoringDays } from './analysis/scoring-days';
import { issuedForDays, sameDaysOf } from './version-comparison';
import type { ModelVersion } from './entities/model-version.entity';
import { toModelVersionDto } from './model-dto';
import { ModelVersionsRepository } from './model-versions.repository';
import { ZoneHistoryLoader } from '../history/zone-history.loader';
import { ZoneWeatherLoader } from './zone-weather.loader';

/**
 * Model versions: the list per zone, a candidate beside the model in service (both scored on the
 * same latest days as they forecast them), and promotion by hand with a reason — a rollback is the promotion of
 * an earlier retired version. The promoted model's forecast is stored in the same transaction.
 */
@Injectable()
export class ModelsService {
  constructor(
    private readonly versions: ModelVersionsRepository,
    private readonly audit: AuditService,
    private readonly compute: ComputeService,
    private readonly forecasts: ForecastsService,
    private readonly history: ZoneHistoryLoader,
    private readonly runs: ForecastRunsRepository,
    private readonly weather: ZoneWeatherLoader,
  ) {}

  async list(zone: string | undefined, limit = 100): Promise<ModelVersionDto[]> {
    const versions = await this.versions.list(zone, limit);
    return versions.map(toModelVersionDto);
  }

  private async find(id: number): Promise<ModelVersion> {
    const v = await this.versions.byId(id);
    if (!v) throw new NotFoundException(`No model version ${id}`);
    return v;
  }

  async get(id: number): Promise<ModelVersionDto> {
    return toModelVersionDto(await this.find(id));
  }

  /**
   * The version beside the model in service, both scored on the zone's latest whole operating days
   * as they forecast them: each day at its issue time with the version's own coefficients (see
   * analysis/issue-time-score.ts). A badge is given only when both were scored on the same days
   * and hours.
   */
  async compare(id: number): Promise<ModelCompareDto> {
    const candidate = await this.find(id);
    const served = await this.versions.inService(candidate.zone.id, true);
    const inService = served && served.id !== candidate.id ? served : null;
    const zone = candidate.zone;
    const issueTime = `at the ${zone.gateClosure} gate closure the day before (${zone.timeZone}), from the hours that had ended by then`;
    const history = await this.history.load(zone, TRAINING_HOURS + (COMPARE_DAYS + 2) * 24);
    const days = history ? scoringDays(history.firstHourMs, history.lastHourMs, zone.timeZone, zone.gateClosure) : [];
    const base = { zone: zone.code, timeZone: zone.timeZone, candidate: toModelVersionDto(candidate), inService: inService ? toModelVersionDto(inService) : null };
    if (!history || days.length === 0) {
      const sameDays: ModelCompareDto['sameDays'] = { days: 0, from: null, to: null, candidateMape: null, inServiceMape: null, baselineMape: null, issueTime, candidate: null, inService: null, comparable: false, notComparable: 'the zone has no whole operating day of readings to score on yet' };
      return { ...base, sameDays, candidateBetter: null, diagnostics: [] };
    }
    const sides = inService ? [candidate, inService] : [candidate];
    const runs = await this.runs.ofVersions(zone.id, sides.map((v) => v.id), new Date(days[0].issuedAt - 2 * 24 * HOUR_MS), new Date(days[days.length - 1].issuedAt));
    // versions with weather terms re-forecast each day on the temperature forecast known at its issue time
    const weather = sides.some((v) => v.weather?.used) ? await this.weather.forRefit(zone, history, 0, Date.now()) : undefined;
    const result = await this.compute.run('models.score-at-issue', {
      values: history.values,
      excluded: history.excluded,
      days: days.map(({ dayStart, hours, cut, issuedAt }) => ({ dayStart, hours, cut, issuedAt: (issuedAt - history.firstHourMs) / HOUR_MS })),
      versions: sides.map((v) => ({ model: v.parameters, issued: issuedForDays(v.id, runs, days), weather: v.weather })),
      ...(weather ? { weather } : {}),
    });
    return { ...base, ...sameDaysOf(candidate, inService, result, days, issueTime) };
  }

  /** Puts a candidate (promote) or a retired version (rollback) into service. */
  async promote(actor: Actor, id: number, reason: string): Promise<ModelVersionDto> {
    const target = await this.find(id);
    if (target.status === 'in-service') throw new ConflictException(`Version ${id} is already in service for ${target.zone.code}`);
    // its forecast from the latest history, computed before anything is written
    const history = await this.history.load(target.zone);
    const horizon = history ? forecastHorizon(history.lastHourMs, target.zone.timeZone) : 0;
    // a version with weather terms forecasts on the temperature forecast known now (none issued later)
    const inputs = history && target.weather?.used ? await this.weather.forRefit(target.zone, history, horizon, Date.now()) : undefined;
    const weather = target.weather && inputs ? { stored: target.weather, inputs } : undefined;
    const forecast = history
      ? (await this.compute.run('models.forecast', { values: history.values, excluded: history.excluded, horizon, model: target.parameters, ...(weather ? { weather } : {}) })).forecast
      : null;
    const { dto, run } = await this.versions.fork().transactional(async (tx) => {
      const v = await this.versions.lockOrFail(tx, id);
      if (v.status === 'in-service') throw new ConflictException(`Version ${id} is already in service for ${target.zone.code}`);
      const current = await this.versions.lockInService(tx, target.zone.id);
      const action = v.status === 'retired' ? 'model.rollback' : 'model.promote';
      const now = new Date();
      if (current) {
        current.status = 'retired';
        current.retiredAt = now;
      }
      v.status = 'in-service';
      v.promotedAt = now;
      v.retiredAt = null;
      this.audit.stage(tx, actor, { action, subjectType: 'model', subjectId: v.id, before: { inService: current?.id ?? null }, after: { inService: v.id, zone: target.zone.code }, reason: reason.trim() });
      const stored =
        forecast && history
          ? this.forecasts.stage(tx, { zone: target.zone, basedOnHour: history.lastHourMs, method: 'arima', fallbackReason: null, modelVersionId: v.id, firstHour: history.lastHourMs + HOUR_MS, forecast })
          : null;
      await tx.flush();
      v.zone = target.zone;
      return { dto: toModelVersionDto(v), run: stored };
    });
    if (run) this.forecasts.announce(run, target.zone.code);
    return dto;
  }
}
