import { DEMO_TIME_ZONE, hourEndingLabel, operatingDaySlots, type FeedReading } from '@morrowline/shared';
import { DateTime } from 'luxon';
import type { Socket } from 'socket.io-client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoUser, openDesk, screenshot, signInAs, type Desk } from './support/browser';
import { apiToken, connectFeed, createFeedKey, HOUR_MS, hourIso, sendReadings } from './support/feed';
import { insertPastForecastRun, insertPublishedSchedule } from './support/test-database';

// Lanternside: no other browser test writes to it.
const ZONE = 'LANTERN';
const TZ = DEMO_TIME_ZONE;
const round1 = (v: number) => Math.round(v * 10) / 10;
/**
 * History with a daily swing, some wobble and a step of 12 MW from one week to the next, so that
 * last week's load is never within 4 % of this week's: the deviation from the day-ahead forecast
 * (about −2.4 %) can then never read the same as a deviation from last week's load (with the
 * wobble alone the two once rounded to the same −2.5 % at one hour of the day).
 */
function historyMw(t: number): number {
  const h = t / HOUR_MS;
  return round1(120 + 15 * Math.sin((2 * Math.PI * h) / 24) + 3 * Math.sin(h * 1.7) + 12 * (Math.floor(h / 168) % 2));
}
const WEEK_MS = 168 * HOUR_MS;
/** The day-ahead forecast the desk issued before gate closure: a little above the history (within 5 %). */
const dayAheadMw = (t: number) => round1(historyMw(t) + 3);
/** Today's published schedule: the day-ahead forecast plus 2 MW. */
const scheduleMw = (t: number) => round1(dayAheadMw(t) + 2);

/** What the desk shows for an alert's deviation: the server's two decimals, then one, signed. */
function shownPct(actual: number, committed: number): string {
  const pct = Math.round(((actual - committed) / committed) * 100 * 100) / 100;
  return `${pct > 0 ? '+' : ''}${pct.toFixed(1)} %`;
}
function peakPct(values: [number, number][]): string {
  const pcts = values.map(([mw, t]) => (mw - dayAheadMw(t)) / dayAheadMw(t));
  const k = Math.abs(pcts[0]) >= Math.abs(pcts[1]) ? 0 : 1;
  return shownPct(values[k][0], dayAheadMw(values[k][1]));
}
const mwText = (mw: number) => `${mw.toFixed(1)} MW`;
/** The card's deviation: computed on the desk from the reading and the committed value. */
function cardPct(actual: number, committed: number): string {
  const pct = ((actual - committed) / committed) * 100;
  return `${pct > 0 ? '+' : ''}${pct.toFixed(1)} %`;
}

describe('live load against what was committed', () => {
  let desk: Desk;
  let feed: Socket;
  // Set in beforeAll, after any wait for the hour to turn (below).
  let nowHour = 0;
  let today: DateTime;
  /** Every reading sent, by hour: what today's energy and peak are checked against. */
  const sent = new Map<number, number>();
  const send = async (readings: FeedReading[]) => {
    await sendReadings(feed, readings);
    for (const r of readings) sent.set(Date.parse(r.hour), r.mw);
  };

  beforeAll(async () => {
    // Every expected figure below is reckoned from the current hour; a run that crossed into the
    // next hour would compare the desk's new hour with the old one (the energy so far once timed
    // out that way at 19:00 UTC). So within two minutes of the hour, wait for it to turn.
    const toNextHour = HOUR_MS - (Date.now() % HOUR_MS);
    if (toNextHour < 120_000) await new Promise((r) => setTimeout(r, toNextHour + 5_000));
    nowHour = Math.floor(Date.now() / HOUR_MS) * HOUR_MS;
    today = DateTime.fromMillis(nowHour, { zone: TZ }).startOf('day');
    // The day-ahead forecast, issued before yesterday's gate closure (so it is the committed
    // forecast for yesterday, today and tomorrow), starting at yesterday's local midnight.
    const first = today.minus({ days: 1 }).toMillis();
    const end = today.plus({ days: 2 }).toMillis();
    await insertPastForecastRun({
      zone: ZONE,
      issuedAt: new Date(today.minus({ days: 2 }).toMillis() - HOUR_MS),
      firstHour: new Date(first),
      mean: Array.from({ length: (end - first) / HOUR_MS }, (_, i) => dayAheadMw(first + i * HOUR_MS)),
    });
    const key = await createFeedKey(await apiToken(demoUser('admin')), `e2e live ${Date.now()}`);
    feed = await connectFeed(key);
    // Ten days of history up to six hours ago.
    const history: FeedReading[] = [];
    for (let t = nowHour - 10 * 24 * HOUR_MS; t < nowHour - 6 * HOUR_MS; t += HOUR_MS) history.push({ zone: ZONE, hour: hourIso(t), mw: historyMw(t) });
    await send(history);
    desk = await openDesk();
  }, 180_000);

  afterAll(async () => {
    feed?.disconnect();
    await desk?.close();
  });

  it('measures the latest reading against the day-ahead forecast, never last week’s load, and shows a new reading without a reload', async () => {
    const { page } = desk;
    await signInAs(page, demoUser('operator'), `/sign-in`);
    await page.goto(`/live?zone=${ZONE}`);
    const card = page.getByTestId(`zone-card-${ZONE}`);
    const t0 = nowHour - 7 * HOUR_MS;
    await card.getByTestId('current-mw').getByText(mwText(historyMw(t0))).waitFor();
    await card.getByTestId('committed-mw').getByText(mwText(dayAheadMw(t0))).waitFor();
    expect(await card.getByTestId('committed-basis').innerText()).toBe('Day-ahead');
    expect(await card.getByTestId('deviation').innerText()).toBe(cardPct(historyMw(t0), dayAheadMw(t0)));
    expect(await card.getByTestId('deviation').innerText()).not.toBe(cardPct(historyMw(t0), historyMw(t0 - WEEK_MS)));
    await page.locator('[data-testid="live-connection"][data-state="connected"]').waitFor();
    await page.getByTestId('load-chart').locator('canvas').waitFor();
    expect(await page.getByTestId('chart-title').innerText()).toBe('Lanternside');
    expect(await page.getByTestId('committed-sources').innerText()).toContain(`${today.toFormat('ccc LL-dd')}: day-ahead forecast issued`);

    let loads = 0;
    page.on('load', () => loads++);
    const t1 = nowHour - 6 * HOUR_MS;
    const v1 = round1(dayAheadMw(t1) + 1.5); // close to what was committed: no alert
    await send([{ zone: ZONE, hour: hourIso(t1), mw: v1 }]);
    await card.getByTestId('current-mw').getByText(mwText(v1)).waitFor();
    expect(loads).toBe(0);
    expect(await card.getByTestId('deviation').innerText()).toBe(cardPct(v1, dayAheadMw(t1)));
    await screenshot(page, 'live-reading-arrived');
  });

  it('raises a deviation alert against the day-ahead forecast, lets the operator acknowledge it, and keeps it in the alert history', async () => {
    const { page } = desk;
    const openCount = async () => (await page.getByTestId('open-alert-count').innerText()).toLowerCase();
    const before = Number((await openCount()).split(' ')[0]);
    // Two consecutive hours well over 5 % above the day-ahead forecast (at most 141 MW): the zone's alert rule.
    await send([
      { zone: ZONE, hour: hourIso(nowHour - 5 * HOUR_MS), mw: 175 },
      { zone: ZONE, hour: hourIso(nowHour - 4 * HOUR_MS), mw: 180 },
    ]);
    const row = page.getByTestId('alerts-table').locator('tr', { hasText: 'Lanternside' }).first();
    await row.waitFor();
    const peak = peakPct([[175, nowHour - 5 * HOUR_MS], [180, nowHour - 4 * HOUR_MS]]);
    expect(await row.innerText()).toContain(peak);
    expect(await row.innerText()).toContain('day-ahead forecast');
    await page.getByText('Deviation alert: Lanternside').waitFor();
    expect(await openCount()).toBe(`${before + 1} open`);
    await page.getByTestId(`zone-card-${ZONE}`).getByTestId('current-mw').getByText('180.0 MW').waitFor();
    await screenshot(page, 'live-alert-raised');

    await row.getByRole('button', { name: 'Acknowledge' }).click();
    await page.getByLabel('Comment (optional)').fill('Lanternside street fair, load expected to stay high tonight');
    await page.getByRole('button', { name: 'Acknowledge alert' }).click();
    await page.getByText('Alert for Lanternside acknowledged.').waitFor();
    await row.waitFor({ state: 'detached' });
    expect(await openCount()).toBe(`${before} open`);
    const history = page.getByTestId('alert-history').locator('tr', { hasText: 'Lanternside street fair' });
    await history.waitFor();
    const text = await history.innerText();
    expect(text).toContain(demoUser('operator').name);
    expect(text).toContain(peak);
    await screenshot(page, 'live-alert-acknowledged');
  });

  it('shows the viewer the alerts without an Acknowledge button', async () => {
    const viewer = await openDesk();
    try {
      // A normal hour, then two hours well below: a new alert, apart from the acknowledged one.
      await send([
        { zone: ZONE, hour: hourIso(nowHour - 3 * HOUR_MS), mw: dayAheadMw(nowHour - 3 * HOUR_MS) },
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
      await viewer.page.getByTestId('alert-history').getByText(demoUser('operator').name).waitFor();
      await screenshot(viewer.page, 'live-viewer');
    } finally {
      await viewer.close();
    }
  });

  it('charts today’s published schedule beside the day-ahead forecast, measures against it, and sums today’s energy against it', async () => {
    const { page } = desk;
    const day = today.toFormat('yyyy-LL-dd');
    await insertPublishedSchedule({
      zone: ZONE,
      operatingDay: day,
      hours: operatingDaySlots(day, TZ).map((slot) => ({ ...slot, mw: scheduleMw(Date.parse(slot.intervalStartUtc)) })),
      publishedAt: new Date(today.minus({ days: 1 }).toMillis() - HOUR_MS),
      publishedBy: demoUser('supervisor').email,
    });
    await page.goto(`/live?zone=${ZONE}`);
    const legend = page.getByTestId('chart-legend');
    await legend.getByText('Published schedule', { exact: true }).waitFor();
    // the latest run comes by a query of its own, which may answer after the schedule's
    await legend.getByText('Latest run', { exact: true }).waitFor();
    expect(await legend.innerText()).not.toContain('none');
    await legend.getByText('Day-ahead forecast (issued by gate closure)').waitFor();
    expect(await page.getByTestId('committed-sources').innerText()).toContain(`${today.toFormat('ccc LL-dd')}: published schedule rev 1`);

    const card = page.getByTestId(`zone-card-${ZONE}`);
    const last = nowHour - HOUR_MS;
    if (last >= today.toMillis()) {
      // The latest hour is today's: measured against the schedule now.
      await card.getByTestId('committed-mw').getByText(mwText(scheduleMw(last))).waitFor();
      expect(await card.getByTestId('committed-basis').innerText()).toBe('Schedule');
      expect(await card.getByTestId('deviation').innerText()).toBe(cardPct(78, scheduleMw(last)));
    }

    // Today's hours that are over, every one with a reading (all were sent above).
    let actual = 0;
    let scheduled = 0;
    let hours = 0;
    let peak: [number, number] | null = null;
    for (let t = today.toMillis(); t < nowHour; t += HOUR_MS) {
      const mw = sent.get(t);
      if (mw === undefined) continue;
      actual += mw;
      scheduled += scheduleMw(t);
      hours++;
      if (!peak || mw > peak[0]) peak = [mw, t];
    }
    const energy = page.getByTestId('energy-today');
    const mwh = (v: number) => v.toLocaleString('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
    if (hours > 0 && peak) {
      const pct = ((actual - scheduled) / scheduled) * 100;
      await energy.getByText(`${mwh(actual)} MWh against ${mwh(scheduled)} MWh of the published schedule (${pct > 0 ? '+' : ''}${pct.toFixed(1)} %) over ${hours} of ${hours} hours`).waitFor();
      expect(await page.getByTestId('peak-today').innerText()).toBe(`Peak today: ${mwText(peak[0])} at ${hourEndingLabel(peak[1], TZ)}`);
    } else {
      await energy.getByText('no hour of today is over yet').waitFor();
    }
    // The chart is drawn again once the last queries (outage windows, runs) have answered.
    await page.waitForLoadState('networkidle');
    await page.waitForFunction(() => (document.querySelector('[data-testid="load-chart"] canvas')?.clientHeight ?? 0) > 0);
    await screenshot(page, 'live-schedule');
  });
});
