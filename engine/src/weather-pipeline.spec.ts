/**
 * The choice of terms by the rolling backtest, on synthetic zones whose response is known by
 * construction (./weather/synthetic-zone): one that answers the temperature gets the temperature terms and
 * beats the model without them; one that does not keeps the model without them.
 */
import { calibrationErrors, runWeatherPipeline } from './weather-pipeline';
import { runPipeline } from './pipeline';
import { syntheticZone } from './weather/synthetic-zone';

describe('weather pipeline', () => {
  const hours = 8 * 168;
  it('a zone that answers the temperature gets the temperature terms, and they beat the model without them on the test days', () => {
    const z = syntheticZone(hours, 21);
    const r = runWeatherPipeline({ history: z.load, horizon: 38, temperature: z.temperature, vintages: z.vintages });
    expect(r.method).toBe('regression-arima');
    expect(r.choice!.terms.temperature).toBe(true);
    expect(r.choice!.terms.blockHours).toBe(2); // degree terms by two-hour block of the day
    expect(r.response.some((c) => c.name === 'hdd_h06')).toBe(true);
    const without = r.candidates.find((c) => !c.terms.temperature && !c.terms.recency)!;
    const chosen = r.candidates.find((c) => c.terms.temperature === r.choice!.terms.temperature && c.terms.recency === r.choice!.terms.recency)!;
    expect(chosen.mape).toBeLessThan(without.mape);
    expect(r.forecast.mean).toHaveLength(38);
    expect(r.weatherSd.every((v) => v >= 0)).toBe(true);
    expect(r.weatherSd.some((v) => v > 0)).toBe(true); // the temperature forecast's uncertainty is in the bands
    expect(r.forecast.upper95.every((u, j) => u >= r.forecast.mean[j])).toBe(true);
  });
  it('a zone whose load does not answer the temperature keeps the model without it', () => {
    const z = syntheticZone(hours, 21, { weatherScale: 0 });
    const r = runWeatherPipeline({ history: z.load, horizon: 38, temperature: z.temperature, vintages: z.vintages });
    expect(r.choice!.terms.temperature).toBe(false);
    expect(r.method).not.toBe('regression-arima'); // the ARMA, or seasonal naive where that beat it
    expect(r.response).toEqual([]);
    // exactly today's pipeline: the same forecast and bands
    const today = runPipeline({ history: z.load, horizon: 38 });
    expect(r.forecast).toEqual(today.forecast);
    expect(r.method).toBe(today.method);
  });
  it('a what-if temperature moves the forecast by the fitted response', () => {
    const z = syntheticZone(hours, 21, { meanC: 0 }); // cold: always heating
    const base = runWeatherPipeline({ history: z.load, horizon: 24, temperature: z.temperature, vintages: z.vintages });
    const colder = base.temperature.map((t) => t - 2);
    const r = runWeatherPipeline({ history: z.load, horizon: 24, temperature: z.temperature, vintages: z.vintages, scenarios: [{ name: '−2 °C', temperature: colder }] });
    const diff = r.scenarios[0].forecast.mean.map((m, j) => m - r.forecast.mean[j]);
    // 2 degrees more heating at about 12 MW per degree (the construction); recency terms, if chosen, add their share
    for (const d of diff) expect(d).toBeGreaterThan(2 * 12 * 0.6);
    for (const d of diff) expect(d).toBeLessThan(2 * 12 * 1.6);
  });

  it('calibrates the bands on ordinary days; after Christmas and the New Year on the days that are not special nor the day after one; else on every day', () => {
    const day = (v: number, specialWeek: boolean, specialNear: boolean) => ({ z: [v], specialWeek, specialNear });
    // 4 days: 2 ordinary (half) → the ordinary days only
    expect(calibrationErrors([day(1, false, false), day(2, false, false), day(3, true, false), day(40, true, true)], 4)).toEqual([1, 2]);
    // 1 ordinary of 4, 2 not near a special day → those two
    expect(calibrationErrors([day(1, false, false), day(3, true, false), day(40, true, true), day(41, true, true)], 4)).toEqual([1, 3]);
    // 1 of 4 not near a special day → every error
    expect(calibrationErrors([day(1, false, false), day(3, true, true), day(40, true, true), day(41, true, true)], 4)).toEqual([1, 3, 40, 41]);
  });
});
