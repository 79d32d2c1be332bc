import { zoneHistoryWindow } from './zone-history';

const H = 3_600_000;
const T0 = Date.UTC(2026, 10, 2, 0);

describe('zoneHistoryWindow', () => {
  it('places readings by hour, takes excluded hours out and counts the usable ones', () => {
    // Window of 5 hours ending at T0+4h: hours T0..T0+4h. Readings at T0, T0+1h, T0+3h, T0+4h;
    // T0+2h missing; T0+3h excluded (an outage) -> usable: T0, T0+1h, T0+4h = 3.
    const readings = [
      { hourStart: T0, mw: 10 },
      { hourStart: T0 + H, mw: 11 },
      { hourStart: T0 + 3 * H, mw: 13 },
      { hourStart: T0 + 4 * H, mw: 14 },
    ];
    const w = zoneHistoryWindow(T0 + 4 * H, 5, readings, [T0 + 3 * H]);
    expect(w.firstHourMs).toBe(T0);
    expect(w.lastHourMs).toBe(T0 + 4 * H);
    expect(Array.from(w.values)).toEqual([10, 11, NaN, NaN, 14]);
    expect(w.excluded).toEqual([3]);
    expect(w.usable).toBe(3);
  });

  it('ignores readings and exclusions outside the window and sorts the excluded indices', () => {
    const readings = [
      { hourStart: T0 - H, mw: 9 },
      { hourStart: T0, mw: 10 },
      { hourStart: T0 + 2 * H, mw: 12 },
      { hourStart: T0 + 3 * H, mw: 99 },
    ];
    const w = zoneHistoryWindow(T0 + 2 * H, 3, readings, new Set([T0 + 5 * H, T0 + 2 * H, T0 - 4 * H, T0]));
    expect(Array.from(w.values)).toEqual([NaN, NaN, NaN]);
    expect(w.excluded).toEqual([0, 2]);
    expect(w.usable).toBe(0);
  });
});
