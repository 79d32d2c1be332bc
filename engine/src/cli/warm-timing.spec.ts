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
    const t = timeWarm(c.call, { warmUpMs: 0, warmUpCalls: 5, budgetMs: 50, minCalls: 3, maxCalls: 10 });
    expect(t.firstMs).toBeGreaterThanOrEqual(30);
    expect(t.warmMs).toBeGreaterThanOrEqual(1);
    expect(t.warmMs).toBeLessThan(5);
    expect(t.timed).toBe(10);
    expect(c.calls()).toBe(1 + 5 + 10);
  });

  it('cuts the warm-up at its time limit and still times at least the minimum on a slow call', () => {
    const c = taking(() => 20);
    const t = timeWarm(c.call, { warmUpMs: 30, warmUpCalls: 20, warmUpMaxMs: 50, budgetMs: 10, minCalls: 3, maxCalls: 25 });
    expect(t.timed).toBe(3);
    // one first call, three warm-up calls (the cut at 50 ms passes during the third), three timed
    expect(c.calls()).toBe(7);
    expect(t.warmMs).toBeGreaterThanOrEqual(20);
  });

  it('warms a quick call for the whole warm-up time, not only for the call count', () => {
    // a 1 ms call: 20 calls would be 20 ms; the warm-up runs on to 60 ms
    const c = taking((i) => (i === 0 ? 5 : 1));
    const t = timeWarm(c.call, { warmUpMs: 60, warmUpCalls: 20, budgetMs: 5, minCalls: 3, maxCalls: 3 });
    expect(t.timed).toBe(3);
    // about 60 warm-up calls (the timer's slack takes a few off), far more than 20
    expect(c.calls() - 1 - 3).toBeGreaterThanOrEqual(50);
  });
});
