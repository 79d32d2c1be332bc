import type { NestExpressApplication } from '@nestjs/platform-express';
import { HOUR_MS, MAX_READINGS_PER_BATCH, READINGS_EVENT, VersionClock, type ReadingBatchAck } from '@morrowline/shared';
import type { Socket } from 'socket.io-client';
import { ReadingsRepository } from '../src/readings/readings.repository';
import { ReadingsService } from '../src/readings/readings.service';
import { connectFeed, connected, createFeedKey, createZone, hourIso } from './support/feeds';
import { startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(180_000);

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
/** A fixed past day, far from "now" (no alerts, never in the future). */
const BASE = Date.UTC(2020, 0, 6, 0);

describe('ordered ingest (real MariaDB)', () => {
  let app: NestExpressApplication;
  let admin: string;
  let feed: Socket;
  let zone: string;
  let zoneId: number;
  beforeAll(async () => {
    app = await startTestApp();
    admin = await tokenFor(app, 'admin');
    zone = await createZone(app, admin, { maxPlausibleMw: 100000 });
    zoneId = (await app.get(ReadingsService).resolveZones([zone]))[0].id;
    feed = connectFeed(app, (await createFeedKey(app, admin)).apiKey);
    await connected(feed);
  });
  afterAll(async () => {
    feed.close();
    await app.close();
  });

  const stored = async (from: number, hours: number) => app.get(ReadingsService).rows(zoneId, from, from + hours * HOUR_MS);
  const emit = (readings: unknown[]) => new Promise<ReadingBatchAck>((resolve) => feed.emit(READINGS_EVENT, { batchId: `b${Math.random()}`, readings }, resolve));

  it('ends with the later batch of every pair sent 1 ms apart, versioned or not (40 pairs of 100 hours)', async () => {
    const clock = new VersionClock();
    const hours = 100;
    const pairs = 40;
    const failures: string[] = [];
    for (let p = 0; p < pairs; p++) {
      const from = BASE + p * hours * HOUR_MS;
      const versioned = p % 2 === 0;
      const batch = (mw: number) => Array.from({ length: hours }, (_, i) => ({ zone, hour: hourIso(from + i * HOUR_MS), mw: mw + i, ...(versioned ? { version: clock.next() } : {}) }));
      const older = batch(1000);
      const newer = batch(2000);
      const first = emit(older);
      await sleep(1);
      const second = emit(newer);
      const acks = await Promise.all([first, second]);
      expect(acks.map((a) => a.error ?? a.stored)).toEqual([hours, hours]);
      const rows = await stored(from, hours);
      const wrong = rows.filter((r, i) => r.mw !== 2000 + i).length;
      if (rows.length !== hours || wrong > 0) failures.push(`pair ${p}: ${rows.length} rows, ${wrong} at the older value`);
    }
    expect(failures).toEqual([]);
  });

  it('keeps the higher version whatever order the batches arrive in, and keeps the older value as a revision', async () => {
    const hour = BASE + 5000 * HOUR_MS;
    const clock = new VersionClock();
    const early = clock.next();
    const late = clock.next();
    const newer = await emit([{ zone, hour: hourIso(hour), mw: 222, version: late }]);
    const older = await emit([{ zone, hour: hourIso(hour), mw: 111, version: early }]);
    expect(newer).toMatchObject({ stored: 1, superseded: 0, rejected: [] });
    expect(older).toMatchObject({ stored: 1, superseded: 1, rejected: [] });
    expect((await stored(hour, 1)).map((r) => r.mw)).toEqual([222]);
    const revisions = await app.get(ReadingsRepository).revisionsOf(zoneId, hour);
    expect(revisions.map((r) => r.mw)).toEqual([111]);
    // The same superseded value resent is kept once; the stored value's own resend changes nothing.
    await emit([{ zone, hour: hourIso(hour), mw: 111, version: early }]);
    await emit([{ zone, hour: hourIso(hour), mw: 222, version: late }]);
    expect((await app.get(ReadingsRepository).revisionsOf(zoneId, hour)).map((r) => r.mw)).toEqual([111]);
    expect((await stored(hour, 1)).map((r) => r.mw)).toEqual([222]);
  });

  it('treats a value without a version (a CSV upload) as later than what is stored', async () => {
    const hour = BASE + 5001 * HOUR_MS;
    // A version a few minutes ahead of the server clock (a feed whose clock runs fast).
    const ahead = (Date.now() + 5 * 60_000) * 1000;
    await emit([{ zone, hour: hourIso(hour), mw: 300, version: ahead }]);
    const upload = await app.get(ReadingsService).ingest([{ zone, hour: hourIso(hour), mw: 301 }], { source: 'csv:test@tallowmere.example' });
    expect(upload).toMatchObject({ stored: 1, revised: 1, superseded: 0 });
    expect((await stored(hour, 1)).map((r) => r.mw)).toEqual([301]);
    // The feed's retry of its earlier value does not undo the upload.
    const retry = await emit([{ zone, hour: hourIso(hour), mw: 300, version: ahead }]);
    expect(retry).toMatchObject({ stored: 1, superseded: 1 });
    expect((await stored(hour, 1)).map((r) => r.mw)).toEqual([301]);
  });

  it('refuses a version that is not microseconds in the window, naming the field', async () => {
    const hour = hourIso(BASE + 5002 * HOUR_MS);
    const ack = await emit([
      { zone, hour, mw: 1, version: 42 },
      { zone, hour, mw: 1, version: 1.5e15 + 0.5 },
      { zone, hour, mw: 1, version: '1764700000000000' },
      { zone, hour, mw: 1, version: (Date.now() + 2 * 86_400_000) * 1000 },
    ]);
    expect(ack.stored).toBe(0);
    expect(ack.rejected.map((r) => [r.index, r.reason])).toEqual([
      [0, 'malformed'],
      [1, 'malformed'],
      [2, 'malformed'],
      [3, 'malformed'],
    ]);
    expect(ack.rejected[0].message).toMatch(/version/);
  });

  it('answers a batch over the reading limit, and one over the old 1 MB transport limit, with an ack naming the limit', async () => {
    const many = Array.from({ length: MAX_READINGS_PER_BATCH + 1 }, (_, i) => ({ zone, hour: hourIso(BASE + (6000 + i) * HOUR_MS), mw: 1 }));
    const ack = await emit(many);
    expect(ack).toMatchObject({ stored: 0, errorCode: 'too-large', error: expect.stringContaining(`at most ${MAX_READINGS_PER_BATCH} readings`) });
    // About 1.6 MB in 5,000 readings: within the documented message limit, so read and answered.
    const padded = Array.from({ length: MAX_READINGS_PER_BATCH }, (_, i) => ({ zone, hour: hourIso(BASE + (6000 + i) * HOUR_MS), mw: 1, quality: 'x'.repeat(300) }));
    const big = await emit(padded);
    expect(big.error).toBeUndefined();
    expect(big.rejected).toHaveLength(MAX_READINGS_PER_BATCH);
    expect(feed.connected).toBe(true);
  });

  it('stores a batch whole or not at all', async () => {
    const from = BASE + 20000 * HOUR_MS;
    const rows = Array.from({ length: 2500 }, (_, i) => ({ zoneId, zone, hourStart: from + i * HOUR_MS, mw: 5, quality: 'good' as const }));
    // The last row names a zone that does not exist: the database refuses it, after 2,499 good rows.
    rows.push({ zoneId: 2_000_000_000, zone: 'NOWHERE', hourStart: from, mw: 5, quality: 'good' });
    await expect(app.get(ReadingsRepository).store(rows, 'test:atomic')).rejects.toThrow();
    expect(await stored(from, 2500)).toEqual([]);
  });

  it('keeps acks in order for batches on one socket (the ack of an earlier batch never comes after a later one)', async () => {
    const order: number[] = [];
    const clock = new VersionClock();
    await Promise.all(
      Array.from({ length: 12 }, (_, b) =>
        emit(Array.from({ length: 50 }, (_, i) => ({ zone, hour: hourIso(BASE + (30000 + i) * HOUR_MS), mw: b, version: clock.next() }))).then(() => order.push(b)),
      ),
    );
    expect(order).toEqual([...order].sort((a, b) => a - b));
    expect(new Set((await stored(BASE + 30000 * HOUR_MS, 50)).map((r) => r.mw))).toEqual(new Set([11]));
  });
});
