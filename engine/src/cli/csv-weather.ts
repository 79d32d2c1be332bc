/**
 * Readers for the weather and calendar files the command line takes beside a load file (the forms
 * `npm run simulate -- --export` writes and the desk's weather uploads read):
 *   temperature.csv            timestamp,temp_c                     one row per hour
 *   temperature-forecasts.csv  issued_at,timestamp,temp_c[,member]  one row per vintage, hour (and member)
 *   special-days.csv           day,kind                             kind public-holiday|bridge-day|local-event
 * Strict like the load reader (./csv-series): the header must be exactly that, every timestamp ISO
 * 8601 with an offset or Z at the start of an hour, temperatures numbers within −60..60 °C, no
 * duplicate key, forecasts for hours that end after their issue time and at most 16 days ahead of
 * it. Any bad row stops the read with the line and the fault.
 */
import { CsvFormatError, parseTimestamp } from './csv-series';
import type { TemperatureForecastRow } from '@morrowline/engine';

const HOUR = 3_600_000;
const MAX_AHEAD_MS = 16 * 24 * HOUR;
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

function dataLines(text: string, header: string[], alt?: string[]): { lines: string[]; fields: number } {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  while (lines.length && lines[lines.length - 1].trim() === '') lines.pop();
  const want = `"${header.join(',')}"${alt ? ` or "${alt.join(',')}"` : ''}`;
  if (!lines.length) throw new CsvFormatError(1, `the file is empty; expected the header ${want}`);
  const got = lines[0].split(',').map((s) => s.trim().toLowerCase());
  const same = (h: string[]) => got.length === h.length && h.every((x, i) => got[i] === x);
  if (!same(header) && !(alt && same(alt))) throw new CsvFormatError(1, `header must be ${want}, found "${lines[0]}"`);
  if (lines.length < 2) throw new CsvFormatError(2, 'no data rows after the header');
  return { lines, fields: got.length };
}

function hourOf(s: string, ln: number, what: string): number {
  const ts = parseTimestamp(s.trim());
  if (typeof ts === 'string') throw new CsvFormatError(ln, `${what}: ${ts}`);
  return ts.ms;
}

function temperatureOf(s: string, ln: number): number {
  const v = s.trim();
  if (!NUMBER.test(v)) throw new CsvFormatError(ln, `temperature "${v}" is not a number`);
  const t = Number(v);
  if (t < -60 || t > 60) throw new CsvFormatError(ln, `temperature ${v} °C is outside −60..60 °C`);
  return t;
}

function fieldsOf(raw: string, ln: number, fields: number, names: string): string[] {
  if (raw.trim() === '') throw new CsvFormatError(ln, 'empty line inside the data');
  const parts = raw.split(',');
  if (parts.length !== fields) throw new CsvFormatError(ln, `expected ${fields} fields (${names}), found ${parts.length}`);
  return parts;
}

/** Observed temperature placed on the load's timeline (hours outside it are ignored), NaN where absent. */
export function parseTemperatureCsv(text: string, startMs: number, hours: number): Float64Array {
  const { lines } = dataLines(text, ['timestamp', 'temp_c']);
  const out = new Float64Array(hours).fill(NaN);
  const seen = new Set<number>();
  for (let i = 1; i < lines.length; i++) {
    const ln = i + 1;
    const [ts, v] = fieldsOf(lines[i], ln, 2, 'timestamp,temp_c');
    const ms = hourOf(ts, ln, 'timestamp');
    if (ms % HOUR !== 0) throw new CsvFormatError(ln, `timestamp "${ts.trim()}" is not the start of an hour`);
    if (seen.has(ms)) throw new CsvFormatError(ln, `duplicate hour ${ts.trim()}`);
    seen.add(ms);
    const t = temperatureOf(v, ln);
    const k = (ms - startMs) / HOUR;
    if (k >= 0 && k < hours) out[k] = t;
  }
  return out;
}

/** Forecast rows (issued_at,timestamp,temp_c[,member]). */
export function parseTemperatureForecastCsv(text: string): TemperatureForecastRow[] {
  const { lines, fields } = dataLines(text, ['issued_at', 'timestamp', 'temp_c'], ['issued_at', 'timestamp', 'temp_c', 'member']);
  const rows: TemperatureForecastRow[] = [];
  const seen = new Set<string>();
  for (let i = 1; i < lines.length; i++) {
    const ln = i + 1;
    const parts = fieldsOf(lines[i], ln, fields, fields === 4 ? 'issued_at,timestamp,temp_c,member' : 'issued_at,timestamp,temp_c');
    const issuedMs = hourOf(parts[0], ln, 'issued_at');
    const hourMs = hourOf(parts[1], ln, 'timestamp');
    if (hourMs % HOUR !== 0) throw new CsvFormatError(ln, `timestamp "${parts[1].trim()}" is not the start of an hour`);
    if (hourMs + HOUR <= issuedMs) throw new CsvFormatError(ln, `the forecast for ${parts[1].trim()} was issued after that hour ended (${parts[0].trim()})`);
    if (hourMs - issuedMs > MAX_AHEAD_MS) throw new CsvFormatError(ln, `the forecast for ${parts[1].trim()} is more than 16 days ahead of its issue time`);
    const member = fields === 4 ? parts[3].trim() : undefined;
    if (member === '') throw new CsvFormatError(ln, 'member is empty');
    const key = `${issuedMs}|${hourMs}|${member ?? ''}`;
    if (seen.has(key)) throw new CsvFormatError(ln, `duplicate forecast for issue ${parts[0].trim()}, hour ${parts[1].trim()}${member ? `, member ${member}` : ''}`);
    seen.add(key);
    rows.push({ issuedMs, hourMs, tempC: temperatureOf(parts[2], ln), ...(member !== undefined ? { member } : {}) });
  }
  return rows;
}

export const SPECIAL_DAY_KINDS = ['public-holiday', 'bridge-day', 'local-event'] as const;
export type SpecialDayKind = (typeof SPECIAL_DAY_KINDS)[number];

/** Special days by local date (YYYY-MM-DD). */
export function parseCalendarCsv(text: string): Map<string, SpecialDayKind> {
  const { lines } = dataLines(text, ['day', 'kind']);
  const out = new Map<string, SpecialDayKind>();
  for (let i = 1; i < lines.length; i++) {
    const ln = i + 1;
    const [d, k] = fieldsOf(lines[i], ln, 2, 'day,kind').map((s) => s.trim());
    const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(d);
    const date = m ? new Date(Date.UTC(+m[1], +m[2] - 1, +m[3])) : null;
    if (!m || !date || date.getUTCMonth() !== +m[2] - 1 || date.getUTCDate() !== +m[3]) throw new CsvFormatError(ln, `day "${d}" is not a calendar date YYYY-MM-DD`);
    if (!(SPECIAL_DAY_KINDS as readonly string[]).includes(k)) throw new CsvFormatError(ln, `kind "${k}" is not one of ${SPECIAL_DAY_KINDS.join(', ')}`);
    if (out.has(d)) throw new CsvFormatError(ln, `duplicate day ${d}`);
    out.set(d, k as SpecialDayKind);
  }
  return out;
}
