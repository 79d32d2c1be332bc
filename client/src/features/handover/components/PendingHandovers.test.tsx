import type { Role } from '@morrowline/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

// Generous waits: the whole suite runs in parallel on a busy machine. Not a timing check.
const SLOW = { timeout: 5000 };
import { sessionStore } from '../../../lib/session-store';
import { userFixture } from '../../../test/fixtures';
import { apiError, mockApi } from '../../../test/mock-api';
import { renderApp } from '../../../test/render';
import { mayAcknowledge } from '../acknowledge-rule';
import { currentShift, draftWith, noteFixture, quarryZone } from '../test-data';

const ines = userFixture('operator', { name: 'Ines Marlow' });
const tomas = userFixture('operator', { name: 'Tomas Reedy' });
const waiting = noteFixture({
  id: 31,
  author: { id: ines.id, name: ines.name },
  body: '**Q-7** still out.',
  items: [{ id: 5, kind: 'outage-in-progress', zoneCode: 'QUARRY', text: 'Feeder Q-7 out, crew on site', status: 'open', carriedFromItemId: null }],
});

function shiftLogAs(me: typeof ines, acknowledge?: () => { status: number; body: unknown }) {
  const mock = mockApi({
    'GET /api/auth/me': () => ({ body: me }),
    'GET /api/handover/shift': () => ({ body: currentShift }),
    'GET /api/handover/draft': () => ({ body: draftWith([]) }),
    'GET /api/handover/pending': () => ({ body: [waiting] }),
    'GET /api/zones': () => ({ body: [quarryZone] }),
    'POST /api/handover/31/acknowledge': acknowledge ?? (() => ({ status: 201, body: { ...waiting, acknowledgedBy: { id: me.id, name: me.name } } })),
  });
  sessionStore.start('token', 3600);
  renderApp('/shift-log');
  return mock;
}

describe('who is offered "Acknowledge"', () => {
  it('is an operator or supervisor who did not write the note, while nobody has acknowledged it', () => {
    const note = { author: { id: 7, name: 'Ines Marlow' }, acknowledgedAt: null };
    const offered = (role: Role, id = 8) => mayAcknowledge({ id, role }, note);
    expect(offered('operator')).toBe(true);
    expect(offered('supervisor')).toBe(true);
    expect(offered('operator', 7)).toBe(false);
    expect(offered('viewer')).toBe(false);
    expect(offered('admin')).toBe(false);
    expect(mayAcknowledge({ id: 8, role: 'operator' }, { ...note, acknowledgedAt: '2026-03-03T21:05:00Z' })).toBe(false);
  });

  it('hides the button from the note’s author and says why', async () => {
    shiftLogAs(ines);
    const card = await screen.findByTestId('handover-note-31', {}, SLOW);
    expect(within(card).getByText(/Your handover: the next operator or supervisor/)).toBeInTheDocument();
    expect(within(card).queryByRole('button', { name: 'Acknowledge' })).not.toBeInTheDocument();
  });

  it("names an item's zone, not its code", async () => {
    shiftLogAs(ines);
    const item = await screen.findByTestId('handover-item-5', {}, SLOW);
    await waitFor(() => expect(item).toHaveTextContent(`Outage in progress · ${quarryZone.name} — Feeder Q-7 out`), SLOW);
    expect(item).not.toHaveTextContent('QUARRY');
  });

  it('offers the incoming operator the button and sends the reply', async () => {
    const { calls } = shiftLogAs(tomas);
    const user = userEvent.setup();
    const card = await screen.findByTestId('handover-note-31', {}, SLOW);
    expect(card.querySelector('strong')).toHaveTextContent('Q-7');
    await user.click(within(card).getByLabelText(/Reply to the outgoing shift/));
    await user.paste('Got it, I have the desk.');
    await user.click(within(card).getByRole('button', { name: 'Acknowledge' }));
    await waitFor(() => expect(calls.some((call) => call.method === 'POST')).toBe(true), SLOW);
    expect(calls.find((call) => call.method === 'POST')?.body).toEqual({ reply: 'Got it, I have the desk.' });
  });

  it('shows the server’s message when it refuses', async () => {
    shiftLogAs(tomas, () => ({ status: 400, body: apiError(400, 'Bad Request', 'Already acknowledged by Hal Brennick') }));
    const user = userEvent.setup();
    const card = await screen.findByTestId('handover-note-31', {}, SLOW);
    await user.click(within(card).getByRole('button', { name: 'Acknowledge' }));
    expect(await within(card).findByText('Already acknowledged by Hal Brennick', {}, SLOW)).toBeInTheDocument();
  });
});

describe('the banner on every desk screen', () => {
  it('names who wrote the waiting handover and links to the shift log', async () => {
    mockApi({
      'GET /api/auth/me': () => ({ body: tomas }),
      'GET /api/handover/pending': () => ({ body: [waiting] }),
    });
    sessionStore.start('token', 3600);
    renderApp('/accuracy');
    const banner = await screen.findByTestId('pending-handover-banner', {}, SLOW);
    expect(banner).toHaveTextContent('Handover from Ines Marlow');
    expect(within(banner).getByRole('link', { name: 'Read and acknowledge it' })).toHaveAttribute('href', '/shift-log');
  });

  it('is not shown while nothing waits', async () => {
    mockApi({
      'GET /api/auth/me': () => ({ body: tomas }),
      'GET /api/handover/pending': () => ({ body: [] }),
    });
    sessionStore.start('token', 3600);
    renderApp('/accuracy');
    await screen.findByRole('heading', { name: 'Accuracy' }, SLOW);
    await waitFor(() => expect(screen.queryByTestId('pending-handover-banner')).not.toBeInTheDocument());
  });
});
