import type { FeedReading } from '@morrowline/shared';
import type { Socket } from 'socket.io-client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoUser, openDesk, screenshot, signInAs, type Desk } from './support/browser';
import { apiToken, connectFeed, createFeedKey, HOUR_MS, hourIso, sendReadings } from './support/feed';

const ZONE = 'LANTERN';
/** History with a daily swing and some wobble, so that the stand-in forecast has bands to draw. */
function historyMw(t: number): number {
  const h = t / HOUR_MS;
  return Math.round((120 + 15 * Math.sin((2 * Math.PI * h) / 24) + 3 * Math.sin(h * 1.7)) * 10) / 10;
}
const WEEK_MS = 168 * HOUR_MS;
/** What the desk shows for a deviation: the server's two decimals, then one, signed. */
function shownPct(actual: number, t: number): string {
  const pct = Math.round(((actual - historyMw(t - WEEK_MS)) / historyMw(t - WEEK_MS)) * 100 * 100) / 100;
  return `${pct > 0 ? '+' : ''}${pct.toFixed(1)} %`;
}
function peakPct(values: [number, number][]): string {
  const pcts = values.map(([mw, t]) => (mw - historyMw(t - WEEK_MS)) / historyMw(t - WEEK_MS));
  const k = Math.abs(pcts[0]) >= Math.abs(pcts[1]) ? 0 : 1;
  return shownPct(values[k][0], values[k][1]);
}
const mwText = (mw: number) => `${mw.toFixed(1)} MW`;
/** The card's deviation: computed on the desk from the reading and the week-earlier value. */
function cardPct(actual: number, t: number): string {
  const pct = ((actual - historyMw(t - WEEK_MS)) / historyMw(t - WEEK_MS)) * 100;
  return `${pct > 0 ? '+' : ''}${pct.toFixed(1)} %`;
}

describe('live load', () => {
  let desk: Desk;
  let feed: Socket;
  const nowHour = Math.floor(Date.now() / HOUR_MS) * HOUR_MS;

  beforeAll(async () => {
    const key = await createFeedKey(await apiToken(demoUser('admin')), `e2e live ${Date.now()}`);
    feed = await connectFeed(key);
    // Ten days of history up to six hours ago: every recent hour has its week-earlier value, and
    // the stand-in has three days of its own errors to draw its bands from.
    const history: FeedReading[] = [];
    for (let t = nowHour - 10 * 24 * HOUR_MS; t < nowHour - 6 * HOUR_MS; t += HOUR_MS) history.push({ zone: ZONE, hour: hourIso(t), mw: historyMw(t) });
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
    await card.getByTestId('current-mw').getByText(mwText(historyMw(nowHour - 7 * HOUR_MS))).waitFor();
    await page.locator('[data-testid="live-connection"][data-state="connected"]').waitFor();
    await page.getByTestId('load-chart').locator('canvas').waitFor();
    expect(await page.getByTestId('chart-title').innerText()).toBe('Lanternside');

    let loads = 0;
    page.on('load', () => loads++);
    const t1 = nowHour - 6 * HOUR_MS;
    const v1 = Math.round((historyMw(t1 - WEEK_MS) + 1.5) * 10) / 10; // close to its forecast: no alert
    await sendReadings(feed, [{ zone: ZONE, hour: hourIso(t1), mw: v1 }]);
    await card.getByTestId('current-mw').getByText(mwText(v1)).waitFor();
    expect(loads).toBe(0);
    expect(await card.getByTestId('deviation').innerText()).toBe(cardPct(v1, t1));
    await screenshot(page, 'live-reading-arrived');
  });

  it('raises a deviation alert the desk sees at once, and lets the operator acknowledge it', async () => {
    const { page } = desk;
    const openCount = async () => (await page.getByTestId('open-alert-count').innerText()).toLowerCase();
    const before = Number((await openCount()).split(' ')[0]);
    // Two consecutive hours well over 5 % above the week-earlier load (at most 138 MW): the zone's alert rule.
    await sendReadings(feed, [
      { zone: ZONE, hour: hourIso(nowHour - 5 * HOUR_MS), mw: 150 },
      { zone: ZONE, hour: hourIso(nowHour - 4 * HOUR_MS), mw: 156 },
    ]);
    const row = page.getByTestId('alerts-table').locator('tr', { hasText: 'Lanternside' }).first();
    await row.waitFor();
    expect(await row.innerText()).toContain(peakPct([[150, nowHour - 5 * HOUR_MS], [156, nowHour - 4 * HOUR_MS]]));
    await page.getByText('Deviation alert: Lanternside').waitFor();
    expect(await openCount()).toBe(`${before + 1} open`);
    await page.getByTestId(`zone-card-${ZONE}`).getByTestId('current-mw').getByText('156.0 MW').waitFor();
    await screenshot(page, 'live-alert-raised');

    await row.getByRole('button', { name: 'Acknowledge' }).click();
    await page.getByLabel('Comment (optional)').fill('Lanternside street fair, load expected to stay high tonight');
    await page.getByRole('button', { name: 'Acknowledge alert' }).click();
    await page.getByText('Alert for Lanternside acknowledged.').waitFor();
    await row.waitFor({ state: 'detached' });
    expect(await openCount()).toBe(`${before} open`);
    await screenshot(page, 'live-alert-acknowledged');
  });

  it('shows the viewer the alerts without an Acknowledge button', async () => {
    const viewer = await openDesk();
    try {
      // A normal hour, then two hours well below: a new alert, apart from the acknowledged one.
      await sendReadings(feed, [
        { zone: ZONE, hour: hourIso(nowHour - 3 * HOUR_MS), mw: historyMw(nowHour - 3 * HOUR_MS - WEEK_MS) },
        { zone: ZONE, hour: hourIso(nowHour - 2 * HOUR_MS), mw: 80 },
        { zone: ZONE, hour: hourIso(nowHour - 1 * HOUR_MS), mw: 78 },
      ]);
      await signInAs(viewer.page, demoUser('viewer'));
      await viewer.page.goto('/live');
      const row = viewer.page.getByTestId('alerts-table').locator('tr', { hasText: 'Lanternside' }).first();
      await row.waitFor();
      expect(await row.innerText()).toContain(peakPct([[80, nowHour - 2 * HOUR_MS], [78, nowHour - HOUR_MS]]));
      expect(await row.getByRole('button', { name: 'Acknowledge' }).count()).toBe(0);
      await viewer.page.getByText('Operators and supervisors acknowledge alerts').waitFor();
      await screenshot(viewer.page, 'live-viewer');
    } finally {
      await viewer.close();
    }
  });
});
