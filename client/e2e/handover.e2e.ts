import { DEMO_USERS, type DemoUser } from '@morrowline/shared';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { openDesk, screenshot, signInAs, type Desk } from './support/browser';

function demoUserNamed(name: string): DemoUser {
  const user = DEMO_USERS.find((candidate) => candidate.name === name);
  if (!user) throw new Error(`The demo scenario has no ${name}`);
  return user;
}

describe('handing the desk to the next shift', () => {
  let desk: Desk;

  beforeEach(async () => {
    desk = await openDesk();
  });

  afterEach(async () => {
    await desk?.close();
  });

  it('Ines writes a note with an outage in progress, Tomas sees it waiting and acknowledges it with a reply', async () => {
    const { page } = desk;
    // A word of this run's own, so that notes from earlier runs on the same database do not count.
    const marker = `run${Date.now().toString(36)}`;
    const itemText = `Feeder Q-7 out since 09:40, crew on site (${marker})`;

    // The outgoing operator writes the handover.
    await signInAs(page, demoUserNamed('Ines Marlow'));
    await page.getByRole('link', { name: 'Shift log' }).click();
    await page.getByRole('heading', { name: 'Shift log' }).waitFor();
    expect(await page.getByTestId('current-shift-label').innerText()).toMatch(/\d\d:\d\d–\d\d:\d\d/);

    const form = page.getByRole('form', { name: 'Write handover' });
    await form.getByLabel('Handover note').fill(`Quiet shift, ${marker}.\n\n- Copperline smelter back on **two shifts** from Monday\n- Rain expected from 18:00`);
    await form.getByRole('button', { name: 'Add item' }).click();
    const row = form.locator('[data-testid^="item-row-"]:not([data-carried])').last();
    await row.locator('input[aria-label^="Kind of item"]').click();
    await page.getByRole('option', { name: 'Outage in progress' }).click();
    await row.locator('input[aria-label^="Zone of item"]').click();
    await page.getByRole('option', { name: 'Quarry Hill (QUARRY)' }).click();
    await row.locator('input[aria-label^="Text of item"]').fill(itemText);
    await screenshot(page, 'handover-writing');
    await form.getByRole('button', { name: 'Hand over' }).click();

    await page.getByTestId('handed-over').waitFor();
    const ownNote = page.getByTestId('pending-handovers').locator('[data-testid^="handover-note-"]', { hasText: marker });
    await ownNote.waitFor();
    expect(await ownNote.innerText()).toContain('Your handover: the next operator or supervisor');
    expect(await ownNote.getByRole('button', { name: 'Acknowledge' }).count()).toBe(0);
    await screenshot(page, 'handover-written');

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL('**/sign-in');

    // The incoming operator sees the banner on the first screen and acknowledges.
    await signInAs(page, demoUserNamed('Tomas Reedy'));
    const banner = page.getByTestId('pending-handover-banner');
    await banner.waitFor();
    expect(await banner.innerText()).toContain('Handover from Ines Marlow');
    await screenshot(page, 'handover-banner');

    await banner.getByRole('link', { name: 'Read and acknowledge it' }).click();
    await page.waitForURL('**/shift-log');
    const note = page.getByTestId('pending-handovers').locator('[data-testid^="handover-note-"]', { hasText: marker });
    await note.waitFor();
    const noteText = await note.innerText();
    expect(noteText).toContain('Outage in progress · Quarry Hill');
    expect(noteText).toContain(itemText);
    expect(await note.locator('strong', { hasText: 'two shifts' }).count()).toBe(1);
    await note.getByLabel(/Reply to the outgoing shift/).fill('Got it, I have the desk. Will call the Q-7 crew at 16:00.');
    await screenshot(page, 'handover-pending');
    await note.getByRole('button', { name: 'Acknowledge' }).click();
    await note.waitFor({ state: 'detached' });

    // The note now shows as acknowledged, with the reply, among the past notes.
    await page.getByRole('tab', { name: 'Past notes' }).click();
    await page.getByLabel('Words').fill(marker);
    const past = page.getByTestId('handover-history').locator('[data-testid^="handover-note-"]', { hasText: marker });
    await past.getByTestId('acknowledged-badge').waitFor();
    expect(await past.getByTestId('acknowledgement').innerText()).toMatch(/Acknowledged by Tomas Reedy .* reply: Got it, I have the desk/);
    await screenshot(page, 'handover-history');

    // Its own page, and how it prints: no navigation, black on white.
    await past.getByRole('button', { name: /^Open the note/ }).click();
    const detail = page.getByTestId('handover-detail');
    await detail.getByRole('heading', { name: /^Handover · / }).waitFor();
    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('navigation', { name: 'Sections' }).isVisible()).toBe(false);
    expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
    expect(await detail.innerText()).toContain(itemText);
    await screenshot(page, 'handover-print');
    await page.emulateMedia({ media: 'screen' });
  });
});
