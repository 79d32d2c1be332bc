/** Query keys of the live view. Prefixes are what the live updates write into. */
export const readingsSeriesPrefix = ['readings', 'series'] as const;
export const feedStatusKey = ['readings', 'status'] as const;
export const openAlertsKey = ['alerts', 'open'] as const;
export const latestForecastsPrefix = ['forecasts', 'latest'] as const;

export function readingsSeriesKey(zones: readonly string[], from: string, to: string) {
  return [...readingsSeriesPrefix, { zones: zones.join(','), from, to }] as const;
}

export function latestForecastsKey(zones: readonly string[], from: string, to: string) {
  return [...latestForecastsPrefix, { zones: zones.join(','), from, to }] as const;
}
