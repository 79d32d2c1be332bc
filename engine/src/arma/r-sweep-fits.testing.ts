/**
 * The engine's fit of each fit of the R sweep fixtures (fixtures/r-arima-sweep.testing.ts), and
 * how far it ends from R's best, for fit-r-sweep.spec.ts, fit-r-further.spec.ts and the hold-out
 * rounds' specs. Test-only:
 * left out of the build (tsconfig.build.json).
 */
import { rBest, rBestExact, SweepFit, SweepSeries, sweepValues } from '../fixtures/r-arima-sweep.testing';
import { ArmaFit, fitArma, FitOptions } from './fit';

/** fitArma with the fixture's order, period and mean, without standard errors. */
export function fitLike(s: SweepSeries, f: SweepFit, opts: FitOptions = {}): ArmaFit {
  const P = f.P ?? 0;
  const Q = f.Q ?? 0;
  const spec = P + Q > 0 ? { p: f.p, q: f.q, P, Q, period: s.period, includeMean: s.includeMean } : { p: f.p, q: f.q, includeMean: s.includeMean };
  return fitArma(sweepValues(s), spec, { computeSe: false, ...opts });
}

/** A fit's name in the tests: series, then (p,q)(P,Q). */
export const fitId = (s: SweepSeries, f: SweepFit): string => `${s.name} (${f.p},${f.q})(${f.P ?? 0},${f.Q ?? 0})`;

/**
 * The engine's log-likelihood minus R's best (by `best`), by fitId, over every fit R reached by
 * one method at least.
 */
export function gapsOver(cases: Array<{ s: SweepSeries; fits: SweepFit[] }>, best: (f: SweepFit) => number = rBest): Map<string, number> {
  const gaps = new Map<string, number>();
  for (const { s, fits } of cases) {
    for (const f of fits) {
      const b = best(f);
      if (Number.isFinite(b)) gaps.set(fitId(s, f), fitLike(s, f).loglik - b);
    }
  }
  return gaps;
}

/** gapsOver for series that carry their fits (the hold-out rounds' fixtures), against R's exact best (rBestExact). */
export const gapsOfSeries = (series: SweepSeries[]): Map<string, number> =>
  gapsOver(
    series.map((s) => ({ s, fits: s.fits })),
    rBestExact,
  );

/** The fits that end below R's best by more than 0.001, sorted. */
export const belowR = (gaps: Map<string, number>): string[] =>
  [...gaps]
    .filter(([, d]) => d < -0.001)
    .map(([k]) => k)
    .sort();

/** A series of a sweep by name and one of its fits by order. */
export function findFit(series: SweepSeries[], name: string, p: number, q: number, P = 0, Q = 0): { s: SweepSeries; f: SweepFit } {
  const s = series.find((c) => c.name === name)!;
  return { s, f: s.fits.find((f) => f.p === p && f.q === q && (f.P ?? 0) === P && (f.Q ?? 0) === Q)! };
}
