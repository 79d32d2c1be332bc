import { committedBasisLabel, type AlertDto } from '@morrowline/shared';
import { formatMw } from '../../../lib/format';

/** "day-ahead forecast 100.0 MW at the peak": what an alert's peak hour was measured against. */
export function alertComparedWith(alert: AlertDto): string {
  if (alert.comparedWith === null) return 'not recorded';
  return `${committedBasisLabel(alert.comparedWith)} ${formatMw(alert.committedMw)}`;
}
