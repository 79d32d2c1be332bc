import { HOUR_MS, type FeedStatusDto, type ReadingSeriesDto, type ZoneDto } from '@morrowline/shared';
import { emptyForecastLine, type ForecastLine } from './forecast-line';
import { systemTotal } from './system-total';

export const SYSTEM = 'SYSTEM';

/** What the chart and the zone card show for one zone, or for the system total. */
export interface LoadView {
  key: string;
  name: string;
  timeZone: string;
  actual: (number | null)[];
  forecast: ForecastLine;
  /** Hours that ended without every zone reporting (system total only). */
  incomplete: boolean[];
  /** Latest hour with a value, and the values there. */
  latestIndex: number | null;
  currentMw: number | null;
  forecastMw: number | null;
  deviationPct: number | null;
  forecastSource: string;
  feed: FeedState;
}

export type FeedState =
  | { kind: 'live'; lastHour: string; lastReceivedAt: string | null }
  | { kind: 'stale'; lastHour: string | null; hoursBehind: number | null; staleZones?: string[] }
  | { kind: 'unknown' };

export function feedState(status: FeedStatusDto | undefined): FeedState {
  if (!status) return { kind: 'unknown' };
  if (status.stale || !status.lastHour) return { kind: 'stale', lastHour: status.lastHour, hoursBehind: status.hoursBehind };
  return { kind: 'live', lastHour: status.lastHour, lastReceivedAt: status.lastReceivedAt };
}

function latestValue(actual: readonly (number | null)[], before: number): number | null {
  for (let i = Math.min(before, actual.length) - 1; i >= 0; i--) if (actual[i] !== null) return i;
  return null;
}

function withCurrent(view: Omit<LoadView, 'latestIndex' | 'currentMw' | 'forecastMw' | 'deviationPct'>, nowIndex: number): LoadView {
  const latestIndex = latestValue(view.actual, nowIndex + 1);
  const currentMw = latestIndex === null ? null : view.actual[latestIndex];
  const forecastMw = latestIndex === null ? null : view.forecast.mean[latestIndex];
  const deviationPct = currentMw !== null && forecastMw !== null && forecastMw > 0 ? ((currentMw - forecastMw) / forecastMw) * 100 : null;
  return { ...view, latestIndex, currentMw, forecastMw, deviationPct };
}

export interface ViewInputs {
  series: ReadingSeriesDto;
  zones: readonly ZoneDto[];
  forecasts: ReadonlyMap<string, { line: ForecastLine; source: string }>;
  status: readonly FeedStatusDto[] | undefined;
  /** Start of the current hour (epoch ms). */
  nowHour: number;
}

/** Index of the current hour in the series (may be past its end). */
export function nowIndexOf(series: ReadingSeriesDto, nowHour: number): number {
  return Math.floor((nowHour - Date.parse(series.from)) / HOUR_MS);
}

export function zoneViews({ series, zones, forecasts, status, nowHour }: ViewInputs): LoadView[] {
  const nowIndex = nowIndexOf(series, nowHour);
  return zones.flatMap((zone) => {
    const readings = series.zones.find((z) => z.zone === zone.code);
    if (!readings) return [];
    const forecast = forecasts.get(zone.code);
    return [
      withCurrent(
        {
          key: zone.code,
          name: zone.name,
          timeZone: zone.timeZone,
          actual: readings.mw,
          forecast: forecast?.line ?? emptyForecastLine(series.hours.length),
          incomplete: new Array<boolean>(series.hours.length).fill(false),
          forecastSource: forecast?.source ?? 'No forecast',
          feed: feedState(status?.find((s) => s.zone === zone.code)),
        },
        nowIndex,
      ),
    ];
  });
}

/**
 * The system total. Actual load is added only where every zone reported (see systemTotal); only
 * hours already over count as incomplete. The total's bands add the zones' bands, which assumes
 * the zones' errors move together: wider than the truth when they partly cancel, never narrower.
 */
export function systemView(views: readonly LoadView[], series: ReadingSeriesDto, nowHour: number): LoadView {
  const length = series.hours.length;
  const nowIndex = nowIndexOf(series, nowHour);
  const actual = systemTotal(views.map((v) => v.actual), length);
  const band = (pick: (f: ForecastLine) => (number | null)[]) => systemTotal(views.map((v) => pick(v.forecast)), length).mw;
  const staleZones = views.filter((v) => v.feed.kind === 'stale');
  const lastHours = views.map((v) => (v.feed.kind === 'live' ? v.feed.lastHour : null));
  const allLive = views.length > 0 && lastHours.every((h) => h !== null);
  const feed: FeedState = staleZones.length > 0 ? { kind: 'stale', lastHour: null, hoursBehind: null, staleZones: staleZones.map((v) => v.name) } : allLive ? { kind: 'live', lastHour: lastHours.sort()[0] as string, lastReceivedAt: null } : { kind: 'unknown' };
  return withCurrent(
    {
      key: SYSTEM,
      name: 'System total',
      timeZone: views[0]?.timeZone ?? 'UTC',
      actual: actual.mw,
      forecast: { mean: band((f) => f.mean), lower80: band((f) => f.lower80), upper80: band((f) => f.upper80), lower95: band((f) => f.lower95), upper95: band((f) => f.upper95) },
      incomplete: actual.incomplete.map((flag, i) => flag && i < nowIndex),
      forecastSource: 'Sum of the zones’ forecasts',
      feed,
    },
    nowIndex,
  );
}

