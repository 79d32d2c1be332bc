import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { sessionStore } from '../../../lib/session-store';
import { userFixture } from '../../../test/fixtures';
import { apiError, mockApi } from '../../../test/mock-api';
import { renderApp } from '../../../test/render';

const admin = userFixture('admin', { name: 'Dana Oakes', email: 'dana.oakes@tallowmere.example' });
const viewer = userFixture('viewer', { name: 'Pia Lund', email: 'pia.lund@tallowmere.example', lastLoginAt: '2026-02-27T06:30:00Z' });
const retired = userFixture('operator', { name: 'Old Hand', active: false });

describe('users screen', () => {
  it('lists the users from GET /api/users, with role and status', async () => {
    const { calls } = mockApi({
      'GET /api/auth/me': () => ({ body: admin }),
      'GET /api/users': () => ({ body: [admin, viewer, retired] }),
    });
    sessionStore.start('admin-token', 3600);
    renderApp('/admin/users');

    const table = await screen.findByRole('table', { name: 'Users' });
    const viewerRow = within(table).getByTestId(`user-row-${viewer.id}`);
    expect(viewerRow).toHaveTextContent('Pia Lund');
    expect(viewerRow).toHaveTextContent('pia.lund@tallowmere.example');
    expect(viewerRow).toHaveTextContent('Viewer');
    expect(viewerRow).toHaveTextContent('Active');
    expect(within(viewerRow).getByRole('button', { name: 'Deactivate' })).toBeInTheDocument();

    const retiredRow = within(table).getByTestId(`user-row-${retired.id}`);
    expect(retiredRow).toHaveTextContent('Deactivated');
    expect(within(retiredRow).getByRole('button', { name: 'Reactivate' })).toBeInTheDocument();

    // No one can lock themselves out from their own row.
    const ownRow = within(table).getByTestId(`user-row-${admin.id}`);
    expect(ownRow).toHaveTextContent('Your account');
    expect(within(ownRow).queryByRole('button')).not.toBeInTheDocument();

    expect(calls.find((call) => call.path === '/api/users')?.headers.Authorization).toBe('Bearer admin-token');
  });

  it('deactivates a user with a reason through PATCH /api/users/:id', async () => {
    const { calls } = mockApi({
      'GET /api/auth/me': () => ({ body: admin }),
      'GET /api/users': () => ({ body: [admin, viewer] }),
      [`PATCH /api/users/${viewer.id}`]: () => ({ body: { ...viewer, active: false } }),
    });
    sessionStore.start('admin-token', 3600);
    renderApp('/admin/users');
    const user = userEvent.setup();

    const row = await screen.findByTestId(`user-row-${viewer.id}`);
    await user.click(within(row).getByRole('button', { name: 'Deactivate' }));
    const dialog = await screen.findByRole('dialog');
    await user.click(within(dialog).getByRole('button', { name: 'Deactivate user' }));
    expect(await within(dialog).findByText('Say why, for the audit trail')).toBeInTheDocument();

    await user.type(within(dialog).getByLabelText(/Reason/), 'Left the trading desk');
    await user.click(within(dialog).getByRole('button', { name: 'Deactivate user' }));

    await waitFor(() => expect(calls.some((call) => call.method === 'PATCH')).toBe(true));
    expect(calls.find((call) => call.method === 'PATCH')?.body).toEqual({ active: false, reason: 'Left the trading desk' });
  });

  it('shows the server message when the list cannot be loaded', async () => {
    mockApi({
      'GET /api/auth/me': () => ({ body: admin }),
      'GET /api/users': () => ({ status: 500, body: apiError(500, 'Internal Server Error', 'Database is not answering') }),
    });
    sessionStore.start('admin-token', 3600);
    renderApp('/admin/users');

    expect(await screen.findByText('Database is not answering', {}, { timeout: 4000 })).toBeInTheDocument();
  });
});
