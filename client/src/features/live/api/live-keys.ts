/** Query keys of the live view. Prefixes are what the live updates write into. */
export const readingsSeriesPrefix = ['readings', 'series'] as const;
export const feedStatusKey = ['readings', 'status'] as const;
export const openAlertsKey = ['alerts', 'open'] as const;
export const alertHistoryKey = ['alerts', 'acknowledged'] as const;
export const latestForecastsPrefix = ['forecasts', 'latest'] as const;
export const committedLoadPrefix = ['live', 'committed'] as const;

// The zones are in the keys so that a changed zone list fetches again; the requests themselves
// ask for every active zone, so a zone switched off or added a moment ago never makes one fail.
export function readingsSeriesKey(zones: readonly string[], from: string, to: string) {
  return [...readingsSeriesPrefix, { zones: zones.join(','), from, to }] as const;
}

export function latestForecastsKey(zones: readonly string[], from: string, to: string) {
  return [...latestForecastsPrefix, { zones: zones.join(','), from, to }] as const;
}

export function committedLoadKey(zones: readonly string[], from: string, to: string) {
  return [...committedLoadPrefix, { zones: zones.join(','), from, to }] as const;
}
