import { describe, expect, it } from 'vitest';
import type { LoadView } from '../model/zone-view';
import { loadChartRows } from './load-chart-rows';

// Three hours starting 2026-12-02 07:00 UTC = 00:00 MST, so they end at HE01, HE02 and HE03 in Denver.
const HOURS = ['2026-12-02T06:00:00.000Z', '2026-12-02T07:00:00.000Z', '2026-12-02T08:00:00.000Z', '2026-12-02T09:00:00.000Z'];

function view(): LoadView {
  return {
    key: 'SALTMARSH',
    name: 'Saltmarsh',
    timeZone: 'America/Denver',
    actual: [100, 101.25, null, null],
    committed: { schedule: [null, 98, null, null], dayAhead: [99, 97, 96, null], committed: [99, 98, 96, null], basis: ['day-ahead', 'schedule', 'day-ahead', null], days: [] },
    latestRun: { mean: [null, 100, 102.04, null], lower80: [null, 95, 97, null], upper80: [null, 105, 107, null], lower95: [null, null, null, null], upper95: [null, null, null, null] },
    latestRunSource: 'test',
    incomplete: [],
    leftOut: [],
    latestIndex: 1,
    currentMw: 101.25,
    committedMw: 98,
    committedBasis: 'schedule',
    deviationPct: 3.3,
    nextRunMw: 102.04,
    feed: { kind: 'unknown' },
  };
}

describe('loadChartRows', () => {
  it('gives each hour shown its hour ending in the zone’s time and what the chart draws, in words where the colour says it', () => {
    expect(loadChartRows(view(), HOURS, 1)).toEqual([
      ['2026-12-02 HE01', '101.3', '98.0', 'published schedule', '100.0', '95.0 – 105.0'],
      ['2026-12-02 HE02', '—', '96.0', 'day-ahead forecast', '102.0', '97.0 – 107.0'],
    ]);
  });
  it('leaves out the hours before the first shown and the hours with nothing drawn', () => {
    expect(loadChartRows(view(), HOURS, 0)).toHaveLength(3);
    expect(loadChartRows(view(), HOURS, 3)).toEqual([]);
  });
});
