import type { AlertDto } from '@morrowline/shared';

/** The open list with an alert raised or widened: replaced in place, or added, newest first. */
export function withAlert(list: readonly AlertDto[], alert: AlertDto): AlertDto[] {
  if (alert.state !== 'open') return withoutAlert(list, alert.id);
  const rest = list.filter((a) => a.id !== alert.id);
  return [alert, ...rest].sort((a, b) => Date.parse(b.start) - Date.parse(a.start) || b.id - a.id);
}

export function withoutAlert(list: readonly AlertDto[], id: number): AlertDto[] {
  return list.filter((a) => a.id !== id);
}
