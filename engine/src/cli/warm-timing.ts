/**
 * How the benchmarks time a fit warm: the first call (cold: the JIT compiles what it runs) is
 * reported apart; then the same fit is repeated untimed until V8 has optimised its paths (for
 * at least 100 ms and at least 20 calls, the calls cut at a second), and the median of the
 * timed calls after that is the figure, as a long-running server that refits every hour sees
 * it. R's side is timed warm too (a loop of at least 200 ms after its first call), so neither
 * side carries its start-up.
 *
 * The warm-up is in time as well as in calls because a quick fit's code goes cold while R runs
 * its half of a group (seconds in which this process idles and V8 may drop what it compiled):
 * 20 calls of a 0.1 ms fit are 2 ms, too few to compile it again, and MA(1) on the demand series
 * read 0.27 ms in the bench where the same fit runs in 0.12 ms.
 */
import { median } from '@morrowline/engine';

export interface WarmTiming {
  /** the first call, milliseconds */
  firstMs: number;
  /** the median of the timed calls after the warm-up, milliseconds */
  warmMs: number;
  /** how many calls were timed */
  timed: number;
}

export interface WarmTimingOptions {
  /** untimed warm-up: until this many milliseconds have passed… */
  warmUpMs?: number;
  /** …and this many calls were made, whichever comes last… */
  warmUpCalls?: number;
  /** …but no calls are added for the count once this many milliseconds have passed */
  warmUpMaxMs?: number;
  /** timed calls: until this budget in milliseconds is spent… */
  budgetMs?: number;
  /** …at least this many… */
  minCalls?: number;
  /** …and at most this many */
  maxCalls?: number;
  /** the clock, milliseconds (performance.now; the tests give one that only the calls move) */
  now?: () => number;
}

export function timeWarm(call: () => void, o: WarmTimingOptions = {}): WarmTiming {
  const warmUpMs = o.warmUpMs ?? 100;
  const warmUpCalls = o.warmUpCalls ?? 20;
  const budgetMs = o.budgetMs ?? 1000;
  const minCalls = o.minCalls ?? 3;
  const maxCalls = o.maxCalls ?? 100;
  const warmUpMaxMs = o.warmUpMaxMs ?? 1000;
  const now = o.now ?? (() => performance.now());
  let t = now();
  call();
  const firstMs = now() - t;
  const warmStart = now();
  for (let i = 0; ; i++) {
    const elapsed = now() - warmStart;
    if (elapsed >= warmUpMs && (i >= warmUpCalls || elapsed >= warmUpMaxMs)) break;
    call();
  }
  const ts: number[] = [];
  const end = now() + budgetMs;
  while (ts.length < minCalls || (ts.length < maxCalls && now() < end)) {
    t = now();
    call();
    ts.push(now() - t);
  }
  return { firstMs, warmMs: median(ts), timed: ts.length };
}
