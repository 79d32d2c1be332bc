import { scoreAtIssueTimes } from './issue-time-score';
import { forecastStored, refitZone } from './refit';
import { temperatureZone } from '../../../test/support/temperature-zone';

/** The zone of test/support/temperature-zone.ts, with this spec's own noise. */
const zone = () => temperatureZone(5);

describe('a stored version with weather terms forecasts as the refit that made it did', () => {
  it('gives the refit\'s own forecast again from the stored terms, response and error model (coefficients held)', () => {
    const { values, weather } = zone();
    const fitted = refitZone({ values, excluded: [], horizon: 48, backtestDays: 3, weather });
    expect(fitted.weather?.used).toBe(true);
    expect(fitted.weather?.sigma2).toBeGreaterThan(0);
    const again = forecastStored({ values, excluded: [], horizon: 48, model: fitted.stored!, weather: { stored: fitted.weather!, inputs: weather } }).forecast;
    for (let j = 0; j < 48; j++) {
      expect(again.mean[j]).toBeCloseTo(fitted.forecast.mean[j], 6);
      expect(again.upper95[j]).toBeCloseTo(fitted.forecast.upper95[j], 6);
    }
    // and without the weather it is the plain model's, not the same forecast
    const plain = forecastStored({ values, excluded: [], horizon: 48, model: fitted.stored! }).forecast;
    expect(plain.mean.some((m, j) => Math.abs(m - fitted.forecast.mean[j]) > 1)).toBe(true);
  });

  it('is scored on past days on the temperature forecast known at each day\'s issue time, never a later vintage', () => {
    const { values, weather } = zone();
    const n = values.length;
    const fitted = refitZone({ values: values.subarray(0, n - 72), excluded: [], horizon: 48, backtestDays: 3, weather: { ...weather, temperature: weather.temperature.subarray(0, n - 72), issuedAt: n - 72 } });
    expect(fitted.weather?.used).toBe(true);
    // the last three days, each issued 14 hours before it starts
    const days = [3, 2, 1].map((k) => ({ dayStart: n - 24 * k, hours: 24, cut: n - 24 * k - 14, issuedAt: n - 24 * k - 14 }));
    const score = (w: typeof weather, withTerms: boolean) =>
      scoreAtIssueTimes({ values, excluded: [], days, weather: w, versions: [{ model: fitted.stored!, issued: [null, null, null], weather: withTerms ? fitted.weather : null }] }).versions[0];
    const withWeather = score(weather, true);
    const without = score(weather, false);
    expect(withWeather.perDay.every((d) => d.source === 're-forecast')).toBe(true);
    expect(withWeather.mape!).toBeLessThan(without.mape!);
    // every vintage issued after the first day's issue time set to 40 °C: that day's score does not move, a later one's does
    const corrupted = { ...weather, vintages: weather.vintages.map((v) => (v.issued > days[0].issuedAt ? { ...v, members: v.members.map((m) => m.map(() => 40)) } : v)) };
    const after = score(corrupted, true);
    expect(after.perDay[0].mape).toBe(withWeather.perDay[0].mape);
    expect(after.perDay[2].mape).not.toBe(withWeather.perDay[2].mape);
  });
});

