import { hourEndingLabel } from '@morrowline/shared';
import { DateTime } from 'luxon';
import type { LoadView } from '../model/zone-view';

export const LOAD_CHART_COLUMNS = ['Hour ending', 'Actual, MW', 'Committed, MW', 'Committed from', 'Latest run, MW', 'Latest run 80 % band, MW'] as const;

const mw = (value: number | null | undefined) => (value === null || value === undefined ? '—' : value.toFixed(1));

/**
 * The live chart as rows of text, one per hour shown that has anything drawn: the hour ending in
 * the zone's time, the actual load, what was committed and where from, the latest run and its
 * 80 % band.
 */
export function loadChartRows(view: LoadView, hours: readonly string[], first: number): string[][] {
  const rows: string[][] = [];
  for (let i = first; i < hours.length; i++) {
    const committed = view.committed.committed[i] ?? null;
    const values = [view.actual[i], committed, view.latestRun.mean[i]];
    if (values.every((v) => v === null || v === undefined)) continue;
    const day = DateTime.fromISO(hours[i], { zone: view.timeZone }).toFormat('yyyy-LL-dd');
    const basis = view.committed.basis[i];
    const lower = view.latestRun.lower80[i];
    const upper = view.latestRun.upper80[i];
    rows.push([
      `${day} ${hourEndingLabel(hours[i], view.timeZone)}`,
      mw(view.actual[i]),
      mw(committed),
      committed === null ? '—' : basis === 'schedule' ? 'published schedule' : basis === 'day-ahead' ? 'day-ahead forecast' : 'schedule or day-ahead, by zone',
      mw(view.latestRun.mean[i]),
      lower === null || upper === null || lower === undefined || upper === undefined ? '—' : `${mw(lower)} – ${mw(upper)}`,
    ]);
  }
  return rows;
}
