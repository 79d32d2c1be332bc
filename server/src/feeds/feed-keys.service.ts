import { UniqueConstraintViolationException } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, Injectable, Logger, NotFoundException } from '@nestjs/common';
import type { CreateFeedKeyRequest, CreatedFeedKey, FeedKeyDto } from '@morrowline/shared';
import { createHash, randomBytes } from 'node:crypto';
import { AuditService, type Actor } from '../audit/audit.service';
import { DATABASE_UNAVAILABLE_MESSAGE, isDatabaseUnavailable } from '../common/database-unavailable';
import { WeatherRepository } from '../weather/weather.repository';
import { ZonesRepository } from '../zones/zones.repository';
import type { FeedKey } from './entities/feed-key.entity';
import { FeedKeysRepository } from './feed-keys.repository';

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
    station: key.station ? key.station.code : null,
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
  /** Weather only, for this station. */
  station: string | null;
}

/** Meter-feed API keys: created (shown once), listed and revoked by admins; checked on connect. */
@Injectable()
export class FeedKeysService {
  private readonly logger = new Logger(FeedKeysService.name);
  private readonly touched = new Map<number, number>();

  constructor(
    private readonly keys: FeedKeysRepository,
    private readonly zones: ZonesRepository,
    private readonly stations: WeatherRepository,
    private readonly audit: AuditService,
  ) {}

  async list(): Promise<FeedKeyDto[]> {
    const keys = await this.keys.list();
    return keys.map(toFeedKeyDto);
  }

  async create(actor: Actor | null, request: CreateFeedKeyRequest): Promise<CreatedFeedKey> {
    const apiKey = `${KEY_PREFIX}${randomBytes(32).toString('base64url')}`;
    try {
      return await this.keys.fork().transactional(async (tx) => {
        const zone = request.zone ? await this.zones.byCode(request.zone, tx) : null;
        if (request.zone && !zone) throw new NotFoundException(`No zone with code ${request.zone}`);
        if (request.zone && request.station) throw new BadRequestException('A feed key may be limited to a zone (readings) or to a weather station (weather), not both');
        const station = request.station ? await this.stations.stationByCode(request.station, tx) : null;
        if (request.station && !station) throw new NotFoundException(`No weather station with code ${request.station}`);
        const key = await this.keys.insert(tx, {
          name: request.name.trim(),
          keyHash: hashFeedKey(apiKey),
          prefix: apiKey.slice(0, KEY_PREFIX.length + 6),
          zone,
          station,
          createdById: actor?.id ?? null,
          createdByEmail: actor?.email ?? null,
        });
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
    return this.keys.fork().transactional(async (tx) => {
      const key = await this.keys.byId(tx, id);
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
    const old = await this.keys.byName(name);
    if (old) {
      await this.revoke(null, old.id, 'Rotated by the start script');
      await this.keys.rename(old.id, `${name} (rotated ${new Date().toISOString()})`.slice(0, 120));
    }
    const created = await this.create(null, { name });
    return created.apiKey;
  }

  /** The feed a key belongs to, or an error a feed can act on. */
  async authenticate(apiKey: unknown): Promise<FeedIdentity> {
    if (typeof apiKey !== 'string' || apiKey.length === 0) throw new Error('A feed must connect with auth: { apiKey }');
    let key: FeedKey | null;
    try {
      key = await this.keys.byHash(hashFeedKey(apiKey));
    } catch (error) {
      // The handshake's answer reaches a client not yet known: never the driver's message.
      this.logger.warn(`feed key check failed: ${error instanceof Error ? error.message : String(error)}`);
      throw new Error(isDatabaseUnavailable(error) ? DATABASE_UNAVAILABLE_MESSAGE : 'The server could not check this feed key; try again', { cause: error });
    }
    if (!key) throw new Error('This feed key is not known');
    if (key.revokedAt) throw new Error('This feed key has been revoked');
    this.touch(key.id);
    return { id: key.id, name: key.name, zone: key.zone ? key.zone.code : null, station: key.station ? key.station.code : null };
  }

  /** Is the key still good? (checked for every batch, so a revocation takes effect at once). */
  async isActive(id: number): Promise<boolean> {
    const active = await this.keys.isActive(id);
    if (active) this.touch(id);
    return active;
  }

  private touch(id: number): void {
    const now = Date.now();
    if (now - (this.touched.get(id) ?? 0) < TOUCH_EVERY_MS) return;
    this.touched.set(id, now);
    void this.keys.touch(id, new Date(now)).catch(() => undefined);
  }
}
