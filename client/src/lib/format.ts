import { formatLocalTime } from '@morrowline/shared';

/**
 * "2026-03-08 14:05 MDT": the desk's one clock rule (shared/src/clock.ts) in the zone given, a load
 * zone's or the desk's (useDeskTimeZone). Until the desk's zone is known the browser's own zone
 * stands in, still with its abbreviation, so no time is ever shown without saying which clock.
 */
export function formatDateTime(iso: string | null | undefined, timeZone?: string): string {
  return formatLocalTime(iso, timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone);
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

/** A deviation in percent with its sign, e.g. "+7.1 %" or "-3.8 %"; "—" when there is none. */
export function formatSignedPercent(value: number | null | undefined, fractionDigits = 1): string {
  const text = formatPercent(value, fractionDigits);
  return value != null && value > 0 ? `+${text}` : text;
}

/**
 * A model's orders as the desk writes them everywhere: "ARMA(2,1)", with its seasonal block
 * "ARMA(2,1)×(1,1)_24" (the block's period in hours, 24 when the row does not say).
 */
export function formatArmaOrders(p: number, q: number, seasonal?: { P: number; Q: number; period?: number } | null): string {
  return `ARMA(${p},${q})${seasonal ? `×(${seasonal.P},${seasonal.Q})_${seasonal.period ?? 24}` : ''}`;
}
