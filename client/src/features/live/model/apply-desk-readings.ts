import { HOUR_MS, STALE_AFTER_HOURS, type DeskReadings, type FeedStatusDto, type ReadingSeriesDto } from '@morrowline/shared';
import { hourIndex } from './hours';

function later(a: string | null, b: string): string {
  return a === null || Date.parse(b) > Date.parse(a) ? b : a;
}

/**
 * A cached series with the values of a desk readings event written in: only the hours inside the
 * series' range change, and the zone's latest hour and receipt time move on. Answers the same
 * object when nothing in it changed, so that the query cache does not re-render for nothing.
 */
export function applyDeskReadings(series: ReadingSeriesDto, event: DeskReadings): ReadingSeriesDto {
  const fromMs = Date.parse(series.from);
  let changed = false;
  const zones = series.zones.map((zone) => {
    const update = event.zones.find((z) => z.zone === zone.zone);
    if (!update || update.hours.length === 0) return zone;
    const mw = zone.mw.slice();
    const quality = zone.quality.slice();
    let lastHour = zone.lastHour;
    update.hours.forEach((hour, k) => {
      lastHour = later(lastHour, new Date(Date.parse(hour)).toISOString());
      const i = hourIndex(hour, fromMs, mw.length);
      if (i < 0) return;
      mw[i] = update.mw[k];
      quality[i] = quality[i] ?? 'good';
    });
    changed = true;
    return { ...zone, mw, quality, lastHour, lastReceivedAt: event.receivedAt };
  });
  return changed ? { ...series, zones } : series;
}

/** The feed status list after a readings event: the zones in it are up to date again. */
export function applyDeskReadingsToStatus(status: FeedStatusDto[], event: DeskReadings, now = Date.now()): FeedStatusDto[] {
  return status.map((feed) => {
    const update = event.zones.find((z) => z.zone === feed.zone);
    if (!update || update.hours.length === 0) return feed;
    let lastHour = feed.lastHour;
    for (const hour of update.hours) lastHour = later(lastHour, new Date(Date.parse(hour)).toISOString());
    const lastEnd = Date.parse(lastHour as string) + HOUR_MS;
    return {
      ...feed,
      lastHour,
      lastReceivedAt: event.receivedAt,
      hoursBehind: Math.max(0, Math.floor((now - lastEnd) / HOUR_MS)),
      stale: now - lastEnd > STALE_AFTER_HOURS * HOUR_MS,
    };
  });
}
