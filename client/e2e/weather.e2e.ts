import { DEMO_TIME_ZONE, DEMO_USERS, WEATHER_EVENT, type FeedReading, type WeatherBatchAck } from '@morrowline/shared';
import { DateTime } from 'luxon';
import type { Socket } from 'socket.io-client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, demoUser, openDesk, screenshot, signInAs, type Desk } from './support/browser';
import { apiToken, connectFeed, createFeedKey, HOUR_MS, hourIso, sendReadings } from './support/feed';

// A zone and a weather station of this test's own, and the second supervisor at the desk (the
// first operator signs in for many files, and sign-ins are limited per e-mail and minute).
const DESK_USER = DEMO_USERS.find((u) => u.email === 'nora.vance@tallowmere.example')!;
const ZONE = 'FROSTGATE';
const STATION = 'FROSTGATEWX';

async function call(token: string, method: string, path: string, body?: unknown): Promise<Response> {
  return fetch(`${BASE_URL}/api${path}`, { method, headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });
}

async function ok(response: Promise<Response>, what: string): Promise<void> {
  const r = await response;
  if (!r.ok) throw new Error(`${what} failed: ${r.status} ${await r.text()}`);
}

describe('temperature where forecasters look', () => {
  let desk: Desk;
  let feed: Socket;
  const nowHour = Math.floor(Date.now() / HOUR_MS) * HOUR_MS;
  const issuedAt = nowHour - HOUR_MS + 30 * 60_000;
  // The forecast's value for an hour: a figure the test can read back on the schedule.
  const forecastAt = (hour: number) => Math.round((2 + ((hour / HOUR_MS) % 24) / 4) * 10) / 10;

  beforeAll(async () => {
    const admin = await apiToken(demoUser('admin'));
    await ok(call(admin, 'POST', '/zones', { code: ZONE, name: 'Frostgate', timeZone: DEMO_TIME_ZONE, alertThresholdPct: 5, alertConsecutiveHours: 2, gateClosure: '10:00', minPlausibleMw: 0, maxPlausibleMw: 1000 }), 'creating the zone');
    await ok(call(admin, 'POST', '/weather/stations', { code: STATION, name: 'Frostgate Weir', timeZone: DEMO_TIME_ZONE }), 'creating the station');
    await ok(call(admin, 'PUT', `/weather/zone-stations/${ZONE}`, { stations: [{ station: STATION, weight: 1 }] }), 'setting the weights');
    feed = await connectFeed(await createFeedKey(admin, `e2e weather ${Date.now()}`));
    const readings: FeedReading[] = [];
    const observations = [];
    for (let t = nowHour - 48 * HOUR_MS; t < nowHour; t += HOUR_MS) {
      readings.push({ zone: ZONE, hour: hourIso(t), mw: 80 + ((t / HOUR_MS) % 5) });
      observations.push({ station: STATION, hour: hourIso(t), tempC: t === nowHour - HOUR_MS ? -7.5 : -3 });
    }
    await sendReadings(feed, readings);
    const forecasts = [];
    for (let t = nowHour; t < nowHour + 72 * HOUR_MS; t += HOUR_MS) forecasts.push({ station: STATION, issuedAt: hourIso(issuedAt), hour: hourIso(t), tempC: forecastAt(t) });
    const ack = (await feed.timeout(30_000).emitWithAck(WEATHER_EVENT, { batchId: `e2e-weather-${Date.now()}`, observations, forecasts })) as WeatherBatchAck;
    if (ack.error || ack.rejected.length > 0) throw new Error(`weather refused: ${JSON.stringify(ack).slice(0, 400)}`);
    desk = await openDesk();
    await signInAs(desk.page, DESK_USER);
  });

  afterAll(async () => {
    feed?.disconnect();
    await desk?.close();
  });

  it('shows the zone\'s observed temperature and its latest forecast beside the load on the live view', async () => {
    const { page } = desk;
    await page.goto(`/live?zone=${ZONE}`);
    const panel = page.getByTestId('temperature-panel');
    await panel.getByTestId('temperature-now').getByText(/Observed -7\.5 °C/).waitFor({ timeout: 30_000 });
    expect(await panel.getByTestId('temperature-forecast-issued').innerText()).toMatch(/^Temperature forecast issued \d{4}-\d{2}-\d{2} \d{2}:\d{2} M[SD]T$/);
    expect(await panel.getByTestId('weather-feed-state').textContent()).toBe('Weather up to date');
    // Every zone's card carries its latest observed temperature.
    expect(await page.getByTestId(`zone-card-${ZONE}`).getByTestId('zone-temperature').textContent()).toBe('-7.5 °C');
    await panel.getByTestId('temperature-chart').locator('canvas').waitFor();
    await screenshot(page, 'live-temperature');
  });

  it('shows per hour the temperature forecast and its issue time on the day-ahead schedule', async () => {
    const { page } = desk;
    const tomorrow = DateTime.now().setZone(DEMO_TIME_ZONE).plus({ days: 1 });
    await page.goto(`/schedules?day=${tomorrow.toISODate()}&zones=${ZONE}`);
    const table = page.getByTestId(`zone-schedule-${ZONE}`).getByTestId('schedule-table');
    // HE01 of tomorrow is the hour starting at local midnight.
    const firstHour = tomorrow.startOf('day').toMillis();
    const row = table.getByTestId('hour-HE01');
    await row.getByTestId('hour-temperature').getByText(/°C$/).waitFor({ timeout: 30_000 });
    expect(await row.getByTestId('hour-temperature').textContent()).toBe(`${forecastAt(firstHour).toFixed(1)} °C`);
    expect(await row.textContent()).toContain(DateTime.fromMillis(issuedAt, { zone: DEMO_TIME_ZONE }).toFormat('yyyy-LL-dd HH:mm'));
    await screenshot(page, 'schedule-temperature');
  });

  it('plots the zone\'s load against its observed temperature on the workbench', async () => {
    const { page } = desk;
    await page.goto(`/workbench?zone=${ZONE}`);
    const panel = page.getByTestId('load-temperature');
    await panel.waitFor({ timeout: 30_000 });
    // 48 hours with both a reading and an observed temperature.
    await panel.getByRole('img', { name: 'Load against temperature, 48 hours' }).waitFor({ timeout: 30_000 });
    await screenshot(page, 'workbench-load-temperature');
  });
});
