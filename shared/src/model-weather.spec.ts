import { calendarEffects, dayBlockNames, responseBandBasis, temperatureResponseCurve, type ModelWeatherDto } from './model-weather';

const terms = { temperature: true, recency: false, calendar: true, heatBelow: 14, coolAbove: 20 };

describe('the temperature response drawn from a stored model', () => {
  it('is the mean over the parts of the day of the degree terms, zero between the thresholds', () => {
    // hand-computed: heating 20/24/28/32 MW per °C by part (mean 26), cooling 10 MW per °C in every part
    const response: ModelWeatherDto['response'] = [
      { name: 'hdd_night', value: 20, se: 2 },
      { name: 'hdd_morning', value: 24, se: 2 },
      { name: 'hdd_afternoon', value: 28, se: 2 },
      { name: 'hdd_evening', value: 32, se: 2 },
      ...['night', 'morning', 'afternoon', 'evening'].map((p) => ({ name: `cdd_${p}`, value: 10, se: null })),
    ];
    const [cold, mild, hot] = temperatureResponseCurve({ terms, response }, 4, 24, 10);
    expect(cold.temperatureC).toBe(4);
    expect(cold.mw).toBeCloseTo(26 * 10, 10);
    // 1.96 · √(4 · (10/4 · 2)²) = 1.96 · 10 = 19.6
    expect(cold.upper95 - cold.mw).toBeCloseTo(19.6, 10);
    expect(mild).toEqual({ temperatureC: 14, mw: 0, lower95: 0, upper95: 0 });
    expect(hot.mw).toBeCloseTo(4 * 10, 10);
  });

  it('uses the coefficients\' covariance for the band when it is stored, and says when it is not', () => {
    // two heating terms at 4 °C (10 degrees below 14): x = (10, 10) for hdd_mean24 and hdd_lag3;
    // se 2 and 3, correlation −0.5: Var = 100·4 + 100·9 + 2·100·(−0.5·2·3) = 700 (hand-computed)
    const t = { ...terms, recency: true };
    const response = [{ name: 'hdd_mean24', value: 5, se: 2 }, { name: 'hdd_lag3', value: 3, se: 3 }];
    const independent = temperatureResponseCurve({ terms: t, response }, 4, 4, 1)[0];
    expect(responseBandBasis({ response })).toBe('independent');
    expect(independent.upper95 - independent.mw).toBeCloseTo(1.96 * Math.sqrt(1300), 9);
    const responseCovariance = { names: ['hdd_mean24', 'hdd_lag3'], values: [4, -3, -3, 9] };
    expect(responseBandBasis({ response, responseCovariance })).toBe('covariance');
    const joint = temperatureResponseCurve({ terms: t, response, responseCovariance }, 4, 4, 1)[0];
    expect(joint.mw).toBeCloseTo(80, 9);
    expect(joint.upper95 - joint.mw).toBeCloseTo(1.96 * Math.sqrt(700), 9);
    // a covariance that does not name every coefficient, or is not square, is not used
    expect(responseBandBasis({ response, responseCovariance: { names: ['hdd_mean24'], values: [4] } })).toBe('independent');
    expect(responseBandBasis({ response, responseCovariance: { names: ['hdd_mean24', 'hdd_lag3'], values: [4, -3, 9] } })).toBe('independent');
  });

  it('adds the recency terms at a steady temperature, where the 24-hour mean and the 3-hour lag equal it', () => {
    const curve = temperatureResponseCurve({ terms: { ...terms, recency: true }, response: [{ name: 'hdd_mean24', value: 5, se: 1 }, { name: 'hdd_lag3', value: 3, se: 0 }] }, 10, 10, 1);
    expect(curve).toHaveLength(1);
    expect(curve[0].mw).toBeCloseTo(8 * 4, 10);
  });

  it('lists the calendar effects in MW, a holiday as the mean of its parts of the day', () => {
    const effects = calendarEffects({
      terms,
      response: [
        { name: 'holiday_night', value: -40, se: 4 },
        { name: 'holiday_morning', value: -120, se: 4 },
        { name: 'holiday_afternoon', value: -100, se: 4 },
        { name: 'holiday_evening', value: -60, se: 4 },
        { name: 'day_after', value: -15, se: 5 },
      ],
    });
    expect(effects).toEqual([
      { label: 'Public holiday', mw: -80, halfWidth95: 1.96 * 2 },
      { label: 'Day after a holiday', mw: -15, halfWidth95: 1.96 * 5 },
    ]);
    expect(calendarEffects({ terms: { ...terms, calendar: false }, response: [] })).toEqual([]);
  });

  it('reads the two-hour blocks of the day of versions that have them (hdd_h00 … hdd_h22), each weighing 1/12', () => {
    expect(dayBlockNames({ blockHours: 2 })).toEqual(['h00', 'h02', 'h04', 'h06', 'h08', 'h10', 'h12', 'h14', 'h16', 'h18', 'h20', 'h22']);
    expect(dayBlockNames({})).toEqual(['night', 'morning', 'afternoon', 'evening']);
    // hand-computed: heating 12 MW per °C in six blocks, 36 in the other six (mean 24); se 1 each
    const blocks = dayBlockNames({ blockHours: 2 });
    const response = blocks.map((b, i) => ({ name: `hdd_${b}`, value: i < 6 ? 12 : 36, se: 1 }));
    const [cold] = temperatureResponseCurve({ terms: { ...terms, blockHours: 2 }, response }, 4, 4, 1);
    expect(cold.mw).toBeCloseTo(24 * 10, 10);
    // 1.96 · √(12 · (10/12 · 1)²) = 1.96 · 10/√12
    expect(cold.upper95 - cold.mw).toBeCloseTo((1.96 * 10) / Math.sqrt(12), 10);
    const holiday = calendarEffects({ terms: { ...terms, blockHours: 2 }, response: blocks.map((b, i) => ({ name: `holiday_${b}`, value: i % 2 ? -100 : -50, se: 6 })) });
    expect(holiday).toHaveLength(1);
    expect(holiday[0].mw).toBeCloseTo(-75, 10);
    expect(holiday[0].halfWidth95).toBeCloseTo((1.96 * 6) / Math.sqrt(12), 10);
  });
});
