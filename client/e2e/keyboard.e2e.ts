import { DEMO_TIME_ZONE, DEMO_USERS, type DemoUser } from '@morrowline/shared';
import { DateTime } from 'luxon';
import { afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { openDesk, type Desk } from './support/browser';
import { zoneWithDeviatingLoad } from './support/deviating-zone';
import { HOUR_MS, MILLRACE_LOAD } from './support/history';
import { pressEnterOn, signInByKeyboard, signOutByKeyboard, tabTo, typeInto } from './support/keyboard';

/** The keyboard tests' own zone: no other browser test writes to it. */
const ZONE = 'FERNBROOK';
const ZONE_NAME = 'Fernbrook';

function demoUserNamed(name: string): DemoUser {
  const user = DEMO_USERS.find((candidate) => candidate.name === name);
  if (!user) throw new Error(`The demo scenario has no ${name}`);
  return user;
}

/**
 * Each workflow done with the keyboard alone: Tab (and Shift+Tab) to move, Enter to press, typing
 * to write; no mouse click anywhere. Every stop reached is checked for a visible focus.
 */
describe('keyboard only', () => {
  let desk: Desk;

  beforeAll(async () => {
    await zoneWithDeviatingLoad(ZONE, ZONE_NAME, MILLRACE_LOAD);
  });
  beforeEach(async () => {
    desk = await openDesk();
  });
  afterEach(async () => {
    await desk?.close();
  });

  it('an operator acknowledges a deviation alert with a comment', async () => {
    const { page } = desk;
    // Tomas, not Ines: the live view's test looks for Ines among the acknowledgements of every zone.
    await signInByKeyboard(page, demoUserNamed('Tomas Reedy'));
    await page.waitForURL('**/live');
    // Choose the zone's card, then reach the alert's button.
    await pressEnterOn(page, page.getByTestId(`zone-card-${ZONE}`));
    await page.waitForURL(`**/live?zone=${ZONE}`);
    const row = page.locator('[data-testid^="alert-row-"]', { hasText: ZONE_NAME }).first();
    await row.waitFor();
    const rowId = (await row.getAttribute('data-testid')) as string;
    await pressEnterOn(page, row.getByRole('button', { name: 'Acknowledge' }));
    // The pop-over takes the focus into its comment field.
    const comment = page.getByLabel('Comment (optional)');
    await comment.waitFor();
    await typeInto(page, comment, 'Feeder switching in Fernbrook, crew confirmed');
    await pressEnterOn(page, page.getByRole('button', { name: 'Acknowledge alert' }));
    // That alert leaves the open list (the upload may have raised others on the zone).
    await expect.poll(() => page.getByTestId(rowId).count(), { timeout: 15_000 }).toBe(0);
  });

  it('an operator submits tomorrow’s schedule and a supervisor approves and publishes it', async () => {
    const { page } = desk;
    await signInByKeyboard(page, demoUserNamed('Ines Marlow'));
    await page.goto(`/schedules?zones=${ZONE}`);
    await pressEnterOn(page, page.getByRole('button', { name: 'Start the draft' }));
    await pressEnterOn(page, page.getByRole('button', { name: 'Submit for approval' }));
    const dialog = page.getByRole('dialog');
    // The dialog puts the focus in its comment field.
    await tabTo(page, dialog.getByLabel(/Comment for the supervisor/));
    await page.keyboard.type('Model forecast as issued, no events known');
    await pressEnterOn(page, dialog.getByRole('button', { name: 'Submit', exact: true }));
    await expect.poll(() => page.getByTestId('revision-state').first().innerText(), { timeout: 15_000 }).toMatch(/Submitted by Ines Marlow/);
    await signOutByKeyboard(page);

    await signInByKeyboard(page, demoUserNamed('Nora Vance'));
    await page.goto(`/schedules?zones=${ZONE}`);
    await pressEnterOn(page, page.getByRole('button', { name: 'Approve and publish' }));
    const confirm = page.getByRole('dialog');
    await pressEnterOn(page, confirm.getByRole('button', { name: 'Publish revision 1' }));
    await expect.poll(() => page.getByTestId('revision-state').first().innerText(), { timeout: 15_000 }).toMatch(/Approved and published by Nora Vance/);
  });

  it('a supervisor writes a handover and the next one acknowledges it with a reply', async () => {
    const { page } = desk;
    const marker = `kb${Date.now().toString(36)}`;
    await signInByKeyboard(page, demoUserNamed('Nora Vance'));
    await page.goto('/shift-log');
    const form = page.getByRole('form', { name: 'Write handover' });
    await typeInto(page, form.getByLabel('Handover note'), `Handed over by keyboard, ${marker}. Fernbrook alert acknowledged.`);
    await pressEnterOn(page, form.getByRole('button', { name: 'Hand over' }));
    await page.getByTestId('handed-over').waitFor();
    await signOutByKeyboard(page);

    await signInByKeyboard(page, demoUserNamed('Hal Brennick'));
    await page.goto('/shift-log');
    const note = page.getByTestId('pending-handovers').locator('[data-testid^="handover-note-"]', { hasText: marker });
    await typeInto(page, note.getByLabel(/Reply to the outgoing shift/), 'Read, I have the desk.');
    await pressEnterOn(page, note.getByRole('button', { name: 'Acknowledge' }));
    await note.waitFor({ state: 'detached' });
  });

  it('an operator uploads a CSV for a chosen zone and reads the report', async () => {
    const { page } = desk;
    // Three hours ten weeks back (older than the zone's history) and one row that is no time at all.
    const start = Math.floor(Date.now() / HOUR_MS) * HOUR_MS - 70 * 24 * HOUR_MS;
    const csv = ['timestamp,load_mw', ...[0, 1, 2].map((i) => `${new Date(start + i * HOUR_MS).toISOString()},${(150 + i).toFixed(1)}`), 'yesterday noon,151.0'].join('\n') + '\n';
    await signInByKeyboard(page, demoUserNamed('Tomas Reedy'));
    await page.goto('/history');
    // The file field opens the system's file chooser on Enter; the test answers it.
    const chooser = page.waitForEvent('filechooser');
    await pressEnterOn(page, page.getByRole('button', { name: 'CSV file' }));
    await (await chooser).setFiles({ name: 'fernbrook-extra.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.getByText('The file has no zone column').waitFor();
    // The zone list opens with the arrow key and is walked with it to the zone's option.
    await tabTo(page, page.getByRole('combobox', { name: 'Zone for every row' }));
    await page.keyboard.press('ArrowDown');
    const option = page.getByRole('option', { name: `${ZONE_NAME} (${ZONE})` });
    await option.waitFor();
    for (let step = 0; step < 30 && (await option.getAttribute('data-combobox-selected')) === null; step++) await page.keyboard.press('ArrowDown');
    await page.keyboard.press('Enter');
    await pressEnterOn(page, page.getByRole('button', { name: 'Upload and check' }));
    await page.getByTestId('upload-report').waitFor();
    expect(await page.getByTestId('report-accepted').innerText()).toBe('3');
    expect(await page.getByTestId('report-rejected').innerText()).toBe('1');
  });

  it('an operator marks an outage window and starts a refit of the zone', async () => {
    const { page } = desk;
    const reason = `after the Fernbrook outage, by keyboard ${Date.now().toString(36)}`;
    // Three days ago, 09:00 to 13:00 in the zone's time.
    const day = DateTime.now().setZone(DEMO_TIME_ZONE).minus({ days: 3 });
    await signInByKeyboard(page, demoUserNamed('Tomas Reedy'));
    await page.goto(`/refits?zone=${ZONE}`);
    await pressEnterOn(page, page.getByRole('button', { name: 'Mark a window' }));
    const dialog = page.getByRole('dialog', { name: `Mark a window on ${ZONE_NAME}` });
    // A date-and-time field takes its parts as typed digits (month, day, year; the arrow key on
    // to the time; hour, minute, A or P in en-US).
    const typeDateTime = async (label: RegExp, time: string) => {
      await typeInto(page, dialog.getByLabel(label), day.toFormat('LLddyyyy'));
      await page.keyboard.press('ArrowRight');
      await page.keyboard.type(time);
    };
    await typeDateTime(/^Start/, '0900A');
    await typeDateTime(/^End/, '0100P');
    await typeInto(page, dialog.getByLabel(/^Note/), 'Fernbrook feeder 2 out for a crossing repair');
    expect(await dialog.getByTestId('outage-time-hint').first().innerText()).toMatch(new RegExp(`^${day.toFormat('yyyy-LL-dd')} 09:00 M[SD]T`));
    await pressEnterOn(page, dialog.getByRole('button', { name: 'Mark the window' }));
    await dialog.waitFor({ state: 'hidden' });
    const windows = page.getByTestId('outage-windows').getByRole('table', { name: 'Windows' });
    await expect.poll(() => windows.innerText(), { timeout: 15_000 }).toMatch(new RegExp(`${day.toFormat('yyyy-LL-dd')} 09:00[\\s\\S]*${day.toFormat('yyyy-LL-dd')} 13:00[\\s\\S]*crossing repair`));

    await pressEnterOn(page, page.getByRole('button', { name: 'Refit this zone' }));
    const refit = page.getByRole('dialog', { name: `Refit ${ZONE_NAME}` });
    // The dialog puts the focus in its reason; Enter in the field submits the form.
    await typeInto(page, refit.getByLabel(/^Reason/), reason);
    await page.keyboard.press('Enter');
    await refit.waitFor({ state: 'hidden' });
    await page.locator('[data-testid^="refit-job-"]', { hasText: reason }).first().waitFor();
  });
});
