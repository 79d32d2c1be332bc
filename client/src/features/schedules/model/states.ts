import type { ScheduleState } from '@morrowline/shared';

/** How each state reads on the screen, and its badge colour from our palette. */
export const STATE_LABELS: Record<ScheduleState, string> = {
  draft: 'Draft',
  submitted: 'Submitted, waiting for approval',
  returned: 'Returned for changes',
  published: 'Published',
  superseded: 'Superseded by a later revision',
};

export const STATE_COLORS: Record<ScheduleState, string> = {
  draft: 'slate',
  submitted: 'dusk',
  returned: 'ember',
  published: 'tide',
  superseded: 'gray',
};

