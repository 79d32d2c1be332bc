import type { HandoverItemDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { formToHandoverRequest, HANDOVER_FORM_MESSAGES, initialHandoverForm, newItem, validateHandoverForm } from './handover-form';

const stillOpen: HandoverItemDto = {
  id: 17,
  kind: 'outage-in-progress',
  zoneCode: 'QUARRY',
  text: 'Feeder Q-7 out since 09:40, crew on site',
  status: 'open',
  carriedFromItemId: 9,
};

describe('the handover form', () => {
  it('starts with every item left open, each pointing at the item it carries on', () => {
    const values = initialHandoverForm([stillOpen, { ...stillOpen, id: 18, kind: 'refit-pending', zoneCode: null, text: 'Refit HARROW after the heat' }]);
    expect(values.body).toBe('');
    expect(values.items.map(({ key: _key, ...item }) => item)).toEqual([
      { kind: 'outage-in-progress', zoneCode: 'QUARRY', text: 'Feeder Q-7 out since 09:40, crew on site', status: 'open', carriedFromItemId: 17 },
      { kind: 'refit-pending', zoneCode: '', text: 'Refit HARROW after the heat', status: 'open', carriedFromItemId: 18 },
    ]);
    expect(new Set(values.items.map((item) => item.key)).size).toBe(2);
  });

  it('wants some text or an item', () => {
    expect(validateHandoverForm({ body: '  \n', items: [] })).toEqual({ body: HANDOVER_FORM_MESSAGES.empty });
    expect(validateHandoverForm({ body: 'Quiet shift.', items: [] })).toEqual({});
    expect(validateHandoverForm({ body: '', items: [{ ...newItem(), text: 'Q-7 out' }] })).toEqual({});
  });

  it('wants a line of text on every item, and names the one missing it', () => {
    const items = [{ ...newItem(), text: 'Q-7 out' }, { ...newItem(), text: '   ' }];
    expect(validateHandoverForm({ body: 'x', items })).toEqual({ 'items.1.text': HANDOVER_FORM_MESSAGES.itemText });
  });

  it('sends trimmed text, no zone as null, and carriedFromItemId only for carried items', () => {
    const [carried] = initialHandoverForm([stillOpen]).items;
    const request = formToHandoverRequest({
      body: '  Q-7 restored at 15:10.  ',
      items: [{ ...carried, status: 'closed' }, { ...newItem(), text: ' Printer fixed ', kind: 'other' }],
    });
    expect(request).toEqual({
      body: 'Q-7 restored at 15:10.',
      items: [
        { kind: 'outage-in-progress', zoneCode: 'QUARRY', text: 'Feeder Q-7 out since 09:40, crew on site', status: 'closed', carriedFromItemId: 17 },
        { kind: 'other', zoneCode: null, text: 'Printer fixed', status: 'open' },
      ],
    });
  });
});
