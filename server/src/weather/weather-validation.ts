import {
  FORECAST_MEMBER_PATTERN,
  HOUR_MS,
  MAX_FORECAST_HINDCAST_HOURS,
  MAX_FORECAST_LEAD_HOURS,
  MAX_TEMP_C,
  MIN_TEMP_C,
  parseInstant,
  type WeatherRejectionReason,
} from '@morrowline/shared';

/** What validation needs to know about a station. */
export interface StationRef {
  id: number;
  code: string;
}

export interface WeatherContext {
  stations: ReadonlyMap<string, StationRef>;
  /** Server clock, ms. */
  now: number;
  /** A feed key limited to one station. */
  allowedStation?: string | null;
}

export interface ValidObservation {
  stationId: number;
  station: string;
  hourStart: number;
  tempC: number;
}

export interface ValidForecast {
  stationId: number;
  station: string;
  issuedAt: number;
  hourStart: number;
  member: string;
  tempC: number;
}

export type Checked<T> = { ok: true; value: T } | { ok: false; reason: WeatherRejectionReason; message: string };

/** How far past the server's clock an observed hour or an issue time may lie: one hour, for clock differences. */
export const MAX_AHEAD_HOURS = 1;

function reject<T>(reason: WeatherRejectionReason, message: string): Checked<T> {
  return { ok: false, reason, message };
}

function station(code: unknown, context: WeatherContext): Checked<StationRef> {
  if (typeof code !== 'string' || code.length === 0) return reject('malformed', 'station must be a station code');
  const found = context.stations.get(code);
  if (!found) return reject('unknown-station', `No weather station with code ${code.slice(0, 40)}`);
  if (context.allowedStation && context.allowedStation !== code) return reject('station-not-allowed', `This feed key may only send weather for ${context.allowedStation}`);
  return { ok: true, value: found };
}

function temperature(value: unknown): Checked<number> {
  if (typeof value !== 'number' || !Number.isFinite(value)) return reject('not-a-number', 'tempC must be a finite number of degrees Celsius');
  if (value < MIN_TEMP_C || value > MAX_TEMP_C) {
    return reject('implausible', `tempC ${value} is outside ${MIN_TEMP_C} to ${MAX_TEMP_C} °C (a value in °F or kelvin, or a sensor fault)`);
  }
  return { ok: true, value };
}

function hourStart(text: unknown, field: string): Checked<number> {
  const parsed = parseInstant(text, field);
  if (!parsed.ok) return reject('malformed', parsed.message);
  if (parsed.value % HOUR_MS !== 0) return reject('not-on-the-hour', `${field} ${String(text)} is not the start of an hour`);
  return { ok: true, value: parsed.value };
}

function object(raw: unknown): Record<string, unknown> | null {
  return typeof raw === 'object' && raw !== null && !Array.isArray(raw) ? (raw as Record<string, unknown>) : null;
}

/** One observed temperature as a feed or a CSV row sent it. Pure: no database, no clock of its own. */
export function validateObservation(raw: unknown, context: WeatherContext): Checked<ValidObservation> {
  const fields = object(raw);
  if (!fields) return reject('malformed', 'An observation must be an object with station, hour and tempC');
  const s = station(fields.station, context);
  if (!s.ok) return s;
  const hour = hourStart(fields.hour, 'hour');
  if (!hour.ok) return hour;
  const temp = temperature(fields.tempC);
  if (!temp.ok) return temp;
  if (hour.value > Math.floor(context.now / HOUR_MS) * HOUR_MS + MAX_AHEAD_HOURS * HOUR_MS) {
    return reject('too-far-in-future', `hour ${String(fields.hour)} lies in the future; observations are for hours that have begun`);
  }
  return { ok: true, value: { stationId: s.value.id, station: s.value.code, hourStart: hour.value, tempC: temp.value } };
}

/** One forecast value of a vintage. */
export function validateForecast(raw: unknown, context: WeatherContext): Checked<ValidForecast> {
  const fields = object(raw);
  if (!fields) return reject('malformed', 'A forecast value must be an object with station, issuedAt, hour and tempC');
  const s = station(fields.station, context);
  if (!s.ok) return s;
  const issued = parseInstant(fields.issuedAt, 'issuedAt');
  if (!issued.ok) return reject('malformed', issued.message);
  const hour = hourStart(fields.hour, 'hour');
  if (!hour.ok) return hour;
  const temp = temperature(fields.tempC);
  if (!temp.ok) return temp;
  const member = fields.member === undefined || fields.member === null || fields.member === '' ? '' : fields.member;
  if (member !== '' && (typeof member !== 'string' || !FORECAST_MEMBER_PATTERN.test(member))) {
    return reject('malformed', 'member must be a label of up to 16 letters, digits, ".", "_" or "-" (e.g. m07, p10), or left out for the central forecast');
  }
  if (issued.value > context.now + MAX_AHEAD_HOURS * HOUR_MS) {
    return reject('too-far-in-future', `issuedAt ${String(fields.issuedAt)} lies in the future; a forecast is stored once it has been issued`);
  }
  const lead = (hour.value - issued.value) / HOUR_MS;
  if (lead > MAX_FORECAST_LEAD_HOURS) return reject('too-far-in-future', `hour ${String(fields.hour)} lies more than ${MAX_FORECAST_LEAD_HOURS / 24} days after the issue time`);
  if (lead < -MAX_FORECAST_HINDCAST_HOURS) return reject('malformed', `hour ${String(fields.hour)} lies more than ${MAX_FORECAST_HINDCAST_HOURS} hours before the issue time: not a forecast`);
  return { ok: true, value: { stationId: s.value.id, station: s.value.code, issuedAt: issued.value, hourStart: hour.value, member: member as string, tempC: temp.value } };
}
