import { DEMO_TIME_ZONE, type FeedReading, type ZoneDto } from '@morrowline/shared';
import type { Socket } from 'socket.io-client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, demoUser, openDesk, screenshot, signInAs, type Desk } from './support/browser';
import { apiToken, connectFeed, createFeedKey, HOUR_MS, hourIso, sendReadings } from './support/feed';

// Two zones of this test's own: Willow Bend reports, Meadowside has no meters yet.
const REPORTING = 'WILLOWBEND';
const NEW_ZONE = 'MEADOWSIDE';

async function adminApi(token: string, method: string, path: string, body?: unknown): Promise<Response> {
  return fetch(`${BASE_URL}/api${path}`, { method, headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });
}

async function createZone(token: string, code: string, name: string): Promise<ZoneDto> {
  const response = await adminApi(token, 'POST', '/zones', { code, name, timeZone: DEMO_TIME_ZONE, alertThresholdPct: 5, alertConsecutiveHours: 2, gateClosure: '10:00', minPlausibleMw: 0, maxPlausibleMw: 1000 });
  if (response.status !== 201) throw new Error(`creating zone ${code} failed: ${response.status} ${await response.text()}`);
  return (await response.json()) as ZoneDto;
}

describe('the system total while zones change', () => {
  let desk: Desk;
  let feed: Socket;
  let admin: string;
  const nowHour = Math.floor(Date.now() / HOUR_MS) * HOUR_MS;

  beforeAll(async () => {
    admin = await apiToken(demoUser('admin'));
    await createZone(admin, REPORTING, 'Willow Bend');
    feed = await connectFeed(await createFeedKey(admin, `e2e live zones ${Date.now()}`));
    // Three days of readings up to the last complete hour.
    const readings: FeedReading[] = [];
    for (let t = nowHour - 72 * HOUR_MS; t < nowHour; t += HOUR_MS) readings.push({ zone: REPORTING, hour: hourIso(t), mw: 90 + (t / HOUR_MS) % 7 });
    await sendReadings(feed, readings);
    desk = await openDesk();
    await signInAs(desk.page, demoUser('admin'));
  });

  afterAll(async () => {
    feed?.disconnect();
    await desk?.close();
  });

  it('leaves a new zone without readings out of the total, says so, and the page survives it being added, renamed and switched off', async () => {
    const { page } = desk;
    await page.goto('/live');
    const system = page.getByTestId('zone-card-SYSTEM');
    await system.getByTestId('current-mw').getByText(/\d MW$/).waitFor();

    // The server's zone list was just read (the feed status asks for it); a zone added now is one
    // the server's cache has not seen when the desk, which has, asks for its readings.
    expect((await adminApi(admin, 'GET', '/readings/status')).status).toBe(200);
    const added = await createZone(admin, NEW_ZONE, 'Meadowside');
    await page.goto('/live');
    await page.getByTestId('zone-card-SYSTEM').waitFor();
    const note = page.getByTestId('left-out-note');
    await note.getByText('Meadowside (has never reported)').waitFor({ timeout: 30_000 });
    expect(await system.getByTestId('current-mw').innerText()).toMatch(/\d MW$/);
    expect(await system.getByTestId('left-out-count').innerText()).toMatch(/^\d+ zones? left out$/);
    expect(await page.getByText(/No active zone with code/).count()).toBe(0);
    await page.getByTestId(`zone-card-${NEW_ZONE}`).waitFor();
    await page.getByTestId('load-chart').locator('canvas').waitFor();
    await screenshot(page, 'live-zone-without-readings');

    // Renamed, then switched off, with the page open: the page goes on, the note follows.
    expect((await adminApi(admin, 'PATCH', `/zones/${added.id}`, { name: 'Meadowside East', reason: 'Browser test: renamed' })).status).toBe(200);
    expect((await adminApi(admin, 'PATCH', `/zones/${added.id}`, { active: false, reason: 'Browser test: switched off' })).status).toBe(200);
    await page.goto(`/live?zone=${NEW_ZONE}`);
    await note.getByText('Meadowside East (switched off)').waitFor();
    // The address named the zone switched off: the system total is shown instead, not an error.
    expect(await page.getByTestId('chart-title').innerText()).toBe('System total');
    expect(await page.getByTestId(`zone-card-${NEW_ZONE}`).count()).toBe(0);
    expect(await system.getByTestId('current-mw').innerText()).toMatch(/\d MW$/);
    expect(await page.getByText(/No active zone with code/).count()).toBe(0);
  });
});
