interface MorrowlineMarkProps {
  size?: number;
  title?: string;
}

/**
 * Our mark: a horizon line with tomorrow's load curve rising over it to a lit point, the
 * forecast hour. Drawn in theme variables so it follows the colour scheme.
 */
export function MorrowlineMark({ size = 32, title = 'Morrowline' }: MorrowlineMarkProps) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" role="img" aria-label={title}>
      <rect width="32" height="32" rx="7" fill="var(--mantine-color-tide-7)" />
      <path d="M5 21.5h22" stroke="var(--mantine-color-tide-1)" strokeWidth="1.6" strokeLinecap="round" opacity="0.7" />
      <path
        d="M5 24c3.2 0 4.4-5.5 7.6-5.5S16.4 22 19.4 19 22.8 9.6 26 8.5"
        fill="none"
        stroke="#fff"
        strokeWidth="2.4"
        strokeLinecap="round"
        strokeLinejoin="round"
      />
      <circle cx="26" cy="8.5" r="2.3" fill="var(--mantine-color-ember-3)" />
    </svg>
  );
}
