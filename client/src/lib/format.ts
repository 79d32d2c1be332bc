import { DateTime } from 'luxon';

/** "2026-03-08 14:05" in the viewer's own zone, or in a zone given (operating days follow zones). */
export function formatDateTime(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return '—';
  const value = DateTime.fromISO(iso, { zone: timeZone ?? 'local' });
  return value.isValid ? value.toFormat('yyyy-LL-dd HH:mm') : '—';
}

const mwFormat = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });

/** Load in MW with one decimal, e.g. "243.7 MW". Shown in the monospace face so columns line up. */
export function formatMw(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${mwFormat.format(value)} MW`;
}

export function formatPercent(value: number | null | undefined, fractionDigits = 1): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${value.toFixed(fractionDigits)} %`;
}
