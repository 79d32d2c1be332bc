import { isZoneCode, ZONE_CODE_RULE, type CreateZoneRequest, type UpdateZoneRequest, type ZoneDto } from '@morrowline/shared';

/** What the zone form edits; numbers may be '' while a field is being typed. */
export interface ZoneFormValues {
  code: string;
  name: string;
  timeZone: string;
  alertThresholdPct: number | string;
  alertConsecutiveHours: number | string;
  gateClosure: string;
  minPlausibleMw: number | string;
  maxPlausibleMw: number | string;
  active: boolean;
  reason: string;
}

export const EMPTY_ZONE_FORM: ZoneFormValues = {
  code: '',
  name: '',
  timeZone: '',
  alertThresholdPct: 5,
  alertConsecutiveHours: 2,
  gateClosure: '10:00',
  minPlausibleMw: 0,
  maxPlausibleMw: 500,
  active: true,
  reason: '',
};

export function zoneToForm(zone: ZoneDto): ZoneFormValues {
  return { ...zone, reason: '' };
}

const HIGHEST_PLAUSIBLE_MW = 100_000;
const GATE_PATTERN = /^([01]\d|2[0-3]):[0-5]\d$/;

function isNumber(value: number | string): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

/**
 * `otherZones`: the zones other than the one being edited; a name one of them has (trimmed, any
 * case) is refused here as the server refuses it (409), so the form says so beside the field.
 */
export function validateZoneForm(values: ZoneFormValues, timeZones: readonly string[], creating: boolean, otherZones: readonly Pick<ZoneDto, 'code' | 'name'>[] = []) {
  const errors: Partial<Record<keyof ZoneFormValues, string>> = {};
  if (creating && !isZoneCode(values.code.trim().toUpperCase())) {
    errors.code = ZONE_CODE_RULE;
  }
  const taken = otherZones.find((zone) => zone.name.trim().toLowerCase() === values.name.trim().toLowerCase());
  if (!values.name.trim()) errors.name = 'Enter a name';
  else if (taken) errors.name = `Zone ${taken.code} is already called "${taken.name}"; choose another name`;
  if (!timeZones.includes(values.timeZone)) errors.timeZone = 'Choose an IANA time zone';
  if (!isNumber(values.alertThresholdPct) || values.alertThresholdPct <= 0 || values.alertThresholdPct > 100) {
    errors.alertThresholdPct = 'Between 0 and 100 %';
  }
  if (
    !isNumber(values.alertConsecutiveHours) ||
    !Number.isInteger(values.alertConsecutiveHours) ||
    values.alertConsecutiveHours < 1 ||
    values.alertConsecutiveHours > 48
  ) {
    errors.alertConsecutiveHours = 'A whole number of hours, 1 to 48';
  }
  if (!GATE_PATTERN.test(values.gateClosure)) errors.gateClosure = 'A time as HH:mm';
  if (!isNumber(values.minPlausibleMw) || values.minPlausibleMw < 0) errors.minPlausibleMw = 'Zero or more MW';
  if (!isNumber(values.maxPlausibleMw)) errors.maxPlausibleMw = 'Enter a value in MW';
  else if (values.maxPlausibleMw > HIGHEST_PLAUSIBLE_MW) errors.maxPlausibleMw = 'At most 100,000 MW';
  else if (isNumber(values.minPlausibleMw) && values.maxPlausibleMw <= values.minPlausibleMw) {
    errors.maxPlausibleMw = 'Must be above the lowest plausible load';
  }
  return errors;
}

/** Only call after validateZoneForm found nothing: the numbers are then numbers. */
/** The settings a zone is created and changed with, as the API takes them. */
function formToSettings(values: ZoneFormValues): Omit<CreateZoneRequest, 'code'> {
  return {
    name: values.name.trim(),
    timeZone: values.timeZone,
    alertThresholdPct: Number(values.alertThresholdPct),
    alertConsecutiveHours: Number(values.alertConsecutiveHours),
    gateClosure: values.gateClosure,
    minPlausibleMw: Number(values.minPlausibleMw),
    maxPlausibleMw: Number(values.maxPlausibleMw),
    active: values.active,
  };
}

export function formToCreateRequest(values: ZoneFormValues): CreateZoneRequest {
  return { code: values.code, ...formToSettings(values) };
}

export function formToUpdateRequest(values: ZoneFormValues): UpdateZoneRequest {
  const update: UpdateZoneRequest = formToSettings(values);
  const reason = values.reason.trim();
  return reason ? { ...update, reason } : update;
}

/** Every IANA zone the browser knows, for the time-zone picker. */
export function supportedTimeZones(): string[] {
  try {
    return Intl.supportedValuesOf('timeZone');
  } catch {
    return ['UTC'];
  }
}
