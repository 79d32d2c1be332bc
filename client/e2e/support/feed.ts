import { FEED_NAMESPACE, READINGS_EVENT, type CreatedFeedKey, type FeedReading, type ReadingBatchAck, type DemoUser } from '@morrowline/shared';
import { io, type Socket } from 'socket.io-client';
import { BASE_URL } from './browser';

/** Signs in over the API and answers the access token. */
export async function apiToken(user: DemoUser): Promise<string> {
  const response = await fetch(`${BASE_URL}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: user.email, password: user.password }),
  });
  if (!response.ok) throw new Error(`sign-in as ${user.email} failed: ${response.status}`);
  return ((await response.json()) as { accessToken: string }).accessToken;
}

export async function createFeedKey(adminToken: string, name: string): Promise<string> {
  const response = await fetch(`${BASE_URL}/api/feeds/keys`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Authorization: `Bearer ${adminToken}` },
    body: JSON.stringify({ name }),
  });
  if (!response.ok) throw new Error(`creating a feed key failed: ${response.status} ${await response.text()}`);
  return ((await response.json()) as CreatedFeedKey).apiKey;
}

/** A meter feed as the simulator is one: socket.io to /feeds with an API key. */
export async function connectFeed(apiKey: string): Promise<Socket> {
  const socket = io(`${BASE_URL}${FEED_NAMESPACE}`, { auth: { apiKey }, transports: ['websocket'], reconnection: false });
  await new Promise<void>((resolve, reject) => {
    socket.once('connect', () => resolve());
    socket.once('connect_error', (error) => reject(error));
  });
  return socket;
}

let batches = 0;
export async function sendReadings(feed: Socket, readings: FeedReading[]): Promise<ReadingBatchAck> {
  const batchId = `e2e-${process.pid}-${++batches}`;
  const ack = (await feed.timeout(30_000).emitWithAck(READINGS_EVENT, { batchId, readings })) as ReadingBatchAck;
  if (ack.error || ack.rejected.length > 0) throw new Error(`batch refused: ${JSON.stringify(ack).slice(0, 400)}`);
  return ack;
}

export const HOUR_MS = 3_600_000;
export function hourIso(ms: number): string {
  return new Date(ms).toISOString();
}
