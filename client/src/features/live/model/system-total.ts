/** The system total of an hourly quantity, and the hours it could not be added up for. */
export interface SystemTotal {
  mw: (number | null)[];
  /** True where at least one zone had a value and at least one had none: the sum would mislead. */
  incomplete: boolean[];
}

/**
 * Adds the zones hour by hour. An hour is totalled only when every zone has a value: a sum over
 * the zones that happened to report would look like a drop in load. Such hours stay null and are
 * marked incomplete, so the chart shows a gap that says why.
 */
export function systemTotal(zones: readonly (readonly (number | null)[])[], length: number): SystemTotal {
  const mw: (number | null)[] = new Array<number | null>(length).fill(null);
  const incomplete = new Array<boolean>(length).fill(false);
  if (zones.length === 0) return { mw, incomplete };
  for (let i = 0; i < length; i++) {
    let sum = 0;
    let present = 0;
    for (const zone of zones) {
      const value = zone[i] ?? null;
      if (value === null) continue;
      sum += value;
      present++;
    }
    if (present === zones.length) mw[i] = sum;
    else if (present > 0) incomplete[i] = true;
  }
  return { mw, incomplete };
}
