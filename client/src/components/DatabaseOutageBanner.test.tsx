import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { sessionStore } from '../lib/session-store';
import { serverStatusStore } from '../lib/server-status';
import { apiError, mockApi } from '../test/mock-api';
import { renderApp, renderWithProviders } from '../test/render';
import { DatabaseOutageBanner } from './DatabaseOutageBanner';

// Generous waits: the whole suite runs in parallel on a busy machine. Not a timing check.
const SLOW = { timeout: 8000 };
const HEALTH_DOWN = { status: 503, body: { status: 'degraded', database: 'down', version: '0.1.0', time: '' } };
const DOWN = { status: 503, body: apiError(503, 'Service Unavailable', 'The server cannot reach its database; try again shortly') };

describe('a database outage on the desk', () => {
  it('keeps the desk signed in and says the server cannot reach its database', async () => {
    mockApi({ 'GET /api/auth/me': () => DOWN, 'GET /api/health': () => HEALTH_DOWN });
    sessionStore.start('token', 3600);
    const { router } = renderApp('/live');

    expect(await screen.findByTestId('database-outage-banner', {}, SLOW)).toHaveTextContent('The server cannot reach its database');
    expect(sessionStore.getSnapshot().session?.token).toBe('token');
    expect(sessionStore.getSnapshot().endReason).toBeNull();
    expect(router.state.location.pathname).toBe('/live');
  });

  it('keeps checking health while the database is out, and goes when it is back', async () => {
    let down = true;
    const mock = mockApi({ 'GET /api/health': () => (down ? HEALTH_DOWN : { body: { status: 'ok', database: 'up', version: '0.1.0', time: '' } }) });
    serverStatusStore.databaseDown();
    renderWithProviders(<DatabaseOutageBanner retryMs={20} />);
    expect(screen.getByTestId('database-outage-banner')).toBeInTheDocument();

    await waitFor(() => expect(mock.calls.filter((c) => c.path === '/api/health').length).toBeGreaterThan(1), SLOW);
    expect(screen.getByTestId('database-outage-banner')).toBeInTheDocument();
    down = false;
    await waitFor(() => expect(screen.queryByTestId('database-outage-banner')).toBeNull(), SLOW);
    expect(serverStatusStore.getSnapshot()).toBe('ok');
  });

  it('shows nothing while the database answers', () => {
    serverStatusStore.reachable();
    renderWithProviders(<DatabaseOutageBanner />);
    expect(screen.queryByTestId('database-outage-banner')).toBeNull();
  });
});
