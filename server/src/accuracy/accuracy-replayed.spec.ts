import { systemInput, zoneAccuracy, type ZoneInput } from './accuracy-report';
import { operatingDay } from '@morrowline/shared';

const TZ = 'America/Denver';
const HOUR = 3_600_000;
const later = Date.parse('2027-01-01T00:00:00Z');

/** Two days of a flat 100 MW; the model 5 % high, its run on the first day replayed when asked. */
function input(code: string, replayedFirst: boolean): ZoneInput {
  const days = ['2026-06-10', '2026-06-11'].map((d) => operatingDay(d, TZ));
  return {
    code,
    name: code,
    timeZone: TZ,
    days,
    actual: days.map((d) => d.labels.map(() => 100)),
    model: days.map((d, i) => ({ id: i + 1, at: d.start - 20 * HOUR, revision: null, values: d.labels.map(() => 105), replayed: i === 0 && replayedFirst })),
    schedule: days.map(() => null),
  };
}

describe('accuracy of replayed forecasts', () => {
  it('scores a replayed run like any other and marks its day', () => {
    const z = zoneAccuracy(input('A', true), later);
    expect(z.days.map((d) => [d.model?.replayed, d.model?.score?.mape])).toEqual([
      [true, 5],
      [false, 5],
    ]);
    expect(z.daysReplayed).toBe(1);
    expect(z.daysScored).toBe(2);
  });

  it('marks a system-total day as replayed when any zone’s forecast for it is', () => {
    const a = input('A', true);
    const b = input('B', false);
    const sys = zoneAccuracy(systemInput([a, b], a.days), later);
    expect(sys.days.map((d) => d.model?.replayed)).toEqual([true, false]);
    expect(sys.daysReplayed).toBe(1);
  });
});
