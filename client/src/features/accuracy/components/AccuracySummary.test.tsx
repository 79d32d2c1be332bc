import { screen, within } from '@testing-library/react';
import type { AccuracyZoneDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { renderWithProviders } from '../../../test/render';
import { AccuracySummary } from './AccuracySummary';
import { DayTable } from './DayTable';

const s = (mape: number | null, bias: number | null) => ({ hours: mape === null ? 0 : 47, mape, mae: mape === null ? null : 20, bias, peakErrorMw: null, peakErrorPct: null });
const zone: AccuracyZoneDto = {
  zone: 'MILLRACE',
  zoneName: 'Millrace',
  timeZone: 'America/Denver',
  days: [
    { operatingDay: '2026-03-08', hours: 23, actualHours: 23, actuals: 'complete', model: { id: 1, at: '', revision: null, replayed: false, score: s(20, -40), peakHourEnding: 'HE19' }, schedule: { id: 5, at: '', revision: 2, replayed: false, score: s(10, -20), peakHourEnding: 'HE19' }, adjustmentEffect: -10 },
    { operatingDay: '2026-03-09', hours: 24, actualHours: 0, actuals: 'none', model: null, schedule: null, adjustmentEffect: null },
  ],
  byHour: [],
  model: s(20, -40),
  schedule: s(10, -20),
  comparison: { days: 1, modelMape: 20, scheduleMape: 10, difference: -10, daysHelped: 1 },
  daysScored: 1,
  daysWithoutActuals: 1,
  daysWithoutForecast: 1,
  daysWithoutSchedule: 1,
  daysReplayed: 0,
};

describe('accuracy summary and day table', () => {
  it('sets model against schedule and says the adjustments helped', () => {
    renderWithProviders(<AccuracySummary subject={zone} />);
    const box = screen.getByTestId('accuracy-summary');
    expect(box).toHaveTextContent('Millrace (MILLRACE)');
    expect(box).toHaveTextContent('1 of 2 days scored · 1 without actuals');
    const mape = within(box).getByText('MAPE').closest('tr')!;
    expect(mape).toHaveTextContent('20.00 %');
    expect(mape).toHaveTextContent('10.00 %');
    expect(within(box).getByText('Bias (forecast − actual)').closest('tr')).toHaveTextContent('−40.0 MW (under-forecast)');
    expect(screen.getByTestId('accuracy-verdict')).toHaveTextContent("The adjustments helped: over 1 day, the published schedule's MAPE was 10.00 points lower");
    expect(box).toHaveTextContent('positive means the forecast was too high');
  });

  it('lists a day without actuals as such, not as zero error', () => {
    renderWithProviders(<DayTable subject={zone} />);
    const rows = within(screen.getByTestId('accuracy-days')).getAllByRole('row');
    expect(rows[1]).toHaveTextContent('2026-03-08');
    expect(rows[1]).toHaveTextContent('−10.00 pts');
    expect(rows[1]).toHaveTextContent('23-hour day');
    expect(rows[2]).toHaveTextContent('no actuals');
    expect(rows[2]).not.toHaveTextContent('0.00 %');
  });
});
