import type { NestExpressApplication } from '@nestjs/platform-express';
import { io, type Socket } from 'socket.io-client';
import request from 'supertest';
import { FEED_NAMESPACE, READINGS_EVENT, type CreatedFeedKey, type FeedReading, type ReadingBatchAck } from '@morrowline/shared';
import { baseUrl } from './test-app';

let serial = 0;

/** A unique suffix for names and zone codes a test creates (the test database is shared by files). */
export function unique(): string {
  serial += 1;
  return `${(Date.now() % 1_000_000).toString(36).toUpperCase()}${serial}`;
}

export async function createFeedKey(app: NestExpressApplication, adminToken: string, zone?: string): Promise<CreatedFeedKey> {
  const response = await request(app.getHttpServer())
    .post('/api/feeds/keys')
    .set('Authorization', `Bearer ${adminToken}`)
    .send({ name: `test feed ${unique()}`, ...(zone ? { zone } : {}) })
    .expect(201);
  return response.body as CreatedFeedKey;
}

/** Creates a zone for one test's own readings, so files do not disturb each other. */
export async function createZone(app: NestExpressApplication, adminToken: string, overrides: Record<string, unknown> = {}): Promise<string> {
  const code = `T${unique()}`.slice(0, 32);
  await request(app.getHttpServer())
    .post('/api/zones')
    .set('Authorization', `Bearer ${adminToken}`)
    .send({ code, name: `Test ${code}`, timeZone: 'America/Denver', alertThresholdPct: 5, alertConsecutiveHours: 2, gateClosure: '10:00', minPlausibleMw: 0, maxPlausibleMw: 1000, ...overrides })
    .expect(201);
  return code;
}

export function connectFeed(app: NestExpressApplication, apiKey: string | undefined, reconnection = false): Socket {
  return io(`${baseUrl(app)}${FEED_NAMESPACE}`, { auth: apiKey ? { apiKey } : {}, transports: ['websocket'], reconnection, reconnectionDelay: 50, reconnectionDelayMax: 200 });
}

export function connected(socket: Socket): Promise<void> {
  return new Promise((resolve, reject) => {
    if (socket.connected) return resolve();
    socket.once('connect', () => resolve());
    socket.once('connect_error', reject);
  });
}

export function send(socket: Socket, readings: unknown[], batchId = unique()): Promise<ReadingBatchAck> {
  return new Promise((resolve) => socket.emit(READINGS_EVENT, { batchId, readings }, resolve));
}

export function hourIso(ms: number): string {
  return new Date(ms).toISOString();
}

export type { FeedReading };
