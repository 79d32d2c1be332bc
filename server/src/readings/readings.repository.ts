import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { ReadingQuality } from '@morrowline/shared';
import type { ValidReading } from './reading-validation';

/** Rows per transaction: the rate of the batched upsert levels off around a thousand. */
export const UPSERT_CHUNK = 1000;
const DEADLOCK_ERRNOS = new Set([1213, 1205]);

export interface StoredRow {
  zoneId: number;
  hourStart: number;
  mw: number;
  quality: ReadingQuality;
}

export interface StoreOutcome {
  /** Readings accepted (repeats of the stored value included). */
  stored: number;
  /** Of them, how many replaced a different earlier value (a revision was written). */
  revised: number;
  /** Rows whose stored value is now new or different: what desks and alerts need to hear of. */
  changed: StoredRow[];
}

/** "YYYY-MM-DD HH:MM:SS" in UTC, the form DATETIME columns take without any zone conversion. */
export function sqlDateTime(ms: number): string {
  return new Date(ms).toISOString().slice(0, 19).replace('T', ' ');
}

function sqlDateTime3(ms: number): string {
  return new Date(ms).toISOString().slice(0, 23).replace('T', ' ');
}

/** DATETIME values come back as UTC "YYYY-MM-DD HH:MM:SS[.fff]" strings (see dateStrings below) or Dates. */
export function fromSqlDateTime(value: unknown): number {
  if (value instanceof Date) return value.getTime();
  return Date.parse(`${String(value).replace(' ', 'T')}Z`);
}

interface ExistingRow {
  zone_id: number;
  hour_start: unknown;
  mw: number;
  quality: ReadingQuality;
  source: string;
  received_at: unknown;
}

/**
 * The readings table through plain SQL: a keyed upsert in transactions of UPSERT_CHUNK rows
 * that keeps each replaced value as a revision, and the range queries of the live view.
 */
@Injectable()
export class ReadingsRepository {
  /** Writes run one after another: no lock waits between our own batches, no deadlocks. */
  private queue: Promise<unknown> = Promise.resolve();

  constructor(private readonly em: EntityManager) {}

  /** Stores valid readings (idempotent: the same value sent twice is stored once). */
  store(readings: readonly ValidReading[], source: string): Promise<StoreOutcome> {
    const run = this.queue.then(() => this.storeNow(readings, source));
    this.queue = run.catch(() => undefined);
    return run;
  }

  private async storeNow(readings: readonly ValidReading[], source: string): Promise<StoreOutcome> {
    const outcome: StoreOutcome = { stored: 0, revised: 0, changed: [] };
    for (let i = 0; i < readings.length; i += UPSERT_CHUNK) {
      const chunk = readings.slice(i, i + UPSERT_CHUNK);
      const result = await this.withDeadlockRetry(() => this.storeChunk(chunk, source));
      outcome.stored += result.stored;
      outcome.revised += result.revised;
      outcome.changed.push(...result.changed);
      // Let sockets and HTTP requests in between chunks of a large upload.
      if (i + UPSERT_CHUNK < readings.length) await new Promise((resolve) => setImmediate(resolve));
    }
    return outcome;
  }

  private async withDeadlockRetry<T>(work: () => Promise<T>): Promise<T> {
    for (let attempt = 1; ; attempt++) {
      try {
        return await work();
      } catch (error) {
        const errno = (error as { errno?: number }).errno;
        if (attempt >= 5 || errno === undefined || !DEADLOCK_ERRNOS.has(errno)) throw error;
        await new Promise((resolve) => setTimeout(resolve, 20 * attempt));
      }
    }
  }

  private async storeChunk(chunk: readonly ValidReading[], source: string): Promise<StoreOutcome> {
    const knex = this.em.getKnex();
    return knex.transaction(async (trx) => {
      const now = Date.now();
      // 1. What is stored now for these keys, locked until we commit.
      const hoursByZone = new Map<number, Set<number>>();
      for (const r of chunk) {
        let hours = hoursByZone.get(r.zoneId);
        if (!hours) hoursByZone.set(r.zoneId, (hours = new Set()));
        hours.add(r.hourStart);
      }
      const existing = new Map<string, { mw: number; quality: ReadingQuality; source: string; receivedAt: number }>();
      for (const [zoneId, hours] of hoursByZone) {
        const list = [...hours];
        const rows = unwrap<ExistingRow>(
          await trx.raw(
            `select zone_id, hour_start, mw, quality, source, received_at from readings where zone_id = ? and hour_start in (${list.map(() => '?').join(',')}) for update`,
            [zoneId, ...list.map(sqlDateTime)],
          ),
        );
        for (const row of rows) {
          existing.set(`${row.zone_id}|${fromSqlDateTime(row.hour_start)}`, {
            mw: Number(row.mw),
            quality: row.quality,
            source: row.source,
            receivedAt: fromSqlDateTime(row.received_at),
          });
        }
      }
      // 2. Walk the chunk in order: each value that replaces a different one leaves a revision.
      const current = new Map(existing);
      const finals = new Map<string, ValidReading>();
      const revisions: (string | number)[] = [];
      let revised = 0;
      for (const r of chunk) {
        const key = `${r.zoneId}|${r.hourStart}`;
        const before = current.get(key);
        if (before && before.mw === r.mw && before.quality === r.quality) continue;
        if (before) {
          revised++;
          revisions.push(r.zoneId, sqlDateTime(r.hourStart), before.mw, before.quality, before.source, sqlDateTime3(before.receivedAt), sqlDateTime3(now), source);
        }
        current.set(key, { mw: r.mw, quality: r.quality, source, receivedAt: now });
        finals.set(key, r);
      }
      if (revisions.length > 0) {
        const rows = revisions.length / 8;
        await trx.raw(
          `insert into reading_revisions (zone_id, hour_start, mw, quality, source, received_at, replaced_at, replaced_by) values ${new Array(rows).fill('(?,?,?,?,?,?,?,?)').join(',')}`,
          revisions,
        );
      }
      // 3. The upsert, only for keys whose value is new or different.
      const changed = [...finals.values()];
      if (changed.length > 0) {
        const received = sqlDateTime3(now);
        const values: (string | number)[] = [];
        for (const r of changed) values.push(r.zoneId, sqlDateTime(r.hourStart), r.mw, r.quality, source, received);
        await trx.raw(
          `insert into readings (zone_id, hour_start, mw, quality, source, received_at) values ${new Array(changed.length).fill('(?,?,?,?,?,?)').join(',')}
           on duplicate key update mw = values(mw), quality = values(quality), source = values(source), received_at = values(received_at)`,
          values,
        );
      }
      return {
        stored: chunk.length,
        revised,
        changed: changed.map((r) => ({ zoneId: r.zoneId, hourStart: r.hourStart, mw: r.mw, quality: r.quality })),
      };
    });
  }

  /** Stored readings of some zones in [from, to), ordered by zone and hour. */
  async range(zoneIds: readonly number[], from: number, to: number): Promise<StoredRow[]> {
    if (zoneIds.length === 0) return [];
    const rows = unwrap<{ zone_id: number; hour_start: unknown; mw: number; quality: ReadingQuality }>(
      await this.em
        .getKnex()
        .raw(
          `select zone_id, hour_start, mw, quality from readings where zone_id in (${zoneIds.map(() => '?').join(',')}) and hour_start >= ? and hour_start < ? order by zone_id, hour_start`,
          [...zoneIds, sqlDateTime(from), sqlDateTime(to)],
        ),
    );
    return rows.map((row) => ({ zoneId: row.zone_id, hourStart: fromSqlDateTime(row.hour_start), mw: Number(row.mw), quality: row.quality }));
  }

  /** The latest stored hour of one zone (the primary key's prefix answers it); null when it has none. */
  async lastHour(zoneId: number): Promise<number | null> {
    const rows = unwrap<{ last_hour: unknown }>(await this.em.getKnex().raw('select max(hour_start) as last_hour from readings where zone_id = ?', [zoneId]));
    const last = rows[0]?.last_hour;
    return last === null || last === undefined ? null : fromSqlDateTime(last);
  }

  /** How many hours of a zone are stored. */
  async countOf(zoneId: number): Promise<number> {
    const rows = unwrap<{ n: number | string }>(await this.em.getKnex().raw('select count(*) as n from readings where zone_id = ?', [zoneId]));
    return Number(rows[0]?.n ?? 0);
  }

  /** The latest stored hour per zone and when it arrived. */
  async latest(): Promise<Map<number, { hourStart: number; receivedAt: number }>> {
    const rows = unwrap<{ zone_id: number; hour_start: unknown; received_at: unknown }>(
      await this.em
        .getKnex()
        .raw(
          `select r.zone_id, r.hour_start, r.received_at from readings r
           join (select zone_id, max(hour_start) as last_hour from readings group by zone_id) m on m.zone_id = r.zone_id and m.last_hour = r.hour_start`,
        ),
    );
    return new Map(rows.map((row) => [row.zone_id, { hourStart: fromSqlDateTime(row.hour_start), receivedAt: fromSqlDateTime(row.received_at) }]));
  }

  /** How many revisions an hour has (tests, diagnostics). */
  async revisionsOf(zoneId: number, hourStart: number): Promise<{ mw: number; source: string; replacedBy: string }[]> {
    const rows = unwrap<{ mw: number; source: string; replaced_by: string }>(
      await this.em
        .getKnex()
        .raw('select mw, source, replaced_by from reading_revisions where zone_id = ? and hour_start = ? order by id', [zoneId, sqlDateTime(hourStart)]),
    );
    return rows.map((row) => ({ mw: Number(row.mw), source: row.source, replacedBy: row.replaced_by }));
  }
}

/** knex.raw on the MySQL-family clients answers [rows, fields]; take the rows. */
function unwrap<T>(result: unknown): T[] {
  if (Array.isArray(result) && Array.isArray(result[0])) return result[0] as T[];
  if (Array.isArray(result)) return result as T[];
  return [];
}
