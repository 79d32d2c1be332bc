import { BadRequestException, Injectable } from '@nestjs/common';
import { parseDecimal, parseInstant, type WeatherCsvReport, type WeatherRejectionReason } from '@morrowline/shared';
import { AuditService, type Actor } from '../audit/audit.service';
import { csvRecords } from '../readings/csv-file';
import { WeatherRepository } from './weather.repository';
import { WeatherService } from './weather.service';

/** How many rejected rows a report lists in full (the count is always complete). */
const REPORT_LIMIT = 1000;
/** Rows per ingest call (one transaction each), so a large file does not hold the event loop. */
const SLICE = 5000;

type Kind = 'observed' | 'forecasts';

/** The columns of each file, in the order a file without a header gives them. */
const FORMS: Record<Kind, { required: string[]; optional: string[] }> = {
  observed: { required: ['timestamp', 'station', 'temp_c'], optional: [] },
  forecasts: { required: ['issued_at', 'timestamp', 'station', 'temp_c'], optional: ['member'] },
};

function formText(kind: Kind): string {
  const { required, optional } = FORMS[kind];
  return `${required.join(',')}${optional.map((c) => `[,${c}]`).join('')}`;
}

interface Row {
  line: number;
  value: Record<string, unknown>;
  /** What makes two rows of one file the same value, when the times parse. */
  key: string | null;
}

type Refusal = { line: number; reason: WeatherRejectionReason; message: string };

/**
 * Weather upload and download as CSV, read by the readings' CSV reader and checked by the same
 * rules as the feed: observed `timestamp,station,temp_c`; forecasts
 * `issued_at,timestamp,station,temp_c[,member]`. Times ISO 8601 with an offset, temperatures plain
 * decimals in °C. Each bad row is reported with its line; a key given twice in one file is refused
 * on every line that gives it.
 */
@Injectable()
export class WeatherCsvService {
  constructor(
    private readonly weather: WeatherService,
    private readonly repository: WeatherRepository,
    private readonly audit: AuditService,
  ) {}

  async upload(actor: Actor, kind: Kind, fileName: string, content: Buffer): Promise<WeatherCsvReport> {
    const { rows, refused } = await this.parse(kind, content);
    const report: WeatherCsvReport = { fileName, rows: rows.length + refused.length, accepted: 0, rejected: [], rejectedCount: 0 };
    const rejections: Refusal[] = [...refused];
    const groups = new Map<string, Row[]>();
    for (const row of rows) if (row.key) (groups.get(row.key) ?? groups.set(row.key, []).get(row.key)!).push(row);
    const duplicate = new Set<number>();
    for (const group of groups.values()) {
      if (group.length < 2) continue;
      for (const row of group) {
        duplicate.add(row.line);
        const others = group.filter((r) => r !== row).map((r) => r.line);
        rejections.push({ line: row.line, reason: 'duplicate', message: `the same ${kind === 'observed' ? 'station and hour' : 'station, issue time, hour and member'} is also on line${others.length > 1 ? 's' : ''} ${others.join(', ')}; none of these rows was stored` });
      }
    }
    const kept = rows.filter((r) => !duplicate.has(r.line));
    const source = `csv:${actor.email}`;
    for (let i = 0; i < kept.length; i += SLICE) {
      const slice = kept.slice(i, i + SLICE);
      const values = slice.map((r) => r.value);
      const result = kind === 'observed' ? await this.weather.ingestObservations(values, { source }) : await this.weather.ingestForecasts(values, { source });
      report.accepted += result.stored;
      for (const r of result.rejected) rejections.push({ line: slice[r.index].line, reason: r.reason, message: r.message });
    }
    rejections.sort((a, b) => a.line - b.line);
    report.rejectedCount = rejections.length;
    report.rejected = rejections.slice(0, REPORT_LIMIT);
    await this.audit.record(actor, {
      action: `weather.${kind}.upload`,
      subjectType: 'weather',
      after: { fileName, rows: report.rows, accepted: report.accepted, rejected: report.rejectedCount },
    });
    return report;
  }

  private async parse(kind: Kind, content: Buffer): Promise<{ rows: Row[]; refused: Refusal[] }> {
    const { required, optional } = FORMS[kind];
    const form = formText(kind);
    const rows: Row[] = [];
    const refused: Refusal[] = [];
    let columns: Map<string, number> | null = null;
    for await (const { record, line } of csvRecords(content, form)) {
      if (columns === null) {
        const first = record.map((c) => c.toLowerCase());
        if (first.some((c) => required.includes(c))) {
          const unknown = first.filter((c) => !required.includes(c) && !optional.includes(c));
          if (required.some((c) => !first.includes(c)) || unknown.length > 0 || new Set(first).size !== first.length) {
            throw new BadRequestException(`The header must be ${form}; found ${record.join(',')}. Nothing was stored`);
          }
          columns = new Map(first.map((c, i) => [c, i]));
          continue;
        }
        columns = new Map([...required, ...optional].map((c, i) => [c, i]));
      }
      const width = columns.size;
      const fixed = required.length;
      if (record.length < fixed || record.length > width) {
        refused.push({ line, reason: 'malformed', message: `expected ${form}; found ${record.length} columns` });
        continue;
      }
      const cell = (name: string) => {
        const at = columns!.get(name);
        return at === undefined ? undefined : record[at];
      };
      const temp = parseDecimal(cell('temp_c'), 'temp_c');
      if (!temp.ok) {
        refused.push({ line, reason: 'not-a-number', message: temp.message });
        continue;
      }
      const station = (cell('station') ?? '').toUpperCase();
      const hour = cell('timestamp');
      if (kind === 'observed') {
        const at = parseInstant(hour);
        rows.push({ line, value: { station, hour, tempC: temp.value }, key: at.ok ? `${station}|${at.value}` : null });
      } else {
        const issuedAt = cell('issued_at');
        const member = cell('member') ?? '';
        const at = parseInstant(hour);
        const issued = parseInstant(issuedAt);
        rows.push({ line, value: { station, issuedAt, hour, tempC: temp.value, member }, key: at.ok && issued.ok ? `${station}|${issued.value}|${at.value}|${member}` : null });
      }
    }
    if (rows.length + refused.length === 0) throw new BadRequestException('The file holds no weather values; nothing was stored');
    return { rows, refused };
  }

  /** A station's observed temperatures in [from, to), in the upload's own columns. */
  async downloadObserved(stationCode: string, from: number, to: number): Promise<string> {
    const station = await this.weather.stationByCode(stationCode);
    const rows = await this.repository.observations([station.id], from, to);
    const lines = ['timestamp,station,temp_c'];
    for (const row of rows) lines.push(`${new Date(row.hourStart).toISOString()},${station.code},${row.tempC}`);
    return `${lines.join('\n')}\n`;
  }

  /** Every vintage of a station issued in [from, to), every member, in the upload's own columns. */
  async downloadForecasts(stationCode: string, from: number, to: number): Promise<string> {
    const station = await this.weather.stationByCode(stationCode);
    const rows = await this.repository.forecastsIssuedBetween(station.id, from, to);
    const lines = ['issued_at,timestamp,station,temp_c,member'];
    for (const row of rows) lines.push(`${new Date(row.issuedAt).toISOString()},${new Date(row.hourStart).toISOString()},${station.code},${row.tempC},${row.member}`);
    return `${lines.join('\n')}\n`;
  }
}
