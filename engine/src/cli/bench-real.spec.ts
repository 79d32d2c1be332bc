import { difference } from '@morrowline/engine';
import { BENCH_MISSING_HOURS, printRealTable, TAYLOR_SOURCE, withMissingHours } from './bench-real';

describe('the bench’s demand series with hours missing (--gaps-only)', () => {
  const load = Array.from({ length: 2016 }, (_, t) => 30000 + 5000 * Math.sin((2 * Math.PI * t) / 24));

  it('takes out exactly the listed hours, on a copy', () => {
    const gappy = withMissingHours(load);
    expect(load.every(Number.isFinite)).toBe(true);
    const missing = gappy.flatMap((v, t) => (Number.isNaN(v) ? [t] : []));
    expect(missing).toEqual([...BENCH_MISSING_HOURS].sort((a, b) => a - b));
  });

  it('leaves each missing hour in both weekly differences that use it, (1 − B¹⁶⁸)x at t − 168 and t + 168 where they exist', () => {
    const w = difference(withMissingHours(load), [168]);
    const missing = Array.from(w).flatMap((v, i) => (Number.isNaN(v) ? [i] : []));
    // w_i = x_{i+168} − x_i: hour h is read by w_{h−168} and by w_h
    const expected = new Set<number>();
    for (const h of BENCH_MISSING_HOURS) {
      if (h >= 168) expected.add(h - 168);
      if (h + 168 < load.length) expected.add(h);
    }
    expect(missing).toEqual([...expected].sort((a, b) => a - b));
  });
});

describe('the real-series table’s heading (--input)', () => {
  const heading = (source?: string, missing: number[] = []) => {
    const lines: string[] = [];
    printRealTable([], (l) => lines.push(l), missing, source);
    return lines[0];
  };

  it('names the open demand fixture by default, and the caller’s file with --input', () => {
    expect(heading()).toContain(`real demand (${TAYLOR_SOURCE}),`);
    expect(heading('vic-elec-2014q1.csv, 2016 h')).toMatch(/^real demand \(vic-elec-2014q1\.csv, 2016 h\), each differencing/);
  });

  it('still lists the hours taken out (--gaps-only)', () => {
    expect(heading(undefined, [300, 700])).toContain('; hours 300, 700 taken out, missing on both sides)');
  });
});
