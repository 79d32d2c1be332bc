import { HOUR_MS, type ForecastDiffHourDto } from '@morrowline/shared';

export interface RunHours {
  firstHour: number;
  mean: readonly number[];
}

/**
 * Two runs of a zone side by side over [from, to) (default: every hour either run reaches), the
 * change rounded to 0.1 MW as the schedule keeps it, and the hour that moved most.
 */
export function diffRuns(a: RunHours, b: RunHours, from?: number, to?: number): { hours: ForecastDiffHourDto[]; largestChangeMw: number | null; largestChangeHour: string | null } {
  const start = from ?? Math.min(a.firstHour, b.firstHour);
  const end = to ?? Math.max(a.firstHour + a.mean.length * HOUR_MS, b.firstHour + b.mean.length * HOUR_MS);
  const at = (r: RunHours, t: number) => {
    const k = (t - r.firstHour) / HOUR_MS;
    return k >= 0 && k < r.mean.length && Number.isFinite(r.mean[k]) ? Math.round(r.mean[k] * 10) / 10 : null;
  };
  const hours: ForecastDiffHourDto[] = [];
  let largest: ForecastDiffHourDto | null = null;
  for (let t = start; t < end; t += HOUR_MS) {
    const fromMw = at(a, t);
    const toMw = at(b, t);
    const changeMw = fromMw !== null && toMw !== null ? Math.round((toMw - fromMw) * 10) / 10 : null;
    const row = { hour: new Date(t).toISOString(), fromMw, toMw, changeMw };
    hours.push(row);
    if (changeMw !== null && (largest === null || Math.abs(changeMw) > Math.abs(largest.changeMw as number))) largest = row;
  }
  return { hours, largestChangeMw: largest?.changeMw ?? null, largestChangeHour: largest?.hour ?? null };
}
