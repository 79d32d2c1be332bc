import { MIN_READING_VERSION, VersionClock } from './feed';

describe('VersionClock (the versions a feed stamps its readings with)', () => {
  it('gives microseconds since the epoch from the wall clock', () => {
    const clock = new VersionClock(() => Date.UTC(2026, 2, 8, 9, 0, 0, 123));
    expect(clock.next()).toBe(Date.UTC(2026, 2, 8, 9, 0, 0, 123) * 1000);
    expect(clock.next()).toBeGreaterThan(MIN_READING_VERSION);
  });

  it('never repeats or goes back, within one millisecond or when the wall clock steps back', () => {
    let wall = 1_800_000_000_000;
    const clock = new VersionClock(() => wall);
    const a = clock.next();
    const b = clock.next();
    wall -= 5_000;
    const c = clock.next();
    wall += 60_000;
    const d = clock.next();
    expect([b - a, c - b]).toEqual([1, 1]);
    expect(d).toBe(1_800_000_055_000 * 1000);
  });

  it('answers a version above a stored one even when the wall clock is behind it', () => {
    const clock = new VersionClock(() => 1_800_000_000_000);
    expect(clock.nextAbove(1_900_000_000_000_000)).toBe(1_900_000_000_000_001);
    expect(clock.next()).toBe(1_900_000_000_000_002);
  });
});
