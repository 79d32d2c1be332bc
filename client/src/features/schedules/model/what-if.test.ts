import type { WeatherVintagesDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { checkShift, vintageOptions } from './what-if';

describe('the weather what-if on the schedule', () => {
  it('reads the shift with the shared number parser and the documented range', () => {
    expect(checkShift('-2.5')).toBeNull();
    expect(checkShift('10')).toBeNull();
    expect(checkShift('10.1')).toMatch(/between −10 and 10 °C/);
    expect(checkShift('1e1')).toMatch(/not a plain decimal/);
    expect(checkShift('')).toMatch(/empty/);
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
