import type { WeatherStatusDto, ZoneWeatherSeriesDto } from '@morrowline/shared';

/** A zone's temperatures on another series' hours (the load chart's), null where the weather has none. */
export function alignedTemperatures(weather: ZoneWeatherSeriesDto | undefined, zone: string, hours: readonly string[]): { observedC: (number | null)[]; forecastC: (number | null)[]; issuedAt: (string | null)[] } {
  const own = weather?.zones.find((z) => z.zone === zone);
  const index = new Map((weather?.hours ?? []).map((h, i) => [Date.parse(h), i]));
  const pick = <T>(values: readonly (T | null)[] | undefined) =>
    hours.map((h) => {
      const i = index.get(Date.parse(h));
      return i === undefined || !values ? null : values[i] ?? null;
    });
  return { observedC: pick(own?.observedC), forecastC: pick(own?.forecastC), issuedAt: pick(own?.forecastIssuedAt) };
}

export interface ZoneWeatherState {
  /** Stations of the zone whose observations or forecasts have stopped, and what stopped. */
  stale: { station: string; observed: boolean; forecast: boolean }[];
  /** The zone has no station at all. */
  noStations: boolean;
}

/** Whether a zone's weather is keeping up: stale when any of its stations has gone quiet. */
export function zoneWeatherState(status: readonly WeatherStatusDto[] | undefined, zone: string): ZoneWeatherState {
  const own = (status ?? []).filter((s) => s.zones.includes(zone));
  return {
    stale: own.filter((s) => s.observedStale || s.forecastStale).map((s) => ({ station: s.station, observed: s.observedStale, forecast: s.forecastStale })),
    noStations: status !== undefined && own.length === 0,
  };
}

/** °C with one decimal, or a dash. */
export function formatTemperature(tempC: number | null | undefined): string {
  if (tempC === null || tempC === undefined) return '—';
  const rounded = Math.round(tempC * 10) / 10;
  return `${(rounded === 0 ? 0 : rounded).toFixed(1)} °C`;
}

/** Each zone's latest observed temperature in the series (null for a zone with none). */
export function latestObserved(weather: ZoneWeatherSeriesDto | undefined): Map<string, number | null> {
  const out = new Map<string, number | null>();
  for (const z of weather?.zones ?? []) {
    let last: number | null = null;
    for (const v of z.observedC) if (v !== null) last = v;
    out.set(z.zone, last);
  }
  return out;
}
