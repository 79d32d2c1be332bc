import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, demoUser, openDesk, screenshot, signInAs, type Desk } from './support/browser';
import { apiToken } from './support/history';

/** A date and time with a zone abbreviation: the desk's one clock rule ("2026-12-02 08:18 MST"). */
const LOCAL_TIME = /\d{4}-\d{2}-\d{2} \d{2}:\d{2} M[SD]T/;

describe('administration: feed keys, the one clock, zone names', () => {
  let desk: Desk;
  beforeAll(async () => {
    desk = await openDesk();
    await signInAs(desk.page, demoUser('admin'));
  });
  afterAll(async () => {
    await desk?.close();
  });

  it('creates a feed key limited to one zone, shows its secret once, lists it and revokes it', async () => {
    const page = desk.page;
    await page.getByRole('link', { name: 'Feed keys' }).click();
    await page.waitForURL('**/admin/feed-keys');
    await page.getByRole('button', { name: 'Create key' }).click();
    const dialog = page.getByRole('dialog', { name: 'Create a feed key' });
    const name = `Copperline test RTU ${Date.now() % 100000}`;
    await dialog.getByLabel(/^Name/).fill(name);
    await dialog.getByLabel('May send for').click();
    await page.getByRole('option', { name: /Copperline/ }).click();
    await dialog.getByRole('button', { name: 'Create key' }).click();

    const shown = page.getByRole('dialog', { name: 'Feed key created' });
    const secret = (await shown.getByLabel('Feed key secret').innerText()).trim();
    expect(secret.length).toBeGreaterThan(20);
    await screenshot(page, 'admin-feed-key-created');
    await shown.getByRole('button', { name: 'I have copied it' }).click();
    await shown.waitFor({ state: 'hidden' });

    const row = page.getByRole('table', { name: 'Feed keys' }).getByRole('row').filter({ hasText: name });
    await row.waitFor();
    expect(await row.innerText()).toMatch(/Copperline/);
    expect(await row.innerText()).toMatch(LOCAL_TIME);
    expect(await page.getByText(secret).count()).toBe(0);
    await screenshot(page, 'admin-feed-keys');

    await row.getByRole('button', { name: 'Revoke' }).click();
    const revoke = page.getByRole('dialog', { name: `Revoke ${name}` });
    await revoke.getByLabel(/^Reason/).fill('Test key, not needed');
    await revoke.getByRole('button', { name: 'Revoke key' }).click();
    await revoke.waitFor({ state: 'hidden' });
    await expect.poll(() => row.innerText()).toMatch(/revoked/i);
    expect(await row.getByRole('button', { name: 'Revoke' }).count()).toBe(0);
  });

  it("writes sign-ins and the audit trail in the desk's time with its abbreviation", async () => {
    const page = desk.page;
    await page.getByRole('link', { name: 'Users' }).click();
    const users = page.getByRole('table', { name: 'Users' });
    await users.waitFor();
    const adminRow = users.getByRole('row').filter({ hasText: demoUser('admin').email });
    await expect.poll(() => adminRow.innerText()).toMatch(LOCAL_TIME);

    await page.getByRole('link', { name: 'Audit trail' }).click();
    const audit = page.getByRole('table', { name: 'Audit trail' });
    await audit.waitFor();
    await expect.poll(() => audit.locator('tbody tr').first().locator('td').first().innerText()).toMatch(LOCAL_TIME);
    await screenshot(page, 'admin-audit-clock');
  });

  it('refuses a zone name another zone already has, in the form and at the server', async () => {
    const page = desk.page;
    await page.getByRole('link', { name: 'Zones' }).click();
    await page.getByRole('table', { name: 'Zones' }).waitFor();
    await page.getByRole('button', { name: 'Add zone' }).click();
    const dialog = page.getByRole('dialog', { name: 'Add a zone' });
    await dialog.getByLabel(/^Code/).fill('MILLRACE2');
    await dialog.getByLabel(/^Name/).fill('millrace');
    await dialog.getByRole('button', { name: 'Add zone' }).click();
    await dialog.getByText('Zone MILLRACE is already called "Millrace"; choose another name').waitFor();
    await screenshot(page, 'admin-zone-duplicate-name');
    await dialog.getByRole('button', { name: 'Cancel' }).click();

    const token = await apiToken('admin');
    const response = await fetch(`${BASE_URL}/api/zones`, {
      method: 'POST',
      headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' },
      body: JSON.stringify({ code: 'MILLRACE2', name: 'Millrace ', timeZone: 'America/Denver', alertThresholdPct: 5, alertConsecutiveHours: 2, gateClosure: '10:00', minPlausibleMw: 0, maxPlausibleMw: 500 }),
    });
    expect(response.status).toBe(409);
  });
});
