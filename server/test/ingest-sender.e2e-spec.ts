/**
 * The project's feed sender (simulators/src/sender.ts) against the real server: batches the
 * server refuses as too large are split rather than resent as they were, and a reading too large
 * to send at all is given up, so the sender never loops on them.
 */
import { join } from 'node:path';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { HOUR_MS, MAX_READINGS_PER_BATCH, type ReadingBatch, type ReadingBatchAck } from '@morrowline/shared';
import { ReadingsService } from '../src/readings/readings.service';
import { createFeedKey, createZone, hourIso } from './support/feeds';
import { ROOT } from './support/server-process';
import { baseUrl, startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(120_000);

interface Sender {
  send(readings: { zone: string; hour: string; mw: number }[]): Promise<void>;
  drain(): Promise<void>;
  close(): void;
  readonly stats: { stored: number; dropped: number; sent: number };
}
type SenderClass = new (
  url: string,
  apiKey: string,
  runId: string,
  log: (line: string) => void,
  options: { maxReadings?: number; maxBytes?: number; onStored?: (batch: ReadingBatch, ack: ReadingBatchAck) => void },
) => Sender;
const { FeedSender } = require(join(ROOT, 'simulators', 'src', 'sender')) as { FeedSender: SenderClass };

const BASE = Date.UTC(2019, 0, 7, 0);

describe('the feed sender and the batch limits (real MariaDB)', () => {
  let app: NestExpressApplication;
  let apiKey: string;
  let zone: string;
  beforeAll(async () => {
    app = await startTestApp();
    const admin = await tokenFor(app, 'admin');
    zone = await createZone(app, admin);
    apiKey = (await createFeedKey(app, admin)).apiKey;
  });
  afterAll(async () => {
    await app.close();
  });

  it('splits a batch the server refuses as too large and stores all of it', async () => {
    const lines: string[] = [];
    const sizes: number[] = [];
    // A sender that believes the limit is higher than the server's.
    const sender = new FeedSender(baseUrl(app), apiKey, 'split', (line) => lines.push(line), { maxReadings: 2 * MAX_READINGS_PER_BATCH, onStored: (batch) => sizes.push(batch.readings.length) });
    const readings = Array.from({ length: MAX_READINGS_PER_BATCH + 1500 }, (_, i) => ({ zone, hour: hourIso(BASE + i * HOUR_MS), mw: 40 + (i % 7) }));
    await sender.send(readings);
    await sender.drain();
    sender.close();
    expect(sender.stats.stored).toBe(readings.length);
    expect(sizes).toEqual([3250, 3250]);
    expect(lines.some((l) => /split batch .* in two: the server refused it as too large/.test(l))).toBe(true);
    const [limits] = await app.get(ReadingsService).resolveZones([zone]);
    const rows = await app.get(ReadingsService).rows(limits.id, BASE, BASE + readings.length * HOUR_MS);
    expect(rows.map((r) => r.mw)).toEqual(readings.map((r) => r.mw));
  });

  it('gives up a reading too large to send alone and sends the rest', async () => {
    const lines: string[] = [];
    const sender = new FeedSender(baseUrl(app), apiKey, 'giant', (line) => lines.push(line), { maxBytes: 4096 });
    const hour = BASE + 20_000 * HOUR_MS;
    await sender.send([
      { zone, hour: hourIso(hour), mw: 50 },
      { zone: 'X'.repeat(10_000), hour: hourIso(hour + HOUR_MS), mw: 50 },
      { zone, hour: hourIso(hour + 2 * HOUR_MS), mw: 51 },
    ]);
    await sender.drain();
    sender.close();
    expect(sender.stats).toMatchObject({ sent: 3, stored: 2, dropped: 1 });
    expect(lines.some((l) => /dropped a reading .* larger than the server's 4096-byte message limit/.test(l))).toBe(true);
  });
});
