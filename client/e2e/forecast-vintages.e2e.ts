import { DateTime } from 'luxon';
import { operatingDayBounds, type DayScheduleDto, type ScheduleRevisionDto } from '@morrowline/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, demoUser, openDesk, screenshot, signInAs, waitForLoaded, type Desk } from './support/browser';
import { apiToken } from './support/history';
import { insertPastForecastRun } from './support/test-database';
import { ownZone } from './support/zones';

const ZONE = 'WILLOW';
const NAME = 'Willowmere';
const TIME_ZONE = 'America/Denver';
const HOUR = 3_600_000;

/** A model run covering tomorrow: 150 MW plus the hour's position, and `bump` MW on HE19. */
function run(day: string, bump: number): { firstHour: Date; mean: number[] } {
  const { from, to } = operatingDayBounds(day, TIME_ZONE);
  const hours = (to - from) / HOUR;
  return { firstHour: new Date(from), mean: Array.from({ length: hours }, (_, i) => 150 + i + (i === 18 ? bump : 0)) };
}

async function call<T>(token: string, method: string, path: string, body?: unknown): Promise<T> {
  const res = await fetch(`${BASE_URL}/api${path}`, { method, headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });
  expect(res.status, `${method} ${path}: ${await res.clone().text()}`).toBeLessThan(300);
  return (await res.json()) as T;
}

describe('forecast vintages on the day-ahead schedule', () => {
  let desk: Desk;
  let day: string;
  const firstIssuedAt = new Date(Math.floor(Date.now() / 60_000) * 60_000 - 2 * HOUR);
  // the desk writes a moment with its zone's abbreviation (MST or MDT in Willowmere)
  const local = (d: Date) => DateTime.fromJSDate(d).setZone(TIME_ZONE).setLocale('en-US').toFormat('yyyy-LL-dd HH:mm ZZZZ');

  beforeAll(async () => {
    // the gate stays open all day, so the operator may submit whenever the test runs
    await ownZone(ZONE, NAME, '23:59');
    day = DateTime.now().setZone(TIME_ZONE).plus({ days: 1 }).toISODate() as string;
    await insertPastForecastRun({ zone: ZONE, issuedAt: firstIssuedAt, ...run(day, 0) });
    desk = await openDesk();
  });
  afterAll(async () => {
    await desk?.close();
  });

  it('shows the run a draft started from, warns of a newer run hour by hour, starts again from it, carries adjustments into a correction and goes back to the model', async () => {
    const page = desk.page;
    const operator = await apiToken('operator');
    await signInAs(page, demoUser('operator'));
    await page.goto(`/schedules?day=${day}&zones=${ZONE}`);
    // The card needs GET /api/zones and GET /api/schedules/:day; a refusal (the server once
    // answered "No active zone with code WILLOW" for a zone added a moment ago) fails here at once.
    await waitForLoaded(page, `zone-schedule-${ZONE}`);
    await page.getByRole('button', { name: 'Start the draft' }).click();
    const origin = page.getByTestId('revision-forecast');
    await origin.waitFor();
    const draftIssued = local(firstIssuedAt);
    expect(await origin.innerText()).toMatch(new RegExp(`^Revision 1 started from the forecast issued ${draftIssued} \\(America/Denver\\), run \\d+\\.$`));
    const view = await call<DayScheduleDto>(operator, 'GET', `/schedules/${day}?zone=${ZONE}`);
    const draft = view.zones[0].working as ScheduleRevisionDto;
    await call(operator, 'POST', `/schedules/${day}/adjustments`, { zones: [ZONE], kind: 'add', fromHour: 17, toHour: 19, value: 22.2, reason: 'Willowmere regatta evening, floodlights on the quay' });

    // the model moves: a newer run, 22 MW higher on HE19
    const newerIssuedAt = new Date(firstIssuedAt.getTime() + HOUR);
    await insertPastForecastRun({ zone: ZONE, issuedAt: newerIssuedAt, ...run(day, 22) });
    await page.reload();
    const newer = page.getByTestId('newer-forecast');
    await newer.waitFor();
    // the header line keeps the draft's own run and issue time
    expect(await origin.innerText()).toContain(`issued ${draftIssued}`);
    await newer.getByText(/largest change is \+22\.0 MW at HE19/).waitFor();
    expect(await newer.getByTestId('forecast-change-HE19').innerText()).toMatch(/HE19\s+168\.0\s+190\.0\s+\+22\.0/);
    expect(await newer.getByTestId('forecast-change-HE18').innerText()).toMatch(/HE18\s+167\.0\s+167\.0\s+0\.0/);
    await screenshot(page, 'forecast-vintages-newer-run');
    await newer.getByRole('button', { name: 'Start again from the latest run' }).click();
    await newer.waitFor({ state: 'detached' });
    const latestIssued = local(newerIssuedAt);
    await page.getByText(new RegExp(`started from the forecast issued ${latestIssued}`)).waitFor();
    const hours = page.getByRole('table', { name: `Hours of ${NAME}` });
    await expect.poll(() => hours.getByTestId('hour-HE19').innerText(), { timeout: 15_000 }).toMatch(/190\.0[\s\S]*212\.2[\s\S]*\+22\.2/);

    // submitted and published, then corrected: the adjustment and its reason come along
    const supervisor = await apiToken('supervisor');
    await call(operator, 'POST', `/schedules/revisions/${draft.id}/submit`, {});
    await call(supervisor, 'POST', `/schedules/revisions/${draft.id}/approve`);
    await page.reload();
    await page.getByRole('button', { name: 'Correct' }).click();
    const dialog = page.getByRole('dialog', { name: /Correct Willowmere/ });
    await dialog.getByLabel(/Reason for the correction/).fill('Regatta moved to the afternoon');
    await dialog.getByRole('button', { name: 'Start the correction' }).click();
    await dialog.waitFor({ state: 'hidden' });
    const carried = page.getByRole('table', { name: 'Adjustments' }).locator('tbody tr').first();
    await expect.poll(() => carried.innerText(), { timeout: 15_000 }).toMatch(/Add 22\.2 MW[\s\S]*HE18–HE20[\s\S]*regatta evening[\s\S]*carried from revision 1/);
    await expect.poll(() => hours.getByTestId('hour-HE19').innerText(), { timeout: 15_000 }).toMatch(/212\.2/);
    await screenshot(page, 'forecast-vintages-correction');

    // back to the model: the adjustment undone (still listed), the hours the model's
    await page.getByRole('button', { name: 'Back to the model' }).click();
    await expect.poll(() => carried.innerText(), { timeout: 15_000 }).toMatch(/undone/i);
    await expect.poll(() => hours.getByTestId('hour-HE19').innerText(), { timeout: 15_000 }).not.toMatch(/212\.2/);
    expect(await page.getByRole('button', { name: 'Back to the model' }).count()).toBe(0);
  }, 240_000);
});
