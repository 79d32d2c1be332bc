/** The shift log: handover notes written by the outgoing shift, acknowledged by the incoming one. */

export const HANDOVER_ITEM_KINDS = ['open-issue', 'outage-in-progress', 'refit-pending', 'schedule-not-published', 'other'] as const;
export type HandoverItemKind = (typeof HANDOVER_ITEM_KINDS)[number];

export const HANDOVER_ITEM_STATUSES = ['open', 'closed'] as const;
export type HandoverItemStatus = (typeof HANDOVER_ITEM_STATUSES)[number];

export interface ShiftDto {
  /** e.g. "Day 06:00–14:00", in the desk's local time. */
  label: string;
  start: string;
  end: string;
  timeZone: string;
}

export interface CurrentShiftDto {
  current: ShiftDto;
  previous: ShiftDto;
  /** Operators and supervisors who signed in during the current shift. */
  onShift: { id: number; name: string; role: string }[];
}

export interface HandoverItemDto {
  id: number;
  kind: HandoverItemKind;
  zoneCode: string | null;
  text: string;
  status: HandoverItemStatus;
  /** The item of an earlier note this one carries on, if any. */
  carriedFromItemId: number | null;
}

export interface ShiftEventDto {
  at: string;
  action: string;
  actorEmail: string | null;
  subjectType: string;
  subjectId: string | null;
  reason: string | null;
  summary: string;
}

export interface HandoverNoteDto {
  id: number;
  shift: ShiftDto;
  author: { id: number; name: string };
  body: string;
  items: HandoverItemDto[];
  createdAt: string;
  acknowledgedBy: { id: number; name: string } | null;
  acknowledgedAt: string | null;
  reply: string | null;
}

export interface HandoverNoteWithEventsDto extends HandoverNoteDto {
  events: ShiftEventDto[];
}

/** What the outgoing operator starts from: the shift's events and the items still open. */
export interface HandoverDraftDto {
  shift: ShiftDto;
  events: ShiftEventDto[];
  openItems: HandoverItemDto[];
}

export interface HandoverItemInput {
  kind: HandoverItemKind;
  zoneCode?: string | null;
  text: string;
  status: HandoverItemStatus;
  carriedFromItemId?: number | null;
}

export interface CreateHandoverRequest {
  body: string;
  items: HandoverItemInput[];
}

export interface AcknowledgeHandoverRequest {
  reply?: string;
}
