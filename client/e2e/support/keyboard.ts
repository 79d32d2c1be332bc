import type { DemoUser } from '@morrowline/shared';
import type { Locator, Page } from 'playwright-core';
import { settle } from './accessibility';

/** More Tab presses than any screen of the desk has stops; reaching it means the target is not in the tab order. */
const MAX_TAB_STOPS = 200;

/**
 * Presses Tab (Shift+Tab with `backwards`) until `target` has the keyboard focus, as someone
 * without a mouse would, and checks that the focus is visible there (an outline or a ring, WCAG
 * 2.1 2.4.7). Fails when the target is never reached.
 */
export async function tabTo(page: Page, target: Locator, { backwards = false } = {}): Promise<void> {
  await target.waitFor({ state: 'visible' });
  for (let presses = 0; presses < MAX_TAB_STOPS; presses++) {
    if (await target.evaluate((element) => element === document.activeElement)) {
      await expectVisibleFocus(page);
      return;
    }
    await page.keyboard.press(backwards ? 'Shift+Tab' : 'Tab');
  }
  throw new Error(`${MAX_TAB_STOPS} presses of Tab never reached ${target.toString()}`);
}

/** The focused element shows where the focus is: an outline, or a ring drawn as a box shadow. */
export async function expectVisibleFocus(page: Page): Promise<void> {
  // Read the focus style at the end of its transition (a field's border fades to the new colour).
  await settle(page);
  const indicator = await page.evaluate(() => {
    const element = document.activeElement as HTMLElement | null;
    if (!element || element === document.body) return { visible: false, what: 'nothing focused' };
    const style = getComputedStyle(element);
    const outline = style.outlineStyle !== 'none' && Number.parseFloat(style.outlineWidth) > 0;
    const ring = style.boxShadow !== 'none' && style.boxShadow !== '';
    // A field (a text box, or a Mantine input drawn as a button: file, date, select) shows its
    // focus by turning its border to the working colour.
    const probe = document.createElement('span');
    probe.style.color = 'var(--mantine-primary-color-filled)';
    document.body.append(probe);
    const working = getComputedStyle(probe).color;
    probe.remove();
    // A password field's own input is borderless: the box around it (a parent) shows the focus.
    let box: HTMLElement | null = element;
    let field = false;
    for (let level = 0; level < 3 && box && element.matches('input, textarea, .mantine-Input-input'); level++, box = box.parentElement) {
      if (getComputedStyle(box).borderTopColor === working) field = true;
    }
    return { visible: outline || ring || field, what: element.outerHTML.slice(0, 160) };
  });
  if (!indicator.visible) throw new Error(`The keyboard focus is not visible on ${indicator.what}`);
}

/** Presses Tab to the control and then Enter on it. */
export async function pressEnterOn(page: Page, target: Locator): Promise<void> {
  await tabTo(page, target);
  await page.keyboard.press('Enter');
}

/** Tabs to a text field and types into it, key by key. */
export async function typeInto(page: Page, field: Locator, text: string): Promise<void> {
  await tabTo(page, field);
  await page.keyboard.type(text);
}

/** Signs in with the keyboard alone: Tab to each field, type, Enter. */
export async function signInByKeyboard(page: Page, user: DemoUser): Promise<void> {
  await page.goto('/sign-in');
  await typeInto(page, page.getByLabel('E-mail'), user.email);
  await typeInto(page, page.getByLabel('Password', { exact: true }), user.password);
  await page.keyboard.press('Enter');
  await page.getByTestId('signed-in-name').waitFor({ state: 'visible' });
}

/** Signs out with the keyboard alone. */
export async function signOutByKeyboard(page: Page): Promise<void> {
  await pressEnterOn(page, page.getByRole('button', { name: 'Sign out' }));
  await page.waitForURL('**/sign-in');
}
