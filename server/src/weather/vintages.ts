/**
 * "As known at T": which temperature forecast value stands for each (station, hour) at a time T.
 * Only vintages issued at or before T count (one issued later was not known then); of those, the
 * newest that covers the hour. So an hour before the newest vintage's first hour keeps the value
 * of the last vintage that reached it, and a past load forecast can be set beside exactly the
 * temperature forecast its forecaster could have seen.
 */
export interface VintageValue {
  stationId: number;
  hourStart: number;
  issuedAt: number;
  tempC: number;
}

/** For each station and hour, the value of the newest vintage issued at or before `asOf`. */
export function knownAt(values: readonly VintageValue[], asOf: number): Map<string, VintageValue> {
  const best = new Map<string, VintageValue>();
  for (const v of values) {
    if (v.issuedAt > asOf) continue;
    const key = vintageKey(v.stationId, v.hourStart);
    const held = best.get(key);
    if (!held || v.issuedAt > held.issuedAt) best.set(key, v);
  }
  return best;
}

export function vintageKey(stationId: number, hourStart: number): string {
  return `${stationId}|${hourStart}`;
}
