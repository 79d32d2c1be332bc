import { Badge } from '@mantine/core';
import type { ZoneWeatherState } from '../../weather';

/** The zone's weather feed, flagged like a stale meter feed when a station's observations or forecasts stop. */
export function WeatherFeedBadge({ state }: { state: ZoneWeatherState }) {
  if (state.noStations) return <Badge color="slate" data-testid="weather-feed-state">No weather station</Badge>;
  if (state.stale.length === 0) return <Badge color="tide" data-testid="weather-feed-state">Weather up to date</Badge>;
  const what = state.stale.map((s) => `${s.station}: ${[s.observed ? 'observations' : '', s.forecast ? 'forecasts' : ''].filter(Boolean).join(' and ')} stopped`).join('; ');
  return (
    <Badge color="ember" variant="filled" data-testid="weather-feed-state" title={what}>
      Weather feed stale
    </Badge>
  );
}
