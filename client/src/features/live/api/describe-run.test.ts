import type { ForecastRunDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { describeRun } from './use-zone-forecast';

const run = (origin: ForecastRunDto['origin']): ForecastRunDto => ({
  id: 5, zone: 'MILLRACE', issuedAt: '2026-11-29T16:05:00.000Z', basedOnHour: '2026-11-29T15:00:00.000Z', origin, method: 'arima', fallbackReason: null, modelVersionId: null,
  hours: [], mean: [], lower80: [], upper80: [], lower95: [], upper95: [],
});

describe('the live chart’s forecast caption', () => {
  it('never presents a replayed run as issued', () => {
    expect(describeRun(run('replayed'))).toBe('Replayed forecast (worked out afterwards as of 2026-11-29 16:05 UTC; not issued by the desk then)');
    expect(describeRun(run('issued'))).toBe('Model forecast issued 2026-11-29 16:05 UTC');
  });
});
