/**
 * Temperature forecast vintages and the rule "as known at the issue time": a forecast issued at
 * time T may use only the vintages issued at or before T and the temperatures observed in hours
 * that ended by T. Times are hours on the load's timeline: hour index i is the hour that starts
 * i hours after the first load hour; an issue time is a (fractional) number of hours from the
 * start of hour 0, so a vintage issued at 04:30 of hour 4 is 4.5, and an issue time o means the
 * load and the observed temperature of hours 0..o−1 are known.
 */

export interface TemperatureVintage {
  /** issue time, hours from the start of hour 0 (fractional) */
  issued: number;
  /** hour index of members[k][0] */
  first: number;
  /** one path per ensemble member (a single path when the forecast has no members), °C, NaN where absent */
  members: Float64Array[];
}

/** One row of a forecast file: when it was issued, for which hour, the value, and its member (absent = the single forecast). */
export interface TemperatureForecastRow {
  issuedMs: number;
  hourMs: number;
  tempC: number;
  member?: string;
}

const HOUR = 3_600_000;

/**
 * Vintages from forecast rows, on the timeline whose hour 0 starts at `startMs`. Rows of one
 * issue time form one vintage; its members are the distinct member names (rows without one are a
 * single member). Vintages come out in order of issue.
 */
export function vintagesFromRows(rows: readonly TemperatureForecastRow[], startMs: number): TemperatureVintage[] {
  const byIssue = new Map<number, Map<string, Map<number, number>>>();
  for (const r of rows) {
    const members = byIssue.get(r.issuedMs) ?? byIssue.set(r.issuedMs, new Map()).get(r.issuedMs)!;
    const key = r.member ?? '';
    const hours = members.get(key) ?? members.set(key, new Map()).get(key)!;
    hours.set(Math.round((r.hourMs - startMs) / HOUR), r.tempC);
  }
  const out: TemperatureVintage[] = [];
  for (const [issuedMs, members] of [...byIssue].sort((a, b) => a[0] - b[0])) {
    let first = Infinity;
    let last = -Infinity;
    for (const hours of members.values())
      for (const i of hours.keys()) {
        first = Math.min(first, i);
        last = Math.max(last, i);
      }
    const paths = [...members.values()].map((hours) => {
      const p = new Float64Array(last - first + 1).fill(NaN);
      for (const [i, v] of hours) p[i - first] = v;
      return p;
    });
    out.push({ issued: (issuedMs - startMs) / HOUR, first, members: paths });
  }
  return out;
}

/** The vintages known at issue time `at` (issued at or before it), in order of issue. */
export function knownVintages(vintages: readonly TemperatureVintage[], at: number): TemperatureVintage[] {
  return vintages.filter((v) => v.issued <= at);
}

/** Mean over the members of a vintage at hour index i (NaN when the vintage does not cover it). */
export function vintageMean(v: TemperatureVintage, i: number): number {
  const k = i - v.first;
  if (k < 0 || k >= v.members[0].length) return NaN;
  let s = 0;
  let m = 0;
  for (const p of v.members) {
    if (Number.isFinite(p[k])) {
      s += p[k];
      m++;
    }
  }
  return m ? s / m : NaN;
}
