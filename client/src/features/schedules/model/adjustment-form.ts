import type { CreateScheduleAdjustmentRequest, ScheduleAdjustmentKind } from '@morrowline/shared';

/** The adjustment form as it edits: hours are slot indices as strings (Select values). */
export interface AdjustmentFormValues {
  zones: string[];
  kind: ScheduleAdjustmentKind;
  /** '' until chosen; NumberInput gives '' when empty. */
  value: number | string;
  fromHour: string;
  toHour: string;
  reason: string;
}

export const ADJUSTMENT_KIND_LABELS: Record<ScheduleAdjustmentKind, string> = {
  set: 'Set to MW',
  add: 'Add MW',
  scale: 'Scale by %',
};

export const ADJUSTMENT_FORM_MESSAGES = {
  zones: 'Choose at least one zone',
  value: 'Enter a number',
  setNegative: 'A schedule is never below 0 MW',
  zero: 'A change of 0 changes nothing',
  scaleFloor: 'Scaling by −100 % or less would leave nothing',
  fromHour: 'Choose the first hour',
  toHour: 'Choose the last hour',
  order: 'The last hour comes before the first',
  reason: 'Say why: the supervisor and the audit trail read it',
} as const;

export function initialAdjustmentForm(zones: string[], hourCount: number): AdjustmentFormValues {
  return { zones, kind: 'add', value: '', fromHour: '0', toHour: String(Math.max(0, hourCount - 1)), reason: '' };
}

/** The server's rules, said before the request goes out: zones, a number that changes something, a range in order, a reason. */
export function validateAdjustmentForm(values: AdjustmentFormValues): Record<string, string> {
  const errors: Record<string, string> = {};
  if (values.zones.length === 0) errors.zones = ADJUSTMENT_FORM_MESSAGES.zones;
  const value = typeof values.value === 'number' ? values.value : values.value.trim() === '' ? NaN : Number(values.value);
  if (!Number.isFinite(value)) errors.value = ADJUSTMENT_FORM_MESSAGES.value;
  else if (values.kind === 'set' && value < 0) errors.value = ADJUSTMENT_FORM_MESSAGES.setNegative;
  else if (values.kind !== 'set' && value === 0) errors.value = ADJUSTMENT_FORM_MESSAGES.zero;
  else if (values.kind === 'scale' && value <= -100) errors.value = ADJUSTMENT_FORM_MESSAGES.scaleFloor;
  if (values.fromHour === '') errors.fromHour = ADJUSTMENT_FORM_MESSAGES.fromHour;
  if (values.toHour === '') errors.toHour = ADJUSTMENT_FORM_MESSAGES.toHour;
  if (values.fromHour !== '' && values.toHour !== '' && Number(values.toHour) < Number(values.fromHour)) errors.toHour = ADJUSTMENT_FORM_MESSAGES.order;
  if (values.reason.trim() === '') errors.reason = ADJUSTMENT_FORM_MESSAGES.reason;
  return errors;
}

export function formToAdjustmentRequest(values: AdjustmentFormValues): CreateScheduleAdjustmentRequest {
  return {
    zones: values.zones,
    kind: values.kind,
    fromHour: Number(values.fromHour),
    toHour: Number(values.toHour),
    value: Number(values.value),
    reason: values.reason.trim(),
  };
}

/** "Add 25 MW", "Set to 180 MW", "Scale by −5 %". */
export function describeAdjustment(kind: ScheduleAdjustmentKind, value: number): string {
  const shown = String(value).replace('-', '−');
  if (kind === 'set') return `Set to ${shown} MW`;
  if (kind === 'add') return value < 0 ? `Take off ${String(-value)} MW` : `Add ${shown} MW`;
  return `Scale by ${value > 0 ? '+' : ''}${shown} %`;
}
