/** CSV reader for hourly load history: timeline, missing hours, errors naming line and fault. */
import { parseLoadCsv, CsvFormatError, localDate } from './csv-series';

const ok = ['timestamp,load_mw', '2024-03-09T00:00:00-06:00,100', '2024-03-09T01:00:00-06:00,', '2024-03-09T03:00:00-06:00,103.5'].join('\n');

function faultOf(text: string): { line: number; fault: string } {
  try {
    parseLoadCsv(text);
  } catch (e) {
    if (e instanceof CsvFormatError) return { line: e.line, fault: e.fault };
    throw e;
  }
  throw new Error('expected an error');
}

describe('parseLoadCsv', () => {
  it('puts rows on an hourly timeline with explicit missing hours', () => {
    const s = parseLoadCsv(ok);
    expect(s.startMs).toBe(Date.parse('2024-03-09T06:00:00Z'));
    expect(Array.from(s.values)).toEqual([100, NaN, NaN, 103.5]);
    expect(s.missing).toBe(2);
    expect(s.rows).toBe(3);
    expect(s.dayStarts).toEqual([0]);
    expect(localDate(s, 3)).toBe('2024-03-09');
  });
  it('follows the offsets over a daylight-saving change (23-hour local day)', () => {
    const rows = ['timestamp,load_mw'];
    // 2024-03-10 in a zone at −06:00 / −05:00: 02:00 local does not exist
    let ms = Date.parse('2024-03-10T06:00:00Z');
    for (let i = 0; i < 48; i++, ms += 3600_000) {
      const off = ms >= Date.parse('2024-03-10T08:00:00Z') ? -5 : -6;
      const local = new Date(ms + off * 3600_000).toISOString().slice(0, 19);
      rows.push(`${local}-0${-off}:00,${50 + i}`);
    }
    const s = parseLoadCsv(rows.join('\n'));
    expect(s.values.length).toBe(48);
    expect(s.dayStarts.slice(0, 2)).toEqual([0, 23]);
  });
  it('accepts Z and CRLF', () => {
    const s = parseLoadCsv('timestamp,load_mw\r\n2024-01-01T00:00:00Z,5\r\n2024-01-01T01:00Z,6\r\n');
    expect(Array.from(s.values)).toEqual([5, 6]);
  });
  it.each([
    ['time,mw\n', 1, 'header'],
    ['timestamp,load_mw\n2024-01-01 00:00,5', 2, 'ISO 8601'],
    ['timestamp,load_mw\n2024-01-01T00:00:00,5', 2, 'offset'],
    ['timestamp,load_mw\n2024-01-01T00:00:00Z,abc', 2, 'not a number'],
    ['timestamp,load_mw\n2024-01-01T00:00:00Z,-3', 2, 'negative'],
    ['timestamp,load_mw\n2024-01-01T00:00:00Z,3\n2024-01-01T00:00:00Z,4', 3, 'duplicate'],
    ['timestamp,load_mw\n2024-01-01T02:00:00Z,3\n2024-01-01T01:00:00Z,4', 3, 'earlier'],
    ['timestamp,load_mw\n2024-01-01T00:30:00Z,3', 2, 'start of an hour'],
    ['timestamp,load_mw\n2024-02-30T00:00:00Z,3', 2, 'valid date'],
    ['timestamp,load_mw\n2024-01-01T00:00:00Z,3,4', 2, '2 fields'],
    ['timestamp,load_mw\n2024-01-01T00:00:00Z,3\n\n2024-01-01T01:00:00Z,3', 3, 'empty line'],
  ])('rejects %j at line %d (%s)', (text, line, word) => {
    const f = faultOf(text);
    expect(f.line).toBe(line);
    expect(f.fault).toContain(word);
  });
});
