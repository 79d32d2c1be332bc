/**
 * How the benchmarks time a fit warm: the first call (cold: the JIT compiles what it runs) is
 * reported apart; then the same fit is repeated untimed until V8 has optimised its paths (at
 * least 100 ms or 20 calls), and the median of the timed calls after that is the figure, as a
 * long-running server that refits every hour sees it. R's side is timed warm too (a loop of at
 * least 200 ms after its first call), so neither side carries its start-up.
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
  /** …or this many calls were made, whichever comes first */
  warmUpCalls?: number;
  /** timed calls: until this budget in milliseconds is spent… */
  budgetMs?: number;
  /** …at least this many… */
  minCalls?: number;
  /** …and at most this many */
  maxCalls?: number;
}

export function timeWarm(call: () => void, o: WarmTimingOptions = {}): WarmTiming {
  const warmUpMs = o.warmUpMs ?? 100;
  const warmUpCalls = o.warmUpCalls ?? 20;
  const budgetMs = o.budgetMs ?? 1000;
  const minCalls = o.minCalls ?? 3;
  const maxCalls = o.maxCalls ?? 25;
  let t = performance.now();
  call();
  const firstMs = performance.now() - t;
  const warmEnd = performance.now() + warmUpMs;
  for (let i = 0; i < warmUpCalls && performance.now() < warmEnd; i++) call();
  const ts: number[] = [];
  const end = performance.now() + budgetMs;
  while (ts.length < minCalls || (ts.length < maxCalls && performance.now() < end)) {
    t = performance.now();
    call();
    ts.push(performance.now() - t);
  }
  return { firstMs, warmMs: median(ts), timed: ts.length };
}
