import { describe, expect, it } from 'vitest';
import { temperatureError } from './DayTable';

describe('the temperature forecast error of a day', () => {
  it('reads as its mean absolute error with the bias signed, or a dash without one', () => {
    expect(temperatureError({ asOf: '2026-11-01T17:00:00.000Z', hours: 24, maeC: 1.44, biasC: 0.61 })).toBe('1.4 °C (+0.6)');
    expect(temperatureError({ asOf: '2026-11-01T17:00:00.000Z', hours: 24, maeC: 2, biasC: -1.26 })).toBe('2.0 °C (−1.3)');
    expect(temperatureError({ asOf: '2026-11-01T17:00:00.000Z', hours: 0, maeC: null, biasC: null })).toBe('—');
    expect(temperatureError(undefined)).toBe('—');
  });
});
