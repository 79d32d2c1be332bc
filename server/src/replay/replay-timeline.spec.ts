import { gateForecastAt, nightlyRefitBefore, replaySteps, type ReplayRoutine } from './replay-timeline';

const TZ = 'America/Denver';
const routine: ReplayRoutine = { updateMinute: 5, nightly: { hour: 1, minute: 30 }, deskTimeZone: TZ };
const iso = (ms: number) => new Date(ms).toISOString();

describe('when the desk issues the forecast behind a day’s schedule', () => {
  it('is the last hourly update before the gate closure (10:00 local the day before)', () => {
    // 10 June 2026: gate closure 9 June 10:00 MDT = 16:00Z, last update before it 09:05 MDT
    expect(iso(gateForecastAt('2026-06-10', TZ, '10:00', 5))).toBe('2026-06-09T15:05:00.000Z');
    // in winter (MST, UTC−7)
    expect(iso(gateForecastAt('2026-12-02', TZ, '10:00', 5))).toBe('2026-12-01T16:05:00.000Z');
    // a gate closure at half past: the update at 10:05 is still before it
    expect(iso(gateForecastAt('2026-06-10', TZ, '10:30', 5))).toBe('2026-06-09T16:05:00.000Z');
    // an update on the minute of the gate closure is too late: the one an hour earlier
    expect(iso(gateForecastAt('2026-06-10', TZ, '10:00', 0))).toBe('2026-06-09T15:00:00.000Z');
  });

  it('runs the nightly refit before it, across the spring change of the clocks', () => {
    expect(iso(nightlyRefitBefore(Date.parse('2026-06-09T15:05:00Z'), routine))).toBe('2026-06-09T07:30:00.000Z');
    // 8 March 2026: 01:30 is still MST (UTC−7); the update at 09:05 is MDT (UTC−6)
    const update = gateForecastAt('2026-03-09', TZ, '10:00', 5);
    expect(iso(update)).toBe('2026-03-08T15:05:00.000Z');
    expect(iso(nightlyRefitBefore(update, routine))).toBe('2026-03-08T08:30:00.000Z');
    // a refit time later in the day than the update: the previous night's
    expect(iso(nightlyRefitBefore(update, { ...routine, nightly: { hour: 23, minute: 0 } }))).toBe('2026-03-08T06:00:00.000Z');
  });

  it('lists the days from the one after the first reading whose update had passed, oldest first', () => {
    const first = Date.parse('2026-06-01T06:00:00Z'); // local midnight
    const steps = replaySteps(first, Date.parse('2026-06-10T15:05:00Z'), TZ, '10:00', routine);
    expect(steps.map((s) => s.day)).toEqual(['2026-06-02', '2026-06-03', '2026-06-04', '2026-06-05', '2026-06-06', '2026-06-07', '2026-06-08', '2026-06-09', '2026-06-10', '2026-06-11']);
    expect(iso(steps[9].issuedAt)).toBe('2026-06-10T15:05:00.000Z');
    expect(iso(steps[9].gateClosureAt)).toBe('2026-06-10T16:00:00.000Z');
    expect(iso(steps[9].nightlyAt)).toBe('2026-06-10T07:30:00.000Z');
    // a minute earlier, the 11th's forecast had not been made yet
    expect(replaySteps(first, Date.parse('2026-06-10T15:04:00Z'), TZ, '10:00', routine).map((s) => s.day).at(-1)).toBe('2026-06-10');
  });
});
