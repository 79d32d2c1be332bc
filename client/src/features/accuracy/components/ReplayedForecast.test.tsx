import { screen, within } from '@testing-library/react';
import type { AccuracyDaySourceDto, AccuracyZoneDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { renderWithProviders } from '../../../test/render';
import { AccuracySummary } from './AccuracySummary';
import { DayTable } from './DayTable';
import { ZoneTable } from './ZoneTable';

const s = (mape: number) => ({ hours: 24, mape, mae: 5, bias: 1, peakErrorMw: 2, peakErrorPct: 1 });
const model = (replayed: boolean, mape: number): AccuracyDaySourceDto => ({ id: 1, at: '2026-11-29T16:05:00.000Z', revision: null, replayed, score: s(mape), peakHourEnding: 'HE18' });
const zone: AccuracyZoneDto = {
  zone: 'HARROW',
  zoneName: 'Harrow Flats',
  timeZone: 'America/Denver',
  days: [
    { operatingDay: '2026-11-29', hours: 24, actualHours: 24, actuals: 'complete', model: model(true, 4.25), schedule: null, adjustmentEffect: null },
    { operatingDay: '2026-11-30', hours: 24, actualHours: 24, actuals: 'complete', model: model(false, 3.5), schedule: null, adjustmentEffect: null },
  ],
  byHour: [],
  model: s(3.9),
  schedule: { hours: 0, mape: null, mae: null, bias: null, peakErrorMw: null, peakErrorPct: null },
  comparison: { days: 0, modelMape: null, scheduleMape: null, difference: null, daysHelped: 0 },
  daysScored: 2,
  daysWithoutActuals: 0,
  daysWithoutForecast: 0,
  daysWithoutSchedule: 2,
  daysReplayed: 1,
};

describe('replayed model forecasts on the Accuracy screen', () => {
  it('marks the day scored against a replay, and only that day', () => {
    renderWithProviders(<DayTable subject={zone} />);
    const rows = within(screen.getByTestId('accuracy-days')).getAllByRole('row');
    expect(within(rows[1]).getByTestId('accuracy-replayed-badge')).toHaveTextContent('replayed');
    expect(rows[1]).toHaveTextContent('4.25 %');
    expect(within(rows[2]).queryByTestId('accuracy-replayed-badge')).toBeNull();
    expect(rows[2]).toHaveTextContent('3.50 %');
  });

  it('says in the summary how many days are replays and that they are not what the desk issued', () => {
    renderWithProviders(<AccuracySummary subject={zone} />);
    const note = screen.getByTestId('accuracy-replayed-note');
    expect(note).toHaveTextContent('1 of the 2 days are scored against replayed model forecasts');
    expect(note).toHaveTextContent('not forecasts the desk issued at the time');
  });

  it('has no replay note when every forecast was issued', () => {
    renderWithProviders(<AccuracySummary subject={{ ...zone, days: [zone.days[1]], daysReplayed: 0 }} />);
    expect(screen.queryByTestId('accuracy-replayed-note')).toBeNull();
  });

  it('counts replayed days per zone in the zone table', () => {
    renderWithProviders(<ZoneTable zones={[zone]} system={zone} />);
    expect(screen.getByTestId('accuracy-zone-replayed')).toHaveTextContent('1 of 2 days');
  });
});
