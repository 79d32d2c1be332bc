import type { CSSVariablesResolver } from '@mantine/core';

/**
 * Secondary ("dimmed") text and placeholders are a step darker by day and lighter at night than
 * the library's greys, so they keep 4.5:1 against the page, the panels and a hovered row (WCAG
 * 2.1 AA, 1.4.3): slate 8 by day, night 1 after dark.
 *
 * The page behind the panels (--morrowline-page): a faint blue-grey by day so white panels
 * stand out, and the deepest night shade after dark so a wall of screens does not glow. Panels
 * keep Mantine's body colour, one step lighter at night.
 */
export const cssVariablesResolver: CSSVariablesResolver = () => ({
  variables: {},
  light: {
    '--morrowline-page': 'var(--mantine-color-slate-0)',
    '--mantine-color-dimmed': 'var(--mantine-color-slate-8)',
    '--mantine-color-placeholder': 'var(--mantine-color-slate-7)',
  },
  dark: {
    '--morrowline-page': 'var(--mantine-color-dark-8)',
    '--mantine-color-dimmed': 'var(--mantine-color-dark-1)',
    '--mantine-color-placeholder': 'var(--mantine-color-dark-2)',
  },
});
