import { HOUR_MS, type FeedStatusDto, type ReadingSeriesDto, type ZoneDto } from '@morrowline/shared';
import { emptyCommittedLine, systemCommitted, type CommittedLine, type LineBasis } from './committed-line';
import { emptyForecastLine, type ForecastLine } from './forecast-line';
import { systemTotal } from './system-total';

export const SYSTEM = 'SYSTEM';

/**
 * A zone without a reading in this many hours up to now is left out of the system total: marking
 * every hour since it fell silent as incomplete would blank the total just where the desk looks.
 * Shorter gaps are marked hour by hour.
 */
export const SILENT_AFTER_HOURS = 24;

/** A zone the system total leaves out, and why. */
export interface LeftOutZone {
  name: string;
  reason: 'never-reported' | 'switched-off' | 'silent';
  /** For a silent zone: its latest hour ever (UTC start). */
  lastHour?: string | null;
}

/** What the chart and the zone card show for one zone, or for the system total. */
export interface LoadView {
  key: string;
  name: string;
  timeZone: string;
  actual: (number | null)[];
  /** What was committed: the published schedule, else the day-ahead forecast. */
  committed: CommittedLine;
  /** The latest intraday model run with its bands: a line of its own, never the committed one. */
  latestRun: ForecastLine;
  latestRunSource: string;
  /** Hours that ended without every counted zone reporting (system total only). */
  incomplete: boolean[];
  /** Zones the system total leaves out (system total only). */
  leftOut: LeftOutZone[];
  /** Latest hour with a value, and the values there. */
  latestIndex: number | null;
  currentMw: number | null;
  committedMw: number | null;
  committedBasis: LineBasis | null;
  deviationPct: number | null;
  /** The latest run's value for the hour after the latest reading. */
  nextRunMw: number | null;
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

type ViewBase = Omit<LoadView, 'latestIndex' | 'currentMw' | 'committedMw' | 'committedBasis' | 'deviationPct' | 'nextRunMw'>;

/** The card's figures: the latest reading against what was committed for that hour. */
function withCurrent(view: ViewBase, nowIndex: number): LoadView {
  const latestIndex = latestValue(view.actual, nowIndex + 1);
  const currentMw = latestIndex === null ? null : view.actual[latestIndex];
  const committedMw = latestIndex === null ? null : view.committed.committed[latestIndex];
  const committedBasis = latestIndex === null ? null : view.committed.basis[latestIndex];
  const deviationPct = currentMw !== null && committedMw !== null && committedMw > 0 ? ((currentMw - committedMw) / committedMw) * 100 : null;
  const nextIndex = latestIndex === null ? nowIndex : latestIndex + 1;
  const nextRunMw = view.latestRun.mean[nextIndex] ?? null;
  return { ...view, latestIndex, currentMw, committedMw, committedBasis, deviationPct, nextRunMw };
}

export interface ViewInputs {
  series: ReadingSeriesDto;
  /** The active zones, in the order shown. */
  zones: readonly ZoneDto[];
  committed: ReadonlyMap<string, CommittedLine>;
  latestRuns: ReadonlyMap<string, { line: ForecastLine; source: string }>;
  status: readonly FeedStatusDto[] | undefined;
  /** Start of the current hour (epoch ms). */
  nowHour: number;
}

/** Index of the current hour in the series (may be past its end). */
export function nowIndexOf(series: ReadingSeriesDto, nowHour: number): number {
  return Math.floor((nowHour - Date.parse(series.from)) / HOUR_MS);
}

/** One view per active zone the series has readings for (a zone added a moment ago waits for the next fetch). */
export function zoneViews({ series, zones, committed, latestRuns, status, nowHour }: ViewInputs): LoadView[] {
  const nowIndex = nowIndexOf(series, nowHour);
  const length = series.hours.length;
  return zones.flatMap((zone) => {
    const readings = series.zones.find((z) => z.zone === zone.code);
    if (!readings) return [];
    const run = latestRuns.get(zone.code);
    return [
      withCurrent(
        {
          key: zone.code,
          name: zone.name,
          timeZone: zone.timeZone,
          actual: readings.mw,
          committed: committed.get(zone.code) ?? emptyCommittedLine(length),
          latestRun: run?.line ?? emptyForecastLine(length),
          latestRunSource: run?.source ?? 'No forecast run',
          incomplete: new Array<boolean>(length).fill(false),
          leftOut: [],
          feed: feedState(status?.find((s) => s.zone === zone.code)),
        },
        nowIndex,
      ),
    ];
  });
}

export interface SystemInputs {
  views: readonly LoadView[];
  series: ReadingSeriesDto;
  /** Zones switched off (inactive): never part of the total, named in its note. */
  inactive: readonly ZoneDto[];
  nowHour: number;
}

/**
 * The system total over the zones that report: a zone that has never reported, or has no reading
 * in the last SILENT_AFTER_HOURS hours, is left out (and named), so one new or silent zone does
 * not blank the total for everyone. Among the counted zones an hour is totalled only where every one reported (see
 * systemTotal); the hours over that miss one are marked incomplete. The committed line and the
 * latest run's bands add the counted zones' lines; adding bands assumes the zones' errors move
 * together: wider than the truth when they partly cancel, never narrower.
 */
export function systemView({ views, series, inactive, nowHour }: SystemInputs): LoadView {
  const length = series.hours.length;
  const nowIndex = nowIndexOf(series, nowHour);
  const shown = (v: LoadView) => v.actual.some((mw, i) => mw !== null && i <= nowIndex && i >= nowIndex - SILENT_AFTER_HOURS);
  const counted = views.filter(shown);
  const leftOut: LeftOutZone[] = [
    ...views.filter((v) => !shown(v)).map((v): LeftOutZone => {
      const lastHour = v.feed.kind === 'unknown' ? null : v.feed.lastHour;
      return lastHour ? { name: v.name, reason: 'silent', lastHour } : { name: v.name, reason: 'never-reported' };
    }),
    ...inactive.map((z): LeftOutZone => ({ name: z.name, reason: 'switched-off' })),
  ];
  const actual = systemTotal(counted.map((v) => v.actual), length);
  const band = (pick: (f: ForecastLine) => (number | null)[]) => systemTotal(counted.map((v) => pick(v.latestRun)), length).mw;
  const staleZones = counted.filter((v) => v.feed.kind === 'stale');
  const lastHours = counted.map((v) => (v.feed.kind === 'live' ? v.feed.lastHour : null));
  const allLive = counted.length > 0 && lastHours.every((h) => h !== null);
  const feed: FeedState = staleZones.length > 0 ? { kind: 'stale', lastHour: null, hoursBehind: null, staleZones: staleZones.map((v) => v.name) } : allLive ? { kind: 'live', lastHour: lastHours.sort()[0] as string, lastReceivedAt: null } : { kind: 'unknown' };
  return withCurrent(
    {
      key: SYSTEM,
      name: 'System total',
      timeZone: views[0]?.timeZone ?? 'UTC',
      actual: actual.mw,
      committed: systemCommitted(counted.map((v) => v.committed), length),
      latestRun: { mean: band((f) => f.mean), lower80: band((f) => f.lower80), upper80: band((f) => f.upper80), lower95: band((f) => f.lower95), upper95: band((f) => f.upper95) },
      latestRunSource: 'Sum of the counted zones’ latest runs',
      incomplete: actual.incomplete.map((flag, i) => flag && i < nowIndex),
      leftOut,
      feed,
    },
    nowIndex,
  );
}
