/** CSV reader for regressor files: one row per hour of the load, numbers only, faults named by line. */
import { CsvFormatError, parseLoadCsv } from './csv-series';
import { parseRegressorCsv } from './csv-xreg';

const load = parseLoadCsv(['timestamp,load_mw', '2024-03-09T00:00:00-06:00,100', '2024-03-09T01:00:00-06:00,', '2024-03-09T02:00:00-06:00,103.5'].join('\n'));
const good = ['timestamp,temp_c,holiday', '2024-03-09T06:00:00Z,-1.5,0', '2024-03-09T01:00:00-06:00,2e-1,1', '2024-03-09T02:00:00-06:00,+3,0'];

function faultOf(lines: string[]): { line: number; fault: string } {
  try {
    parseRegressorCsv(lines.join('\n'), load);
  } catch (e) {
    if (e instanceof CsvFormatError) return { line: e.line, fault: e.fault };
    throw e;
  }
  throw new Error('expected an error');
}

describe('parseRegressorCsv', () => {
  it("puts each column on the load's timeline (any offset, the same instant)", () => {
    const r = parseRegressorCsv(good.join('\n') + '\n', load);
    expect(r.names).toEqual(['temp_c', 'holiday']);
    expect(Array.from(r.columns[0])).toEqual([-1.5, 0.2, 3]);
    expect(Array.from(r.columns[1])).toEqual([0, 1, 0]);
  });
  it.each([
    ['a missing hour', [good[0], good[1], good[3]], 3, "no row for the load's hour 2024-03-09T07:00:00Z (the next row is 2024-03-09T02:00:00-06:00); every hour of the load needs its regressor values"],
    ['an hour after the load', [...good, '2024-03-09T03:00:00-06:00,1,0'], 5, "hour 2024-03-09T03:00:00-06:00 is outside the load's hours (2024-03-09T06:00:00Z to 2024-03-09T08:00:00Z)"],
    ['an hour before the load', [good[0], '2024-03-08T23:00:00-06:00,1,0', ...good.slice(1)], 2, "hour 2024-03-08T23:00:00-06:00 is outside the load's hours"],
    ['the file ending early', good.slice(0, 3), 4, "the file ends before the load's hour 2024-03-09T08:00:00Z"],
    ['a duplicate hour', [good[0], good[1], good[1], ...good.slice(2)], 3, 'hour 2024-03-09T06:00:00Z is a duplicate'],
    ['rows out of order', [good[0], good[2], good[1], good[3]], 2, "no row for the load's hour 2024-03-09T06:00:00Z"],
    ['a non-number', [good[0], good[1], '2024-03-09T01:00:00-06:00,warm,1', good[3]], 3, 'temp_c "warm" is not a number'],
    ['an empty value', [good[0], good[1], '2024-03-09T01:00:00-06:00,,1', good[3]], 3, 'temp_c is empty; every regressor needs a value for every hour'],
    ['a wrong field count', [good[0], good[1], '2024-03-09T01:00:00-06:00,1', good[3]], 3, 'expected 3 fields (timestamp,temp_c,holiday), found 2'],
    ['a bad timestamp', [good[0], good[1], '2024-03-09 01:00,1,1', good[3]], 3, 'is not ISO 8601 with an offset or Z'],
    ['a timestamp inside an hour', [good[0], good[1], '2024-03-09T01:30:00-06:00,1,1', good[3]], 3, 'is not the start of an hour'],
    ['no regressor in the header', ['timestamp', ...good.slice(1)], 1, 'header must be "timestamp," followed by one or more regressor names'],
    ['a repeated name', ['timestamp,t,t', ...good.slice(1)], 1, 'regressor "t" appears twice in the header'],
    ['the reserved name', ['timestamp,intercept,t', ...good.slice(1)], 1, '"intercept" cannot name a regressor (reserved)'],
    ['an empty name', ['timestamp,,t', ...good.slice(1)], 1, 'a regressor name in the header is empty'],
  ])('refuses %s, naming the line', (_what, lines, line, fault) => {
    const f = faultOf(lines as string[]);
    expect(f.line).toBe(line);
    expect(f.fault).toContain(fault);
  });
});
