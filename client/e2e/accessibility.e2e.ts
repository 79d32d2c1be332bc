import type { Role } from '@morrowline/shared';
import type { Locator, Page } from 'playwright-core';
import { afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { accessibilityViolations, type ColorScheme } from './support/accessibility';
import { demoUser, openDesk, signInAs, type Desk } from './support/browser';
import { zoneWithDeviatingLoad } from './support/deviating-zone';
import { QUARRY_LOAD } from './support/history';

/** The scan's own zone: no other browser test writes to it. */
const ZONE = 'SALTMARSH';
const ZONE_NAME = 'Saltmarsh';

/**
 * The screens each role opens, written out here rather than read from the desk's navigation
 * table, so a screen added to a role without a scan is noticed by the navigation test.
 */
const SCREENS: Record<Role, string[]> = {
  viewer: ['/live', '/wall', '/schedules', '/accuracy', '/history'],
  operator: ['/live', '/wall', `/workbench?zone=${ZONE}`, `/refits?zone=${ZONE}`, `/schedules?zones=${ZONE}`, '/accuracy', '/shift-log', '/history'],
  supervisor: ['/live', `/refits?zone=${ZONE}`, `/schedules?zones=${ZONE}`, '/accuracy', '/shift-log', '/history', '/admin/audit'],
  admin: ['/live', '/wall', '/admin/users', '/admin/zones', '/admin/feed-keys', '/admin/audit'],
};

const SCHEMES: ColorScheme[] = ['light', 'dark'];

/**
 * Every dialog, and the states a screen reaches without leaving it (the alert's acknowledgement
 * pop-over, a tab, a chart's table of numbers), by the role that may open it: the screen, the
 * control that opens it, and what to do first when it needs a state (a draft).
 */
interface StateCase {
  role: Role;
  path: string;
  opener: string;
  /** dialog (closed again with Escape), popover (likewise), tab, or disclosure (a chart's numbers). */
  kind?: 'dialog' | 'popover' | 'tab' | 'disclosure';
  before?: (page: Page) => Promise<void>;
}
const STATES: StateCase[] = [
  { role: 'operator', path: `/refits?zone=${ZONE}`, opener: 'Mark a window' },
  { role: 'operator', path: `/refits?zone=${ZONE}`, opener: 'Refit this zone' },
  { role: 'operator', path: `/refits?zone=${ZONE}`, opener: 'Refit all zones' },
  { role: 'operator', path: `/schedules?zones=${ZONE}`, opener: 'Submit for approval', before: startDraftIfNone },
  { role: 'operator', path: `/schedules?zones=${ZONE}`, opener: 'Show the numbers behind this chart as a table', kind: 'disclosure' },
  { role: 'operator', path: `/live?zone=${ZONE}`, opener: 'Acknowledge', kind: 'popover' },
  { role: 'operator', path: `/live?zone=${ZONE}`, opener: 'Show the numbers behind this chart as a table', kind: 'disclosure' },
  { role: 'operator', path: '/shift-log', opener: 'Past notes', kind: 'tab' },
  { role: 'operator', path: `/workbench?zone=${ZONE}`, opener: 'Show the numbers behind this chart as a table', kind: 'disclosure' },
  { role: 'viewer', path: '/accuracy', opener: 'Operating days', kind: 'popover' },
  { role: 'supervisor', path: `/schedules?zones=${ZONE}`, opener: 'Subscribers' },
  { role: 'admin', path: '/admin/users', opener: 'Add user' },
  { role: 'admin', path: '/admin/users', opener: 'Change role' },
  { role: 'admin', path: '/admin/users', opener: 'Deactivate' },
  { role: 'admin', path: '/admin/zones', opener: 'Add zone' },
  { role: 'admin', path: '/admin/zones', opener: 'Edit' },
  { role: 'admin', path: '/admin/feed-keys', opener: 'Create key' },
];

/** Opens the state and answers what to wait for while it is open, and whether Escape closes it. */
async function openState(page: Page, state: StateCase): Promise<{ shown: Locator; closesOnEscape: boolean }> {
  const kind = state.kind ?? 'dialog';
  if (kind === 'tab') {
    await page.getByRole('tab', { name: state.opener, exact: true }).click();
    return { shown: page.getByRole('tabpanel', { name: state.opener }), closesOnEscape: false };
  }
  if (kind === 'disclosure') {
    const disclosure = page.locator('details', { has: page.getByText(state.opener, { exact: true }) }).first();
    await disclosure.locator('summary').click();
    return { shown: disclosure.locator('table'), closesOnEscape: false };
  }
  await page.getByRole('button', { name: state.opener, exact: true }).first().click();
  return { shown: kind === 'popover' ? page.locator('.mantine-Popover-dropdown').filter({ visible: true }) : page.getByRole('dialog'), closesOnEscape: true };
}

async function startDraftIfNone(page: Page): Promise<void> {
  const start = page.getByRole('button', { name: 'Start the draft' });
  const submit = page.getByRole('button', { name: 'Submit for approval' });
  await start.or(submit).first().waitFor();
  if (await start.isVisible()) await start.click();
  await submit.waitFor();
}

/** Opens `path` in a fresh page load with `scheme` chosen, and waits until its data has come. */
async function open(page: Page, path: string, scheme: ColorScheme): Promise<void> {
  await page.evaluate((value) => window.localStorage.setItem('morrowline.color-scheme', value), scheme);
  await page.goto(path);
  await page.locator('main').waitFor({ state: 'visible' });
  await page.waitForLoadState('networkidle');
  await page.locator('.mantine-Loader-root').first().waitFor({ state: 'detached', timeout: 20_000 }).catch(() => undefined);
  expect(await page.evaluate(() => document.documentElement.getAttribute('data-mantine-color-scheme'))).toBe(scheme);
}

/** Fails listing every violation found: rule, impact, element and the start of its HTML. */
function expectNone(found: string[]): void {
  if (found.length > 0) throw new Error(`${found.length} accessibility violation(s):\n${found.join('\n')}`);
}

describe('accessibility: WCAG 2.1 A and AA on every screen, for every role, in both colour schemes', () => {
  let desk: Desk;

  beforeAll(async () => {
    await zoneWithDeviatingLoad(ZONE, ZONE_NAME, QUARRY_LOAD);
  });
  beforeEach(async () => {
    desk = await openDesk();
  });
  afterEach(async () => {
    await desk?.close();
  });

  it('the sign-in page', async () => {
    const found: string[] = [];
    await desk.page.goto('/sign-in');
    for (const scheme of SCHEMES) {
      await desk.page.evaluate((value) => window.localStorage.setItem('morrowline.color-scheme', value), scheme);
      await desk.page.goto('/sign-in');
      await desk.page.getByLabel('E-mail').waitFor();
      for (const line of await accessibilityViolations(desk.page)) found.push(`[sign-in, ${scheme}] ${line}`);
    }
    expectNone(found);
  });

  for (const role of ['viewer', 'operator', 'supervisor', 'admin'] as const) {
    it(`every screen and dialog of the ${role}`, { timeout: 480_000 }, async () => {
      const { page } = desk;
      await signInAs(page, demoUser(role));
      const found: string[] = [];
      for (const scheme of SCHEMES) {
        for (const path of SCREENS[role]) {
          await open(page, path, scheme);
          for (const line of await accessibilityViolations(page)) found.push(`[${path}, ${role}, ${scheme}] ${line}`);
        }
        for (const state of STATES.filter((d) => d.role === role)) {
          await open(page, state.path, scheme);
          await state.before?.(page);
          const { shown, closesOnEscape } = await openState(page, state);
          await shown.waitFor({ state: 'visible' });
          for (const line of await accessibilityViolations(page)) found.push(`[${state.path} "${state.opener}", ${role}, ${scheme}] ${line}`);
          if (closesOnEscape) {
            await page.keyboard.press('Escape');
            await shown.waitFor({ state: 'hidden' });
          }
        }
      }
      expectNone(found);
    });
  }
});
