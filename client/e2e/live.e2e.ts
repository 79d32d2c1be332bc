import type { FeedReading } from '@morrowline/shared';
import type { Socket } from 'socket.io-client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoUser, openDesk, screenshot, signInAs, type Desk } from './support/browser';
import { apiToken, connectFeed, createFeedKey, HOUR_MS, hourIso, sendReadings } from './support/feed';

const ZONE = 'LANTERN';
/** Flat history: the seasonal-naive forecast of every recent hour is this. */
const BASE_MW = 120;

describe('live load', () => {
  let desk: Desk;
  let feed: Socket;
  const nowHour = Math.floor(Date.now() / HOUR_MS) * HOUR_MS;

  beforeAll(async () => {
    const key = await createFeedKey(await apiToken(demoUser('admin')), `e2e live ${Date.now()}`);
    feed = await connectFeed(key);
    // Eight days of history up to six hours ago, so that every recent hour has its week-earlier value.
    const history: FeedReading[] = [];
    for (let t = nowHour - 8 * 24 * HOUR_MS; t < nowHour - 6 * HOUR_MS; t += HOUR_MS) history.push({ zone: ZONE, hour: hourIso(t), mw: BASE_MW });
    await sendReadings(feed, history);
    desk = await openDesk();
  });

  afterAll(async () => {
    feed?.disconnect();
    await desk?.close();
  });

  it('shows a reading sent by a feed on the open live view without a reload', async () => {
    const { page } = desk;
    await signInAs(page, demoUser('operator'), `/sign-in`);
    await page.goto(`/live?zone=${ZONE}`);
    const card = page.getByTestId(`zone-card-${ZONE}`);
    await card.getByTestId('current-mw').getByText('120.0 MW').waitFor();
    await page.locator('[data-testid="live-connection"][data-state="connected"]').waitFor();
    await page.getByTestId('load-chart').locator('canvas').waitFor();
    expect(await page.getByTestId('chart-title').innerText()).toBe('Lanternside');

    let loads = 0;
    page.on('load', () => loads++);
    await sendReadings(feed, [{ zone: ZONE, hour: hourIso(nowHour - 6 * HOUR_MS), mw: 121.7 }]);
    await card.getByTestId('current-mw').getByText('121.7 MW').waitFor();
    expect(loads).toBe(0);
    expect(await card.getByTestId('deviation').innerText()).toBe('+1.4 %');
    await screenshot(page, 'live-reading-arrived');
  });

  it('raises a deviation alert the desk sees at once, and lets the operator acknowledge it', async () => {
    const { page } = desk;
    const openCount = async () => (await page.getByTestId('open-alert-count').innerText()).toLowerCase();
    const before = Number((await openCount()).split(' ')[0]);
    // Two consecutive hours more than 5 % above the week-earlier load: the zone's alert rule.
    await sendReadings(feed, [
      { zone: ZONE, hour: hourIso(nowHour - 5 * HOUR_MS), mw: 150 },
      { zone: ZONE, hour: hourIso(nowHour - 4 * HOUR_MS), mw: 156 },
    ]);
    const row = page.getByTestId('alerts-table').locator('tr', { hasText: 'Lanternside' }).first();
    await row.waitFor();
    expect(await row.innerText()).toContain('+30.0 %');
    await page.getByText('Deviation alert: LANTERN').waitFor();
    expect(await openCount()).toBe(`${before + 1} open`);
    await page.getByTestId(`zone-card-${ZONE}`).getByTestId('current-mw').getByText('156.0 MW').waitFor();
    await screenshot(page, 'live-alert-raised');

    await row.getByRole('button', { name: 'Acknowledge' }).click();
    await page.getByLabel('Comment (optional)').fill('Lanternside street fair, load expected to stay high tonight');
    await page.getByRole('button', { name: 'Acknowledge alert' }).click();
    await page.getByText('Alert for LANTERN acknowledged.').waitFor();
    await row.waitFor({ state: 'detached' });
    expect(await openCount()).toBe(`${before} open`);
    await screenshot(page, 'live-alert-acknowledged');
  });

  it('shows the viewer the alerts without an Acknowledge button', async () => {
    const viewer = await openDesk();
    try {
      // A normal hour, then two hours well below: a new alert, apart from the acknowledged one.
      await sendReadings(feed, [
        { zone: ZONE, hour: hourIso(nowHour - 3 * HOUR_MS), mw: 120 },
        { zone: ZONE, hour: hourIso(nowHour - 2 * HOUR_MS), mw: 80 },
        { zone: ZONE, hour: hourIso(nowHour - 1 * HOUR_MS), mw: 78 },
      ]);
      await signInAs(viewer.page, demoUser('viewer'));
      await viewer.page.goto('/live');
      const row = viewer.page.getByTestId('alerts-table').locator('tr', { hasText: 'Lanternside' }).first();
      await row.waitFor();
      expect(await row.innerText()).toContain('-35.0 %');
      expect(await row.getByRole('button', { name: 'Acknowledge' }).count()).toBe(0);
      await viewer.page.getByText('Operators and supervisors acknowledge alerts').waitFor();
      await screenshot(viewer.page, 'live-viewer');
    } finally {
      await viewer.close();
    }
  });
});
