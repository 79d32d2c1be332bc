import { delimiterProblem, duplicateRows } from './csv-checks';

describe('delimiterProblem', () => {
  it('passes a comma-separated file, header or not, comments and a byte-order mark allowed', () => {
    expect(delimiterProblem('timestamp,load_mw\n2026-03-08T09:00Z,12\n')).toBeNull();
    expect(delimiterProblem('\uFEFF# exported\n\n2026-03-08T09:00Z,12,MILLRACE\n')).toBeNull();
  });

  it.each([
    ['timestamp;load_mw\n2026-03-08T09:00Z;12,5\n', 'semicolons'],
    ['2026-03-08T09:00Z;12\n', 'semicolons'],
    ['timestamp\tload_mw\n2026-03-08T09:00Z\t12\n', 'tabs'],
    ['timestamp|load_mw\n', 'vertical bars'],
  ])('refuses %j, naming its %s', (text, name) => {
    expect(delimiterProblem(text)).toBe(`The file's columns are separated by ${name}; Morrowline reads comma-separated files only (timestamp,load_mw[,zone], with a point for decimals). Nothing was stored`);
  });
});

describe('duplicateRows', () => {
  it('finds one instant written twice across a spring-forward gap (02:00-06:00 is 01:00-07:00)', () => {
    const rejections = duplicateRows([
      { line: 2, zone: 'MILLRACE', hour: '2024-03-10T01:00:00-07:00' },
      { line: 3, zone: 'MILLRACE', hour: '2024-03-10T02:00:00-06:00' },
      { line: 4, zone: 'MILLRACE', hour: '2024-03-10T03:00:00-06:00' },
    ]);
    expect(rejections).toEqual([
      { line: 2, reason: 'duplicate', message: 'MILLRACE 2024-03-10T08:00:00Z is also on line 3; one hour may appear once per file, so none of these rows was stored' },
      { line: 3, reason: 'duplicate', message: 'MILLRACE 2024-03-10T08:00:00Z is also on line 2; one hour may appear once per file, so none of these rows was stored' },
    ]);
  });

  it('names every other line of a group of three and keeps zones apart', () => {
    const rejections = duplicateRows([
      { line: 5, zone: 'HARROW', hour: '2026-03-08T09:00Z' },
      { line: 6, zone: 'MILLRACE', hour: '2026-03-08T09:00Z' },
      { line: 7, zone: 'HARROW', hour: '2026-03-08 09:00:00Z' },
      { line: 9, zone: 'HARROW', hour: '2026-03-08T10:00+01:00' },
    ]);
    expect(rejections.map((r) => [r.line, r.message.split(';')[0]])).toEqual([
      [5, 'HARROW 2026-03-08T09:00:00Z is also on lines 7, 9'],
      [7, 'HARROW 2026-03-08T09:00:00Z is also on lines 5, 9'],
      [9, 'HARROW 2026-03-08T09:00:00Z is also on lines 5, 7'],
    ]);
  });

  it('leaves rows whose hour does not parse to the reading checks', () => {
    expect(duplicateRows([{ line: 2, zone: 'MILLRACE', hour: 'soon' }, { line: 3, zone: 'MILLRACE', hour: 'soon' }])).toEqual([]);
  });
});
