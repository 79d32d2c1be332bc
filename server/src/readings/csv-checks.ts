import { parseInstant } from '@morrowline/shared';
import type { CsvRowRejection } from '@morrowline/shared';

/** Separators other than a comma that a spreadsheet may write, by how a message names them. */
const OTHER_DELIMITERS: [string, string][] = [
  [';', 'semicolons'],
  ['\t', 'tabs'],
  ['|', 'vertical bars'],
];

/**
 * Why a whole file is refused for its separator, or null when it is comma-separated. The first
 * line with content decides: no valid line (a timestamp, a plain number, a zone code) can hold a
 * semicolon, tab or vertical bar, so one there means the file is in another dialect, and reading
 * it as commas would only refuse every row one by one.
 */
export function delimiterProblem(text: string, form = 'timestamp,load_mw[,zone]'): string | null {
  const first = text
    .replace(/^\uFEFF/, '')
    .split(/\r?\n/)
    .find((line) => line.trim().length > 0 && !line.trimStart().startsWith('#'));
  if (first === undefined) return null;
  for (const [delimiter, name] of OTHER_DELIMITERS) {
    if (first.includes(delimiter)) {
      return `The file's columns are separated by ${name}; Morrowline reads comma-separated files only (${form}, with a point for decimals). Nothing was stored`;
    }
  }
  return null;
}

/** A row as far as duplicate finding needs it. */
export interface RowKey {
  line: number;
  zone: unknown;
  hour: unknown;
}

/**
 * Rows that name the same zone and hour as another row of the same file, however each spells the
 * hour (02:00-06:00 and 01:00-07:00 are one instant). Neither value can be known to be the later
 * one, so every row of such a group is refused, each naming the others' lines; nothing is
 * resolved silently. Rows whose hour does not parse are left to the reading checks.
 */
export function duplicateRows(rows: readonly RowKey[]): CsvRowRejection[] {
  const groups = new Map<string, RowKey[]>();
  for (const row of rows) {
    if (typeof row.zone !== 'string') continue;
    const parsed = parseInstant(row.hour);
    if (!parsed.ok) continue;
    const key = `${row.zone}|${parsed.value}`;
    const group = groups.get(key);
    if (group) group.push(row);
    else groups.set(key, [row]);
  }
  const rejections: CsvRowRejection[] = [];
  for (const [key, group] of groups) {
    if (group.length < 2) continue;
    const [zone, ms] = key.split('|');
    const utc = new Date(Number(ms)).toISOString().replace('.000Z', 'Z');
    for (const row of group) {
      const others = group.filter((r) => r !== row).map((r) => r.line);
      rejections.push({
        line: row.line,
        reason: 'duplicate',
        message: `${zone} ${utc} is also on line${others.length > 1 ? 's' : ''} ${others.join(', ')}; one hour may appear once per file, so none of these rows was stored`,
      });
    }
  }
  return rejections.sort((a, b) => a.line - b.line);
}
