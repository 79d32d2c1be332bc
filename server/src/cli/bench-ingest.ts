/**
 * Ingest benchmark (run by scripts/bench-ingest.sh against a private, durable MariaDB and server):
 *   (a) raw: the batched upsert straight through the mariadb driver, 1000 rows a transaction,
 *       into a copy of the readings table — what this database can do;
 *   (b) ingest: versioned readings/s from a socket.io feed client through the /feeds gateway
 *       (validation, ordered per socket, revision check, conditional upsert, one transaction per
 *       batch, broadcast) until every batch is acknowledged, i.e. committed.
 * Both run against the same server with innodb_flush_log_at_trx_commit=1 (checked): every commit,
 * and so every ack, is on disk. The two are measured in alternating rounds (raw, feed, raw, feed,
 * …) on fresh hours each round, and each rate is the total rows over the total time of its rounds:
 * on a shared machine the background load drifts within a run, and alternating lets both paths
 * meet the same drift instead of one of them meeting a quiet minute. The raw table is kept across
 * rounds, so both paths insert into tables that grow alike.
 * Last line: `ingest: N readings/s, raw M rows/s, ratio R`.
 * Environment: DB_PORT, DB_NAME, DB_USER, DB_PASSWORD, BENCH_URL, MORROWLINE_FEED_KEY,
 * BENCH_READINGS (default 200000, split over the rounds), BENCH_ROUNDS (default 4).
 */
import * as mariadb from 'mariadb';
import { io, type Socket } from 'socket.io-client';
import { DEMO_ZONES, FEED_NAMESPACE, READINGS_EVENT, VersionClock, type FeedReading, type ReadingBatchAck } from '@morrowline/shared';

const HOUR = 3_600_000;
const BATCH = 1000;
const IN_FLIGHT = 8;
/** Most readings of the uncounted warm-up round of each path (never more than a round). */
const MAX_WARM_UP = 10_000;

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

/** Seconds to upsert `readings` into the raw copy table, 1000 rows a transaction. */
async function rawSeconds(conn: mariadb.Connection, zoneIds: Map<string, number>, readings: FeedReading[]): Promise<number> {
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
  return Number(process.hrtime.bigint() - started) / 1e9;
}

/** Seconds for the feed path to acknowledge every batch of `readings` (each ack follows its commit). */
async function ingestSeconds(socket: Socket, readings: FeedReading[]): Promise<{ seconds: number; stored: number; rejected: number }> {
  let stored = 0;
  let rejected = 0;
  let next = 0;
  const started = process.hrtime.bigint();
  await new Promise<void>((resolve, reject) => {
    let inFlight = 0;
    const pump = () => {
      while (inFlight < IN_FLIGHT && next < readings.length) {
        const batch = readings.slice(next, next + BATCH);
        const batchId = `bench-${readings[0]?.hour}-${next}`;
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
  return { seconds: Number(process.hrtime.bigint() - started) / 1e9, stored, rejected };
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
    const rounds = Number(env('BENCH_ROUNDS', '4'));
    const perRound = Math.ceil(total / rounds);
    const hoursPerRound = Math.ceil(perRound / DEMO_ZONES.length);
    const warmUp = Math.min(MAX_WARM_UP, perRound);
    const before = Number(((await pool.query('select count(*) n from readings')) as { n: bigint }[])[0].n);
    const conn = await pool.getConnection();
    const socket = io(`${env('BENCH_URL')}${FEED_NAMESPACE}`, { auth: { apiKey: env('MORROWLINE_FEED_KEY') }, transports: ['websocket'] });
    let rawTime = 0;
    let feedTime = 0;
    let stored = 0;
    let rejected = 0;
    try {
      await new Promise<void>((resolve, reject) => {
        socket.once('connect', () => resolve());
        socket.once('connect_error', reject);
      });
      await conn.query('drop table if exists bench_raw_readings');
      await conn.query('create table bench_raw_readings like readings');
      // Old hours (no alerts to evaluate), fresh keys in every round of both paths: all first inserts.
      // A warm-up round of each, not counted, so neither is timed while its code is still compiled.
      const warmHours = rounds * hoursPerRound;
      await rawSeconds(conn, zoneIds, makeReadings(warmUp, end, warmHours));
      await ingestSeconds(socket, makeReadings(warmUp, end, warmHours));
      for (let round = 0; round < rounds; round++) {
        const readings = makeReadings(perRound, end, round * hoursPerRound);
        const raw = await rawSeconds(conn, zoneIds, readings);
        const feed = await ingestSeconds(socket, makeReadings(perRound, end, round * hoursPerRound));
        rawTime += raw;
        feedTime += feed.seconds;
        stored += feed.stored;
        rejected += feed.rejected;
        console.log(`round ${round + 1}/${rounds}: raw ${Math.round(perRound / raw)} rows/s, feed ${Math.round(perRound / feed.seconds)} readings/s, ratio ${(raw / feed.seconds).toFixed(2)}`);
      }
      await conn.query('drop table bench_raw_readings');
    } finally {
      socket.close();
      await conn.release();
    }
    const count = perRound * rounds;
    const raw = count / rawTime;
    const ingest = count / feedTime;
    console.log(`raw batched upsert: ${Math.round(raw)} rows/s (${count} rows in ${rounds} rounds, ${BATCH} per transaction)`);
    const after = Number(((await pool.query('select count(*) n from readings')) as { n: bigint }[])[0].n);
    console.log(`feed ingest: ${Math.round(ingest)} readings/s (${stored} stored, ${rejected} rejected, ${after - before} new rows committed)`);
    if (after - before !== count + warmUp) throw new Error(`expected ${count + warmUp} new rows, found ${after - before}`);
    console.log(`ingest: ${Math.round(ingest)} readings/s, raw ${Math.round(raw)} rows/s, ratio ${(ingest / raw).toFixed(2)}`);
  } finally {
    await pool.end();
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
