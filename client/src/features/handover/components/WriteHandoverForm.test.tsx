import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

// Generous waits: the whole suite runs in parallel on a busy machine. Not a timing check.
const SLOW = { timeout: 5000 };
import { sessionStore } from '../../../lib/session-store';
import { userFixture } from '../../../test/fixtures';
import { apiError, mockApi } from '../../../test/mock-api';
import { renderApp } from '../../../test/render';
import { currentShift, draftWith, noteFixture, quarryZone } from '../test-data';

const tomas = userFixture('operator', { name: 'Tomas Reedy' });
const carried = {
  id: 17,
  kind: 'outage-in-progress' as const,
  zoneCode: 'QUARRY',
  text: 'Feeder Q-7 out since 09:40, crew on site',
  status: 'open' as const,
  carriedFromItemId: null,
};

function deskWith(openItems: (typeof carried)[], post?: () => { status?: number; body: unknown }) {
  const mock = mockApi({
    'GET /api/auth/me': () => ({ body: tomas }),
    'GET /api/handover/shift': () => ({ body: currentShift }),
    'GET /api/handover/draft': () => ({ body: draftWith(openItems) }),
    'GET /api/handover/pending': () => ({ body: [] }),
    'GET /api/zones': () => ({ body: [quarryZone] }),
    'POST /api/handover': post ?? (() => ({ status: 201, body: noteFixture({ author: { id: tomas.id, name: tomas.name } }) })),
  });
  sessionStore.start('operator-token', 3600);
  renderApp('/shift-log');
  return mock;
}

describe('writing a handover', () => {
  it('pre-fills the items left open by earlier notes, and shows the shift events beside the form', async () => {
    deskWith([carried]);
    const row = await screen.findByTestId('item-row-0', {}, SLOW);
    expect(row).toHaveAttribute('data-carried', 'true');
    expect(within(row).getByText('Carried on from an earlier note')).toBeInTheDocument();
    expect(within(row).getByLabelText('Text of item 1')).toHaveValue('Feeder Q-7 out since 09:40, crew on site');
    // A carried item is closed, not dropped.
    expect(within(row).queryByRole('button', { name: 'Remove item 1' })).not.toBeInTheDocument();

    const events = screen.getByRole('table', { name: 'Events this shift' });
    expect(events).toHaveTextContent('Outage window marked · zone QUARRY');
    expect(events).toHaveTextContent('why: Feeder Q-7 tripped');
    expect(events).toHaveTextContent('15:15'); // 22:15 UTC in the desk's zone
  });

  it('refuses an empty note and an item without text, and sends nothing', async () => {
    const { calls } = deskWith([]);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Hand over' }, SLOW));
    expect(await screen.findByText(/Write a few words or add an item/, {}, SLOW)).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Add item' }));
    await user.click(screen.getByRole('button', { name: 'Hand over' }));
    expect(await screen.findByText('Say what the item is about', {}, SLOW)).toBeInTheDocument();
    expect(calls.some((call) => call.method === 'POST')).toBe(false);
  });

  // Many fields and clicks in jsdom: a longer limit for a slow machine, not a timing check.
  it('sends a carried item closed with the id it carries on, and a new item open', { timeout: 20_000 }, async () => {
    const { calls } = deskWith([carried]);
    const user = userEvent.setup();
    const row = await screen.findByTestId('item-row-0', {}, SLOW);
    await user.click(within(row).getByText('Closed'));
    await user.click(screen.getByLabelText('Handover note'));
    await user.paste('Q-7 restored at 15:10.');
    await user.click(screen.getByRole('button', { name: 'Add item' }));
    await user.click(screen.getByLabelText('Text of item 2'));
    await user.paste('HE18 peak looks high for Harrow Flats');
    await user.click(screen.getByRole('button', { name: 'Hand over' }));

    await waitFor(() => expect(calls.some((call) => call.method === 'POST')).toBe(true), SLOW);
    expect(calls.find((call) => call.method === 'POST')?.body).toEqual({
      body: 'Q-7 restored at 15:10.',
      items: [
        { kind: 'outage-in-progress', zoneCode: 'QUARRY', text: 'Feeder Q-7 out since 09:40, crew on site', status: 'closed', carriedFromItemId: 17 },
        { kind: 'open-issue', zoneCode: null, text: 'HE18 peak looks high for Harrow Flats', status: 'open' },
      ],
    });
    expect(await screen.findByTestId('handed-over', {}, SLOW)).toBeInTheDocument();
  });

  it('shows the server message when it refuses the note', async () => {
    deskWith([], () => ({ status: 400, body: apiError(400, 'Bad Request', 'A handover needs some text or at least one item') }));
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Handover note', {}, SLOW), 'x');
    await user.click(screen.getByRole('button', { name: 'Hand over' }));
    expect(await screen.findByText('A handover needs some text or at least one item', {}, SLOW)).toBeInTheDocument();
  });
});
