import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { renderWithProviders } from '../../../test/render';
import { revisionFixture, zoneFixture } from '../test-data';
import { ZoneSchedulePanel } from './ZoneSchedulePanel';

const DAY = '2026-05-12';
const user = { id: 9, role: 'viewer' as const };

describe('a schedule drafted from a replayed forecast', () => {
  it('says its model values are a replay, with the time they stand for', () => {
    const published = revisionFixture('MILLRACE', DAY, 'published', { forecastReplayed: true, forecastIssuedAt: '2026-05-11T15:05:00.000Z' });
    renderWithProviders(<ZoneSchedulePanel day={DAY} zone={zoneFixture('MILLRACE', DAY, { forecast: null, published })} user={user} caution="" clockOffsetMs={0} />);
    expect(screen.getByTestId('schedule-replayed-forecast')).toHaveTextContent('replayed forecast');
    expect(screen.getByText(/as of 2026-05-11 15:05 UTC\), not one the desk issued then/)).toBeInTheDocument();
  });

  it('says nothing of the kind for a schedule drafted from an issued forecast', () => {
    const published = revisionFixture('MILLRACE', DAY, 'published');
    renderWithProviders(<ZoneSchedulePanel day={DAY} zone={zoneFixture('MILLRACE', DAY, { published })} user={user} caution="" clockOffsetMs={0} />);
    expect(screen.queryByTestId('schedule-replayed-forecast')).toBeNull();
  });
});
