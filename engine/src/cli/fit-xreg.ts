/**
 * `npm run fit -- --input LOAD.csv --xreg REGRESSORS.csv --order p,q [--diff …] [--seasonal P,Q,s]
 *  [--mean|--no-mean] [--repeat N] [--json]`: regression with ARMA errors on regressors fitted as
 * given (the engine's fitRegression; R's arima(x, order, seasonal, xreg=) fits the same model),
 * printing each regression coefficient with its standard error beside the ARMA coefficients.
 * The orders are given, not chosen: the order search of the plain fit knows no regressors.
 */
import { readFileSync } from 'node:fs';
import { describeDifferencing, differenceOrder, fitRegression, ljungBox, RegressionFit } from '@morrowline/engine';
import { HourlySeries } from './csv-series';
import { parseRegressorCsv } from './csv-xreg';
import { repeatedTime, timeRepeated } from './warm-timing';

export interface XregFitArgs {
  input: string;
  series: HourlySeries;
  xreg: string;
  diff: number[];
  order: number[] | undefined;
  seasonal: number[] | undefined;
  includeMean: boolean | undefined;
  repeat: number;
}

export function runXregFit(a: XregFitArgs): { text: string; json: Record<string, unknown> } {
  if (!a.order) throw new Error('--xreg needs --order p,q (the orders are not chosen when regressors are given)');
  const regs = parseRegressorCsv(readFileSync(a.xreg, 'utf8'), a.series);
  const y = a.series.values;
  const regressors = regs.names.map((name, j) => ({ name, values: regs.columns[j] }));
  const spec = { diff: a.diff, p: a.order[0], q: a.order[1], P: a.seasonal?.[0], Q: a.seasonal?.[1], period: a.seasonal?.[2], includeMean: a.includeMean };
  let fit: RegressionFit | undefined;
  const timing = timeRepeated(() => {
    fit = fitRegression(y, regressors, spec);
  }, a.repeat);
  const m = fit as RegressionFit;
  const fitMs = timing.warmMs;
  const fitdf = m.spec.p + m.spec.q + m.spec.P + m.spec.Q;
  const lb = [24, 48].map((lag) => ljungBox(m.residuals.subarray(differenceOrder(a.diff)), lag, fitdf));
  const seasonal = m.spec.P + m.spec.Q > 0 ? { P: m.spec.P, Q: m.spec.Q, period: m.spec.period } : null;
  const json = {
    input: a.input,
    xreg: a.xreg,
    hours: y.length,
    missingHours: a.series.missing,
    regressors: regs.names,
    diff: a.diff,
    differencing: describeDifferencing(a.diff),
    order: { p: m.spec.p, q: m.spec.q },
    seasonal,
    includeMean: m.spec.includeMean,
    chosenBy: 'given',
    coefficients: m.coefficients,
    arma: m.armaCoefficients,
    regression: m.beta,
    // the figures under the plain fit's names
    ...{ sigma2: m.sigma2, loglik: m.loglik, aic: m.aic, aicc: m.aicc, bic: m.bic },
    ljungBox: lb,
    n: m.nUsed,
    likelihood: m.likelihood,
    converged: m.converged,
    fitMs,
    firstFitMs: timing.firstMs,
    fits: a.repeat,
    warmUpFits: timing.warmUp,
  };
  const f = (v: number, d = 4) => (Number.isFinite(v) ? v.toFixed(d) : 'n/a');
  const row = (kind: string) => (c: { name: string; value: number; se: number }) => `${kind.padEnd(11)} ${c.name.padEnd(16)} ${f(c.value).padStart(14)}   ${f(c.se).padStart(12)}`;
  const lines = [
    `${a.input}: ${y.length} hours, ${a.series.missing} missing; regressors from ${a.xreg}: ${regs.names.join(', ')}`,
    `model: regression with ${describeDifferencing(a.diff)} ARMA(${m.spec.p},${m.spec.q})${seasonal ? `×(${m.spec.P},${m.spec.Q})_${m.spec.period}` : ''} errors${m.spec.includeMean ? ' and an intercept' : ''}  [given]`,
    '',
    'term        coefficient          estimate      std.error',
    ...m.armaCoefficients.map(row('ARMA')),
    ...m.beta.map(row('regression')),
    '',
    `sigma2 ${f(m.sigma2)}   loglik ${f(m.loglik, 2)}   AIC ${f(m.aic, 2)}   AICc ${f(m.aicc, 2)}   BIC ${f(m.bic, 2)}`,
    ...lb.map((l) => `Ljung–Box lag ${l.lag}: Q ${f(l.statistic, 2)} on ${l.df} df, p ${f(l.pValue, 4)}`),
    `n ${m.nUsed}   likelihood ${m.likelihood === 'diffuse' ? 'in the diffuse state space (gaps under a differencing, as R)' : 'of the differenced series'}   estimation ${repeatedTime(timing, a.repeat)}${m.converged ? '' : '   (optimiser did not fully converge)'}`,
  ];
  return { text: lines.join('\n'), json };
}
