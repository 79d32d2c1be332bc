import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { HOUR_MS } from '@morrowline/shared';
import type { ModelCompareDto, ModelVersionDto } from '@morrowline/shared';
import { AuditService, type Actor } from '../audit/audit.service';
import { ComputeService } from '../compute/compute.service';
import { forecastHorizon } from '../forecasts/forecast-horizon';
import { ForecastsService } from '../forecasts/forecasts.service';
import type { ModelVersion } from './entities/model-version.entity';
import { choiceOf, toModelVersionDto } from './model-dto';
import { ModelVersionsRepository } from './model-versions.repository';
import { ZoneHistoryLoader } from '../history/zone-history.loader';

/**
 * Model versions: the list per zone, a candidate beside the model in service (both scored again
 * on the same latest days), and promotion by hand with a reason — a rollback is the promotion of
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

  async compare(id: number): Promise<ModelCompareDto> {
    const candidate = await this.find(id);
    const served = await this.versions.inService(candidate.zone.id, true);
    const inService = served && served.id !== candidate.id ? served : null;
    const history = await this.history.load(candidate.zone);
    let sameDays: ModelCompareDto['sameDays'] = { days: 0, from: null, to: null, candidateMape: null, inServiceMape: null, baselineMape: null };
    if (history) {
      const r = await this.compute.run('models.compare', { values: history.values, excluded: history.excluded, candidate: choiceOf(candidate), inService: inService ? choiceOf(inService) : null });
      const at = (i: number | null) => (i === null ? null : new Date(history.firstHourMs + i * HOUR_MS).toISOString());
      sameDays = { days: r.candidate.days, from: at(r.candidate.from), to: at(r.candidate.to), candidateMape: r.candidate.mape, inServiceMape: r.inService?.mape ?? null, baselineMape: r.candidate.baselineMape };
    }
    const better = sameDays.candidateMape !== null && sameDays.inServiceMape !== null ? sameDays.candidateMape < sameDays.inServiceMape : null;
    return { zone: candidate.zone.code, candidate: toModelVersionDto(candidate), inService: inService ? toModelVersionDto(inService) : null, sameDays, candidateBetter: better };
  }

  /** Puts a candidate (promote) or a retired version (rollback) into service. */
  async promote(actor: Actor, id: number, reason: string): Promise<ModelVersionDto> {
    const target = await this.find(id);
    if (target.status === 'in-service') throw new ConflictException(`Version ${id} is already in service for ${target.zone.code}`);
    // its forecast from the latest history, computed before anything is written
    const history = await this.history.load(target.zone);
    const forecast = history
      ? (await this.compute.run('models.forecast', { values: history.values, excluded: history.excluded, horizon: forecastHorizon(history.lastHourMs, target.zone.timeZone), model: target.parameters })).forecast
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
