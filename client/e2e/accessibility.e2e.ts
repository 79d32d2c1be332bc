import { DEMO_TIME_ZONE, type Role } from '@morrowline/shared';
import { DateTime } from 'luxon';
import type { Page } from 'playwright-core';
import { afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { accessibilityViolations, type ColorScheme } from './support/accessibility';
import { demoUser, openDesk, signInAs, type Desk } from './support/browser';
import { apiToken, historyCsv, HOUR_MS, QUARRY_LOAD, uploadHistory } from './support/history';
import { insertPastForecastRun } from './support/test-database';
import { ownZone } from './support/zones';

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
    await ownZone(ZONE, ZONE_NAME);
    // The day-ahead forecast issued before yesterday's gate closure, about 12 % under the load
    // uploaded next, so the live view shows deviations and raises an alert.
    const csv = historyCsv(8 * 168, QUARRY_LOAD);
    const today = DateTime.now().setZone(DEMO_TIME_ZONE).startOf('day');
    const first = today.minus({ days: 1 }).toMillis();
    const loads = new Map(csv.trim().split('\n').slice(1).map((row) => [Date.parse(row.split(',')[0]), Number(row.split(',')[1])]));
    const mean = Array.from({ length: 72 }, (_, i) => Math.round((loads.get(first + i * HOUR_MS - 7 * 24 * HOUR_MS) ?? 100) * 0.88 * 10) / 10);
    await insertPastForecastRun({ zone: ZONE, issuedAt: new Date(today.minus({ days: 2 }).toMillis()), firstHour: new Date(first), mean });
    await uploadHistory(await apiToken('operator'), ZONE, csv, 'saltmarsh-history.csv');
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
    it(`every screen of the ${role}`, { timeout: 240_000 }, async () => {
      const { page } = desk;
      await signInAs(page, demoUser(role));
      const found: string[] = [];
      for (const scheme of SCHEMES) {
        for (const path of SCREENS[role]) {
          await open(page, path, scheme);
          for (const line of await accessibilityViolations(page)) found.push(`[${path}, ${role}, ${scheme}] ${line}`);
        }
      }
      expectNone(found);
    });
  }
});
