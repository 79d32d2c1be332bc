import { scoringDays } from './scoring-days';

const H = 3_600_000;
const denver = 'America/Denver';

describe('scoring days', () => {
  it('takes the last whole operating days, each issued at the gate closure the day before from the hours ended by then', () => {
    // history from 2026-06-01 00:00 MDT (06:00Z) to the hour starting 2026-06-10 13:00 MDT
    const first = Date.UTC(2026, 5, 1, 6);
    const last = Date.UTC(2026, 5, 10, 19);
    const days = scoringDays(first, last, denver, '10:00', 3);
    expect(days.map((d) => d.day)).toEqual(['2026-06-07', '2026-06-08', '2026-06-09']);
    const d = days[2];
    expect(new Date(d.from).toISOString()).toBe('2026-06-09T06:00:00.000Z');
    expect(d.hours).toBe(24);
    expect(new Date(d.issuedAt).toISOString()).toBe('2026-06-08T16:00:00.000Z');
    // 8 days and 10 hours of history had ended at 10:00 MDT on 8 June
    expect(d.cut).toBe(7 * 24 + 10);
    expect(d.dayStart).toBe(8 * 24);
  });

  it('scores the 25-hour autumn day whole', () => {
    const first = Date.UTC(2026, 9, 20, 6);
    const last = Date.UTC(2026, 10, 2, 12);
    const days = scoringDays(first, last, denver, '10:00', 2);
    expect(days.map((d) => [d.day, d.hours])).toEqual([['2026-10-31', 24], ['2026-11-01', 25]]);
    expect(days[1].dayStart * H + first).toBe(Date.UTC(2026, 10, 1, 6));
  });

  it('leaves out days whose issue time came before the history began', () => {
    const first = Date.UTC(2026, 5, 8, 6);
    const last = Date.UTC(2026, 5, 10, 5);
    expect(scoringDays(first, last, denver, '10:00', 7).map((d) => d.day)).toEqual(['2026-06-09']);
  });
});
