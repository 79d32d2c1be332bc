import { SCHEDULE_CAUTION, type DayScheduleDto, type ForecastDiffDto, type ZoneDto } from '@morrowline/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { sessionStore } from '../../../lib/session-store';
import { userFixture } from '../../../test/fixtures';
import { mockApi } from '../../../test/mock-api';
import { renderApp } from '../../../test/render';
import { hoursOf, revisionFixture, zoneFixture } from '../test-data';

const DAY = '2026-05-12';
const millrace: ZoneDto = { id: 1, code: 'MILLRACE', name: 'Millrace', timeZone: 'America/Denver', alertThresholdPct: 5, alertConsecutiveHours: 2, gateClosure: '10:00', minPlausibleMw: 0, maxPlausibleMw: 600, active: true };

const day = (zone: ReturnType<typeof zoneFixture>): DayScheduleDto => ({ operatingDay: DAY, serverTime: new Date().toISOString(), caution: SCHEDULE_CAUTION, zones: [zone] });

function diff(): ForecastDiffDto {
  const run = (id: number, issuedAt: string) => ({ id, zone: 'MILLRACE', issuedAt, origin: 'issued' as const, basedOnHour: null, method: 'arima' as const, modelVersionId: 5, firstHour: '2026-05-12T06:00:00.000Z', hours: 24 });
  return {
    zone: 'MILLRACE', from: run(2, '2026-05-11T21:05:00.000Z'), to: run(3, '2026-05-11T22:05:00.000Z'),
    hours: hoursOf(DAY).map((h, i) => ({ hour: h.intervalStartUtc, fromMw: 150 + i, toMw: i === 18 ? 190 : 150 + i, changeMw: i === 18 ? 22 : 0 })),
    largestChangeMw: 22, largestChangeHour: hoursOf(DAY)[18].intervalStartUtc,
  };
}

describe('forecast vintages on the day-ahead screen', () => {
  it('names the run the draft started from, warns of a newer one with the change by hour, and starts again from it', async () => {
    const working = revisionFixture('MILLRACE', DAY, 'draft', { forecastRunId: 2, forecastIssuedAt: '2026-05-11T21:05:00.000Z' });
    const zone = zoneFixture('MILLRACE', DAY, { working, newerForecast: { runId: 3, issuedAt: '2026-05-11T22:05:00.000Z', revisionRunId: 2, revisionIssuedAt: '2026-05-11T21:05:00.000Z' } });
    const { calls } = mockApi({
      'GET /api/auth/me': () => ({ body: userFixture('operator', { id: 2, name: 'Ines Marlow' }) }),
      'GET /api/zones': () => ({ body: [millrace] }),
      [`GET /api/schedules/${DAY}`]: () => ({ body: day(zone) }),
      [`GET /api/schedules/${DAY}/MILLRACE/revisions`]: () => ({ body: [working] }),
      'GET /api/forecasts/runs/2/diff': () => ({ body: diff() }),
      'POST /api/schedules/revisions/7/restart': () => ({ status: 201, body: { ...working, forecastRunId: 3 } }),
    });
    sessionStore.start('t', 3600);
    renderApp(`/schedules?day=${DAY}`);
    const user = userEvent.setup();

    // the draft's own run and issue time (15:05 in Denver), not the latest run's 16:05
    expect(await screen.findByTestId('revision-forecast')).toHaveTextContent('Revision 1 started from the forecast issued 2026-05-11 15:05 MDT (America/Denver), run 2.');
    const warning = screen.getByTestId('newer-forecast');
    expect(warning).toHaveTextContent('A newer forecast was issued 2026-05-11 16:05 MDT (America/Denver), run 3.');
    expect(await within(warning).findByText(/largest change is \+22\.0 MW at HE19/)).toBeInTheDocument();
    expect(within(warning).getByTestId('forecast-change-HE19')).toHaveTextContent(/HE19\s*168\.0\s*190\.0\s*\+22\.0/);
    const asked = calls.find((c) => c.path.startsWith('/api/forecasts/runs/2/diff'))!;
    expect(asked.path).toContain('against=3');
    expect(asked.path).toContain(`from=${encodeURIComponent('2026-05-12T06:00:00.000Z')}`);

    await user.click(within(warning).getByRole('button', { name: 'Start again from the latest run' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'POST' && c.path === '/api/schedules/revisions/7/restart')).toBe(true));
  });

  it('offers back to the model when adjustments are in force, and shows carried ones with their first revision', async () => {
    const adjustment = { id: 31, revisionId: 7, zone: 'MILLRACE', kind: 'add' as const, fromHour: 17, toHour: 19, value: 22.2, reason: 'Stadium concert', by: { id: 2, name: 'Ines Marlow' }, at: '2026-05-11T15:00:00.000Z', undoneAt: null, undoneBy: null, carriedFromRevision: 1, batchId: null };
    const working = revisionFixture('MILLRACE', DAY, 'draft', { revision: 2, adjustments: [adjustment], correctionReason: 'Concert moved' });
    const { calls } = mockApi({
      'GET /api/auth/me': () => ({ body: userFixture('operator', { id: 2, name: 'Ines Marlow' }) }),
      'GET /api/zones': () => ({ body: [millrace] }),
      [`GET /api/schedules/${DAY}`]: () => ({ body: day(zoneFixture('MILLRACE', DAY, { working })) }),
      [`GET /api/schedules/${DAY}/MILLRACE/revisions`]: () => ({ body: [working] }),
      'POST /api/schedules/revisions/7/back-to-model': () => ({ status: 201, body: working }),
    });
    sessionStore.start('t', 3600);
    renderApp(`/schedules?day=${DAY}`);
    const user = userEvent.setup();

    expect(await screen.findByTestId('adjustment-31')).toHaveTextContent(/Stadium concert\s*carried from revision 1/);
    expect(screen.queryByTestId('newer-forecast')).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Back to the model' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'POST' && c.path === '/api/schedules/revisions/7/back-to-model')).toBe(true));
  });
});
