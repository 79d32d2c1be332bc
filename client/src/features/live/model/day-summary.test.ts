import { describe, expect, it } from 'vitest';
import { daySummary } from './day-summary';

describe('daySummary', () => {
  it('adds the energy of today’s hours that are over, against what was committed over the same hours', () => {
    // Index 0-1 are yesterday, today starts at 2; the current hour is 6 (not over).
    const actual = [500, 500, 100, 120, null, 130, 999, null];
    const committed = [1, 1, 110, 110, 110, 100, 100, 100];
    const basis = ['day-ahead', 'day-ahead', 'schedule', 'schedule', 'schedule', 'day-ahead', 'day-ahead', 'day-ahead'] as const;
    const s = daySummary(actual, committed, [...basis], 2, 8, 6);
    expect(s.hoursOver).toBe(4);
    expect(s.hoursCompared).toBe(3); // the hour without a reading is left out of both sums
    expect(s.actualMwh).toBe(350);
    expect(s.committedMwh).toBe(320);
    expect(s.differencePct).toBeCloseTo((30 / 320) * 100, 10);
    expect(s.basis).toBe('mixed');
    expect(s.peakMw).toBe(130);
    expect(s.peakIndex).toBe(5);
  });

  it('has no energies when nothing was committed, but still the peak', () => {
    const s = daySummary([80, 90], [null, null], [null, null], 0, 24, 2);
    expect(s.actualMwh).toBeNull();
    expect(s.committedMwh).toBeNull();
    expect(s.basis).toBeNull();
    expect(s.peakMw).toBe(90);
  });

  it('has nothing at all before the first hour of the day is over', () => {
    const s = daySummary([80, 90], [80, 90], ['schedule', 'schedule'], 0, 24, 0);
    expect(s).toMatchObject({ hoursOver: 0, hoursCompared: 0, actualMwh: null, peakMw: null, peakIndex: null });
  });
});
