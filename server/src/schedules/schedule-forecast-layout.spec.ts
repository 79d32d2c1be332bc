import { layForecast } from './schedule-forecast-layout';

const slots = [
  { index: 0, intervalStartUtc: '2026-06-10T06:00:00.000Z', hourEnding: 'HE01' },
  { index: 1, intervalStartUtc: '2026-06-10T07:00:00.000Z', hourEnding: 'HE02' },
];

describe('layForecast', () => {
  it('matches run hours to slots by UTC hour start, rounds to 0.1 MW and leaves uncovered slots null', () => {
    const run = { id: 7, issuedAt: '2026-06-09T12:00:00.000Z', origin: 'issued' as const, hours: ['2026-06-10T07:00:00Z'], mean: [101.26], lower80: [90.04], upper80: [110.55], lower95: [85], upper95: [120] };
    const laid = layForecast(run, slots);
    expect(laid.runId).toBe(7);
    expect(laid.issuedAt).toBe('2026-06-09T12:00:00.000Z');
    expect(laid.hours[0]).toEqual({ ...slots[0], modelMw: null, lower80: null, upper80: null, lower95: null, upper95: null, startMw: null, adjustedMw: null });
    expect(laid.hours[1]).toEqual({ ...slots[1], modelMw: 101.3, lower80: 90, upper80: 110.6, lower95: 85, upper95: 120, startMw: 101.3, adjustedMw: 101.3 });
  });
});
