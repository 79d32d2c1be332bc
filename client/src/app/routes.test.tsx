import { act, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { sessionStore } from '../lib/session-store';
import { userFixture } from '../test/fixtures';
import { apiError, mockApi } from '../test/mock-api';
import { renderApp } from '../test/render';

describe('app routes', () => {
  it('sends a visitor without a session to sign-in', async () => {
    mockApi({});
    const { router } = renderApp('/accuracy');
    expect(await screen.findByRole('button', { name: 'Sign in' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
  });

  it('shows the signed-in user and role in the header and only the role’s sections', async () => {
    const viewer = userFixture('viewer', { name: 'Pia Lund' });
    mockApi({ 'GET /api/auth/me': () => ({ body: viewer }) });
    sessionStore.start('v', 3600);
    renderApp('/');

    expect(await screen.findByTestId('signed-in-name')).toHaveTextContent('Pia Lund');
    expect(screen.getByTestId('signed-in-role')).toHaveTextContent('Viewer');
    const navigation = screen.getByRole('navigation', { name: 'Sections' });
    expect(navigation).toHaveTextContent('Live load');
    expect(navigation).not.toHaveTextContent('Users');
    expect(navigation).not.toHaveTextContent('Refits');
  });

  it('links every role to the wall display from the navigation, and keeps it behind sign-in', async () => {
    const viewer = userFixture('viewer');
    mockApi({ 'GET /api/auth/me': () => ({ body: viewer }) });
    sessionStore.start('v', 3600);
    renderApp('/');
    const link = await screen.findByRole('link', { name: 'Wall display' });
    expect(link).toHaveAttribute('href', '/wall');
  });

  it('sends a visitor without a session from the wall display to sign-in', async () => {
    mockApi({});
    const { router } = renderApp('/wall');
    expect(await screen.findByRole('button', { name: 'Sign in' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
  });

  it('refuses an admin screen to a viewer who types its address', async () => {
    const viewer = userFixture('viewer');
    const { calls } = mockApi({ 'GET /api/auth/me': () => ({ body: viewer }) });
    sessionStore.start('v', 3600);
    renderApp('/admin/users');

    expect(await screen.findByText('Users is not available for your role')).toBeInTheDocument();
    expect(calls.some((call) => call.path.startsWith('/api/users'))).toBe(false);
  });

  it('returns to sign-in with a message when the token expires, then back to the same page', async () => {
    vi.useFakeTimers({ shouldAdvanceTime: true });
    const operator = userFixture('operator');
    mockApi({
      'GET /api/auth/me': () => ({ body: operator }),
      'POST /api/auth/login': () => ({ body: { accessToken: 'fresh', tokenType: 'Bearer', expiresIn: 3600, user: operator } }),
    });
    sessionStore.start('short', 60);
    const { router } = renderApp('/refits?zone=MILLRACE');
    expect(await screen.findByRole('heading', { name: 'Refits' })).toBeInTheDocument();

    act(() => {
      vi.advanceTimersByTime(61_000);
    });

    expect(await screen.findByText('Your session has expired, please sign in again')).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');

    const user = userEvent.setup({ advanceTimers: vi.advanceTimersByTime });
    await user.type(screen.getByLabelText('E-mail'), operator.email);
    await user.type(screen.getByLabelText('Password'), 'operator-demo');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/refits'));
    expect(router.state.location.search).toBe('?zone=MILLRACE');
  });

  it('goes back to sign-in when the server rejects the token', async () => {
    mockApi({ 'GET /api/auth/me': () => ({ status: 401, body: apiError(401, 'Unauthorized', 'Token revoked') }) });
    sessionStore.start('revoked', 3600);
    const { router } = renderApp('/live');

    expect(await screen.findByText('Your session has expired, please sign in again')).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
  });

  it('signs out even when the server does not answer', async () => {
    const supervisor = userFixture('supervisor');
    mockApi({
      'GET /api/auth/me': () => ({ body: supervisor }),
      'POST /api/auth/logout': () => ({ status: 503, body: apiError(503, 'Service Unavailable', 'Down') }),
    });
    sessionStore.start('s', 3600);
    const { router } = renderApp('/schedules');

    await userEvent.setup().click(await screen.findByRole('button', { name: 'Sign out' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(sessionStore.token()).toBeNull();
    expect(screen.queryByText('Your session has expired, please sign in again')).not.toBeInTheDocument();
  });
});
