import { HOUR_MS, type ModelCompareDto, type VersionIssueScoreDto } from '@morrowline/shared';
import type { IssuedDay, IssueTimeResult, ScoreSummary, VersionScore } from './analysis/issue-time-score';
import type { ScoringDay } from './analysis/scoring-days';

/** An 80 % band that holds fewer hours than this is too narrow to lean on. */
export const NARROW_BAND_PCT = 70;
/** … and one that holds more than this is wider than it needs to be. */
export const WIDE_BAND_PCT = 92;
/** A mean error beyond this share of the load is a standing bias worth an adjustment. */
export const BIAS_PCT = 2;

/** A stored run as the comparison needs it. */
export interface RunForDays {
  modelVersionId: number | null;
  issuedAt: Date;
  firstHour: Date;
  mean: number[];
  lower80: number[];
  upper80: number[];
}

/**
 * The forecast a version issued for each day: its newest run issued by the day's issue time that
 * covers the whole day, cut to the day's hours; null where it issued none.
 */
export function issuedForDays(versionId: number, runs: readonly RunForDays[], days: readonly ScoringDay[]): (IssuedDay | null)[] {
  const own = runs.filter((r) => r.modelVersionId === versionId).sort((a, b) => b.issuedAt.getTime() - a.issuedAt.getTime());
  return days.map((d) => {
    for (const r of own) {
      if (r.issuedAt.getTime() > d.issuedAt) continue;
      const a = (d.from - r.firstHour.getTime()) / HOUR_MS;
      if (a < 0 || !Number.isInteger(a) || a + d.hours > r.mean.length) continue;
      return { mean: r.mean.slice(a, a + d.hours), lower80: r.lower80.slice(a, a + d.hours), upper80: r.upper80.slice(a, a + d.hours) };
    }
    return null;
  });
}

interface Side {
  id: number;
  trainingTo: Date;
}

export function versionScoreDto(side: Side, score: VersionScore, days: readonly ScoringDay[]): VersionIssueScoreDto {
  return {
    versionId: side.id,
    days: score.days,
    hours: score.hours,
    mape: score.mape,
    bias: score.bias,
    coverage80: score.coverage80,
    issuedDays: score.perDay.filter((d) => d.source === 'issued').length,
    inSampleDays: days.filter((d) => d.from < side.trainingTo.getTime()).length,
    perDay: score.perDay.map((p, k) => ({ day: days[k].day, issuedAt: new Date(days[k].issuedAt).toISOString(), source: p.source, hours: p.hours, mape: p.mape })),
  };
}

/** Why two scores are not comparable (null when they are): the same days and hours, or no ranking. */
export function notComparable(a: VersionIssueScoreDto, b: VersionIssueScoreDto | null): string | null {
  if (!b) return 'there is no model in service to compare with';
  const missing = (s: VersionIssueScoreDto) => s.perDay.filter((d) => d.source === null).map((d) => d.day);
  const ma = missing(a);
  const mb = missing(b);
  if (ma.length || mb.length) {
    const who = [ma.length ? `version ${a.versionId} could not forecast ${ma.join(', ')}` : '', mb.length ? `version ${b.versionId} could not forecast ${mb.join(', ')}` : ''].filter(Boolean);
    return `not scored on the same days: ${who.join('; ')}`;
  }
  if (a.hours === 0) return 'no hour of these days has a reading to score against';
  if (a.hours !== b.hours) return `not scored on the same hours (${a.hours} against ${b.hours})`;
  return null;
}

const pct = (v: number) => `${v.toFixed(0)} %`;

/**
 * What the scores tell an operator to do, per version: whether the 80 % band can be leaned on
 * (its coverage on these days, the check that matters for a schedule's margin, rather than a
 * residual test that nearly every hourly load model fails), a standing bias and its size in MW,
 * a loss to the same hour last week, and days the version was fitted on.
 */
export function diagnosticsOf(name: string, s: VersionIssueScoreDto, level: number | null, baseline: ScoreSummary): string[] {
  const out: string[] = [];
  if (s.coverage80 !== null && s.hours >= 24) {
    if (s.coverage80 < NARROW_BAND_PCT) out.push(`${name}: its 80 % band held only ${pct(s.coverage80)} of the hours on these days, so the band is too narrow; keep a wider margin than it shows.`);
    else if (s.coverage80 > WIDE_BAND_PCT) out.push(`${name}: its 80 % band held ${pct(s.coverage80)} of the hours; the band is wider than it needs to be.`);
  }
  if (s.bias !== null && level !== null && level > 0 && Math.abs(s.bias) / level >= BIAS_PCT / 100) {
    out.push(`${name}: its forecasts ran ${Math.abs(s.bias).toFixed(1)} MW ${s.bias > 0 ? 'high' : 'low'} on average (${((100 * Math.abs(s.bias)) / level).toFixed(1)} % of the load); a standing adjustment of about ${s.bias > 0 ? '−' : '+'}${Math.abs(s.bias).toFixed(0)} MW would have helped.`);
  }
  if (s.mape !== null && baseline.mape !== null && s.mape > baseline.mape) {
    out.push(`${name}: did worse than the same hour one week earlier on these days (${s.mape.toFixed(2)} % against ${baseline.mape.toFixed(2)} %).`);
  }
  if (s.inSampleDays > 0) {
    out.push(`${name}: was fitted on hours that include ${s.inSampleDays} of these ${s.perDay.length} days, so its score there is partly in-sample and flatters it.`);
  }
  return out;
}

/** The same-days part of the comparison and the verdict, from the scores of [candidate, in service]. */
export function sameDaysOf(
  candidate: Side,
  inService: Side | null,
  result: IssueTimeResult,
  days: readonly ScoringDay[],
  issueTime: string,
): Pick<ModelCompareDto, 'sameDays' | 'candidateBetter' | 'diagnostics'> {
  const c = versionScoreDto(candidate, result.versions[0], days);
  const s = inService && result.versions[1] ? versionScoreDto(inService, result.versions[1], days) : null;
  const why = notComparable(c, s);
  const comparable = why === null && s !== null;
  const level = result.versions[0].level;
  const diagnostics = [
    ...diagnosticsOf(`Version ${candidate.id}`, c, level, result.baseline),
    ...(s && inService ? diagnosticsOf(`Version ${inService.id} (in service)`, s, result.versions[1].level, result.baseline) : []),
  ];
  return {
    sameDays: {
      days: days.length,
      from: days.length ? new Date(days[0].from).toISOString() : null,
      to: days.length ? new Date(days[days.length - 1].to).toISOString() : null,
      candidateMape: c.mape,
      inServiceMape: s?.mape ?? null,
      baselineMape: result.baseline.mape,
      issueTime,
      candidate: c,
      inService: s,
      comparable,
      notComparable: inService ? why : null,
    },
    candidateBetter: comparable && c.mape !== null && s?.mape != null ? c.mape < s.mape : null,
    diagnostics,
  };
}
