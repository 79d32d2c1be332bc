import { SCHEDULE_CAUTION, type DayScheduleDto, type ZoneDto } from '@morrowline/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { sessionStore } from '../../../lib/session-store';
import { userFixture } from '../../../test/fixtures';
import { apiError, mockApi } from '../../../test/mock-api';
import { renderApp } from '../../../test/render';
import { revisionFixture, zoneFixture } from '../test-data';

const DAY = '2026-11-01';
const millrace: ZoneDto = { id: 1, code: 'MILLRACE', name: 'Millrace', timeZone: 'America/Denver', alertThresholdPct: 5, alertConsecutiveHours: 2, gateClosure: '10:00', minPlausibleMw: 0, maxPlausibleMw: 600, active: true };

function day(zone: ReturnType<typeof zoneFixture>): DayScheduleDto {
  return { operatingDay: DAY, serverTime: new Date().toISOString(), caution: SCHEDULE_CAUTION, zones: [zone] };
}

describe('day-ahead schedule screen', () => {
  it('shows 25 hours on the autumn day and sends an adjustment with its reason', async () => {
    const working = revisionFixture('MILLRACE', DAY, 'draft');
    const operator = userFixture('operator', { id: 2, name: 'Ines Marlow' });
    const { calls } = mockApi({
      'GET /api/auth/me': () => ({ body: operator }),
      'GET /api/zones': () => ({ body: [millrace] }),
      [`GET /api/schedules/${DAY}`]: () => ({ body: day(zoneFixture('MILLRACE', DAY, { working })) }),
      [`GET /api/schedules/${DAY}/MILLRACE/revisions`]: () => ({ body: [working] }),
      [`POST /api/schedules/${DAY}/adjustments`]: () => ({ status: 201, body: { adjustments: [], revisions: [working] } }),
    });
    sessionStore.start('t', 3600);
    renderApp(`/schedules?day=${DAY}`);
    const user = userEvent.setup();

    const table = await screen.findByRole('table', { name: 'Hours of Millrace' });
    expect(within(table).getAllByRole('row')).toHaveLength(26);
    expect(within(table).getByTestId('hour-HE25')).toBeInTheDocument();
    expect(calls.find((c) => c.path.startsWith(`/api/schedules/${DAY}?`))?.path).toBe(`/api/schedules/${DAY}?zone=MILLRACE`);

    const form = screen.getByRole('form', { name: 'Adjust the schedule' });
    await user.click(within(form).getByRole('button', { name: 'Apply adjustment' }));
    expect(await within(form).findByText('Say why: the supervisor and the audit trail read it')).toBeInTheDocument();
    expect(calls.some((c) => c.method === 'POST')).toBe(false);

    await user.type(within(form).getByLabelText(/MW to add/), '25');
    await user.type(within(form).getByLabelText(/Reason/), 'Lantern festival');
    await user.click(within(form).getByRole('button', { name: 'Apply adjustment' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'POST')).toBe(true));
    expect(calls.find((c) => c.method === 'POST')?.body).toEqual({ zones: ['MILLRACE'], kind: 'add', fromHour: 0, toHour: 24, value: 25, reason: 'Lantern festival' });
  });

  it('offers another supervisor approval with the caution, and shows the server refusal', async () => {
    const working = revisionFixture('MILLRACE', DAY, 'submitted', { submittedBy: { id: 2, name: 'Ines Marlow' }, submittedAt: '2026-10-31T14:00:00Z' });
    const supervisor = userFixture('supervisor', { id: 4, name: 'Hal Brennick' });
    const { calls } = mockApi({
      'GET /api/auth/me': () => ({ body: supervisor }),
      'GET /api/zones': () => ({ body: [millrace] }),
      [`GET /api/schedules/${DAY}`]: () => ({ body: day(zoneFixture('MILLRACE', DAY, { working })) }),
      [`GET /api/schedules/${DAY}/MILLRACE/revisions`]: () => ({ body: [working] }),
      'POST /api/schedules/revisions/7/approve': () => ({ status: 409, body: apiError(409, 'Conflict', 'Revision 1 was changed meanwhile') }),
    });
    sessionStore.start('t', 3600);
    renderApp(`/schedules?day=${DAY}`);
    const user = userEvent.setup();

    expect(await screen.findByTestId('publish-caution')).toHaveTextContent('never replace, the judgement of the responsible system operator');
    expect(screen.getByTestId('revision-state')).toHaveTextContent('Submitted by Ines Marlow');
    expect(screen.queryByRole('form', { name: 'Adjust the schedule' })).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Approve and publish' }));
    // one click only asks: nothing is sent until the supervisor confirms
    const confirm = await screen.findByRole('dialog');
    expect(calls.some((call) => call.path.endsWith('/approve'))).toBe(false);
    await user.click(within(confirm).getByRole('button', { name: 'Publish revision 1' }));
    expect(await screen.findByText('Revision 1 was changed meanwhile')).toBeInTheDocument();
  });

  it('shows a viewer the published revision read-only with downloads', async () => {
    const published = revisionFixture('MILLRACE', DAY, 'published', { publishedBy: { id: 4, name: 'Hal Brennick' }, publishedAt: '2026-10-31T15:00:00Z' });
    mockApi({
      'GET /api/auth/me': () => ({ body: userFixture('viewer') }),
      'GET /api/zones': () => ({ body: [millrace] }),
      [`GET /api/schedules/${DAY}`]: () => ({ body: day(zoneFixture('MILLRACE', DAY, { published })) }),
      [`GET /api/schedules/${DAY}/MILLRACE/revisions`]: () => ({ body: [published] }),
    });
    sessionStore.start('t', 3600);
    renderApp(`/schedules?day=${DAY}`);

    expect(await screen.findByText(/Approved and published by Hal Brennick/)).toBeInTheDocument();
    expect(screen.getAllByRole('button', { name: 'Download revision 1 as CSV' }).length).toBeGreaterThan(0);
    expect(screen.queryByRole('button', { name: 'Correct' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Submit/ })).not.toBeInTheDocument();
  });
});
