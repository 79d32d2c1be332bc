import { EntityManager, LockMode, type RequiredEntityData } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { ScheduleAdjustment } from './entities/schedule-adjustment.entity';
import { ScheduleRevision } from './entities/schedule-revision.entity';
import { REVISION_RELATIONS } from './schedule-dto';

/** "<zone id>:<day>": the value of workingKey / publishedKey while a revision holds that place. */
export const revisionKey = (zoneId: number, day: string) => `${zoneId}:${day}`;

/**
 * Schedule revisions and their adjustments. Every method takes the EntityManager to read through
 * (a fork, or the caller's transaction), because the workflow's checks and writes share one.
 */
@Injectable()
export class ScheduleRevisionsRepository {
  constructor(private readonly em: EntityManager) {}

  /** A fresh unit of work for one request. */
  fork(): EntityManager {
    return this.em.fork();
  }

  /** The working and published revisions of the zones for a day. */
  async current(em: EntityManager, zoneIds: number[], day: string): Promise<ScheduleRevision[]> {
    return em.find(
      ScheduleRevision,
      { zone: { $in: zoneIds }, operatingDay: day, $or: [{ workingKey: { $ne: null } }, { publishedKey: { $ne: null } }] },
      { populate: [...REVISION_RELATIONS] },
    );
  }

  async working(em: EntityManager, zoneId: number, day: string): Promise<ScheduleRevision | null> {
    return em.findOne(ScheduleRevision, { workingKey: revisionKey(zoneId, day) });
  }

  /** The zone/day's working revision, locked until the transaction ends. */
  async lockWorking(tx: EntityManager, zoneId: number, day: string): Promise<ScheduleRevision | null> {
    return tx.findOne(ScheduleRevision, { zone: zoneId, operatingDay: day, workingKey: { $ne: null } }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  }

  async isPublished(em: EntityManager, zoneId: number, day: string): Promise<boolean> {
    return (await em.count(ScheduleRevision, { publishedKey: revisionKey(zoneId, day) })) > 0;
  }

  /** The zone/day's published revision, locked until the transaction ends. */
  async lockPublished(tx: EntityManager, zoneId: number, day: string): Promise<ScheduleRevision | null> {
    return tx.findOne(ScheduleRevision, { publishedKey: revisionKey(zoneId, day) }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  }

  /** The zone/day's highest revision number (0 when there is none). */
  async lastNumber(em: EntityManager, zoneId: number, day: string): Promise<number> {
    const last = await em.findOne(ScheduleRevision, { zone: zoneId, operatingDay: day }, { orderBy: { revision: 'desc' } });
    return last?.revision ?? 0;
  }

  async byId(em: EntityManager, id: number, populate = false): Promise<ScheduleRevision | null> {
    return em.findOne(ScheduleRevision, { id }, populate ? { populate: [...REVISION_RELATIONS] } : {});
  }

  /** A revision locked until the transaction ends, with the relations its DTO names. */
  async lock(tx: EntityManager, id: number): Promise<ScheduleRevision | null> {
    const revision = await tx.findOne(ScheduleRevision, { id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (revision) await tx.populate(revision, [...REVISION_RELATIONS]);
    return revision;
  }

  /** Every revision of a zone/day, newest first. */
  async ofDay(em: EntityManager, zoneId: number, day: string): Promise<ScheduleRevision[]> {
    return em.find(ScheduleRevision, { zone: zoneId, operatingDay: day }, { populate: [...REVISION_RELATIONS], orderBy: { revision: 'desc' } });
  }

  /** The adjustments of these revisions (undone ones too), oldest first. */
  async adjustmentsOf(em: EntityManager, revisions: ScheduleRevision[]): Promise<ScheduleAdjustment[]> {
    if (revisions.length === 0) return [];
    return em.find(ScheduleAdjustment, { revision: { $in: revisions.map((r) => r.id) } }, { populate: ['by', 'undoneBy'], orderBy: { id: 'asc' } });
  }

  /** The adjustments still in force on a revision, oldest first; `except` leaves one out. */
  async activeAdjustments(em: EntityManager, revisionId: number, except?: number): Promise<ScheduleAdjustment[]> {
    return em.find(ScheduleAdjustment, { revision: revisionId, undoneAt: null, ...(except === undefined ? {} : { id: { $ne: except } }) }, { orderBy: { id: 'asc' } });
  }

  async adjustment(em: EntityManager, id: number): Promise<ScheduleAdjustment | null> {
    return em.findOne(ScheduleAdjustment, { id });
  }

  /** The revision an adjustment belongs to, locked until the transaction ends. */
  async lockOf(tx: EntityManager, adjustment: ScheduleAdjustment): Promise<ScheduleRevision> {
    return tx.findOneOrFail(ScheduleRevision, { id: adjustment.revision.id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  }

  /** A new revision in the transaction's unit of work (written on the caller's flush). */
  add(tx: EntityManager, data: RequiredEntityData<ScheduleRevision>): ScheduleRevision {
    return tx.create(ScheduleRevision, data);
  }

  /** A new adjustment in the transaction's unit of work (written on the caller's flush). */
  addAdjustment(tx: EntityManager, data: RequiredEntityData<ScheduleAdjustment>): ScheduleAdjustment {
    return tx.create(ScheduleAdjustment, data);
  }

  /** Published (or since superseded) revisions of a zone for days in [fromDay, toDay]; by day, newest revision first. */
  async publishedBetween(zoneId: number, fromDay: string, toDay: string): Promise<Pick<ScheduleRevision, 'id' | 'operatingDay' | 'revision' | 'publishedAt' | 'hours'>[]> {
    return this.em.fork().find(
      ScheduleRevision,
      { zone: zoneId, operatingDay: { $gte: fromDay, $lte: toDay }, state: { $in: ['published', 'superseded'] }, publishedAt: { $ne: null } },
      { fields: ['id', 'operatingDay', 'revision', 'publishedAt', 'hours'], orderBy: { operatingDay: 'asc', revision: 'desc' } },
    );
  }

  /** The most recently published revision of any of the zones; null when none was published. */
  async lastPublished(zoneIds: readonly number[]): Promise<Pick<ScheduleRevision, 'id' | 'publishedAt'> | null> {
    return this.em.fork().findOne(ScheduleRevision, { zone: { $in: [...zoneIds] }, publishedAt: { $ne: null } }, { orderBy: { publishedAt: 'desc', id: 'desc' }, fields: ['id', 'publishedAt'] });
  }
}
