import { EntityManager, type RequiredEntityData } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { ForecastRun } from './entities/forecast-run.entity';

export type RunValues = Pick<ForecastRun, 'id' | 'issuedAt' | 'firstHour' | 'mean' | 'origin'>;
export type VersionRun = Pick<ForecastRun, 'id' | 'issuedAt' | 'firstHour' | 'mean' | 'lower80' | 'upper80' | 'origin' | 'modelVersionId'>;

/** Stored forecast runs. */
@Injectable()
export class ForecastRunsRepository {
  constructor(private readonly em: EntityManager) {}

  /** A new run in the transaction's unit of work (written on the caller's flush). */
  add(tx: EntityManager, data: RequiredEntityData<ForecastRun>): ForecastRun {
    const run = tx.create(ForecastRun, data);
    tx.persist(run);
    return run;
  }

  /** The zone's latest issued run; null when none is stored. */
  async latestOf(zoneId: number): Promise<ForecastRun | null> {
    return this.em.fork().findOne(ForecastRun, { zone: zoneId, origin: 'issued' }, { orderBy: { issuedAt: 'desc', id: 'desc' } });
  }

  /** The newest run of any origin issued at or before `at` (replayed work only). */
  async asOf(zoneId: number, at: Date): Promise<ForecastRun | null> {
    return this.em.fork().findOne(ForecastRun, { zone: zoneId, issuedAt: { $lte: at } }, { orderBy: { issuedAt: 'desc', id: 'desc' } });
  }

  /** The id of the newest run of any of the zones (0 when none): changes whenever one is stored. */
  async newestId(zoneIds: readonly number[]): Promise<number> {
    const run = await this.em.fork().findOne(ForecastRun, { zone: { $in: [...zoneIds] } }, { orderBy: { id: 'desc' }, fields: ['id'] });
    return run?.id ?? 0;
  }

  /** Runs of a zone issued before `issuedBefore` whose first hour lies in [firstFrom, firstTo]; newest first. */
  async issuedBefore(zoneId: number, issuedBefore: Date, firstFrom: Date, firstTo: Date): Promise<RunValues[]> {
    return this.em.fork().find(
      ForecastRun,
      { zone: zoneId, issuedAt: { $lt: issuedBefore }, firstHour: { $lte: firstTo, $gte: firstFrom } },
      { fields: ['id', 'issuedAt', 'firstHour', 'mean', 'origin'], orderBy: { issuedAt: 'desc', id: 'desc' } },
    );
  }

  /** Runs the given model versions made for a zone, issued in [from, to]; newest first. */
  async ofVersions(zoneId: number, versionIds: readonly number[], from: Date, to: Date): Promise<VersionRun[]> {
    if (versionIds.length === 0) return [];
    return this.em.fork().find(
      ForecastRun,
      { zone: zoneId, modelVersionId: { $in: [...versionIds] }, issuedAt: { $gte: from, $lte: to } },
      { fields: ['id', 'issuedAt', 'firstHour', 'mean', 'lower80', 'upper80', 'origin', 'modelVersionId'], orderBy: { issuedAt: 'desc', id: 'desc' } },
    );
  }

  async byId(id: number): Promise<ForecastRun | null> {
    return this.em.fork().findOne(ForecastRun, { id }, { populate: ['zone'] });
  }

  /** A zone's runs, newest first, without their values' bands. */
  async listOf(zoneId: number, limit: number): Promise<ForecastRun[]> {
    return this.em.fork().find(ForecastRun, { zone: zoneId }, { orderBy: { issuedAt: 'desc', id: 'desc' }, limit });
  }
}
