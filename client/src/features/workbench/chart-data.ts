import type { AlignedData } from 'uplot';

/** UTC ISO hour starts → uPlot's x values (seconds). */
export function toSeconds(times: readonly string[]): number[] {
  return times.map((t) => Date.parse(t) / 1000);
}

/** A time axis and series for uPlot; null stays null (a gap in the line). */
export function timeSeriesData(times: readonly string[], ...series: (readonly (number | null)[])[]): AlignedData {
  return [toSeconds(times), ...series.map((s) => s.map((v) => (v === null || !Number.isFinite(v) ? null : v)))] as AlignedData;
}

/**
 * A correlogram for a bar chart: lags 1..n on x, the values, and the ±band lines drawn
 * across the whole range.
 */
export function correlogramData(values: readonly (number | null)[], band: number): AlignedData {
  const lags = values.map((_, i) => i + 1);
  return [lags, values.map((v) => v ?? null), lags.map(() => band), lags.map(() => -band)] as AlignedData;
}

/** Lags whose value lies outside the band, largest first (what an operator should look at). */
export function lagsOutsideBand(values: readonly (number | null)[], band: number, limit = 5): { lag: number; value: number }[] {
  return values
    .map((v, i) => ({ lag: i + 1, value: v ?? 0 }))
    .filter((x) => Math.abs(x.value) > band)
    .sort((a, b) => Math.abs(b.value) - Math.abs(a.value))
    .slice(0, limit);
}

/** Per-day MAPE of model and baseline on a day index axis (labels from the dates). */
export function dailyMapeData(days: readonly { date: string; mape: number | null; baselineMape: number | null }[]): AlignedData {
  return [days.map((_, i) => i), days.map((d) => d.mape), days.map((d) => d.baselineMape)] as AlignedData;
}

/** Format a number for the monospace columns; "—" for missing. */
export function fmtNum(v: number | null | undefined, digits = 2): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  const text = v.toFixed(digits);
  // −0.00 reads as a sign that means nothing
  return /^-0\.?0*$/.test(text) ? text.slice(1) : text;
}

/** y range of a correlogram: wide enough for the largest bar and the band, at least ±0.2, at most ±1. */
export function correlogramRange(values: readonly (number | null)[], band: number): [number, number] {
  const top = Math.max(band, ...values.map((v) => Math.abs(v ?? 0)));
  const r = Math.min(1, Math.max(0.2, Math.ceil(top * 1.15 * 10) / 10));
  return [-r, r];
}

export function fmtP(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  return v < 0.001 ? '< 0.001' : v.toFixed(3);
}
