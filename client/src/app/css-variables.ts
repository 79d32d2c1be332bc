import type { CSSVariablesResolver } from '@mantine/core';

/**
 * The page behind the panels (--morrowline-page): a faint blue-grey by day so white panels
 * stand out, and the deepest night shade after dark so a wall of screens does not glow. Panels
 * keep Mantine's body colour, one step lighter at night.
 */
export const cssVariablesResolver: CSSVariablesResolver = () => ({
  variables: {},
  light: {
    '--morrowline-page': 'var(--mantine-color-slate-0)',
  },
  dark: {
    '--morrowline-page': 'var(--mantine-color-dark-8)',
  },
});
