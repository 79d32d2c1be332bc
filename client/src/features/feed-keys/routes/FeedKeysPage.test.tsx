import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { FeedKeyDto, ZoneDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { sessionStore } from '../../../lib/session-store';
import { userFixture } from '../../../test/fixtures';
import { mockApi } from '../../../test/mock-api';
import { renderApp } from '../../../test/render';

const admin = userFixture('admin', { name: 'Dana Oakes' });
const zone: ZoneDto = {
  id: 1, code: 'MILLRACE', name: 'Millrace', timeZone: 'America/Denver', alertThresholdPct: 8, alertConsecutiveHours: 2,
  gateClosure: '10:00', minPlausibleMw: 0, maxPlausibleMw: 500, active: true,
};
const key = (overrides: Partial<FeedKeyDto>): FeedKeyDto => ({
  id: 1, name: 'Millrace RTU', prefix: 'mlf_ab12', zone: 'MILLRACE', station: null, createdAt: '2026-12-01T17:00:00.000Z',
  createdBy: 'dana.oakes@tallowmere.example', lastUsedAt: null, revokedAt: null, ...overrides,
});

describe('feed-key screen', () => {
  it("lists the keys with their scope and the desk's clock, and creates one whose secret is shown once", async () => {
    const listed = [key({})];
    const { calls } = mockApi({
      'GET /api/auth/me': () => ({ body: admin }),
      'GET /api/clock': () => ({ body: { deskTimeZone: 'America/Denver' } }),
      'GET /api/zones': () => ({ body: [zone] }),
      'GET /api/feeds/keys': () => ({ body: listed }),
      'POST /api/feeds/keys': () => {
        const created = key({ id: 2, name: 'Spare feed', zone: null, prefix: 'mlf_cd34' });
        listed.push(created);
        return { status: 201, body: { feedKey: created, apiKey: 'mlf_cd34-the-whole-secret' } };
      },
    });
    sessionStore.start('admin-token', 3600);
    renderApp('/admin/feed-keys');
    const user = userEvent.setup();

    const row = await screen.findByTestId('feed-key-row-1');
    expect(row).toHaveTextContent('Millrace RTU');
    expect(row).toHaveTextContent('Millrace');
    // 17:00 UTC on 1 December is 10:00 Mountain Standard Time
    expect(row).toHaveTextContent('2026-12-01 10:00 MST');
    expect(row).toHaveTextContent('never');

    await user.click(screen.getByRole('button', { name: 'Create key' }));
    const dialog = await screen.findByRole('dialog');
    await user.click(within(dialog).getByRole('button', { name: 'Create key' }));
    expect(await within(dialog).findByText(/Name the feed/)).toBeInTheDocument();
    await user.type(within(dialog).getByLabelText(/Name/), 'Spare feed');
    await user.click(within(dialog).getByRole('button', { name: 'Create key' }));

    expect(await within(dialog).findByText('mlf_cd34-the-whole-secret')).toBeInTheDocument();
    expect(calls.find((c) => c.method === 'POST')?.body).toEqual({ name: 'Spare feed', zone: null });
    await user.click(within(dialog).getByRole('button', { name: 'I have copied it' }));
    expect(await screen.findByTestId('feed-key-row-2')).toHaveTextContent('any zone');
    expect(screen.queryByText('mlf_cd34-the-whole-secret')).not.toBeInTheDocument();
  });

  it('revokes a key with a reason', async () => {
    const { calls } = mockApi({
      'GET /api/auth/me': () => ({ body: admin }),
      'GET /api/zones': () => ({ body: [zone] }),
      'GET /api/feeds/keys': () => ({ body: [key({})] }),
      'POST /api/feeds/keys/1/revoke': () => ({ body: key({ revokedAt: '2026-12-02T15:00:00.000Z' }) }),
    });
    sessionStore.start('admin-token', 3600);
    renderApp('/admin/feed-keys');
    const user = userEvent.setup();

    await user.click(within(await screen.findByTestId('feed-key-row-1')).getByRole('button', { name: 'Revoke' }));
    const dialog = await screen.findByRole('dialog');
    await user.click(within(dialog).getByRole('button', { name: 'Revoke key' }));
    expect(await within(dialog).findByText('Say why, for the audit trail')).toBeInTheDocument();
    await user.type(within(dialog).getByLabelText(/Reason/), 'RTU replaced');
    await user.click(within(dialog).getByRole('button', { name: 'Revoke key' }));
    await screen.findByText('Millrace RTU can no longer send readings.');
    expect(calls.find((c) => c.path === '/api/feeds/keys/1/revoke')?.body).toEqual({ reason: 'RTU replaced' });
  });
});
