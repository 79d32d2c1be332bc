import { refitZone, scoreChoice, type RefitWeather } from './refit';
import { scoreWeatherChoice } from './weather-score';
import { temperatureZone } from '../../../test/support/temperature-zone';

/** The zone of test/support/temperature-zone.ts, with this spec's own noise. */
const zone = () => temperatureZone(11);

describe('a version with weather terms is scored on its weather backtest', () => {
  const { values, weather } = zone();
  const n = values.length;
  const fitted = refitZone({ values, excluded: [], horizon: 48, backtestDays: 3, weather });
  const choice = fitted.weather!.choice!;

  it('stores the weather backtest as the version\'s score, over the same days as the week-earlier baseline', () => {
    expect(fitted.weather?.used).toBe(true);
    const plain = scoreChoice(values, [], { diff: fitted.model!.diff, p: fitted.model!.p, q: fitted.model!.q }, 3);
    const own = scoreWeatherChoice(values, [], weather, choice, 3);
    expect(fitted.score).toEqual(own);
    // the same three whole days as the score of the model without weather, and the same baseline
    expect([own.days, own.from, own.to]).toEqual([3, n - 72, n]);
    expect([plain.days, plain.from, plain.to]).toEqual([3, n - 72, n]);
    expect(own.baselineMape).toBeCloseTo(plain.baselineMape!, 9);
    // a load 12 MW/°C below 14 °C with the weather wandering: the terms take most of the error away
    expect(own.mape!).toBeLessThan(plain.mape! * 0.8);
  });

  it('never reads a vintage issued after a day\'s origin, nor the temperature observed after it', () => {
    const before = scoreWeatherChoice(values, [], weather, choice, 3);
    // every vintage issued after the last scored day's origin, and the temperature observed from then on, made absurd
    const lastOrigin = n - 24;
    const corrupted: RefitWeather = {
      ...weather,
      temperature: weather.temperature.map((v, t) => (t >= lastOrigin ? 45 : v)),
      vintages: weather.vintages.map((v) => (v.issued > lastOrigin ? { ...v, members: v.members.map((m) => m.map(() => 45)) } : v)),
    };
    expect(scoreWeatherChoice(values, [], corrupted, choice, 3)).toEqual(before);
    // the vintages of the first day's origin do count: corrupting them moves the score
    const earlier: RefitWeather = { ...weather, vintages: weather.vintages.map((v) => (v.issued > n - 96 ? { ...v, members: v.members.map((m) => m.map(() => -30)) } : v)) };
    expect(scoreWeatherChoice(values, [], earlier, choice, 3).mape).not.toBe(before.mape);
  });

  it('scores the model in service with its weather terms, and a version without them as before', () => {
    const plainChoice = { diff: fitted.model!.diff, p: fitted.model!.p, q: fitted.model!.q };
    const again = refitZone({ values, excluded: [], horizon: 48, backtestDays: 3, weather, inService: plainChoice, inServiceWeather: choice });
    expect(again.inServiceScore).toEqual(scoreWeatherChoice(values, [], weather, choice, 3));
    const withoutTerms = refitZone({ values, excluded: [], horizon: 48, backtestDays: 3, weather, inService: plainChoice, inServiceWeather: null });
    expect(withoutTerms.inServiceScore).toEqual(scoreChoice(values, [], plainChoice, 3));
    // a zone without observed temperature: today's score, the model without weather
    const noWeather = refitZone({ values, excluded: [], horizon: 48, backtestDays: 3 });
    expect(noWeather.score).toEqual(scoreChoice(values, [], { diff: noWeather.model!.diff, p: noWeather.model!.p, q: noWeather.model!.q }, 3));
  });
});
