import type { LineBasis } from './committed-line';

/** Today at a glance: energy so far against what was committed, and the peak so far. */
export interface DaySummary {
  /** Hours of today that are over. */
  hoursOver: number;
  /** Of those, the hours with both a reading and a committed value: what the energies add up. */
  hoursCompared: number;
  /** MWh (hourly MW summed over hours of one hour each) over the compared hours. */
  actualMwh: number | null;
  committedMwh: number | null;
  /** The committed values' basis over the compared hours ('mixed' when it changed). */
  basis: LineBasis | null;
  differencePct: number | null;
  /** Highest reading of today so far, and the index of its hour in the series. */
  peakMw: number | null;
  peakIndex: number | null;
}

/**
 * Today's figures from the series: hours [dayStart, min(dayEnd, nowIndex)) are over. Energy is
 * compared only over hours where both numbers exist, so a missing reading does not read as a
 * shortfall.
 */
export function daySummary(
  actual: readonly (number | null)[],
  committed: readonly (number | null)[],
  basis: readonly (LineBasis | null)[],
  dayStart: number,
  dayEnd: number,
  nowIndex: number,
): DaySummary {
  const end = Math.max(dayStart, Math.min(dayEnd, nowIndex, actual.length));
  let actualMwh = 0;
  let committedMwh = 0;
  let compared = 0;
  let peakMw: number | null = null;
  let peakIndex: number | null = null;
  const bases = new Set<LineBasis>();
  for (let i = Math.max(0, dayStart); i < end; i++) {
    const a = actual[i];
    const c = committed[i] ?? null;
    if (a !== null && (peakMw === null || a > peakMw)) {
      peakMw = a;
      peakIndex = i;
    }
    if (a === null || c === null) continue;
    actualMwh += a;
    committedMwh += c;
    compared++;
    const b = basis[i];
    if (b) bases.add(b);
  }
  return {
    hoursOver: end - Math.max(0, dayStart),
    hoursCompared: compared,
    actualMwh: compared > 0 ? actualMwh : null,
    committedMwh: compared > 0 ? committedMwh : null,
    basis: bases.size === 0 ? null : bases.size === 1 ? [...bases][0] : 'mixed',
    differencePct: compared > 0 && committedMwh > 0 ? ((actualMwh - committedMwh) / committedMwh) * 100 : null,
    peakMw,
    peakIndex,
  };
}
