import { BadRequestException } from '@nestjs/common';
import { parse } from 'csv-parse';
import { delimiterProblem } from './csv-checks';

/** One record of a CSV file with its line in the file (1 = first line). */
export interface CsvRecord {
  line: number;
  record: string[];
}

/**
 * The one reader of uploaded CSV files (readings and weather): refuses a file that is empty,
 * binary, not UTF-8 or separated by something other than commas, whole, before anything is
 * stored; then yields each record with its line (cells trimmed, empty lines and # comments
 * skipped, a BOM allowed), yielding to the event loop now and then.
 */
export async function* csvRecords(content: Buffer, form: string): AsyncGenerator<CsvRecord> {
  if (content.length === 0) throw new BadRequestException('The file is empty');
  if (content.includes(0)) throw new BadRequestException('The file is not a text CSV file (it contains binary data); nothing was stored');
  const text = content.toString('utf8');
  if (text.includes('\uFFFD')) throw new BadRequestException('The file is not UTF-8 text; nothing was stored');
  const delimiter = delimiterProblem(text, form);
  if (delimiter) throw new BadRequestException(delimiter);
  const parser = parse(text, { relax_column_count: true, skip_empty_lines: true, trim: true, bom: true, info: true, comment: '#' });
  let count = 0;
  try {
    for await (const item of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
      yield { line: item.info.lines, record: item.record };
      if (++count % 10000 === 0) await new Promise((resolve) => setImmediate(resolve));
    }
  } catch (error) {
    if (error instanceof BadRequestException) throw error;
    throw new BadRequestException(`The file could not be read as CSV (${(error as Error).message}); nothing was stored`);
  }
}
