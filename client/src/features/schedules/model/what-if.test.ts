import type { WeatherVintagesDto, WeatherWhatIfDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { checkShift, vintageOptions, whatIfAdjustments } from './what-if';

const hour = (h: number, changeMw: number | null) => ({ hourStart: `2026-11-02T${String(h).padStart(2, '0')}:00:00.000Z`, modelMw: 500, temperatureC: 3, whatIfTemperatureC: 1, whatIfMw: changeMw === null ? null : 500 + changeMw, changeMw });

describe('the weather what-if on the schedule', () => {
  it('reads the shift with the shared number parser and the documented range', () => {
    expect(checkShift('-2.5')).toBeNull();
    expect(checkShift('10')).toBeNull();
    expect(checkShift('10.1')).toMatch(/between −10 and 10 °C/);
    expect(checkShift('1e1')).toMatch(/not a plain decimal/);
    expect(checkShift('')).toMatch(/empty/);
  });

  it('turns the what-if into one add per schedule hour, rounded to 0.1 MW, skipping hours without a change', () => {
    const w = { hours: [hour(7, 50.04), hour(8, 0.02), hour(9, null), hour(10, -12.36)] } as WeatherWhatIfDto;
    const slots = [7, 8, 9, 10].map((h, index) => ({ index, intervalStartUtc: `2026-11-02T${String(h).padStart(2, '0')}:00:00Z`, hourEnding: `HE0${index + 1}` }));
    expect(whatIfAdjustments(w, slots, 'QUARRY', 'cold front', '−2 °C')).toEqual([
      { zones: ['QUARRY'], kind: 'add', fromHour: 0, toHour: 0, value: 50, reason: 'cold front (weather what-if: −2 °C)' },
      { zones: ['QUARRY'], kind: 'add', fromHour: 3, toHour: 3, value: -12.4, reason: 'cold front (weather what-if: −2 °C)' },
    ]);
  });

  it('offers the vintages known for the day newest first, in the zone\'s time, the forecast\'s own marked and a partial one flagged', () => {
    const v: WeatherVintagesDto = {
      zone: 'QUARRY',
      operatingDay: '2026-11-02',
      forecastVintageIssuedAt: '2026-11-01T05:00:00.000Z',
      vintages: [
        { issuedAt: '2026-11-02T05:00:00.000Z', hours: 18, usedByForecast: false },
        { issuedAt: '2026-11-01T05:00:00.000Z', hours: 24, usedByForecast: true },
        { issuedAt: '2026-10-31T05:00:00.000Z', hours: 24, usedByForecast: false },
      ],
    };
    // America/Denver: MDT (UTC−6) until 08:00 UTC on 1 November 2026, MST (UTC−7) after (common knowledge of US time zones)
    expect(vintageOptions(v, 'America/Denver')).toEqual([
      { value: '2026-11-02T05:00:00.000Z', label: expect.stringMatching(/^.*22:00.* \(18 h of the day\)$/) },
      { value: '2026-11-01T05:00:00.000Z', label: expect.stringMatching(/23:00.* — the forecast’s$/) },
      { value: '2026-10-31T05:00:00.000Z', label: expect.not.stringMatching(/forecast|h of the day/) },
    ]);
  });
});
