import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoUser, openDesk, screenshot, signInAs, type Desk } from './support/browser';
import { apiToken, HOUR_MS, uploadHistory } from './support/history';
import { ownZone } from './support/zones';

/** The wall test's own zone: no other browser test writes to it. */
const ZONE = 'ASHGROVE';
const ZONE_NAME = 'Ashgrove';

/** Two days of a flat 140 MW up to the last complete hour, then that hour at `lastMw`. */
function flatCsv(lastMw: number): string {
  const last = Math.floor(Date.now() / HOUR_MS) * HOUR_MS - HOUR_MS;
  const rows = ['timestamp,load_mw'];
  for (let t = last - 47 * HOUR_MS; t < last; t += HOUR_MS) rows.push(`${new Date(t).toISOString()},140.00`);
  rows.push(`${new Date(last).toISOString()},${lastMw.toFixed(2)}`);
  return rows.join('\n') + '\n';
}

describe('the wall display of live load', () => {
  let desk: Desk;
  let operator: string;

  beforeAll(async () => {
    await ownZone(ZONE, ZONE_NAME);
    operator = await apiToken('operator');
    await uploadHistory(operator, ZONE, flatCsv(151.2), 'ashgrove-history.csv');
    desk = await openDesk();
  });
  afterAll(async () => {
    await desk?.close();
  });

  it('a viewer opens it from the navigation, reads every zone in large type, and sees a new reading without touching it', async () => {
    const { page } = desk;
    await signInAs(page, demoUser('viewer'));
    await page.getByRole('link', { name: 'Wall display' }).click();
    await page.waitForURL('**/wall');
    await page.getByRole('heading', { name: 'Live load', level: 1 }).waitFor();

    const tile = page.getByTestId(`wall-zone-${ZONE}`);
    await tile.getByRole('heading', { name: ZONE_NAME }).waitFor();
    await expect.poll(() => tile.getByTestId('wall-current-mw').innerText(), { timeout: 15_000 }).toBe('151.2 MW');
    expect(await tile.innerText()).toMatch(/Nothing committed/);
    // Every demo zone and the system total are on the wall.
    for (const name of ['System total', 'Millrace', 'Copperline', 'Harrow Flats', 'Quarry Hill', 'Lanternside']) {
      expect(await page.getByRole('heading', { name, exact: true, level: 2 }).count()).toBe(1);
    }
    await page.getByTestId('wall-alerts').getByRole('heading', { name: /^Open deviation alerts: \d+$/ }).waitFor();
    // Large type: the load figure reads from a few metres (56 px, four times the desk's 14 px).
    expect(await tile.getByTestId('wall-current-mw').evaluate((element) => getComputedStyle(element).fontSize)).toBe('56px');
    await screenshot(page, 'wall-display');

    // A corrected reading for the latest hour arrives (an upload replaces the stored value): the
    // wall shows it with no reload and no click.
    await uploadHistory(operator, ZONE, flatCsv(163.8), 'ashgrove-correction.csv');
    await expect.poll(() => tile.getByTestId('wall-current-mw').innerText(), { timeout: 20_000 }).toBe('163.8 MW');
    expect(page.url()).toMatch(/\/wall$/);
  });
});
