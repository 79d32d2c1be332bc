/**
 * Reader for hourly load history files: header `timestamp,load_mw`, one row per hour,
 * ISO 8601 timestamps with an offset or Z, an empty load meaning a missing hour. The rows are
 * placed on a regular hourly timeline (UTC start of each hour); hours absent from the file
 * become missing (NaN) rather than being dropped. Any bad row stops the read with an error that
 * names the line and the fault.
 */

export class CsvFormatError extends Error {
  constructor(
    readonly line: number,
    readonly fault: string,
  ) {
    super(`line ${line}: ${fault}`);
  }
}

export interface HourlySeries {
  /** UTC epoch milliseconds of the first hour */
  startMs: number;
  /** load in MW per hour from startMs, NaN for missing */
  values: Float64Array;
  /** UTC offset in minutes that applies to each hour (carried forward over gaps) */
  offsets: Int32Array;
  /** indices where a local operating day starts (local midnight in the file's offsets);
   *  includes values.length when the file ends exactly at a local midnight */
  dayStarts: number[];
  rows: number;
  /** hours with no value: empty loads plus hours absent from the file */
  missing: number;
}

/** A decimal number as the CSV files write it (sign, digits, optional fraction and exponent). */
export const CSV_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

const TS = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2})(?:\.(\d+))?)?(Z|[+-]\d{2}:?\d{2})$/;
const HOUR = 3600_000;

export function parseTimestamp(s: string): { ms: number; offsetMin: number } | string {
  const m = TS.exec(s);
  if (!m) return `timestamp "${s}" is not ISO 8601 with an offset or Z (e.g. 2024-03-01T00:00:00-06:00)`;
  const [, Y, Mo, D, h, mi, se, frac, off] = m;
  let offsetMin = 0;
  if (off !== 'Z') {
    const sign = off[0] === '-' ? -1 : 1;
    const digits = off.slice(1).replace(':', '');
    offsetMin = sign * (Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2)));
    if (Math.abs(offsetMin) > 14 * 60) return `offset ${off} is out of range`;
  }
  const mo = Number(Mo);
  const d = Number(D);
  if (mo < 1 || mo > 12 || d < 1 || d > 31 || Number(h) > 23 || Number(mi) > 59 || Number(se ?? 0) > 59) return `timestamp "${s}" is not a valid date and time`;
  const local = Date.UTC(Number(Y), mo - 1, d, Number(h), Number(mi), Number(se ?? 0), frac ? Number(`0.${frac}`) * 1000 : 0);
  const check = new Date(local);
  if (check.getUTCDate() !== d || check.getUTCMonth() !== mo - 1) return `timestamp "${s}" is not a valid date`;
  return { ms: local - offsetMin * 60_000, offsetMin };
}

export function parseLoadCsv(text: string): HourlySeries {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  while (lines.length && lines[lines.length - 1].trim() === '') lines.pop();
  if (!lines.length) throw new CsvFormatError(1, 'the file is empty; expected the header "timestamp,load_mw"');
  const header = lines[0].split(',').map((s) => s.trim().toLowerCase());
  if (header.length !== 2 || header[0] !== 'timestamp' || header[1] !== 'load_mw') {
    throw new CsvFormatError(1, `header must be "timestamp,load_mw", found "${lines[0]}"`);
  }
  const rows: Array<{ ms: number; off: number; v: number }> = [];
  for (let i = 1; i < lines.length; i++) {
    const ln = i + 1;
    const raw = lines[i];
    if (raw.trim() === '') throw new CsvFormatError(ln, 'empty line inside the data');
    const parts = raw.split(',');
    if (parts.length !== 2) throw new CsvFormatError(ln, `expected 2 fields (timestamp,load_mw), found ${parts.length}`);
    const ts = parseTimestamp(parts[0].trim());
    if (typeof ts === 'string') throw new CsvFormatError(ln, ts);
    if (ts.ms % HOUR !== 0) throw new CsvFormatError(ln, `timestamp "${parts[0].trim()}" is not the start of an hour`);
    const lv = parts[1].trim();
    let v = NaN;
    if (lv !== '') {
      if (!CSV_NUMBER.test(lv)) throw new CsvFormatError(ln, `load "${lv}" is not a number`);
      v = Number(lv);
      if (!Number.isFinite(v)) throw new CsvFormatError(ln, `load "${lv}" is not a finite number`);
      if (v < 0) throw new CsvFormatError(ln, `load ${lv} MW is negative`);
    }
    if (rows.length) {
      const prev = rows[rows.length - 1].ms;
      if (ts.ms === prev) throw new CsvFormatError(ln, `duplicate hour ${parts[0].trim()}`);
      if (ts.ms < prev) throw new CsvFormatError(ln, `timestamp ${parts[0].trim()} is earlier than the row before; rows must be in time order`);
    }
    rows.push({ ms: ts.ms, off: ts.offsetMin, v });
  }
  if (!rows.length) throw new CsvFormatError(2, 'no data rows after the header');
  const startMs = rows[0].ms;
  const n = (rows[rows.length - 1].ms - startMs) / HOUR + 1;
  if (n > 20 * 8784) throw new CsvFormatError(lines.length, `the file spans ${n} hours; at most 20 years are accepted`);
  const values = new Float64Array(n).fill(NaN);
  const offsets = new Int32Array(n);
  const known = new Uint8Array(n);
  for (const r of rows) {
    const i = (r.ms - startMs) / HOUR;
    values[i] = r.v;
    offsets[i] = r.off;
    known[i] = 1;
  }
  for (let i = 1; i < n; i++) if (!known[i]) offsets[i] = offsets[i - 1];
  const dayStarts: number[] = [];
  let missing = 0;
  for (let i = 0; i < n; i++) {
    if (Number.isNaN(values[i])) missing++;
    const localMs = startMs + i * HOUR + offsets[i] * 60_000;
    if (new Date(localMs).getUTCHours() === 0) dayStarts.push(i);
  }
  if (new Date(startMs + n * HOUR + offsets[n - 1] * 60_000).getUTCHours() === 0) dayStarts.push(n);
  return { startMs, values, offsets, dayStarts, rows: rows.length, missing };
}

/** Local calendar date (YYYY-MM-DD) of hour index i, in the file's own offset. */
export function localDate(s: HourlySeries, i: number): string {
  return new Date(s.startMs + i * HOUR + s.offsets[i] * 60_000).toISOString().slice(0, 10);
}
