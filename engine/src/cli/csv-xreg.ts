/**
 * Reader for regressor files given to `npm run fit -- --xreg FILE.csv`: header
 * `timestamp,NAME1,NAME2,…`, one row per hour of the load file's timeline and no other, in time
 * order, every value a number (the regressors are fitted as given, so nothing is filled in).
 * Timestamps as in the load file (ISO 8601 with an offset or Z, the start of an hour; the
 * load reader's parseTimestamp). Any fault stops the read with an error naming the line.
 */
import { CSV_NUMBER, CsvFormatError, HourlySeries, parseTimestamp } from './csv-series';

export interface RegressorColumns {
  names: string[];
  /** one column per name, one value per hour of the load's timeline */
  columns: Float64Array[];
}

const HOUR = 3600_000;
const RESERVED = new Set(['timestamp', 'intercept']);

const iso = (ms: number): string => new Date(ms).toISOString().replace('.000Z', 'Z');

export function parseRegressorCsv(text: string, load: Pick<HourlySeries, 'startMs' | 'values'>): RegressorColumns {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  while (lines.length && lines[lines.length - 1].trim() === '') lines.pop();
  if (!lines.length) throw new CsvFormatError(1, 'the file is empty; expected the header "timestamp,NAME1,NAME2,…"');
  const header = lines[0].split(',').map((s) => s.trim());
  if (header[0].toLowerCase() !== 'timestamp' || header.length < 2) throw new CsvFormatError(1, `header must be "timestamp," followed by one or more regressor names, found "${lines[0]}"`);
  const names = header.slice(1);
  const seen = new Set<string>();
  for (const nm of names) {
    if (nm === '') throw new CsvFormatError(1, 'a regressor name in the header is empty');
    if (RESERVED.has(nm.toLowerCase())) throw new CsvFormatError(1, `"${nm}" cannot name a regressor (reserved)`);
    if (seen.has(nm)) throw new CsvFormatError(1, `regressor "${nm}" appears twice in the header`);
    seen.add(nm);
  }
  const n = load.values.length;
  const columns = names.map(() => new Float64Array(n));
  const first = load.startMs;
  const last = first + (n - 1) * HOUR;
  let expected = 0;
  for (let i = 1; i < lines.length; i++) {
    const ln = i + 1;
    const parts = lines[i].split(',');
    if (lines[i].trim() === '') throw new CsvFormatError(ln, 'empty line inside the data');
    if (parts.length !== header.length) throw new CsvFormatError(ln, `expected ${header.length} fields (${header.join(',')}), found ${parts.length}`);
    const stamp = parts[0].trim();
    const ts = parseTimestamp(stamp);
    if (typeof ts === 'string') throw new CsvFormatError(ln, ts);
    if (ts.ms % HOUR !== 0) throw new CsvFormatError(ln, `timestamp "${stamp}" is not the start of an hour`);
    if (ts.ms < first || ts.ms > last) throw new CsvFormatError(ln, `hour ${stamp} is outside the load's hours (${iso(first)} to ${iso(last)})`);
    const at = (ts.ms - first) / HOUR;
    if (at < expected) throw new CsvFormatError(ln, `hour ${stamp} is ${at === expected - 1 ? 'a duplicate' : 'earlier than the row before; rows must be in time order'}`);
    if (at > expected) throw new CsvFormatError(ln, `no row for the load's hour ${iso(first + expected * HOUR)} (the next row is ${stamp}); every hour of the load needs its regressor values`);
    for (let j = 0; j < names.length; j++) {
      const v = parts[j + 1].trim();
      if (v === '') throw new CsvFormatError(ln, `${names[j]} is empty; every regressor needs a value for every hour`);
      if (!CSV_NUMBER.test(v)) throw new CsvFormatError(ln, `${names[j]} "${v}" is not a number`);
      const x = Number(v);
      if (!Number.isFinite(x)) throw new CsvFormatError(ln, `${names[j]} "${v}" is not a finite number`);
      columns[j][at] = x;
    }
    expected++;
  }
  if (expected < n) throw new CsvFormatError(lines.length + 1, `the file ends before the load's hour ${iso(first + expected * HOUR)}; every hour of the load (to ${iso(last)}) needs its regressor values`);
  return { names, columns };
}
