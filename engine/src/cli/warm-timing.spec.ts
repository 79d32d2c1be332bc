import { repeatedTime, timeRepeated, timeWarm } from './warm-timing';

/**
 * A call that takes the given milliseconds on a clock of its own, which only the calls move: the
 * counts below then do not depend on how busy the machine running the tests is (with the real
 * clock and busy-waiting calls they did: a call preempted for a few milliseconds cut a
 * warm-up short).
 */
function taking(msOf: (i: number) => number): { call: () => void; calls: () => number; now: () => number } {
  let i = 0;
  let clock = 0;
  return {
    call: () => {
      clock += msOf(i++);
    },
    calls: () => i,
    now: () => clock,
  };
}

describe('timeWarm: a warm figure, the cold one apart', () => {
  it('reports the first call apart and leaves the warm-up calls out of the median', () => {
    // first call 30 ms, the next five 10 ms (still compiling), then 1 ms
    const c = taking((i) => (i === 0 ? 30 : i <= 5 ? 10 : 1));
    const t = timeWarm(c.call, { warmUpMs: 0, warmUpCalls: 5, budgetMs: 50, minCalls: 3, maxCalls: 10, now: c.now });
    expect(t.firstMs).toBe(30);
    expect(t.warmMs).toBe(1);
    expect(t.timed).toBe(10);
    expect(c.calls()).toBe(1 + 5 + 10);
  });

  it('cuts the warm-up at its time limit and still times at least the minimum on a slow call', () => {
    const c = taking(() => 20);
    const t = timeWarm(c.call, { warmUpMs: 30, warmUpCalls: 20, warmUpMaxMs: 50, budgetMs: 10, minCalls: 3, maxCalls: 25, now: c.now });
    expect(t.timed).toBe(3);
    // one first call, three warm-up calls (the cut at 50 ms passes during the third), three timed
    expect(c.calls()).toBe(7);
    expect(t.warmMs).toBe(20);
  });

  it('warms a quick call for the whole warm-up time, not only for the call count', () => {
    // a 1 ms call: 20 calls would be 20 ms; the warm-up runs on to 60 ms
    const c = taking((i) => (i === 0 ? 5 : 1));
    const t = timeWarm(c.call, { warmUpMs: 60, warmUpCalls: 20, budgetMs: 5, minCalls: 3, maxCalls: 3, now: c.now });
    expect(t.timed).toBe(3);
    expect(c.calls() - 1 - 3).toBe(60);
  });

  it('times calls until the budget is spent, between the minimum and the maximum', () => {
    const c = taking(() => 2);
    const t = timeWarm(c.call, { warmUpMs: 0, warmUpCalls: 0, budgetMs: 11, minCalls: 3, maxCalls: 100, now: c.now });
    // calls start at 0, 2, …, 10 (each before the budget's end at 11): six
    expect(t.timed).toBe(6);
  });
});

describe('timeRepeated: --repeat N of the fit commands', () => {
  it('times exactly N − 1 calls after the first and the warm-up, however long they take', () => {
    // first call 40 ms, the next 50 still compiling (10 ms), then 1 ms
    const c = taking((i) => (i === 0 ? 40 : i <= 50 ? 10 : 1));
    const t = timeRepeated(c.call, 5, { now: c.now });
    expect(t.firstMs).toBe(40);
    expect(t.timed).toBe(4);
    // the warm-up: 500 ms and 50 calls, whichever is last
    expect(t.warmUp).toBe(50);
    expect(t.warmMs).toBe(1);
    expect(c.calls()).toBe(1 + 50 + 4);
    expect(repeatedTime(t, 5)).toBe('1.0 ms (median of 4 warm fits after 50 untimed warm-up fits; first 40.0 ms)');
  });

  it('warms a slow fit for two seconds at most', () => {
    const c = taking(() => 300);
    const t = timeRepeated(c.call, 3, { now: c.now });
    // the cut at 2,000 ms passes during the seventh warm-up call
    expect(t.warmUp).toBe(7);
    expect(t.timed).toBe(2);
  });

  it('with N = 1 makes the one call and reports it as both figures', () => {
    const c = taking(() => 7);
    const t = timeRepeated(c.call, 1, { now: c.now });
    expect(c.calls()).toBe(1);
    expect(t).toEqual({ firstMs: 7, warmMs: 7, timed: 1, warmUp: 0 });
    expect(repeatedTime(t, 1)).toBe('7.0 ms');
  });
});
