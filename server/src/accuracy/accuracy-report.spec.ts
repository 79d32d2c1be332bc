import { operatingDay } from '@morrowline/shared';
import { systemInput, zoneAccuracy, type ZoneInput } from './accuracy-report';

const TZ = 'America/Denver';
const HOUR = 3_600_000;
const load = (t: number) => 200 + 100 * Math.sin((2 * Math.PI * ((t / HOUR) % 24)) / 24);

function input(days: string[], scale: number, schedule?: number): ZoneInput {
  const ds = days.map((d) => operatingDay(d, TZ));
  const actual = ds.map((d) => d.labels.map((_, h) => load(d.start + h * HOUR)));
  return {
    code: 'TEST',
    name: 'Test',
    timeZone: TZ,
    days: ds,
    actual,
    model: actual.map((row, i) => ({ id: i + 1, at: 0, revision: null, values: row.map((a) => a * scale) })),
    schedule: actual.map((row, i) => (schedule === undefined ? null : { id: 100 + i, at: 0, revision: 1, values: row.map((a) => a * schedule) })),
  };
}

describe('zone accuracy', () => {
  const later = Date.parse('2027-01-01T00:00:00Z');

  it('scores forecast = actual × 1.1 as MAPE 10 % and bias +10 % of the mean', () => {
    const z = zoneAccuracy(input(['2026-06-10'], 1.1), later);
    const day = z.days[0];
    const mean = input(['2026-06-10'], 1).actual[0].reduce<number>((s, x) => s + (x ?? 0), 0) / 24;
    expect(day.model?.score).toMatchObject({ hours: 24, mape: 10 });
    expect(day.model?.score?.bias).toBeCloseTo(0.1 * mean, 2);
    expect(day.model?.score?.peakErrorPct).toBe(10);
    expect(z.model.mape).toBe(10);
    expect(z.byHour.map((h) => h.hourEnding)).toHaveLength(24);
  });

  it('scores the 23-hour day on 23 hours and keeps HE25 as its own bucket', () => {
    const z = zoneAccuracy(input(['2026-03-08', '2026-11-01'], 0.95), later);
    expect(z.days.map((d) => d.model?.score?.hours)).toEqual([23, 25]);
    expect(z.byHour.find((h) => h.hourEnding === 'HE02')?.days).toBe(1);
    expect(z.byHour.find((h) => h.hourEnding === 'HE25')?.days).toBe(1);
    expect(z.days[0].model?.score?.bias).toBeLessThan(0);
  });

  it('says the adjustments helped when the schedule is closer', () => {
    const z = zoneAccuracy(input(['2026-06-10', '2026-06-11'], 1.1, 1.02), later);
    expect(z.days[0].adjustmentEffect).toBe(-8);
    expect(z.comparison).toMatchObject({ days: 2, modelMape: 10, scheduleMape: 2, difference: -8, daysHelped: 2 });
  });

  it('lists days without actuals or without a forecast and never scores them', () => {
    const i = input(['2026-06-10', '2026-06-11'], 1.1);
    i.actual[0] = i.actual[0].map(() => null);
    i.model[1] = null;
    const z = zoneAccuracy(i, later);
    expect(z.days[0]).toMatchObject({ actuals: 'none', actualHours: 0 });
    expect(z.days[0].model?.score).toBeNull();
    expect(z.days[1].model).toBeNull();
    expect(z.model.hours).toBe(0);
    expect(z.model.mape).toBeNull();
    expect(z).toMatchObject({ daysScored: 0, daysWithoutActuals: 1, daysWithoutForecast: 1 });
  });

  it('does not score a day still running', () => {
    const i = input(['2026-06-10'], 1.1);
    i.actual[0] = i.actual[0].map((a, h) => (h < 10 ? a : null));
    const during = operatingDay('2026-06-10', TZ).start + 11 * HOUR;
    expect(zoneAccuracy(i, during).days[0]).toMatchObject({ actuals: 'in-progress', model: { score: null } });
    expect(zoneAccuracy(i, later).days[0]).toMatchObject({ actuals: 'gaps', model: { score: { hours: 10 } } });
  });

  it('sums zones hour by hour for the system total', () => {
    const a = input(['2026-06-10'], 1.1);
    const b = { ...input(['2026-06-10'], 0.9), code: 'B' };
    const sys = zoneAccuracy(systemInput([a, b], a.days), later);
    expect(sys.days[0].model?.score?.mape).toBe(0);
    expect(sys.days[0].model?.score?.hours).toBe(24);
  });
});
