import { HOUR_MS, type AccuracyComparisonDto, type AccuracyDayDto, type AccuracyDaySourceDto, type AccuracyHourDto, type AccuracyScore, type AccuracyZoneDto, type OperatingDay } from '@morrowline/shared';
import { accuracy } from '@morrowline/engine';

/** A forecast (model run or schedule revision) for one day, aligned with the day's hours. */
export interface DaySource {
  id: number;
  at: number;
  revision: number | null;
  values: (number | null)[];
  /** A replayed model run (ForecastRun.origin), not one the desk issued at the time. */
  replayed?: boolean;
}

export interface ZoneInput {
  code: string;
  name: string;
  timeZone: string;
  days: OperatingDay[];
  /** Per day, aligned with the day's hours; null where there is no usable actual. */
  actual: (number | null)[][];
  model: (DaySource | null)[];
  schedule: (DaySource | null)[];
}

function r3(x: number | null | undefined): number | null {
  if (x === null || x === undefined || !Number.isFinite(x)) return null;
  const r = Math.round(x * 1000) / 1000;
  return r === 0 ? 0 : r;
}

const toNaN = (v: readonly (number | null)[]): number[] => v.map((x) => (x === null ? NaN : x));

const EMPTY: AccuracyScore = { hours: 0, mape: null, mae: null, bias: null, peakErrorMw: null, peakErrorPct: null };

/** Scores a forecast against actuals over hours where both exist (engine metrics). */
function score(actual: number[], forecast: number[], withPeak: boolean): AccuracyScore {
  const a = accuracy(actual, { mean: forecast });
  if (a.n === 0) return EMPTY;
  return { hours: a.n, mape: r3(a.mape), mae: r3(a.mae), bias: r3(a.bias), peakErrorMw: withPeak ? r3(a.peakError) : null, peakErrorPct: withPeak ? r3(a.peakErrorPct) : null };
}

/** Index of the highest actual among hours with a forecast, as the engine picks it. */
function peakIndex(actual: number[], forecast: number[]): number {
  let best = -1;
  for (let i = 0; i < actual.length; i++) {
    if (!Number.isFinite(actual[i]) || !Number.isFinite(forecast[i])) continue;
    if (best < 0 || actual[i] > actual[best]) best = i;
  }
  return best;
}

const mean = (xs: number[]): number | null => (xs.length ? xs.reduce((s, x) => s + x, 0) / xs.length : null);

/** Pools hours of several days; the peak-hour error is the mean of the days' own. */
function pooled(parts: { actual: number[]; forecast: number[]; day: AccuracyScore }[]): AccuracyScore {
  const s = score(
    parts.flatMap((p) => p.actual),
    parts.flatMap((p) => p.forecast),
    false,
  );
  const peaks = parts.map((p) => p.day.peakErrorMw).filter((x): x is number => x !== null);
  const peakPcts = parts.map((p) => p.day.peakErrorPct).filter((x): x is number => x !== null);
  return { ...s, peakErrorMw: r3(mean(peaks)), peakErrorPct: r3(mean(peakPcts)) };
}

function labelNumber(label: string): number {
  return Number(label.slice(2));
}

/** The accuracy of one zone (or the system total) over its operating days. */
export function zoneAccuracy(input: ZoneInput, now: number): AccuracyZoneDto {
  const days: AccuracyDayDto[] = [];
  const parts = { model: [] as { actual: number[]; forecast: number[]; day: AccuracyScore }[], schedule: [] as { actual: number[]; forecast: number[]; day: AccuracyScore }[] };
  const compared: { model: typeof parts.model; schedule: typeof parts.schedule; helped: boolean }[] = [];
  const byHour = new Map<string, { days: number; actual: number[]; model: number[]; schedule: number[] }>();
  let daysWithoutActuals = 0;

  input.days.forEach((day, d) => {
    const actualRow = input.actual[d];
    const actual = toNaN(actualRow);
    const actualHours = actualRow.filter((x) => x !== null).length;
    const state: AccuracyDayDto['actuals'] = actualHours === 0 ? 'none' : actualHours === day.labels.length ? 'complete' : now < day.end ? 'in-progress' : 'gaps';
    const scored = state === 'complete' || state === 'gaps';
    if (!scored) daysWithoutActuals++;

    const sourceDto = (source: DaySource | null, kind: 'model' | 'schedule'): AccuracyDaySourceDto | null => {
      if (!source) return null;
      const out: AccuracyDaySourceDto = { id: source.id, at: new Date(source.at).toISOString(), revision: source.revision, replayed: source.replayed ?? false, score: null, peakHourEnding: null };
      if (!scored) return out;
      const forecast = toNaN(source.values);
      const s = score(actual, forecast, true);
      if (s.hours === 0) return out;
      out.score = s;
      const peak = peakIndex(actual, forecast);
      out.peakHourEnding = peak >= 0 ? day.labels[peak] : null;
      parts[kind].push({ actual, forecast, day: s });
      return out;
    };
    const model = sourceDto(input.model[d], 'model');
    const schedule = sourceDto(input.schedule[d], 'schedule');
    const effect = model?.score?.mape != null && schedule?.score?.mape != null ? r3(schedule.score.mape - model.score.mape) : null;
    if (effect !== null) compared.push({ model: [parts.model[parts.model.length - 1]], schedule: [parts.schedule[parts.schedule.length - 1]], helped: effect < 0 });
    days.push({ operatingDay: day.date, hours: day.labels.length, actualHours, actuals: state, model, schedule, adjustmentEffect: effect });

    if (!scored) return;
    const m = toNaN(input.model[d]?.values ?? day.labels.map(() => null));
    const s = toNaN(input.schedule[d]?.values ?? day.labels.map(() => null));
    day.labels.forEach((label, h) => {
      let bucket = byHour.get(label);
      if (!bucket) byHour.set(label, (bucket = { days: 0, actual: [], model: [], schedule: [] }));
      bucket.days++;
      bucket.actual.push(actual[h]);
      bucket.model.push(m[h]);
      bucket.schedule.push(s[h]);
    });
  });

  const hours: AccuracyHourDto[] = [...byHour.entries()]
    .sort((a, b) => labelNumber(a[0]) - labelNumber(b[0]))
    .map(([hourEnding, b]) => ({ hourEnding, days: b.days, model: score(b.actual, b.model, false), schedule: score(b.actual, b.schedule, false) }));

  const cm = pooled(compared.flatMap((c) => c.model));
  const cs = pooled(compared.flatMap((c) => c.schedule));
  const comparison: AccuracyComparisonDto = {
    days: compared.length,
    modelMape: compared.length ? cm.mape : null,
    scheduleMape: compared.length ? cs.mape : null,
    difference: compared.length && cm.mape !== null && cs.mape !== null ? r3(cs.mape - cm.mape) : null,
    daysHelped: compared.filter((c) => c.helped).length,
  };

  return {
    zone: input.code,
    zoneName: input.name,
    timeZone: input.timeZone,
    days,
    byHour: hours,
    model: pooled(parts.model),
    schedule: pooled(parts.schedule),
    comparison,
    daysScored: parts.model.length,
    daysWithoutActuals,
    daysWithoutForecast: days.filter((d) => d.model === null).length,
    daysWithoutSchedule: days.filter((d) => d.schedule === null).length,
    daysReplayed: days.filter((d) => d.model?.replayed).length,
  };
}

/**
 * The system total: per UTC hour the sum over zones, only where every zone has a value; its days
 * are `days` (the first zone's). A day's source exists when every zone had one for that day.
 */
export function systemInput(zones: readonly ZoneInput[], days: OperatingDay[]): ZoneInput {
  const maps = zones.map((z) => {
    const byHour = new Map<number, { a: number | null; m: number | null; s: number | null; md: DaySource | null; sd: DaySource | null }>();
    z.days.forEach((day, d) =>
      day.labels.forEach((_, h) => byHour.set(day.start + h * HOUR_MS, { a: z.actual[d][h], m: z.model[d]?.values[h] ?? null, s: z.schedule[d]?.values[h] ?? null, md: z.model[d], sd: z.schedule[d] })),
    );
    return byHour;
  });
  const sum = (t: number, key: 'a' | 'm' | 's'): number | null => {
    let total = 0;
    for (const map of maps) {
      const v = map.get(t)?.[key];
      if (v === null || v === undefined) return null;
      total += v;
    }
    return maps.length ? total : null;
  };
  const source = (day: OperatingDay, key: 'md' | 'sd', value: 'm' | 's'): DaySource | null => {
    const hours = day.labels.map((_, h) => day.start + h * HOUR_MS);
    const all = hours.map((t) => maps.map((map) => map.get(t)?.[key] ?? null));
    if (maps.length === 0 || all.some((row) => row.some((x) => x === null))) return null;
    const at = Math.max(...all.flat().map((x) => x!.at));
    // the total is a replay as soon as one zone's part of it is
    return { id: 0, at, revision: null, values: hours.map((t) => sum(t, value)), replayed: all.flat().some((x) => x!.replayed === true) };
  };
  return {
    code: 'SYSTEM',
    name: 'System total',
    timeZone: zones[0]?.timeZone ?? 'UTC',
    days,
    actual: days.map((day) => day.labels.map((_, h) => sum(day.start + h * HOUR_MS, 'a'))),
    model: days.map((day) => source(day, 'md', 'm')),
    schedule: days.map((day) => source(day, 'sd', 's')),
  };
}
