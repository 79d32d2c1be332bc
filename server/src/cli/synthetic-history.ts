/**
 * The benchmarks' zone histories, synthesised in memory (no database): the daily and weekly
 * cycles, noise and the odd missing hour of the demo zones, the same for a given seed in every
 * process (bench:refit's batch pool and bench:cluster's workers fit the same series).
 */
export function synthesise(seed: number, peakMw: number, hours: number): Float64Array {
  let s = seed * 7919 + 17;
  const rnd = () => ((s = (s * 1103515245 + 12345) % 2 ** 31) / 2 ** 31 - 0.5);
  const phase = (seed % 5) - 2;
  const weekend = 0.08 + 0.04 * ((seed % 3) / 2);
  return Float64Array.from({ length: hours }, (_, t) => {
    if (rnd() > 0.497) return NaN; // an occasional meter dropout
    const hod = (t + phase) % 24;
    const dow = Math.floor(t / 24) % 7;
    const daily = 0.72 + 0.18 * Math.sin((2 * Math.PI * (hod - 8)) / 24) + 0.06 * Math.sin((4 * Math.PI * hod) / 24);
    const weekly = dow >= 5 ? 1 - weekend : 1;
    const drift = 1 + 0.03 * Math.sin((2 * Math.PI * t) / (24 * 23));
    return Math.max(0, peakMw * daily * weekly * drift * (1 + 0.025 * rnd()));
  });
}
