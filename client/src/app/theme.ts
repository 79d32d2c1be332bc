import { createTheme, type MantineColorsTuple } from '@mantine/core';

/**
 * Morrowline's palette. "tide" is the working colour (calm blue-green that keeps its contrast on
 * both a bright day screen and a dimmed night desk); "ember" is kept for things needing a look
 * (alerts, deadlines); "dusk" and "slate" tell roles and states apart; "night" replaces the dark
 * greys with a deep blue that is easier on the eyes over a long night shift.
 */
const tide: MantineColorsTuple = [
  '#e6f5f6', '#cde8eb', '#9fd1d7', '#6db9c2', '#45a5b0',
  '#2d98a4', '#1d8c99', '#0f7683', '#046874', '#005a65',
];

// The darker half is pulled down so white on the filled shade (8) and shade 8 as text on the
// light panels keep WCAG 2.1 AA contrast (4.5:1); the night scheme writes ember text in shade 4.
const ember: MantineColorsTuple = [
  '#fff3e4', '#fde5cc', '#f8c998', '#f3ab61', '#ef9235',
  '#ec8219', '#d16700', '#ba5b00', '#a24d00', '#8a4100',
];

const dusk: MantineColorsTuple = [
  '#f0f0fb', '#dedef0', '#b9b9e0', '#9292cf', '#7171c1',
  '#5c5cb8', '#5151b5', '#42429f', '#3a3a8f', '#2f2f80',
];

const slate: MantineColorsTuple = [
  '#f1f4f8', '#e3e7ed', '#c3ccd8', '#a1b0c3', '#8498b1',
  '#7189a7', '#6682a3', '#55708e', '#4a6380', '#3c5672',
];

const night: MantineColorsTuple = [
  '#d3d9e3', '#b4bdcb', '#8c98ab', '#64718a', '#434f66',
  '#2f394d', '#232b3c', '#1a2130', '#131926', '#0d121c',
];

/** Names of the pagination arrows, which show a chevron only. */
const PAGINATION_CONTROL_LABELS: Record<string, string> = {
  first: 'First page',
  previous: 'Previous page',
  next: 'Next page',
  last: 'Last page',
};

/**
 * Names of the calendar's arrow buttons (@mantine/dates leaves them unnamed). The month and year
 * buttons keep their visible text as their name ("November 2026"), as WCAG 2.5.3 asks.
 */
const CALENDAR_LABELS = {
  nextMonth: 'Next month',
  previousMonth: 'Previous month',
  nextYear: 'Next year',
  previousYear: 'Previous year',
  nextDecade: 'Next decade',
  previousDecade: 'Previous decade',
};

export const theme = createTheme({
  colors: { tide, ember, dusk, slate, dark: night },
  primaryColor: 'tide',
  // Shade 8 in both schemes: white labels on filled buttons and badges of every palette colour
  // read at 4.5:1 or more (WCAG 2.1 AA for normal text), measured by the accessibility scan.
  primaryShade: { light: 8, dark: 8 },
  white: '#fbfcfd',
  black: '#141a24',
  fontFamily: 'Inter, system-ui, -apple-system, "Segoe UI", Roboto, sans-serif',
  fontFamilyMonospace: '"JetBrains Mono", ui-monospace, SFMono-Regular, Menlo, monospace',
  headings: { fontFamily: 'Inter, system-ui, sans-serif', fontWeight: '600' },
  defaultRadius: 'sm',
  cursorType: 'pointer',
  components: {
    // The library's close buttons are an icon alone: a screen reader would announce "button".
    Modal: { defaultProps: { closeButtonProps: { 'aria-label': 'Close the dialog' } } },
    Drawer: { defaultProps: { closeButtonProps: { 'aria-label': 'Close the panel' } } },
    Notification: { defaultProps: { closeButtonProps: { 'aria-label': 'Close the message' } } },
    Alert: { defaultProps: { closeButtonLabel: 'Close the message' } },
    InputClearButton: { defaultProps: { 'aria-label': 'Clear the field' } },
    FileInput: { defaultProps: { clearButtonProps: { 'aria-label': 'Clear the chosen file' } } },
    // Days of the next and last month are left out of a month's grid: the library draws them too
    // faint to read (2:1), and a range is picked within the month shown.
    DatePickerInput: { defaultProps: { ariaLabels: CALENDAR_LABELS, hideOutsideDates: true } },
    Pagination: { defaultProps: { getControlProps: (control: string) => ({ 'aria-label': PAGINATION_CONTROL_LABELS[control] ?? control }) } },
    Table: { defaultProps: { verticalSpacing: 'xs', highlightOnHover: true } },
    // A badge is a status word: it keeps its full width in a narrow table cell instead of being
    // cut to "RUN…" (the library's default clips the label with an ellipsis).
    Badge: { defaultProps: { variant: 'light', radius: 'sm' }, styles: { root: { flexShrink: 0, minWidth: 'max-content', overflow: 'visible' }, label: { overflow: 'visible', textOverflow: 'clip' } } },
  },
});
