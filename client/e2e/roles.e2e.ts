import type { Role } from '@morrowline/shared';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { demoUser, navigationLabels, openDesk, screenshot, signInAs, type Desk } from './support/browser';

/** What each role must find in its navigation: written out, not derived from the app's own table. */
const EXPECTED_NAVIGATION: Record<Role, string[]> = {
  viewer: ['Live load', 'Day-ahead schedule', 'Accuracy', 'History'],
  operator: ['Live load', 'Model workbench', 'Refits', 'Day-ahead schedule', 'Accuracy', 'Shift log', 'History'],
  supervisor: [
    'Live load',
    'Model workbench',
    'Refits',
    'Day-ahead schedule',
    'Accuracy',
    'Shift log',
    'History',
    'Audit trail',
  ],
  admin: ['Live load', 'Users', 'Zones', 'Feed keys', 'Audit trail'],
};

const ROLE_LABELS: Record<Role, string> = {
  viewer: 'Viewer',
  operator: 'Operator',
  supervisor: 'Supervisor',
  admin: 'Administrator',
};

describe('what each role sees', () => {
  let desk: Desk;

  beforeEach(async () => {
    desk = await openDesk();
  });

  afterEach(async () => {
    await desk?.close();
  });

  for (const role of ['viewer', 'operator', 'supervisor', 'admin'] as const) {
    it(`signs in as ${role} and shows that role's sections and name`, async () => {
      const user = demoUser(role);
      await signInAs(desk.page, user);

      expect(await desk.page.getByTestId('signed-in-name').innerText()).toBe(user.name);
      expect((await desk.page.getByTestId('signed-in-role').innerText()).toLowerCase()).toBe(ROLE_LABELS[role].toLowerCase());
      expect(await navigationLabels(desk.page)).toEqual(EXPECTED_NAVIGATION[role]);
      await screenshot(desk.page, `home-${role}`);
    });
  }

  it('refuses the users screen to a viewer who types its address', async () => {
    await signInAs(desk.page, demoUser('viewer'));
    await desk.page.goto('/admin/users');

    await desk.page.getByTestId('not-available').waitFor({ state: 'visible' });
    expect(await desk.page.getByTestId('not-available').innerText()).toContain('Users is not available for your role');
    expect(await desk.page.getByRole('table', { name: 'Users' }).count()).toBe(0);
    await screenshot(desk.page, 'viewer-refused-users');
  });

  it('shows the admin the user list from the server', async () => {
    await signInAs(desk.page, demoUser('admin'));
    await desk.page.getByRole('link', { name: 'Users' }).click();

    const table = desk.page.getByRole('table', { name: 'Users' });
    await table.waitFor({ state: 'visible' });
    expect(await table.innerText()).toContain(demoUser('viewer').email);
    await screenshot(desk.page, 'admin-users');
  });

  it('shows the admin the five demo zones', async () => {
    await signInAs(desk.page, demoUser('admin'));
    await desk.page.getByRole('link', { name: 'Zones' }).click();

    const table = desk.page.getByRole('table', { name: 'Zones' });
    await table.waitFor({ state: 'visible' });
    const text = await table.innerText();
    for (const code of ['MILLRACE', 'COPPERLINE', 'HARROW', 'QUARRY', 'LANTERN']) expect(text).toContain(code);
    await screenshot(desk.page, 'admin-zones');
  });

  it('shows a supervisor the audit trail, including sign-ins', async () => {
    await signInAs(desk.page, demoUser('supervisor'));
    await desk.page.getByRole('link', { name: 'Audit trail' }).click();

    const table = desk.page.getByRole('table', { name: 'Audit trail' });
    await table.waitFor({ state: 'visible' });
    expect(await table.locator('tbody tr').count()).toBeGreaterThan(0);
    await screenshot(desk.page, 'supervisor-audit');
  });
});
