/**
 * Ingest benchmark (run by scripts/bench-ingest.sh against a private, durable MariaDB and server):
 *   (a) raw: the batched upsert straight through the mariadb driver, 1000 rows a transaction,
 *       into a copy of the readings table — what this database can do;
 *   (b) ingest: versioned readings/s from a socket.io feed client through the /feeds gateway
 *       (validation, ordered per socket, revision check, conditional upsert, one transaction per
 *       batch, broadcast) until every batch is acknowledged, i.e. committed.
 * Both run against the same server with innodb_flush_log_at_trx_commit=1 (checked): every commit,
 * and so every ack, is on disk.
 * Last line: `ingest: N readings/s, raw M rows/s, ratio R`.
 * Environment: DB_PORT, DB_NAME, DB_USER, DB_PASSWORD, BENCH_URL, MORROWLINE_FEED_KEY,
 * BENCH_READINGS (default 200000).
 */
import * as mariadb from 'mariadb';
import { io } from 'socket.io-client';
import { DEMO_ZONES, FEED_NAMESPACE, READINGS_EVENT, VersionClock, type FeedReading, type ReadingBatchAck } from '@morrowline/shared';

const HOUR = 3_600_000;
const BATCH = 1000;
const IN_FLIGHT = 8;

function env(name: string, fallback?: string): string {
  const value = process.env[name] ?? fallback;
  if (value === undefined) throw new Error(`bench-ingest: set ${name}`);
  return value;
}

function sqlDateTime(ms: number): string {
  return new Date(ms).toISOString().slice(0, 19).replace('T', ' ');
}

/** Readings for the demo zones, hour after hour back from `end`, values inside each zone's range. */
function makeReadings(total: number, end: number, offsetHours: number): FeedReading[] {
  const clock = new VersionClock();
  const out: FeedReading[] = [];
  for (let i = 0; out.length < total; i++) {
    for (const zone of DEMO_ZONES) {
      if (out.length >= total) break;
      const h = i + offsetHours;
      out.push({ zone: zone.code, hour: new Date(end - h * HOUR).toISOString(), mw: Math.round(zone.peakMw * (0.6 + 0.3 * Math.sin(h / 3.8)) * 1000) / 1000, version: clock.next() });
    }
  }
  return out;
}

async function rawRate(pool: mariadb.Pool, zoneIds: Map<string, number>, readings: FeedReading[]): Promise<number> {
  const conn = await pool.getConnection();
  try {
    await conn.query('drop table if exists bench_raw_readings');
    await conn.query('create table bench_raw_readings like readings');
    const started = process.hrtime.bigint();
    const received = sqlDateTime(Date.now()) + '.000';
    for (let i = 0; i < readings.length; i += BATCH) {
      const chunk = readings.slice(i, i + BATCH);
      const values: unknown[] = [];
      for (const r of chunk) values.push(zoneIds.get(r.zone), sqlDateTime(Date.parse(r.hour)), r.mw, 'good', 'bench:raw', received, String(r.version));
      await conn.beginTransaction();
      await conn.query(
        `insert into bench_raw_readings (zone_id, hour_start, mw, quality, source, received_at, version) values ${new Array(chunk.length).fill('(?,?,?,?,?,?,?)').join(',')}
         on duplicate key update mw = values(mw), quality = values(quality), source = values(source), received_at = values(received_at), version = values(version)`,
        values,
      );
      await conn.commit();
    }
    const seconds = Number(process.hrtime.bigint() - started) / 1e9;
    await conn.query('drop table bench_raw_readings');
    return readings.length / seconds;
  } finally {
    await conn.release();
  }
}

async function ingestRate(url: string, apiKey: string, readings: FeedReading[]): Promise<{ rate: number; stored: number; rejected: number }> {
  const socket = io(`${url}${FEED_NAMESPACE}`, { auth: { apiKey }, transports: ['websocket'] });
  await new Promise<void>((resolve, reject) => {
    socket.once('connect', () => resolve());
    socket.once('connect_error', reject);
  });
  let stored = 0;
  let rejected = 0;
  let next = 0;
  const started = process.hrtime.bigint();
  await new Promise<void>((resolve, reject) => {
    let inFlight = 0;
    const pump = () => {
      while (inFlight < IN_FLIGHT && next < readings.length) {
        const batch = readings.slice(next, next + BATCH);
        const batchId = `bench-${next}`;
        next += BATCH;
        inFlight++;
        socket.emit(READINGS_EVENT, { batchId, readings: batch }, (ack: ReadingBatchAck) => {
          inFlight--;
          if (ack.error) return reject(new Error(ack.error));
          stored += ack.stored;
          rejected += ack.rejected.length;
          if (next >= readings.length && inFlight === 0) resolve();
          else pump();
        });
      }
    };
    pump();
  });
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  socket.close();
  return { rate: readings.length / seconds, stored, rejected };
}

async function main(): Promise<void> {
  const total = Number(env('BENCH_READINGS', '200000'));
  const pool = mariadb.createPool({
    host: env('DB_HOST', '127.0.0.1'),
    port: Number(env('DB_PORT')),
    database: env('DB_NAME'),
    user: env('DB_USER'),
    password: env('DB_PASSWORD'),
    connectionLimit: 2,
    timezone: '+00:00',
  });
  try {
    const [durability] = (await pool.query('select @@innodb_flush_log_at_trx_commit as flush, @@sync_binlog as sync_binlog, @@log_bin as log_bin')) as {
      flush: number | bigint;
      sync_binlog: number | bigint;
      log_bin: number | bigint;
    }[];
    if (Number(durability.flush) !== 1 || (Number(durability.log_bin) === 1 && Number(durability.sync_binlog) !== 1)) {
      throw new Error(`the bench database is not durable (innodb_flush_log_at_trx_commit=${durability.flush}, sync_binlog=${durability.sync_binlog}); restart it with scripts/db.sh`);
    }
    console.log(`durable database: innodb_flush_log_at_trx_commit=1, binary log ${Number(durability.log_bin) === 1 ? 'on with sync_binlog=1' : 'off'}`);
    const zones = (await pool.query('select id, code from zones')) as { id: number; code: string }[];
    const zoneIds = new Map(zones.map((z) => [z.code, z.id]));
    const end = Math.floor(Date.now() / HOUR) * HOUR - 72 * HOUR;
    // Old hours (no alerts to evaluate) and fresh keys in both runs: both measure first inserts.
    const raw = await rawRate(pool, zoneIds, makeReadings(total, end, 0));
    console.log(`raw batched upsert: ${Math.round(raw)} rows/s (${total} rows, ${BATCH} per transaction)`);
    const before = Number(((await pool.query('select count(*) n from readings')) as { n: bigint }[])[0].n);
    const ingest = await ingestRate(env('BENCH_URL'), env('MORROWLINE_FEED_KEY'), makeReadings(total, end, 0));
    const after = Number(((await pool.query('select count(*) n from readings')) as { n: bigint }[])[0].n);
    console.log(`feed ingest: ${Math.round(ingest.rate)} readings/s (${ingest.stored} stored, ${ingest.rejected} rejected, ${after - before} new rows committed)`);
    if (after - before !== total) throw new Error(`expected ${total} new rows, found ${after - before}`);
    console.log(`ingest: ${Math.round(ingest.rate)} readings/s, raw ${Math.round(raw)} rows/s, ratio ${(ingest.rate / raw).toFixed(2)}`);
  } finally {
    await pool.end();
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
