import { EntityManager, type Knex } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { HOUR_MS, VersionClock, type ReadingQuality } from '@morrowline/shared';
import { READING_QUALITIES } from './entities/reading.entity';
import type { ValidReading } from './reading-validation';

/** Rows per statement (a batch is one transaction of several statements): larger gains little. */
export const UPSERT_CHUNK = 1000;
const DEADLOCK_ERRNOS = new Set([1213, 1205]);

export interface StoredRow {
  zoneId: number;
  hourStart: number;
  mw: number;
  quality: ReadingQuality;
}

/** A valid reading with what orders it: the feed's version, or none (the server stamps it on storing). */
export type VersionedReading = ValidReading & { version?: number | null };

export interface StoreOutcome {
  /** Readings accepted (repeats of the stored value and superseded values included). */
  stored: number;
  /** Of them, how many replaced a different earlier value (a revision was written). */
  revised: number;
  /** Of them, how many were older than the value already stored (kept as a revision only). */
  superseded: number;
  /** Rows whose stored value is now new or different: what desks and alerts need to hear of. */
  changed: StoredRow[];
}

/** "YYYY-MM-DD HH:MM:SS" in UTC, the form DATETIME columns take without any zone conversion. */
export function sqlDateTime(ms: number): string {
  return new Date(ms).toISOString().slice(0, 19).replace('T', ' ');
}

/**
 * One (zone, hour) as a number, for the maps a batch is planned in: a group holds up to 20,000
 * readings, and number keys spare a string built and hashed for each. Exact while the hour
 * index (about 5.0e5 in 2026, 1.2e6 in 2100) times 2^31 stays below 2^53, i.e. for every hour the
 * time window allows; zone ids are below 2^31 (INT UNSIGNED keys would be refused by
 * sqlInteger long before).
 */
export function readingKey(zoneId: number, hourStart: number): number {
  return (hourStart / HOUR_MS) * 2_147_483_648 + zoneId;
}

/** The SQL text of each hour a group writes, made once per hour rather than once per reading. */
function hourTextCache(): (ms: number) => string {
  const texts = new Map<number, string>();
  return (ms) => {
    let text = texts.get(ms);
    if (text === undefined) texts.set(ms, (text = sqlDateTime(ms)));
    return text;
  };
}

function sqlDateTime3(ms: number): string {
  return new Date(ms).toISOString().slice(0, 23).replace('T', ' ');
}

/** A whole number as an SQL literal; anything else is a bug upstream, refused here. */
function sqlInteger(value: number): string {
  if (!Number.isSafeInteger(value)) throw new Error(`not a whole number for SQL: ${value}`);
  return String(value);
}

/** A finite number as an SQL literal ("1e-7" and "1e+21" are valid MariaDB numbers). */
function sqlNumber(value: number): string {
  if (!Number.isFinite(value)) throw new Error(`not a finite number for SQL: ${value}`);
  return String(value);
}

function sqlQuality(value: ReadingQuality): ReadingQuality {
  if (!(READING_QUALITIES as readonly string[]).includes(value)) throw new Error(`not a reading quality: ${String(value)}`);
  return value;
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
  version: unknown;
}

interface Held {
  mw: number;
  quality: ReadingQuality;
  source: string;
  receivedAt: number;
  version: number;
}

/** The value a (zone, hour) ends with after a group, and who sent it: one row of the upsert. */
interface FinalRow {
  reading: VersionedReading;
  version: number;
  source: string;
}

/** What store() decided for one batch, before it is written. */
interface Plan {
  /** Final value per key, with its version: the upsert's rows. */
  finals: Map<number, FinalRow>;
  /** reading_revisions rows, 9 values each. */
  revisions: (string | number | null)[];
  revised: number;
  superseded: number;
  changed: Map<number, StoredRow>;
}

/**
 * Decides, for a batch walked in order over what is stored (`current`, locked; updated here as
 * the batch goes), which value each (zone, hour) ends with and which values become revisions.
 * No I/O: the SQL below applies the same rule again (the upsert is conditional on the version),
 * so a stored row never goes back to an older value.
 */
export function planBatch(
  readings: readonly VersionedReading[],
  current: Map<number, Held>,
  source: string,
  now: number,
  clock: VersionClock,
  hourText: (ms: number) => string = sqlDateTime,
  finals: Map<number, FinalRow> = new Map(),
): Plan {
  const plan: Plan = { finals, revisions: [], revised: 0, superseded: 0, changed: new Map() };
  const revision = (zoneId: number, hourStart: number, held: Held, replacedBy: string) =>
    plan.revisions.push(zoneId, hourText(hourStart), held.mw, held.quality, held.source, sqlDateTime3(held.receivedAt), sqlDateTime3(now), replacedBy, held.version > 0 ? String(held.version) : null);
  for (const r of readings) {
    const key = readingKey(r.zoneId, r.hourStart);
    const before = current.get(key);
    // No version: the latest value at the moment it is stored (CSV uploads, unversioned feeds).
    const version = r.version ?? clock.nextAbove(before?.version ?? 0);
    const incoming: Held = { mw: r.mw, quality: r.quality, source, receivedAt: now, version };
    if (before && version <= before.version) {
      // A repeat of the stored version changes nothing; an older value is kept as a revision.
      if (version < before.version) {
        plan.superseded++;
        revision(r.zoneId, r.hourStart, incoming, before.source);
      }
      continue;
    }
    const sameValue = before !== undefined && before.mw === r.mw && before.quality === r.quality;
    if (before && !sameValue) {
      plan.revised++;
      revision(r.zoneId, r.hourStart, before, source);
    }
    // The same value under a later version: only the version (and who said it last) moves on.
    current.set(key, incoming);
    plan.finals.set(key, { reading: r, version, source });
    if (!sameValue) plan.changed.set(key, { zoneId: r.zoneId, hourStart: r.hourStart, mw: r.mw, quality: r.quality });
  }
  return plan;
}

/** One store() call waiting for the next group commit. */
interface Request {
  readings: readonly VersionedReading[];
  source: string;
  resolve: (outcome: StoreOutcome) => void;
  reject: (error: unknown) => void;
}

/** Most readings one group commit takes (it always takes at least one whole request). */
export const GROUP_READINGS = 20_000;

/**
 * The readings table through plain SQL: every batch stored whole or not at all, a keyed upsert
 * that applies a value only over a lower version and keeps every other value as a revision, and
 * the range queries of the live view.
 *
 * Writes are applied strictly in the order store() was called. Batches that queue up while a
 * commit is on its way to disk are written together in the next transaction (group commit;
 * DeWitt et al., 1984): with a durable log (innodb_flush_log_at_trx_commit=1) each commit waits
 * for a disk flush, and sharing that flush keeps the rate. A group commits or fails as a whole,
 * so each batch in it is still all or nothing, and each caller learns which.
 */
@Injectable()
export class ReadingsRepository {
  private readonly pending: Request[] = [];
  private writing = false;
  private readonly clock = new VersionClock();

  constructor(private readonly em: EntityManager) {}

  /**
   * Stores valid readings, all or none (idempotent: the same version sent twice is stored once).
   * The order of calls is the order of application; it resolves once the readings are committed.
   */
  store(readings: readonly VersionedReading[], source: string): Promise<StoreOutcome> {
    return new Promise((resolve, reject) => {
      this.pending.push({ readings, source, resolve, reject });
      if (!this.writing) void this.writeAll();
    });
  }

  private async writeAll(): Promise<void> {
    this.writing = true;
    try {
      while (this.pending.length > 0) {
        let count = 0;
        let take = 0;
        while (take < this.pending.length && (take === 0 || count + this.pending[take].readings.length <= GROUP_READINGS)) count += this.pending[take++].readings.length;
        const group = this.pending.splice(0, take);
        try {
          const outcomes = await this.withDeadlockRetry(() => this.storeGroup(group));
          group.forEach((request, i) => request.resolve(outcomes[i]));
        } catch (error) {
          for (const request of group) request.reject(error);
        }
      }
    } finally {
      this.writing = false;
    }
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

  /**
   * Reads and locks the stored rows of some hours of a zone. Hours that lie close together (the
   * usual batch: consecutive hours) are read as one primary-key range, far cheaper than a long
   * IN list of points; scattered hours are read by points, a thousand at a time.
   */
  private async lockStored(trx: Knex.Transaction, zoneId: number, hours: number[]): Promise<ExistingRow[][]> {
    const columns = 'zone_id, hour_start, mw, quality, source, received_at, version';
    hours.sort((a, b) => a - b);
    const first = hours[0];
    const last = hours[hours.length - 1];
    if ((last - first) / HOUR_MS < 2 * hours.length) {
      return [unwrap<ExistingRow>(await trx.raw(`select ${columns} from readings where zone_id = ? and hour_start between ? and ? for update`, [zoneId, sqlDateTime(first), sqlDateTime(last)]))];
    }
    const out: ExistingRow[][] = [];
    for (let i = 0; i < hours.length; i += UPSERT_CHUNK) {
      const list = hours.slice(i, i + UPSERT_CHUNK);
      out.push(unwrap<ExistingRow>(await trx.raw(`select ${columns} from readings where zone_id = ? and hour_start in (${list.map(() => '?').join(',')}) for update`, [zoneId, ...list.map(sqlDateTime)])));
    }
    return out;
  }

  /** One transaction for the group's batches, planned in order; answers each batch's outcome. */
  private async storeGroup(group: readonly Request[]): Promise<StoreOutcome[]> {
    if (group.every((request) => request.readings.length === 0)) return group.map(() => ({ stored: 0, revised: 0, superseded: 0, changed: [] }));
    const knex = this.em.getKnex();
    return knex.transaction(async (trx) => {
      const now = Date.now();
      const hourText = hourTextCache();
      // 1. What is stored now for these keys, locked until we commit.
      const hoursByZone = new Map<number, Set<number>>();
      for (const request of group) {
        for (const r of request.readings) {
          let hours = hoursByZone.get(r.zoneId);
          if (!hours) hoursByZone.set(r.zoneId, (hours = new Set()));
          hours.add(r.hourStart);
        }
      }
      const current = new Map<number, Held>();
      for (const [zoneId, hours] of hoursByZone) {
        for (const rows of await this.lockStored(trx, zoneId, [...hours])) {
          for (const row of rows) {
            current.set(readingKey(row.zone_id, fromSqlDateTime(row.hour_start)), {
              mw: Number(row.mw),
              quality: row.quality,
              source: row.source,
              receivedAt: fromSqlDateTime(row.received_at),
              version: Number(row.version),
            });
          }
        }
      }
      // 2. Walk the batches in order: which value each key ends with, which values are revisions.
      // The batches of a group share one map of final values: a later batch's value for a key
      // replaces an earlier one's, and what is left is the upsert.
      const finals = new Map<number, FinalRow>();
      const plans = group.map((request) => planBatch(request.readings, current, request.source, now, this.clock, hourText, finals));
      const revisions = plans.flatMap((plan) => plan.revisions);
      const fields = 9;
      for (let i = 0; i < revisions.length; i += UPSERT_CHUNK * fields) {
        const values = revisions.slice(i, i + UPSERT_CHUNK * fields);
        // A superseded value sent again is already kept: the unique (zone, hour, version) key skips it.
        await trx.raw(
          `insert into reading_revisions (zone_id, hour_start, mw, quality, source, received_at, replaced_at, replaced_by, version) values ${new Array(values.length / fields).fill('(?,?,?,?,?,?,?,?,?)').join(',')}
           on duplicate key update id = id`,
          values,
        );
      }
      // 3. The upsert, conditional on the version in SQL as well: a row never goes back to an older
      // value. Rows are written as literals (numbers, fixed-form times, a checked quality), the
      // sources and the time received as session variables bound once: thousands of bound
      // parameters cost more CPU in the driver than the database spends on the rows, and every
      // byte of the statement is encoded and sent.
      const sources: string[] = [];
      const sourceVariable = new Map<string, string>();
      for (const final of finals.values()) {
        if (!sourceVariable.has(final.source)) {
          sourceVariable.set(final.source, `@morrowline_source_${sources.length}`);
          sources.push(final.source);
        }
      }
      if (sources.length > 0) {
        await trx.raw(`set @morrowline_received = ?, ${sources.map((_, i) => `@morrowline_source_${i} = ?`).join(', ')}`, [sqlDateTime3(now), ...sources]);
      }
      let tuples = '';
      let inStatement = 0;
      const flush = async () => {
        await trx.raw(
          `insert into readings (zone_id, hour_start, mw, quality, source, received_at, version) values ${tuples}
           on duplicate key update
             mw = if(values(version) > version, values(mw), mw),
             quality = if(values(version) > version, values(quality), quality),
             source = if(values(version) > version, values(source), source),
             received_at = if(values(version) > version, values(received_at), received_at),
             version = greatest(version, values(version))`,
        );
        tuples = '';
        inStatement = 0;
      };
      for (const { reading: r, version, source } of finals.values()) {
        tuples += `${inStatement === 0 ? '' : ','}(${sqlInteger(r.zoneId)},'${hourText(r.hourStart)}',${sqlNumber(r.mw)},'${sqlQuality(r.quality)}',${sourceVariable.get(source)},@morrowline_received,${sqlInteger(version)})`;
        if (++inStatement === UPSERT_CHUNK) await flush();
      }
      if (inStatement > 0) await flush();
      return plans.map((plan, i) => ({ stored: group[i].readings.length, revised: plan.revised, superseded: plan.superseded, changed: [...plan.changed.values()] }));
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
