import { timeWarm } from './warm-timing';

/** A call that takes the given milliseconds, busy-waiting (the timer sees the time pass). */
function taking(msOf: (i: number) => number): { call: () => void; calls: () => number } {
  let i = 0;
  return {
    call: () => {
      const end = performance.now() + msOf(i++);
      while (performance.now() < end);
    },
    calls: () => i,
  };
}

describe('timeWarm: a warm figure, the cold one apart', () => {
  it('reports the first call apart and leaves the warm-up calls out of the median', () => {
    // first call 30 ms, the next five 10 ms (still compiling), then 1 ms
    const c = taking((i) => (i === 0 ? 30 : i <= 5 ? 10 : 1));
    const t = timeWarm(c.call, { warmUpMs: 1000, warmUpCalls: 5, budgetMs: 50, minCalls: 3, maxCalls: 10 });
    expect(t.firstMs).toBeGreaterThanOrEqual(30);
    expect(t.warmMs).toBeGreaterThanOrEqual(1);
    expect(t.warmMs).toBeLessThan(5);
    expect(t.timed).toBe(10);
    expect(c.calls()).toBe(1 + 5 + 10);
  });

  it('cuts the warm-up at its time limit and still times at least the minimum on a slow call', () => {
    const c = taking(() => 20);
    const t = timeWarm(c.call, { warmUpMs: 30, warmUpCalls: 20, budgetMs: 10, minCalls: 3, maxCalls: 25 });
    expect(t.timed).toBe(3);
    // one first call, two warm-up calls (the limit passes during the second), three timed
    expect(c.calls()).toBe(6);
    expect(t.warmMs).toBeGreaterThanOrEqual(20);
  });
});
