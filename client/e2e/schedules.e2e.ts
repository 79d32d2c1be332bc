import { readFile } from 'node:fs/promises';
import { DEMO_TIME_ZONE, SCHEDULE_EXPORT_COLUMNS, type DayScheduleDto, type ZoneDto } from '@morrowline/shared';
import { DateTime } from 'luxon';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, demoUser, openDesk, screenshot, signInAs, type Desk } from './support/browser';
import { apiToken, historyCsv, MILLRACE_LOAD, uploadHistory } from './support/history';

const ZONE = 'MILLRACE';

/**
 * Tomorrow's schedule, in the desk's time zone. The demo gate closes at 10:00 the day before, so
 * on a run after 10:00 local the administrator first moves Millrace's gate to 23:59 (the test
 * database is fresh each run): the operator may then submit without a supervisor.
 */
async function tomorrowWithGateOpen(operator: string): Promise<string> {
  const tomorrow = DateTime.now().setZone(DEMO_TIME_ZONE).plus({ days: 1 }).toISODate() as string;
  const look = async () => {
    const view = await fetch(`${BASE_URL}/api/schedules/${tomorrow}?zone=${ZONE}`, { headers: { Authorization: `Bearer ${operator}` } });
    expect(view.status).toBe(200);
    return ((await view.json()) as DayScheduleDto).zones[0];
  };
  const zone = await look();
  expect(zone.forecast).not.toBeNull();
  if (zone.gateClosed) {
    const admin = await apiToken('admin');
    const zones = (await (await fetch(`${BASE_URL}/api/zones`, { headers: { Authorization: `Bearer ${admin}` } })).json()) as ZoneDto[];
    const millrace = zones.find((z) => z.code === ZONE);
    const patch = await fetch(`${BASE_URL}/api/zones/${millrace?.id}`, {
      method: 'PATCH',
      headers: { Authorization: `Bearer ${admin}`, 'Content-Type': 'application/json' },
      body: JSON.stringify({ gateClosure: '23:59', reason: 'Browser test: keep the gate open for the run' }),
    });
    expect(patch.status).toBe(200);
    expect((await look()).gateClosed).toBe(false);
  }
  return tomorrow;
}

describe('day-ahead schedule', () => {
  let desk: Desk;
  let day: string;

  beforeAll(async () => {
    const token = await apiToken('operator');
    await uploadHistory(token, ZONE, historyCsv(8 * 168, MILLRACE_LOAD), 'millrace-history.csv');
    day = await tomorrowWithGateOpen(token);
    desk = await openDesk();
  });
  afterAll(async () => {
    await desk?.close();
  });

  it('an operator adjusts and submits, another person approves and publishes, the CSV carries the adjusted value', async () => {
    const page = desk.page;
    await signInAs(page, demoUser('operator'));
    await page.getByRole('link', { name: 'Day-ahead schedule' }).click();
    // Tomorrow is the default; the address then narrows the zones to Millrace.
    expect(await page.getByLabel('Operating day').inputValue()).toBe(day);
    await page.goto(`/schedules?zones=${ZONE}`);
    const zonePanel = page.getByTestId(`zone-schedule-${ZONE}`);
    await zonePanel.waitFor();
    expect(await page.getByTestId('no-revision').innerText()).toMatch(/Nothing drafted yet/);
    expect(await page.getByTestId('gate-countdown').innerText()).toMatch(/to gate closure/);
    const hours = page.getByRole('table', { name: 'Hours of Millrace' });
    expect(await hours.locator('tbody tr').count()).toBe(24);
    await page.getByRole('button', { name: 'Start the draft' }).click();

    const form = page.getByRole('form', { name: 'Adjust the schedule' });
    await form.waitFor();
    await form.getByLabel(/MW to add/).fill('30');
    await form.getByLabel(/^From hour/).first().click();
    await page.getByRole('option', { name: 'HE17', exact: true }).click();
    await form.getByLabel(/^To hour/).first().click();
    await page.getByRole('option', { name: 'HE20', exact: true }).click();
    await form.getByLabel(/Reason/).fill('Harvest fair in the old town square, evening stalls and lights');
    await form.getByRole('button', { name: 'Apply adjustment' }).click();

    const he17 = hours.getByTestId('hour-HE17');
    await expect.poll(() => he17.innerText(), { timeout: 15_000 }).toMatch(/\+30\.0/);
    for (const label of ['HE18', 'HE19', 'HE20']) expect(await hours.getByTestId(`hour-${label}`).innerText()).toMatch(/\+30\.0/);
    expect(await hours.getByTestId('hour-HE16').innerText()).not.toMatch(/\+30\.0/);
    expect(await hours.getByTestId('hour-HE21').innerText()).not.toMatch(/\+30\.0/);
    const cells = (await he17.locator('td').allInnerTexts()).map((text) => text.trim());
    const modelMw = Number.parseFloat(cells[1]);
    const adjustedMw = Number.parseFloat(cells[3]);
    expect(adjustedMw).toBeCloseTo(modelMw + 30, 1);
    expect(await page.getByRole('table', { name: 'Adjustments' }).innerText()).toMatch(/Add 30 MW\s+HE17–HE20\s+Harvest fair/);
    await page.getByTestId('schedule-chart').locator('canvas').first().waitFor({ state: 'attached' });
    await screenshot(page, 'schedule-adjusted');

    await page.getByRole('button', { name: 'Submit for approval' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel(/Comment for the supervisor/).fill('Fair adds evening load, as last year');
    await dialog.getByRole('button', { name: 'Submit', exact: true }).click();
    await expect.poll(() => page.getByTestId('revision-state').first().innerText(), { timeout: 15_000 }).toMatch(/Submitted by Ines Marlow/);
    expect(await page.getByRole('form', { name: 'Adjust the schedule' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Approve and publish' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Undo' }).count()).toBe(0);
    await screenshot(page, 'schedule-submitted');

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL('**/sign-in');

    const supervisor = demoUser('supervisor');
    expect(supervisor.name).toBe('Hal Brennick');
    await signInAs(page, supervisor);
    await page.goto(`/schedules?day=${day}&zones=${ZONE}`);
    const caution = page.getByTestId('publish-caution');
    await caution.waitFor();
    expect(await caution.innerText()).toMatch(/never replace, the judgement of the responsible system operator/);
    expect(await caution.innerText()).toMatch(/reliability standards, market rules and local regulations/);
    await screenshot(page, 'schedule-approval');
    await page.getByRole('button', { name: 'Approve and publish' }).click();
    // one click only asks: the revision is still waiting until the supervisor confirms
    const confirm = page.getByRole('dialog');
    await confirm.waitFor();
    expect(await confirm.getByTestId('publish-summary').innerText()).toMatch(/24 hours/);
    expect(await page.getByTestId('revision-state').first().innerText()).toMatch(/submitted, waiting for approval/i);
    await screenshot(page, 'schedule-publish-confirm');
    await confirm.getByRole('button', { name: 'Publish revision 1' }).click();
    await expect.poll(() => page.getByTestId('revision-state').first().innerText(), { timeout: 15_000 }).toMatch(/Approved and published by Hal Brennick/);
    expect(await page.getByRole('button', { name: 'Correct' }).count()).toBe(1);
    await screenshot(page, 'schedule-published');

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId(`workflow-${ZONE}`).getByRole('button', { name: 'Download revision 1 as CSV' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe(`schedule-millrace-${day}-r1.csv`);
    const lines = (await readFile(await download.path(), 'utf8')).trim().split(/\r?\n/);
    expect(lines[0]).toBe(SCHEDULE_EXPORT_COLUMNS.join(','));
    expect(lines).toHaveLength(25);
    const row = lines.map((line) => line.split(',')).find((fields) => fields[2] === 'HE17');
    expect(row).toBeDefined();
    expect(row?.[0]).toBe(day);
    expect(row?.[1]).toBe(ZONE);
    expect(Number(row?.[4])).toBeCloseTo(adjustedMw, 1);
    expect(row?.[5]).toBe('1');
    expect(row?.[7]).toBe(supervisor.email);
  }, 180_000);
});
