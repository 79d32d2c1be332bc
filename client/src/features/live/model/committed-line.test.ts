import type { ZoneCommittedDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { committedOnSeries, emptyCommittedLine, systemCommitted, type CommittedLine } from './committed-line';

const H = 3_600_000;
const iso = (i: number) => new Date(Date.parse('2026-12-01T07:00:00Z') + i * H).toISOString();

describe('committedOnSeries', () => {
  it('moves the server’s hours onto the series’ and leaves hours outside it out', () => {
    const zone: ZoneCommittedDto = { zone: 'MILLRACE', schedule: [null, 120, 130], dayAhead: [100, 110, 125], committed: [100, 120, 130], basis: ['day-ahead', 'schedule', 'schedule'], days: [] };
    const line = committedOnSeries(zone, [iso(1), iso(2), iso(3)], Date.parse(iso(2)), 3);
    expect(line.committed).toEqual([120, 130, null]);
    expect(line.basis).toEqual(['schedule', 'schedule', null]);
    expect(line.dayAhead).toEqual([110, 125, null]);
  });
});

describe('systemCommitted', () => {
  const line = (committed: (number | null)[], basis: CommittedLine['basis']): CommittedLine => ({ ...emptyCommittedLine(committed.length), committed, basis });
  it('adds the zones where every one has a value and says whether they share a basis', () => {
    const out = systemCommitted([line([100, 100, 100], ['schedule', 'schedule', 'day-ahead']), line([50, null, 60], ['schedule', null, 'schedule'])], 3);
    expect(out.committed).toEqual([150, null, 160]);
    expect(out.basis).toEqual(['schedule', null, 'mixed']);
  });
});
