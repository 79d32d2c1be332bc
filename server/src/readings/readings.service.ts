import { OnEvent } from '@nestjs/event-emitter';
import { BadRequestException, Injectable } from '@nestjs/common';
import { HOUR_MS, STALE_AFTER_HOURS, type FeedStatusDto, type ReadingRejection, type ReadingSeriesDto } from '@morrowline/shared';
import { DOMAIN_EVENTS, type ReadingsStored } from '../events/domain-events';
import { DomainEventsPublisher } from '../events/domain-events.publisher';
import { pickActiveZones } from '../zones/active-zones';
import { ZonesRepository } from '../zones/zones.repository';
import { validateBatch, type ZoneLimits } from './reading-validation';
import { checkVersion } from './reading-version';
import { ReadingsRepository, type StoredRow, type VersionedReading } from './readings.repository';

/** Longest range one series request may ask for. */
export const MAX_SERIES_HOURS = 24 * 92;
/** Zone settings are re-read at most this often; a change made on this node drops them at once (onZoneChanged). */
const ZONE_CACHE_MS = 5_000;

export interface IngestOptions {
  /** "feed:<name>" or "csv:<e-mail>", stored with each reading. */
  source: string;
  /** Only this zone's readings are accepted (a scoped feed key). */
  allowedZone?: string | null;
}

export interface IngestResult {
  stored: number;
  revised: number;
  /** Valid readings older than the stored value of their hour (kept as revisions only). */
  superseded: number;
  rejected: ReadingRejection[];
}

/**
 * Readings: validation against the zones' settings, the idempotent keyed store, the
 * readings-stored event (desks and deviation alerts listen), and the series the live view reads.
 */
@Injectable()
export class ReadingsService {
  private zoneCache: { at: number; byCode: Map<string, ZoneLimits>; byId: Map<number, ZoneLimits> } | null = null;

  constructor(
    private readonly zoneRows: ZonesRepository,
    private readonly repository: ReadingsRepository,
    private readonly events: DomainEventsPublisher,
  ) {}

  /**
   * A zone created, switched off or given another plausible range is seen at once, not when the
   * cache expires: a switched-off zone's readings are refused from the next batch on (on this
   * node; in a cluster the others read the change within ZONE_CACHE_MS).
   */
  @OnEvent(DOMAIN_EVENTS.zoneChanged)
  onZoneChanged(): void {
    this.zoneCache = null;
  }

  async zones(refresh = false): Promise<{ byCode: Map<string, ZoneLimits>; byId: Map<number, ZoneLimits> }> {
    if (!refresh && this.zoneCache && Date.now() - this.zoneCache.at < ZONE_CACHE_MS) return this.zoneCache;
    const zones = await this.zoneRows.active();
    const limits = zones.map((z) => ({ id: z.id, code: z.code, minPlausibleMw: z.minPlausibleMw, maxPlausibleMw: z.maxPlausibleMw }));
    this.zoneCache = { at: Date.now(), byCode: new Map(limits.map((z) => [z.code, z])), byId: new Map(limits.map((z) => [z.id, z])) };
    return this.zoneCache;
  }

  /**
   * Validates and stores a batch, its valid readings all or none (a failure throws and nothing
   * is stored); answers what was stored and why the rest was refused.
   */
  async ingest(raws: readonly unknown[], options: IngestOptions): Promise<IngestResult> {
    return (await this.enqueue(raws, options)).result;
  }

  /**
   * Validates a batch and puts its valid readings in the store's queue; resolves as soon as they
   * are queued (their place in the order of application is then fixed), with `result` settling
   * once they are committed. A feed socket waits for this before it looks at its next batch, so
   * its batches are applied in arrival order while one is validated as the other is written.
   */
  async enqueue(raws: readonly unknown[], options: IngestOptions): Promise<{ result: Promise<IngestResult> }> {
    let zones = await this.zones();
    // A zone created a moment ago should not be refused because of the cache.
    if (raws.some((r) => typeof r === 'object' && r !== null && typeof (r as { zone?: unknown }).zone === 'string' && !zones.byCode.has((r as { zone: string }).zone))) {
      zones = await this.zones(true);
    }
    const now = Date.now();
    const checked = validateBatch(raws, { zones: zones.byCode, now, allowedZone: options.allowedZone });
    const rejected = [...checked.rejected];
    const valid: VersionedReading[] = [];
    checked.valid.forEach((reading, i) => {
      const index = checked.indexes[i];
      const version = checkVersion(raws[index], now);
      // Stamped on the validated object itself (made for this batch alone): a copy per reading
      // is garbage the collector pays for at feed rates.
      if (version.ok) valid.push(Object.assign(reading, { version: version.version }));
      else rejected.push({ index, reason: 'malformed', message: version.message });
    });
    rejected.sort((a, b) => a.index - b.index);
    if (valid.length === 0) return { result: Promise.resolve({ stored: 0, revised: 0, superseded: 0, rejected }) };
    const byId = zones.byId;
    const result = this.repository.store(valid, options.source).then((outcome) => {
      if (outcome.changed.length > 0) this.announce(outcome.changed, byId);
      return { stored: outcome.stored, revised: outcome.revised, superseded: outcome.superseded, rejected };
    });
    return { result };
  }

  /** Tells listeners of the rows just stored (the store has committed them). */
  private announce(rows: StoredRow[], byId: Map<number, ZoneLimits>): void {
    const perZone = new Map<number, ReadingsStored['zones'][number]>();
    // Many zones share each hour of a batch: its text is made once.
    const hourTexts = new Map<number, string>();
    for (const row of rows) {
      let entry = perZone.get(row.zoneId);
      if (!entry) perZone.set(row.zoneId, (entry = { zoneId: row.zoneId, zone: byId.get(row.zoneId)?.code ?? String(row.zoneId), hours: [], mw: [] }));
      let hour = hourTexts.get(row.hourStart);
      if (hour === undefined) hourTexts.set(row.hourStart, (hour = new Date(row.hourStart).toISOString()));
      entry.hours.push(hour);
      entry.mw.push(row.mw);
    }
    this.events.publish(DOMAIN_EVENTS.readingsStored, { zones: [...perZone.values()], receivedAt: new Date().toISOString() });
  }

  /**
   * Resolves zone codes (all active zones when none given); unknown codes are a 400. A code the
   * cached list lacks is looked up afresh before it is refused: a zone added a moment ago (less
   * than ZONE_CACHE_MS) is a zone, and its schedule, forecast or history must not be answered
   * "no active zone" until the cache happens to expire.
   */
  async resolveZones(codes: readonly string[] | undefined): Promise<ZoneLimits[]> {
    let zones = await this.zones();
    if (codes?.some((code) => !zones.byCode.has(code))) zones = await this.zones(true);
    return pickActiveZones([...zones.byCode.values()], codes);
  }

  /** Checks a requested [from, to) and rounds it out to whole hours. */
  static hourRange(from: Date | undefined, to: Date | undefined, defaultHours: number, maxHours = MAX_SERIES_HOURS): { from: number; to: number } {
    const end = Math.ceil((to ?? new Date(Date.now() + HOUR_MS)).getTime() / HOUR_MS) * HOUR_MS;
    const start = Math.floor((from?.getTime() ?? end - defaultHours * HOUR_MS) / HOUR_MS) * HOUR_MS;
    if (!(start < end)) throw new BadRequestException('from must be before to');
    if ((end - start) / HOUR_MS > maxHours) throw new BadRequestException(`The range may span at most ${maxHours} hours`);
    return { from: start, to: end };
  }

  async series(codes: readonly string[] | undefined, from?: Date, to?: Date): Promise<ReadingSeriesDto> {
    const zones = await this.resolveZones(codes);
    const range = ReadingsService.hourRange(from, to, 24 * 7);
    const count = (range.to - range.from) / HOUR_MS;
    const hours = Array.from({ length: count }, (_, i) => new Date(range.from + i * HOUR_MS).toISOString());
    const [rows, latest] = await Promise.all([
      this.repository.range(
        zones.map((z) => z.id),
        range.from,
        range.to,
      ),
      this.repository.latest(),
    ]);
    const byZone = new Map(zones.map((z) => [z.id, { mw: new Array<number | null>(count).fill(null), quality: new Array<StoredRow['quality'] | null>(count).fill(null) }]));
    for (const row of rows) {
      const slot = byZone.get(row.zoneId);
      if (!slot) continue;
      const i = (row.hourStart - range.from) / HOUR_MS;
      slot.mw[i] = row.mw;
      slot.quality[i] = row.quality;
    }
    return {
      from: new Date(range.from).toISOString(),
      to: new Date(range.to).toISOString(),
      hours,
      zones: zones.map((z) => {
        const last = latest.get(z.id);
        const slot = byZone.get(z.id)!;
        return {
          zone: z.code,
          mw: slot.mw,
          quality: slot.quality,
          lastHour: last ? new Date(last.hourStart).toISOString() : null,
          lastReceivedAt: last ? new Date(last.receivedAt).toISOString() : null,
        };
      }),
    };
  }

  /** Per zone: the latest hour stored, and whether the feed has fallen silent. */
  async status(now = Date.now()): Promise<FeedStatusDto[]> {
    const zones = await this.resolveZones(undefined);
    const latest = await this.repository.latest();
    return zones.map((z) => {
      const last = latest.get(z.id);
      if (!last) return { zone: z.code, lastHour: null, lastReceivedAt: null, hoursBehind: null, stale: true };
      const behind = Math.max(0, Math.floor((now - (last.hourStart + HOUR_MS)) / HOUR_MS));
      return {
        zone: z.code,
        lastHour: new Date(last.hourStart).toISOString(),
        lastReceivedAt: new Date(last.receivedAt).toISOString(),
        hoursBehind: behind,
        stale: now - (last.hourStart + HOUR_MS) > STALE_AFTER_HOURS * HOUR_MS,
      };
    });
  }

  /** Stored readings of a zone in a range (CSV download and the alerts' look-ups). */
  async rows(zoneId: number, from: number, to: number): Promise<StoredRow[]> {
    return this.repository.range([zoneId], from, to);
  }
}
