import { mkdir, mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEMO_USERS, type DemoUser, type Role } from '@morrowline/shared';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

/** The running desk under test; `npm test` starts one and passes its address. */
export const BASE_URL = (process.env.MORROWLINE_URL ?? 'http://127.0.0.1:3100').replace(/\/$/, '');

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const SCREENSHOTS = fileURLToPath(new URL('../screenshots/', import.meta.url));

// Without the networking switches Chromium keeps trying to reach update and sync services
// that a closed network does not have.
const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface Desk {
  context: BrowserContext;
  page: Page;
  close: () => Promise<void>;
}

/** A fresh Chromium with its own empty profile, so no test inherits another's session. */
export async function openDesk(): Promise<Desk> {
  const profile = await mkdtemp(path.join(tmpdir(), 'morrowline-e2e-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: CHROMIUM_ARGS,
    baseURL: BASE_URL,
    viewport: { width: 1360, height: 860 },
    locale: 'en-US',
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      await rm(profile, { recursive: true, force: true });
    },
  };
}

export function demoUser(role: Role): DemoUser {
  const user = DEMO_USERS.find((candidate) => candidate.role === role);
  if (!user) throw new Error(`The demo scenario has no ${role}`);
  return user;
}

export async function fillSignIn(page: Page, email: string, password: string): Promise<void> {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Signs in through the form and waits until the header shows who is signed in. */
export async function signInAs(page: Page, user: DemoUser, startPath = '/sign-in'): Promise<void> {
  await page.goto(startPath);
  await fillSignIn(page, user.email, user.password);
  await page.getByTestId('signed-in-name').waitFor({ state: 'visible' });
}

/** The title of the desk's inline failure notice (client/src/components/ErrorNotice.tsx). */
const REFUSAL_TITLE = 'That did not work';

/**
 * Waits for the element a page shows once its queries have answered. A request the server
 * refused shows an error notice instead, which no amount of waiting mends: that fails at once
 * with the server's message, and a timeout says what the page showed meanwhile.
 */
export async function waitForLoaded(page: Page, testId: string, timeout = 60_000): Promise<void> {
  const loaded = page.getByTestId(testId);
  const refused = page.getByRole('alert').filter({ hasText: REFUSAL_TITLE });
  try {
    await loaded.or(refused).first().waitFor({ timeout });
  } catch (error) {
    const shown = (await page.locator('main').innerText().catch(() => '')).replace(/\s+/g, ' ').slice(0, 400);
    throw new Error(`${testId} did not appear within ${timeout} ms at ${page.url()}; the page showed: ${shown}`, { cause: error });
  }
  if (!(await loaded.isVisible())) throw new Error(`${testId} did not appear: the page answered "${(await refused.first().innerText()).replace(/\s+/g, ' ')}"`);
}

/** The section labels in the side navigation, in order. */
export async function navigationLabels(page: Page): Promise<string[]> {
  const navigation = page.getByRole('navigation', { name: 'Sections' });
  await navigation.waitFor({ state: 'visible' });
  const labels = await navigation.locator('a[data-section]').allInnerTexts();
  return labels.map((label) => label.trim());
}

export async function screenshot(page: Page, name: string): Promise<string> {
  await mkdir(SCREENSHOTS, { recursive: true });
  const file = path.join(SCREENSHOTS, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
