import { EntityManager, LockMode, type RequiredEntityData } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { ModelVersion } from './entities/model-version.entity';

/** Model versions of the zones. Methods with a `tx` read and write inside the caller's transaction. */
@Injectable()
export class ModelVersionsRepository {
  constructor(private readonly em: EntityManager) {}

  /** Newest first, of one zone (by code) or of all. */
  async list(zoneCode: string | undefined, limit: number): Promise<ModelVersion[]> {
    return this.em.fork().find(ModelVersion, zoneCode ? { zone: { code: zoneCode } } : {}, { populate: ['zone'], orderBy: { id: 'desc' }, limit });
  }

  async byId(id: number): Promise<ModelVersion | null> {
    return this.em.fork().findOne(ModelVersion, { id }, { populate: ['zone'] });
  }

  /** The zone's model in service; null when it has none. */
  async inService(zoneId: number, populateZone = false): Promise<ModelVersion | null> {
    return this.em.fork().findOne(ModelVersion, { zone: zoneId, status: 'in-service' }, populateZone ? { populate: ['zone'] } : {});
  }

  /** The models in service of the active zones. */
  async inServiceOfActiveZones(): Promise<ModelVersion[]> {
    return this.em.fork().find(ModelVersion, { status: 'in-service', zone: { active: true } }, { populate: ['zone'] });
  }

  /** The zone's model in service, locked until the transaction ends. */
  async lockInService(tx: EntityManager, zoneId: number): Promise<ModelVersion | null> {
    return tx.findOne(ModelVersion, { zone: zoneId, status: 'in-service' }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  }

  async lockOrFail(tx: EntityManager, id: number): Promise<ModelVersion> {
    return tx.findOneOrFail(ModelVersion, { id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  }

  /** A new version in the transaction's unit of work (written on the caller's flush). */
  add(tx: EntityManager, data: RequiredEntityData<ModelVersion>): ModelVersion {
    return tx.create(ModelVersion, data);
  }

  /** A fresh unit of work for a transaction the caller runs. */
  fork(): EntityManager {
    return this.em.fork();
  }
}
