/**
 * Text colours that carry a meaning, as CSS variables that change with the colour scheme, so
 * each keeps 4.5:1 against the desk's panels by day and by night (WCAG 2.1 AA, 1.4.3). A fixed
 * palette shade (ember 7 or 8) reads by day but sinks into the night scheme's dark blue.
 *
 * None of them carries the meaning alone: the text beside it says it in words or with a sign.
 */
/** Something needing a look: a deviation beyond the zone's threshold, a failure, a warning. */
export const ATTENTION_TEXT = 'var(--mantine-color-ember-text)';
/** Better than what it is compared with (e.g. a smaller error than the model's). */
export const BETTER_TEXT = 'var(--mantine-color-teal-text)';
