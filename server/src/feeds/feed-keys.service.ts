import { EntityManager, UniqueConstraintViolationException } from '@mikro-orm/mariadb';
import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import type { CreateFeedKeyRequest, CreatedFeedKey, FeedKeyDto } from '@morrowline/shared';
import { createHash, randomBytes } from 'node:crypto';
import { AuditService, type Actor } from '../audit/audit.service';
import { Zone } from '../zones/entities/zone.entity';
import { FeedKey } from './entities/feed-key.entity';

const KEY_PREFIX = 'mlfeed_';
/** lastUsedAt is written at most this often per key. */
const TOUCH_EVERY_MS = 60_000;

export function hashFeedKey(apiKey: string): string {
  return createHash('sha256').update(apiKey, 'utf8').digest('hex');
}

export function toFeedKeyDto(key: FeedKey): FeedKeyDto {
  return {
    id: key.id,
    name: key.name,
    prefix: key.prefix,
    zone: key.zone ? key.zone.code : null,
    createdAt: key.createdAt.toISOString(),
    createdBy: key.createdByEmail,
    lastUsedAt: key.lastUsedAt ? key.lastUsedAt.toISOString() : null,
    revokedAt: key.revokedAt ? key.revokedAt.toISOString() : null,
  };
}

/** A feed as the ingest gateway knows it after its key checked out. */
export interface FeedIdentity {
  id: number;
  name: string;
  zone: string | null;
}

/** Meter-feed API keys: created (shown once), listed and revoked by admins; checked on connect. */
@Injectable()
export class FeedKeysService {
  private readonly touched = new Map<number, number>();

  constructor(
    private readonly em: EntityManager,
    private readonly audit: AuditService,
  ) {}

  async list(): Promise<FeedKeyDto[]> {
    const keys = await this.em.fork().find(FeedKey, {}, { populate: ['zone'], orderBy: { revokedAt: 'asc', name: 'asc' } });
    return keys.map(toFeedKeyDto);
  }

  async create(actor: Actor | null, request: CreateFeedKeyRequest): Promise<CreatedFeedKey> {
    const apiKey = `${KEY_PREFIX}${randomBytes(32).toString('base64url')}`;
    try {
      return await this.em.fork().transactional(async (tx) => {
        const zone = request.zone ? await tx.findOne(Zone, { code: request.zone }) : null;
        if (request.zone && !zone) throw new NotFoundException(`No zone with code ${request.zone}`);
        const key = tx.create(FeedKey, {
          name: request.name.trim(),
          keyHash: hashFeedKey(apiKey),
          prefix: apiKey.slice(0, KEY_PREFIX.length + 6),
          zone,
          createdAt: new Date(),
          createdById: actor?.id ?? null,
          createdByEmail: actor?.email ?? null,
          lastUsedAt: null,
          revokedAt: null,
        });
        await tx.flush();
        const feedKey = toFeedKeyDto(key);
        this.audit.stage(tx, actor, { action: 'feed-key.create', subjectType: 'feed-key', subjectId: key.id, after: feedKey });
        return { feedKey, apiKey };
      });
    } catch (error) {
      if (error instanceof UniqueConstraintViolationException) throw new ConflictException(`A feed key named ${request.name} already exists`);
      throw error;
    }
  }

  async revoke(actor: Actor | null, id: number, reason?: string): Promise<FeedKeyDto> {
    return this.em.fork().transactional(async (tx) => {
      const key = await tx.findOne(FeedKey, { id }, { populate: ['zone'] });
      if (!key) throw new NotFoundException(`No feed key with id ${id}`);
      if (key.revokedAt) return toFeedKeyDto(key);
      const before = toFeedKeyDto(key);
      key.revokedAt = new Date();
      const after = toFeedKeyDto(key);
      this.audit.stage(tx, actor, { action: 'feed-key.revoke', subjectType: 'feed-key', subjectId: key.id, before, after, reason: reason ?? null });
      return after;
    });
  }

  /**
   * For the start script: a key of this name, freshly made. An existing key of the same name is
   * revoked and renamed aside, so the printed key is the only one that works.
   */
  async rotate(name: string): Promise<string> {
    const em = this.em.fork();
    const old = await em.findOne(FeedKey, { name });
    if (old) {
      await this.revoke(null, old.id, 'Rotated by the start script');
      await em.nativeUpdate(FeedKey, { id: old.id }, { name: `${name} (rotated ${new Date().toISOString()})`.slice(0, 120) });
    }
    const created = await this.create(null, { name });
    return created.apiKey;
  }

  /** The feed a key belongs to, or an error a feed can act on. */
  async authenticate(apiKey: unknown): Promise<FeedIdentity> {
    if (typeof apiKey !== 'string' || apiKey.length === 0) throw new Error('A feed must connect with auth: { apiKey }');
    const em = this.em.fork();
    const key = await em.findOne(FeedKey, { keyHash: hashFeedKey(apiKey) }, { populate: ['zone'] });
    if (!key) throw new Error('This feed key is not known');
    if (key.revokedAt) throw new Error('This feed key has been revoked');
    this.touch(key.id);
    return { id: key.id, name: key.name, zone: key.zone ? key.zone.code : null };
  }

  /** Is the key still good? (checked for every batch, so a revocation takes effect at once). */
  async isActive(id: number): Promise<boolean> {
    const count = await this.em.fork().count(FeedKey, { id, revokedAt: null });
    if (count > 0) this.touch(id);
    return count > 0;
  }

  private touch(id: number): void {
    const now = Date.now();
    if (now - (this.touched.get(id) ?? 0) < TOUCH_EVERY_MS) return;
    this.touched.set(id, now);
    void this.em
      .fork()
      .nativeUpdate(FeedKey, { id }, { lastUsedAt: new Date(now) })
      .catch(() => undefined);
  }
}
