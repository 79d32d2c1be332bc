import type { CreateHandoverRequest, HandoverItemDto, HandoverItemKind, HandoverItemStatus } from '@morrowline/shared';

/** One structured item as the form edits it; `key` only keeps React rows stable. */
export interface HandoverItemFormValue {
  key: string;
  kind: HandoverItemKind;
  /** '' for no particular zone. */
  zoneCode: string;
  text: string;
  status: HandoverItemStatus;
  /** Set when the item carries on one left open by an earlier note. */
  carriedFromItemId: number | null;
}

export interface HandoverFormValues {
  body: string;
  items: HandoverItemFormValue[];
}

let keySequence = 0;
function nextKey(): string {
  keySequence += 1;
  return `item-${keySequence}`;
}

export function newItem(): HandoverItemFormValue {
  return { key: nextKey(), kind: 'open-issue', zoneCode: '', text: '', status: 'open', carriedFromItemId: null };
}

/** An item still open from an earlier note, ready to carry on; the writer may close it. */
export function carryOver(item: HandoverItemDto): HandoverItemFormValue {
  return { key: nextKey(), kind: item.kind, zoneCode: item.zoneCode ?? '', text: item.text, status: 'open', carriedFromItemId: item.id };
}

/** A new note starts with every item left open by earlier notes. */
export function initialHandoverForm(openItems: HandoverItemDto[]): HandoverFormValues {
  return { body: '', items: openItems.map(carryOver) };
}

export const HANDOVER_FORM_MESSAGES = {
  empty: 'Write a few words or add an item: the next shift needs something to go on',
  itemText: 'Say what the item is about',
} as const;

/** The same rules as the server: some text or an item; every item with a line of text. */
export function validateHandoverForm(values: HandoverFormValues): Record<string, string> {
  const errors: Record<string, string> = {};
  if (values.body.trim() === '' && values.items.length === 0) errors.body = HANDOVER_FORM_MESSAGES.empty;
  values.items.forEach((item, index) => {
    if (item.text.trim() === '') errors[`items.${index}.text`] = HANDOVER_FORM_MESSAGES.itemText;
  });
  return errors;
}

export function formToHandoverRequest(values: HandoverFormValues): CreateHandoverRequest {
  return {
    body: values.body.trim(),
    items: values.items.map((item) => ({
      kind: item.kind,
      zoneCode: item.zoneCode || null,
      text: item.text.trim(),
      status: item.status,
      ...(item.carriedFromItemId !== null ? { carriedFromItemId: item.carriedFromItemId } : {}),
    })),
  };
}
