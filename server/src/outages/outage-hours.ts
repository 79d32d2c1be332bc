/** Hour arithmetic of outage windows (no framework: unit-tested alone). */
import { ceilHour, floorHour, HOUR_MS } from '@morrowline/shared';

/**
 * UTC hour starts in [from, to) covered by the windows. A window covers every hour it touches
 * (start rounded down, end rounded up); an open window (end null) runs up to `openUntil`.
 */
export function excludedHourSet(windows: readonly { start: number; end: number | null }[], from: number, to: number, openUntil = Number.POSITIVE_INFINITY): Set<number> {
  const out = new Set<number>();
  for (const w of windows) {
    const a = Math.max(floorHour(w.start), ceilHour(from));
    const b = Math.min(w.end === null ? openUntil : ceilHour(w.end), to);
    for (let h = a; h < b; h += HOUR_MS) out.add(h);
  }
  return out;
}
