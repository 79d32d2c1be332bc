import { DateTime } from 'luxon';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, demoUser, openDesk, screenshot, signInAs, type Desk } from './support/browser';
import { apiToken, uploadHistory } from './support/history';
import { insertPastForecastRun } from './support/test-database';

const HOUR = 3_600_000;
const ZONE = 'COPPERLINE';
const TIME_ZONE = 'America/Denver';

/** Six weeks of Copperline load up to the last complete hour: two smelter shifts, lower Sundays. */
function historyCsv(hours: number): string {
  const last = Math.floor(Date.now() / HOUR) * HOUR - HOUR;
  let seed = 77;
  const noise = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31 - 0.5) * 10;
  const rows = ['timestamp,load_mw'];
  for (let i = 0; i < hours; i++) {
    const at = last - (hours - 1 - i) * HOUR;
    const local = DateTime.fromMillis(at, { zone: TIME_ZONE });
    const shift = local.hour >= 6 && local.hour < 22 ? 90 : 20;
    const sunday = local.weekday === 7 ? -40 : 0;
    rows.push(`${new Date(at).toISOString()},${(200 + shift + sunday + noise()).toFixed(1)}`);
  }
  return rows.join('\n') + '\n';
}

/** Uploads the history as the operator, asks for a refit and waits until it has finished. */
async function seedAndRefit(): Promise<Map<number, number>> {
  const token = await apiToken('operator');
  const auth = { Authorization: `Bearer ${token}` };
  const csv = historyCsv(6 * 168);
  await uploadHistory(token, ZONE, csv, 'copperline-history.csv');
  const actuals = new Map(csv.trim().split('\n').slice(1).map((line) => {
    const [at, mw] = line.split(',');
    return [Date.parse(at), Number(mw)] as [number, number];
  }));
  const refit = await fetch(`${BASE_URL}/api/models/refits`, { method: 'POST', headers: { ...auth, 'Content-Type': 'application/json' }, body: JSON.stringify({ zone: ZONE, reason: 'Accuracy browser test: a forecast run to score' }) });
  expect(refit.status).toBe(202);
  const [job] = (await refit.json()) as { id: number }[];
  for (;;) {
    const jobs = (await (await fetch(`${BASE_URL}/api/models/refits?zone=${ZONE}`, { headers: auth })).json()) as { id: number; state: string; message: string | null }[];
    const mine = jobs.find((j) => j.id === job.id);
    if (mine?.state === 'failed') throw new Error(`the refit failed: ${mine.message}`);
    if (mine?.state === 'done') return actuals;
    await new Promise((resolve) => setTimeout(resolve, 1000));
  }
}

describe('accuracy', () => {
  let desk: Desk;
  let actuals: Map<number, number>;

  beforeAll(async () => {
    actuals = await seedAndRefit();
    desk = await openDesk();
  }, 240_000);
  afterAll(async () => {
    await desk?.close();
  });

  it('shows a viewer the days of a zone with actuals but no forecast issued before their gate closure, never as zero error', async () => {
    const page = desk.page;
    await signInAs(page, demoUser('viewer'));
    await page.getByRole('link', { name: 'Accuracy' }).click();
    await page.getByRole('heading', { name: 'Accuracy' }).waitFor();
    await page.getByTestId('accuracy-zones-picker').click();
    await page.getByRole('option', { name: 'Copperline (COPPERLINE)' }).click();
    await page.keyboard.press('Escape');
    await page.waitForURL(/\/accuracy\?zone=COPPERLINE&from=\d{4}-\d\d-\d\d&to=\d{4}-\d\d-\d\d/);

    // The all-zones report shows first and is replaced by Copperline's once its query answers:
    // wait for Copperline's own day table before reading its rows.
    await page.getByRole('heading', { name: /Per operating day · Copperline/ }).waitFor({ timeout: 30_000 });
    // The only stored run was issued just now: no past day had a forecast at its gate closure.
    const empty = page.getByTestId('accuracy-no-data');
    await empty.waitFor({ state: 'visible', timeout: 30_000 });
    expect(await empty.innerText()).toMatch(/never counted as zero error/);
    const zones = await page.getByTestId('accuracy-zones').innerText();
    expect(zones).toMatch(/Copperline \(COPPERLINE\)\s+0 \/ 14/);
    expect(zones).not.toMatch(/0\.00 %/);
    const days = page.getByTestId('accuracy-days');
    await days.getByRole('row').nth(14).waitFor();
    const rows = await days.getByRole('row').allInnerTexts();
    expect(rows).toHaveLength(15);
    expect(rows.slice(1).every((r) => r.includes('no model forecast'))).toBe(true);
    expect(await page.getByTestId('accuracy-verdict').innerText()).toMatch(/nothing to compare yet/);
    expect(await page.getByTestId('accuracy-no-charts').innerText()).toMatch(/no charts yet/);
    await page.addStyleTag({ content: 'header { position: static !important; }' });
    await screenshot(page, 'accuracy-no-forecast');

    // A range the server refuses, asked for by address: its message, not a blank page.
    await page.goto('/accuracy?zone=COPPERLINE&from=2026-01-01&to=2026-06-30');
    expect(await page.getByText(/Choose at most 92 days/).innerText()).toMatch(/this range has 181/);
  }, 120_000);

  it('scores yesterday once a forecast issued before its gate closure is stored: 2 % over every hour is a MAPE of 2.00 %', async () => {
    // Yesterday in Copperline's time, whole (23, 24 or 25 hours), and its gate closure (10:00 the
    // day before, the zone's default). The run, 2 % above every actual hour, is written as issued
    // an hour before that gate: the server only ever issues at the present time.
    const yesterday = DateTime.now().setZone(TIME_ZONE).startOf('day').minus({ days: 1 });
    const start = yesterday.toMillis();
    const end = yesterday.plus({ days: 1 }).toMillis();
    const mean: number[] = [];
    for (let at = start; at < end; at += HOUR) {
      const actual = actuals.get(at);
      if (actual === undefined) throw new Error(`the uploaded history has no hour ${new Date(at).toISOString()}`);
      mean.push(Math.round(actual * 1.02 * 1000) / 1000);
    }
    const gate = yesterday.minus({ days: 1 }).set({ hour: 10, minute: 0 });
    await insertPastForecastRun({ zone: ZONE, issuedAt: gate.minus({ hours: 1 }).toJSDate(), firstHour: new Date(start), mean });

    const page = desk.page;
    const day = yesterday.toFormat('yyyy-LL-dd');
    await page.goto(`/accuracy?zone=${ZONE}&from=${yesterday.minus({ days: 6 }).toFormat('yyyy-LL-dd')}&to=${day}`);
    const zones = page.getByTestId('accuracy-zones');
    await zones.getByText(/1 \/ 7/).waitFor({ timeout: 30_000 });
    expect(await zones.innerText()).toMatch(/Copperline \(COPPERLINE\)\s+1 \/ 7\s+2\.0\d? %/);
    const row = page.getByTestId('accuracy-days').getByRole('row').filter({ hasText: day });
    // MAPE is 2.00 % up to the rounding of the stored values (0.001 MW in some 300 MW)
    expect(await row.innerText()).toMatch(/2\.00 %/);
    expect(await page.getByTestId('accuracy-days').innerText()).toMatch(/no model forecast/);
    await page.addStyleTag({ content: 'header { position: static !important; }' });
    await screenshot(page, 'accuracy-scored-day');
  }, 120_000);

  it('labels a day scored against a replayed forecast as replayed, never as issued', async () => {
    // The day before yesterday, with a run replayed as of 09:05 on the day before it (the last
    // forecast update before the 10:00 gate closure), 3 % under every actual hour.
    const day = DateTime.now().setZone(TIME_ZONE).startOf('day').minus({ days: 2 });
    const start = day.toMillis();
    const end = day.plus({ days: 1 }).toMillis();
    const mean: number[] = [];
    for (let at = start; at < end; at += HOUR) mean.push(Math.round(actuals.get(at)! * 0.97 * 1000) / 1000);
    const issuedAt = day.minus({ days: 1 }).set({ hour: 9, minute: 5 }).toJSDate();
    await insertPastForecastRun({ zone: ZONE, issuedAt, firstHour: new Date(start), mean, origin: 'replayed' });

    const page = desk.page;
    const date = day.toFormat('yyyy-LL-dd');
    await page.goto(`/accuracy?zone=${ZONE}&from=${day.minus({ days: 5 }).toFormat('yyyy-LL-dd')}&to=${day.plus({ days: 1 }).toFormat('yyyy-LL-dd')}`);
    const row = page.getByTestId('accuracy-days').getByRole('row').filter({ hasText: date });
    await row.getByTestId('accuracy-replayed-badge').waitFor({ timeout: 30_000 });
    expect(await row.innerText()).toMatch(/replayed\s*3\.00 %/i);
    // yesterday's run was issued: no badge on its row
    const yesterday = page.getByTestId('accuracy-days').getByRole('row').filter({ hasText: day.plus({ days: 1 }).toFormat('yyyy-LL-dd') });
    expect(await yesterday.getByTestId('accuracy-replayed-badge').count()).toBe(0);
    expect(await page.getByTestId('accuracy-replayed-note').innerText()).toMatch(/1 of the 7 days are scored against replayed model forecasts[\s\S]*not forecasts the desk issued at the time/);
    expect(await page.getByTestId('accuracy-zone-replayed').innerText()).toBe('1 of 7 days');
    await page.addStyleTag({ content: 'header { position: static !important; }' });
    await screenshot(page, 'accuracy-replayed-day');
  }, 120_000);
});
