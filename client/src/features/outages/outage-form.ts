import { DateTime } from 'luxon';
import type { CreateOutageRequest, OutageDto, OutageKind, UpdateOutageRequest } from '@morrowline/shared';

/** What the window form holds: times as the zone's wall clock, "2026-11-01T01:00" (datetime-local). */
export interface OutageFormValues {
  kind: OutageKind;
  start: string;
  /** Empty while the window is still open. */
  end: string;
  stillOpen: boolean;
  note: string;
  /** Only when editing: why the window changes (the server audits it). */
  reason: string;
}

export type LocalTime = { iso: string; error: null; ambiguous: boolean } | { iso: null; error: string; ambiguous: false };

const LOCAL_FORMAT = "yyyy-LL-dd'T'HH:mm";

/**
 * A wall-clock time of the zone as ISO 8601 with the zone's offset, e.g. "2026-07-14T09:00:00-06:00".
 * A time that the clocks skip (spring forward) is refused; a time they pass twice (fall back) is
 * the first of the two, and flagged so the form can say so.
 */
export function localToIso(local: string, timeZone: string): LocalTime {
  if (!local.trim()) return { iso: null, error: 'Enter a date and time', ambiguous: false };
  const value = DateTime.fromISO(local, { zone: timeZone });
  if (!value.isValid) return { iso: null, error: 'Enter a date and time', ambiguous: false };
  // Luxon moves a skipped wall time forward; read it back to see whether it survived.
  if (value.toFormat(LOCAL_FORMAT) !== DateTime.fromISO(local).toFormat(LOCAL_FORMAT)) {
    return { iso: null, error: `${local.replace('T', ' ')} does not happen in ${timeZone}: the clocks go forward that night`, ambiguous: false };
  }
  // At a fall-back change luxon gives the later of the two; take the first, when the window begins.
  const earlier = value.minus({ hours: 1 });
  const ambiguous = earlier.toFormat(LOCAL_FORMAT) === value.toFormat(LOCAL_FORMAT);
  if (ambiguous) return { iso: earlier.toISO({ suppressMilliseconds: true })!, error: null, ambiguous };
  return { iso: value.toISO({ suppressMilliseconds: true })!, error: null, ambiguous };
}

/** A stored UTC time as the zone's wall clock for the form. */
export function isoToLocal(iso: string | null, timeZone: string): string {
  if (!iso) return '';
  return DateTime.fromISO(iso, { zone: timeZone }).toFormat(LOCAL_FORMAT);
}

/** Field errors of the form, null where a field is fine. */
export function validateOutageForm(values: OutageFormValues, timeZone: string, editing: boolean): Partial<Record<keyof OutageFormValues, string>> {
  const errors: Partial<Record<keyof OutageFormValues, string>> = {};
  const start = localToIso(values.start, timeZone);
  if (start.error) errors.start = start.error;
  if (!values.stillOpen) {
    const end = localToIso(values.end, timeZone);
    if (end.iso === null) errors.end = values.end.trim() ? end.error : 'Enter the end, or tick "still open"';
    else if (start.iso && Date.parse(end.iso) <= Date.parse(start.iso)) errors.end = 'The end must be after the start';
  }
  if (!values.note.trim()) errors.note = 'Say what happened, e.g. which feeder';
  if (editing && !values.reason.trim()) errors.reason = 'Say why the window changes';
  return errors;
}

export function toCreateRequest(zone: string, values: OutageFormValues, timeZone: string): CreateOutageRequest {
  const start = localToIso(values.start, timeZone);
  const end = values.stillOpen ? null : localToIso(values.end, timeZone).iso;
  if (!start.iso) throw new Error(start.error ?? 'bad start');
  return { zone, kind: values.kind, start: start.iso, end, note: values.note.trim() };
}

export function toUpdateRequest(values: OutageFormValues, timeZone: string): UpdateOutageRequest {
  const request = toCreateRequest('', values, timeZone);
  return { kind: request.kind, start: request.start, end: request.end, note: request.note, reason: values.reason.trim() };
}

export function formValuesOf(outage: OutageDto | null, timeZone: string): OutageFormValues {
  if (!outage) return { kind: 'outage', start: '', end: '', stillOpen: false, note: '', reason: '' };
  return { kind: outage.kind, start: isoToLocal(outage.start, timeZone), end: isoToLocal(outage.end, timeZone), stillOpen: outage.end === null, note: outage.note, reason: '' };
}

export const KIND_LABELS: Record<OutageKind, string> = { outage: 'Outage', 'bad-data': 'Bad data' };
