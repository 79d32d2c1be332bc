import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { Zone } from '../zones/entities/zone.entity';
import type { WeatherStation } from '../weather/entities/weather-station.entity';
import { FeedKey } from './entities/feed-key.entity';

export interface NewFeedKey {
  name: string;
  keyHash: string;
  prefix: string;
  zone: Zone | null;
  station: WeatherStation | null;
  createdById: number | null;
  createdByEmail: string | null;
}

/** The meter-feed keys table: listing, creation, revocation, and the lookups of the feed socket. */
@Injectable()
export class FeedKeysRepository {
  constructor(private readonly em: EntityManager) {}

  /** A fresh unit of work, for a service that runs a transaction over keys. */
  fork(): EntityManager {
    return this.em.fork();
  }

  list(): Promise<FeedKey[]> {
    return this.em.fork().find(FeedKey, {}, { populate: ['zone', 'station'], orderBy: { revokedAt: 'asc', name: 'asc' } });
  }

  byId(em: EntityManager, id: number): Promise<FeedKey | null> {
    return em.findOne(FeedKey, { id }, { populate: ['zone', 'station'] });
  }

  byName(name: string): Promise<FeedKey | null> {
    return this.em.fork().findOne(FeedKey, { name });
  }

  byHash(keyHash: string): Promise<FeedKey | null> {
    return this.em.fork().findOne(FeedKey, { keyHash }, { populate: ['zone', 'station'] });
  }

  /** A new key, written in the caller's transaction (its id is set on return). */
  async insert(tx: EntityManager, fields: NewFeedKey): Promise<FeedKey> {
    const key = tx.create(FeedKey, { ...fields, createdAt: new Date(), lastUsedAt: null, revokedAt: null });
    await tx.flush();
    return key;
  }

  rename(id: number, name: string): Promise<number> {
    return this.em.fork().nativeUpdate(FeedKey, { id }, { name });
  }

  async isActive(id: number): Promise<boolean> {
    return (await this.em.fork().count(FeedKey, { id, revokedAt: null })) > 0;
  }

  touch(id: number, at: Date): Promise<number> {
    return this.em.fork().nativeUpdate(FeedKey, { id }, { lastUsedAt: at });
  }
}
