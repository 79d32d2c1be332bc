import type { CSSVariablesResolver } from '@mantine/core';

/**
 * The page behind the panels: a faint blue-grey by day so white cards stand out, and the
 * deepest night shade after dark so a wall of screens does not glow.
 */
export const cssVariablesResolver: CSSVariablesResolver = () => ({
  variables: {},
  light: {
    '--mantine-color-body': 'var(--mantine-color-slate-0)',
  },
  dark: {
    '--mantine-color-body': 'var(--mantine-color-dark-8)',
  },
});
