import { BadRequestException, Injectable } from '@nestjs/common';
import { parseDecimal, type CsvRowRejection, type CsvUploadReport } from '@morrowline/shared';
import { AuditService, type Actor } from '../audit/audit.service';
import { duplicateRows } from './csv-checks';
import { csvRecords } from './csv-file';
import { ReadingsService } from './readings.service';

/** How many rejected rows a report lists in full (the count is always complete). */
const REPORT_LIMIT = 1000;

interface CsvRow {
  line: number;
  reading: { zone: string; hour: string | undefined; mw: number };
}

interface ParsedFile {
  rows: CsvRow[];
  /** Rows refused before validation (wrong number of columns, no zone, a load that is not a plain number). */
  refused: CsvRowRejection[];
}

const HEADER_NAMES: Record<string, 'hour' | 'mw' | 'zone'> = { timestamp: 'hour', load_mw: 'mw', zone: 'zone' };

/**
 * History upload and download as CSV: `timestamp,load_mw[,zone]`, timestamp the UTC start of the
 * hour (ISO 8601 with offset). The whole file is read first; a file that cannot be read at all
 * stores nothing. Then each row is checked like a feed reading and the good ones are stored.
 */
@Injectable()
export class ReadingsCsvService {
  constructor(
    private readonly readings: ReadingsService,
    private readonly audit: AuditService,
  ) {}

  async upload(actor: Actor, fileName: string, content: Buffer, defaultZone: string | undefined): Promise<CsvUploadReport> {
    const parsed = await this.parse(content, defaultZone);
    const report: CsvUploadReport = { fileName, rows: parsed.rows.length + parsed.refused.length, accepted: 0, revised: 0, rejected: [], rejectedCount: 0 };
    // An hour given twice in one file is refused on every line that gives it, never resolved.
    const duplicates = duplicateRows(parsed.rows.map((r) => ({ line: r.line, zone: r.reading.zone, hour: r.reading.hour })));
    const duplicateLines = new Set(duplicates.map((d) => d.line));
    const rows = parsed.rows.filter((r) => !duplicateLines.has(r.line));
    const rejections: CsvRowRejection[] = [...parsed.refused, ...duplicates];
    // In slices, so that a large file does not hold the event loop.
    for (let i = 0; i < rows.length; i += 5000) {
      const slice = rows.slice(i, i + 5000);
      const result = await this.readings.ingest(
        slice.map((r) => r.reading),
        { source: `csv:${actor.email}` },
      );
      report.accepted += result.stored;
      report.revised += result.revised;
      for (const r of result.rejected) rejections.push({ line: slice[r.index].line, reason: r.reason, message: r.message });
    }
    rejections.sort((a, b) => a.line - b.line);
    report.rejectedCount = rejections.length;
    report.rejected = rejections.slice(0, REPORT_LIMIT);
    await this.audit.record(actor, {
      action: 'readings.upload',
      subjectType: 'readings',
      subjectId: defaultZone ?? null,
      after: { fileName, rows: report.rows, accepted: report.accepted, revised: report.revised, rejected: report.rejectedCount },
    });
    return report;
  }

  private async parse(content: Buffer, defaultZone: string | undefined): Promise<ParsedFile> {
    const rows: CsvRow[] = [];
    const refused: CsvRowRejection[] = [];
    let columns: { hour: number; mw: number; zone: number } | null = null;
    for await (const { record, line } of csvRecords(content, 'timestamp,load_mw[,zone]')) {
      if (columns === null) {
        const first = record.map((c) => c.toLowerCase());
        if (first.includes('timestamp') || first.includes('load_mw')) {
          const hour = first.indexOf('timestamp');
          const mw = first.indexOf('load_mw');
          const unknown = first.filter((c) => !(c in HEADER_NAMES));
          if (hour < 0 || mw < 0 || unknown.length > 0) {
            throw new BadRequestException(`The header must be timestamp,load_mw[,zone]; found ${record.join(',')}. Nothing was stored`);
          }
          columns = { hour, mw, zone: first.indexOf('zone') };
          continue;
        }
        columns = { hour: 0, mw: 1, zone: 2 };
      }
      const zoneCell = columns.zone >= 0 ? record[columns.zone] : undefined;
      const zone = zoneCell && zoneCell.length > 0 ? zoneCell.toUpperCase() : defaultZone;
      if (record.length < 2 || record.length > 3) {
        refused.push({ line, reason: 'malformed', message: `expected timestamp,load_mw[,zone]; found ${record.length} columns` });
        continue;
      }
      if (!zone) {
        refused.push({ line, reason: 'unknown-zone', message: 'no zone: add a zone column or pass ?zone=CODE' });
        continue;
      }
      // One number parser: plain decimals only ("0x10", "0b101", "1e3", "" are refused, not read).
      const mw = parseDecimal(record[columns.mw], 'load_mw');
      if (!mw.ok) {
        const empty = (record[columns.mw] ?? '').trim() === '';
        refused.push({ line, reason: empty ? 'empty-load' : 'not-a-number', message: mw.message });
        continue;
      }
      rows.push({ line, reading: { zone, hour: record[columns.hour], mw: mw.value } });
    }
    if (rows.length + refused.length === 0) throw new BadRequestException('The file holds no readings; nothing was stored');
    return { rows, refused };
  }

  /** A zone's stored readings in a range as CSV, in the upload's own columns (plus quality). */
  async download(zone: string, from?: Date, to?: Date): Promise<string> {
    const [limits] = await this.readings.resolveZones([zone]);
    const range = ReadingsService.hourRange(from, to, 24 * 31, 24 * 800);
    const rows = await this.readings.rows(limits.id, range.from, range.to);
    const lines = ['timestamp,load_mw,zone,quality'];
    for (const row of rows) lines.push(`${new Date(row.hourStart).toISOString()},${row.mw},${limits.code},${row.quality}`);
    return `${lines.join('\n')}\n`;
  }
}
