import type { IssueTimeResult, VersionScore } from './analysis/issue-time-score';
import type { ScoringDay } from './analysis/scoring-days';
import { issuedForDays, sameDaysOf } from './version-comparison';

const H = 3_600_000;
const day0 = Date.UTC(2026, 5, 9, 6);
const days: ScoringDay[] = [0, 1].map((k) => ({ day: `2026-06-${String(9 + k).padStart(2, '0')}`, from: day0 + k * 24 * H, to: day0 + (k + 1) * 24 * H, issuedAt: day0 + k * 24 * H - 20 * H, dayStart: 0, hours: 24, cut: 0 }));

const score = (mape: number, over: Partial<VersionScore> = {}): VersionScore => ({
  days: 2, hours: 48, mape, bias: 0, level: 200, coverage80: 80,
  perDay: [{ source: 're-forecast', hours: 24, mape }, { source: 're-forecast', hours: 24, mape }],
  ...over,
});
const result = (a: VersionScore, b: VersionScore): IssueTimeResult => ({ versions: [a, b], baseline: { days: 2, hours: 48, mape: 6, bias: 0, level: 200, coverage80: null }, scoredHours: [24, 24] });
const side = (id: number, trainedTo: number) => ({ id, trainingTo: new Date(trainedTo) });

describe('the comparison of two versions on the same days', () => {
  it('ranks only versions scored on the same days and hours', () => {
    const r = sameDaysOf(side(12, day0), side(9, day0), result(score(3.1), score(4.2)), days, 'at gate closure');
    expect(r.sameDays).toMatchObject({ comparable: true, notComparable: null, candidateMape: 3.1, inServiceMape: 4.2, baselineMape: 6 });
    expect(r.candidateBetter).toBe(true);
    const gap = score(3.1, { days: 1, hours: 24, perDay: [{ source: null, hours: 0, mape: null }, { source: 're-forecast', hours: 24, mape: 3.1 }] });
    const r2 = sameDaysOf(side(12, day0), side(9, day0), result(gap, score(4.2)), days, 'at gate closure');
    expect(r2.candidateBetter).toBeNull();
    expect(r2.sameDays.notComparable).toBe('not scored on the same days: version 12 could not forecast 2026-06-09');
  });

  it('says what the scores mean: a narrow band, a standing bias, a loss to last week, in-sample days', () => {
    const narrow = score(7.5, { coverage80: 55, bias: -9 });
    const r = sameDaysOf(side(12, day0 + 30 * H), side(9, day0), result(narrow, score(4)), days, 'at gate closure');
    expect(r.diagnostics).toEqual([
      'Version 12: its 80 % band held only 55 % of the hours on these days, so the band is too narrow; keep a wider margin than it shows.',
      'Version 12: its forecasts ran 9.0 MW low on average (4.5 % of the load); a standing adjustment of about +9 MW would have helped.',
      'Version 12: did worse than the same hour one week earlier on these days (7.50 % against 6.00 %).',
      'Version 12: was fitted on hours that include 2 of these 2 days, so its score there is partly in-sample and flatters it.',
    ]);
    expect(r.sameDays.candidate).toMatchObject({ inSampleDays: 2, issuedDays: 0 });
    expect(r.sameDays.inService).toMatchObject({ inSampleDays: 0 });
  });
});

describe('the forecasts a version issued for the scored days', () => {
  const run = (id: number | null, issuedAt: number, firstHour: number, n: number, v: number) => ({ modelVersionId: id, issuedAt: new Date(issuedAt), firstHour: new Date(firstHour), mean: Array(n).fill(v), lower80: Array(n).fill(v - 1), upper80: Array(n).fill(v + 1) });

  it('takes its newest run issued by the issue time that covers the whole day, and no other version\'s', () => {
    const runs = [
      run(9, days[0].issuedAt - 2 * H, days[0].from - 6 * H, 40, 100),
      run(9, days[0].issuedAt + H, days[0].from - 3 * H, 40, 999),
      run(7, days[1].issuedAt - H, days[1].from - 5 * H, 40, 555),
      run(9, days[1].issuedAt - H, days[1].from - 5 * H, 20, 777),
    ];
    const issued = issuedForDays(9, runs, days);
    expect(issued[0]?.mean).toEqual(Array(24).fill(100));
    expect(issued[0]?.lower80[0]).toBe(99);
    // the only run of version 9 before day 2's issue time stops short of the day's end
    expect(issued[1]).toBeNull();
  });
});
