import type { ModelVersionDto, ModelWeatherDto } from '@morrowline/shared';

/** What a version did with the weather, in one line for the desk. */
export function weatherVerdict(w: ModelWeatherDto | null): string {
  // null also for versions made before the weather terms came in and for hourly updates of them,
  // so the words do not claim the zone lacks temperature.
  if (!w) return 'Fitted without weather terms: the refit that made it did not try them (a version from before they came in, an hourly update of one, or too little observed temperature). A refit of the zone tries them.';
  if (w.used) return `Forecasts with the weather: ${w.description}.`;
  return 'Weather and calendar terms were tried and did not beat the model without them on the backtest; this version forecasts without them.';
}

export interface WeatherCandidateRow {
  label: string;
  candidate: string;
  inService: string;
  /** which side chose this term set */
  chosenBy: Array<'candidate' | 'in-service'>;
}

const fmt = (v: number | null | undefined): string => (v === null || v === undefined ? '—' : `${v.toFixed(2)} %`);

/** The term sets each version's refit tried, side by side: backtest MAPE on forecast weather, with and without weather. */
export function weatherCandidateRows(candidate: ModelVersionDto, inService: ModelVersionDto | null): WeatherCandidateRow[] {
  const labels: string[] = [];
  for (const v of [candidate, inService]) for (const c of v?.weather?.candidates ?? []) if (!labels.includes(c.label)) labels.push(c.label);
  const chosen = (v: ModelVersionDto | null, label: string): boolean => {
    const w = v?.weather;
    if (!w) return false;
    // the description is "<error model> + <terms>"; a shorter label ("calendar") must not match a longer set's tail
    return w.used ? w.description.endsWith(` + ${label}`) : label === 'no weather or calendar terms';
  };
  return labels.map((label) => ({
    label,
    candidate: fmt(candidate.weather?.candidates.find((c) => c.label === label)?.mape),
    inService: fmt(inService?.weather?.candidates.find((c) => c.label === label)?.mape),
    chosenBy: [...(chosen(candidate, label) ? ['candidate' as const] : []), ...(chosen(inService, label) ? ['in-service' as const] : [])],
  }));
}
