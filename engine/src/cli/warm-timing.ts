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
  /** how many untimed warm-up calls ran between the first and the timed ones */
  warmUp: number;
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
  let warmUp = 0;
  for (; ; warmUp++) {
    const elapsed = now() - warmStart;
    if (elapsed >= warmUpMs && (warmUp >= warmUpCalls || elapsed >= warmUpMaxMs)) break;
    call();
  }
  const ts: number[] = [];
  const end = now() + budgetMs;
  while (ts.length < minCalls || (ts.length < maxCalls && now() < end)) {
    t = now();
    call();
    ts.push(now() - t);
  }
  return { firstMs, warmMs: median(ts), timed: ts.length, warmUp };
}

/**
 * The warm-up before --repeat's timed fits, longer than the benchmarks' (whose timed calls run
 * on for a second, so that a few still compiling do not move their median): with N − 1 timed
 * fits all of them must be past the JIT. On the demand series weekly-differenced ARMA(2,1) with
 * standard errors ran 0.8 ms from about the 22nd fit on; after 20 warm-up fits the median of 9
 * read 1.6–4.2 ms over four runs.
 */
const REPEAT_WARM_UP_MS = 500;
const REPEAT_WARM_UP_CALLS = 50;
const REPEAT_WARM_UP_MAX_MS = 2000;

/**
 * `--repeat N` of the fit commands: the first call (cold) and, for N > 1, a warm-up as timeWarm's
 * (REPEAT_WARM_UP_*) followed by exactly N − 1 timed calls, whose median is the warm figure. Without the
 * warm-up a small N timed V8's first tiers, not the compiled engine: on the first 1,500 hours of
 * the demand series, weekly-differenced ARMA(2,1) with standard errors read 7.3 ms as the
 * median of 19 fits straight after the first, and about 1 ms from the 17th fit on.
 */
export function timeRepeated(call: () => void, repeat: number, o: Pick<WarmTimingOptions, 'warmUpMs' | 'warmUpCalls' | 'warmUpMaxMs' | 'now'> = {}): WarmTiming {
  if (repeat <= 1) {
    const now = o.now ?? (() => performance.now());
    const t = now();
    call();
    const ms = now() - t;
    return { firstMs: ms, warmMs: ms, timed: 1, warmUp: 0 };
  }
  return timeWarm(call, { warmUpMs: REPEAT_WARM_UP_MS, warmUpCalls: REPEAT_WARM_UP_CALLS, warmUpMaxMs: REPEAT_WARM_UP_MAX_MS, ...o, budgetMs: 0, minCalls: repeat - 1, maxCalls: repeat - 1 });
}

/** The estimation time as the fit commands print it: the one fit, or the warm median with its counts and the first. */
export function repeatedTime(t: WarmTiming, repeat: number): string {
  const ms = (v: number) => `${v.toFixed(1)} ms`;
  if (repeat <= 1) return ms(t.warmMs);
  return `${ms(t.warmMs)} (median of ${t.timed} warm fits after ${t.warmUp} untimed warm-up fits; first ${ms(t.firstMs)})`;
}
