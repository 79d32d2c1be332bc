import { describe, expect, it } from 'vitest';
import type { ScheduleRow } from './rows';
import { describeScheduleSummary, scheduleSummary } from './summary';

const row = (index: number, adjustedMw: number | null): ScheduleRow => ({
  index,
  hourEnding: `HE${String(index + 1).padStart(2, '0')}`,
  intervalStartUtc: new Date(Date.UTC(2026, 11, 3, 7 + index)).toISOString(),
  modelMw: adjustedMw,
  lower80: null,
  upper80: null,
  lower95: null,
  upper95: null,
  adjustedMw,
  differenceMw: null,
});

describe('schedule summary', () => {
  it('says how many hours are blank and over how many the energy is summed', () => {
    // 16 hours at 192.9 MW = 3,086.4 MWh, 8 blank
    const rows = Array.from({ length: 24 }, (_, i) => row(i, i < 16 ? 192.9 : null));
    const summary = scheduleSummary(rows);
    expect(summary).toEqual({ hours: 24, blank: 8, energyMwh: expect.closeTo(3086.4, 6), peakMw: 192.9 });
    expect(describeScheduleSummary(summary)).toBe('24 hours, 8 blank · 3,086 MWh adjusted over 16 hours');
  });

  it('keeps the short form for a full day, 25 hours on the autumn day', () => {
    const rows = Array.from({ length: 25 }, (_, i) => row(i, 100));
    expect(describeScheduleSummary(scheduleSummary(rows))).toBe('25 hours · 2,500 MWh adjusted');
  });

  it('has no peak and says so when every hour is blank', () => {
    const summary = scheduleSummary(Array.from({ length: 23 }, (_, i) => row(i, null)));
    expect(summary.peakMw).toBeNull();
    expect(describeScheduleSummary(summary)).toBe('23 hours, all blank');
  });
});
