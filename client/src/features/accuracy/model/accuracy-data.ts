import type { AccuracyDayDto, AccuracyHourDto, AccuracyScore, AccuracyZoneDto } from '@morrowline/shared';
import { ACCURACY_MAX_DAYS, formatHourEnding } from '@morrowline/shared';
import { DateTime } from 'luxon';

export type Range = [string | null, string | null];

/** The last 14 complete operating days before today, in a zone's time zone. */
export function defaultRange(timeZone: string, now: DateTime = DateTime.now()): [string, string] {
  const today = now.setZone(timeZone).startOf('day');
  return [today.minus({ days: 14 }).toISODate()!, today.minus({ days: 1 }).toISODate()!];
}

/** Why a range cannot be asked for, in words; null when it can. */
export function rangeProblem([from, to]: Range): string | null {
  if (!from || !to) return 'Choose the first and last operating day.';
  const days = DateTime.fromISO(to).diff(DateTime.fromISO(from), 'days').days + 1;
  if (days < 1) return 'The first day must not be after the last.';
  if (days > ACCURACY_MAX_DAYS) return `Choose at most ${ACCURACY_MAX_DAYS} days (this range has ${Math.round(days)}).`;
  return null;
}

/** Per-day chart: x = day index, then model MAPE and schedule MAPE (null where not scored). */
export function dailyMapeData(days: readonly AccuracyDayDto[]): [number[], (number | null)[], (number | null)[]] {
  return [days.map((_, i) => i), days.map((d) => d.model?.score?.mape ?? null), days.map((d) => d.schedule?.score?.mape ?? null)];
}

/** Whether chart data has anything to draw besides its x values. */
export function hasValues(data: readonly (readonly (number | null)[])[]): boolean {
  return data.slice(1).some((values) => values.some((v) => v !== null && Number.isFinite(v)));
}

export type HourMetric = 'mae' | 'bias';

/**
 * Per-hour-of-day chart over HE01..HE24 (x = 1..24), model then schedule; HE25 is left out of the
 * chart and answered separately (it exists only on the autumn day).
 */
export function hourlyData(hours: readonly AccuracyHourDto[], metric: HourMetric): { data: [number[], (number | null)[], (number | null)[]]; he25: AccuracyHourDto | null } {
  const byLabel = new Map(hours.map((h) => [h.hourEnding, h]));
  const xs = Array.from({ length: 24 }, (_, i) => i + 1);
  return {
    data: [xs, xs.map((n) => byLabel.get(formatHourEnding(n))?.model[metric] ?? null), xs.map((n) => byLabel.get(formatHourEnding(n))?.schedule[metric] ?? null)],
    he25: byLabel.get('HE25') ?? null,
  };
}

/** What a day's row says when it has no score. */
export function dayStatus(day: AccuracyDayDto): string {
  if (day.actuals === 'none') return 'no actuals';
  if (day.actuals === 'in-progress') return 'day still running';
  const parts: string[] = [];
  if (!day.model) parts.push('no model forecast');
  if (!day.schedule) parts.push('no published schedule');
  if (day.actuals === 'gaps') parts.push(`${day.hours - day.actualHours} of ${day.hours} hours missing`);
  if (day.hours !== 24) parts.push(`${day.hours}-hour day`);
  return parts.length ? parts.join(' · ') : 'scored';
}

/** Says how many days are scored against replayed forecasts, and what a replay is. */
export function replayedNote(replayed: number, days: number): string {
  const which = replayed === days ? `All ${days} days` : `${replayed} of the ${days} days`;
  return `${which} are scored against replayed model forecasts (marked “replayed”): worked out when this installation first started, as the desk would have issued each before its gate closure from the readings it had then. They are not forecasts the desk issued at the time.`;
}

/** "+12.3 MW" / "−4.0 MW": signed, for bias and peak error. */
export function signedMw(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const rounded = Math.round(value * 10) / 10;
  if (rounded === 0) return '0.0 MW';
  return `${rounded > 0 ? '+' : '−'}${Math.abs(rounded).toFixed(1)} MW`;
}

export function signedPct(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const rounded = Math.round(value * 10) / 10;
  if (rounded === 0) return '0.0 %';
  return `${rounded > 0 ? '+' : '−'}${Math.abs(rounded).toFixed(1)} %`;
}

/** Bias in words: positive is over-forecast. */
export function biasWords(bias: number | null | undefined): string {
  if (bias === null || bias === undefined || !Number.isFinite(bias)) return '';
  if (Math.abs(bias) < 0.05) return 'no lean either way';
  return bias > 0 ? 'over-forecast' : 'under-forecast';
}

export interface SummaryRow {
  label: string;
  model: string;
  schedule: string;
}

const pct = (v: number | null) => (v === null ? '—' : `${v.toFixed(2)} %`);
const mw = (v: number | null) => (v === null ? '—' : `${v.toFixed(1)} MW`);

/** The summary's rows, model against schedule. */
export function summaryRows(model: AccuracyScore, schedule: AccuracyScore): SummaryRow[] {
  return [
    { label: 'MAPE', model: pct(model.mape), schedule: pct(schedule.mape) },
    { label: 'MAE', model: mw(model.mae), schedule: mw(schedule.mae) },
    { label: 'Bias (forecast − actual)', model: withWords(model.bias), schedule: withWords(schedule.bias) },
    { label: 'Peak-hour error, mean of days', model: peak(model), schedule: peak(schedule) },
    { label: 'Hours scored', model: String(model.hours), schedule: String(schedule.hours) },
  ];
}

function withWords(bias: number | null): string {
  const w = biasWords(bias);
  return bias === null ? '—' : `${signedMw(bias)}${w ? ` (${w})` : ''}`;
}

function peak(s: AccuracyScore): string {
  return s.peakErrorMw === null ? '—' : `${signedMw(s.peakErrorMw)} (${signedPct(s.peakErrorPct)})`;
}

/** The zones and the system total, in the order the chart picker offers them. */
export function chartChoices(zones: readonly AccuracyZoneDto[], system: AccuracyZoneDto | undefined): { value: string; label: string }[] {
  return [...(system && zones.length > 1 ? [{ value: system.zone, label: 'System total' }] : []), ...zones.map((z) => ({ value: z.zone, label: `${z.zoneName} (${z.zone})` }))];
}
