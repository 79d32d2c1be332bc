import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { AxeResults, Result } from 'axe-core';
import type { BrowserContext, Locator, Page } from 'playwright-core';

/**
 * The accessibility scan of the browser tests: axe-core's own engine, injected into the page the
 * test already has open, run with the rules of WCAG 2.0 and 2.1 at levels A and AA (axe-core's
 * tags wcag2a, wcag2aa, wcag21a, wcag21aa; the rule list is axe-core's published one for 4.14).
 */
export const WCAG_21_AA_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] as const;

export type ColorScheme = 'light' | 'dark';

/** The key the desk's colour scheme manager keeps the choice under (client/src/app/providers.tsx). */
const COLOR_SCHEME_KEY = 'morrowline.color-scheme';

const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

/** Every page the context opens from now on starts in `scheme`, as if the user had chosen it. */
export async function chooseColorScheme(context: BrowserContext, scheme: ColorScheme): Promise<void> {
  await context.addInitScript(
    ([key, value]) => {
      window.localStorage.setItem(key, value);
    },
    [COLOR_SCHEME_KEY, scheme] as const,
  );
}

/** Waits until no CSS transition or animation is running, so colours are read at their end state. */
export async function settle(page: Page): Promise<void> {
  await page.waitForFunction(() => document.getAnimations().every((animation) => animation.playState !== 'running'));
}

/**
 * The WCAG 2.1 A/AA violations on the page as it is now (or inside `within`), written out one
 * per line: rule, impact, then each element's selector and the start of its HTML.
 */
export async function accessibilityViolations(page: Page, within?: Locator): Promise<string[]> {
  await settle(page);
  // Evaluated through the browser's debugging protocol: the desk's Content-Security-Policy
  // (script-src 'self') rightly refuses an inline script tag.
  if (!(await page.evaluate(() => 'axe' in window))) await page.evaluate(axeSource);
  const selector = within ? await uniqueSelector(within) : null;
  const results = await page.evaluate(
    async ({ tags, selector }) => {
      const axe = (window as unknown as { axe: typeof import('axe-core') }).axe;
      return (await axe.run(selector ? { include: [selector] } : document, {
        runOnly: { type: 'tag', values: tags },
        resultTypes: ['violations'],
      })) as AxeResults;
    },
    { tags: [...WCAG_21_AA_TAGS], selector },
  );
  return results.violations.flatMap(describeViolation);
}

/** Fails with every violation listed when the page (or the part `within`) has any. */
export async function expectNoViolations(page: Page, where: string, within?: Locator): Promise<void> {
  const violations = await accessibilityViolations(page, within);
  if (violations.length > 0) {
    throw new Error(`${violations.length} accessibility violation(s) on ${where}:\n${violations.join('\n')}`);
  }
}

function describeViolation(violation: Result): string[] {
  return violation.nodes.map((node) => {
    const html = node.html.replace(/\s+/g, ' ').slice(0, 160);
    const detail = (node.any[0] ?? node.all[0] ?? node.none[0])?.message ?? '';
    return `  ${violation.id} (${violation.impact ?? 'unrated'}) at ${node.target.join(' ')}: ${html}${detail ? ` — ${detail}` : ''}`;
  });
}

/** A CSS selector for the element `locator` points at, marked with an attribute of its own. */
async function uniqueSelector(locator: Locator): Promise<string> {
  const mark = `a11y-${Math.random().toString(36).slice(2)}`;
  await locator.evaluate((element, value) => element.setAttribute('data-a11y-scan', value), mark);
  return `[data-a11y-scan="${mark}"]`;
}
