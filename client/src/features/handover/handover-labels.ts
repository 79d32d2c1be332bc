import type { HandoverItemKind, HandoverItemStatus } from '@morrowline/shared';

/** How each structured item is named on screen. */
export const ITEM_KIND_LABELS: Record<HandoverItemKind, string> = {
  'open-issue': 'Open issue',
  'outage-in-progress': 'Outage in progress',
  'refit-pending': 'Refit pending',
  'schedule-not-published': 'Schedule not yet published',
  other: 'Other',
};

export const ITEM_STATUS_LABELS: Record<HandoverItemStatus, string> = {
  open: 'Still open',
  closed: 'Closed',
};

/** Open items take the colour kept for things needing a look. */
export const ITEM_STATUS_COLORS: Record<HandoverItemStatus, string> = {
  open: 'ember',
  closed: 'slate',
};
