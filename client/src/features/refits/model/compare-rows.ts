import type { ModelCompareDto, ModelVersionDto } from '@morrowline/shared';
import { formatArmaOrders } from '../../../lib/format';

/** Which side of a comparison row is the better one; null when it cannot be said. */
export type Better = 'candidate' | 'in-service' | null;

export interface CompareRow {
  label: string;
  candidate: string;
  inService: string;
  better: Better;
  /** The seasonal-naive figure, where there is one. */
  baseline?: string;
  /** What the row means, when that is not obvious. */
  note?: string;
}

function fixed(value: number | null | undefined, digits: number): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : value.toFixed(digits);
}

function pct(value: number | null | undefined, digits = 2): string {
  const text = fixed(value, digits);
  return text === '—' ? text : `${text} %`;
}

/**
 * Decimals enough to tell two ranked percentages apart: two, or up to four where two would print
 * the same number on both sides of a "better" ("3.69 % against 3.69 %").
 */
function digitsToTell(a: number | null | undefined, b: number | null | undefined): number {
  if (a === null || a === undefined || b === null || b === undefined || !Number.isFinite(a) || !Number.isFinite(b) || a === b) return 2;
  let digits = 2;
  while (digits < 4 && a.toFixed(digits) === b.toFixed(digits)) digits++;
  return digits;
}

/** lower is better */
function lower(a: number | null | undefined, b: number | null | undefined): Better {
  if (a === null || a === undefined || b === null || b === undefined || !Number.isFinite(a) || !Number.isFinite(b) || a === b) return null;
  return a < b ? 'candidate' : 'in-service';
}

export function ordersOf(v: ModelVersionDto): string {
  return `${formatArmaOrders(v.p, v.q, v.seasonal)} on ${v.differencingLabel}`;
}

/** The smallest Ljung–Box p-value: the lag where leftover pattern is most likely. */
function worstLjungBox(v: ModelVersionDto): { p: number; lag: number } | null {
  if (v.ljungBox.length === 0) return null;
  const worst = v.ljungBox.reduce((a, b) => (b.pValue < a.pValue ? b : a));
  return { p: worst.pValue, lag: worst.lag };
}

/** Fitted on the same hours with the same differencing: only then are σ², AICc and BIC on one scale. */
function sameFit(c: ModelVersionDto, s: ModelVersionDto | null): boolean {
  return s !== null && c.differencingLabel === s.differencingLabel && c.trainingFrom === s.trainingFrom && c.trainingTo === s.trainingTo;
}

function criterionNote(c: ModelVersionDto, s: ModelVersionDto | null): string | undefined {
  if (!s || sameFit(c, s)) return undefined;
  return c.differencingLabel !== s.differencingLabel ? 'not comparable: different differencing' : 'not comparable: fitted on different hours';
}

function mw(value: number | null | undefined): string {
  const text = fixed(value, 1);
  return text === '—' ? text : `${value! > 0 ? '+' : ''}${text} MW`;
}

/**
 * The rows of the side-by-side comparison. The day-ahead error on the same days, each version
 * forecasting at the issue time with its own coefficients, is the judge, and it gets a side only
 * when the server says both were scored on the same days and hours; criteria of the fit (σ², AICc,
 * BIC) only when both were fitted on the same hours with the same differencing.
 */
export function compareRows(cmp: ModelCompareDto): CompareRow[] {
  const c = cmp.candidate;
  const s = cmp.inService;
  const same = sameFit(c, s);
  const note = criterionNote(c, s);
  const sc = cmp.sameDays.candidate;
  const ss = cmp.sameDays.inService;
  const comparable = cmp.sameDays.comparable;
  const lbC = worstLjungBox(c);
  const lbS = s ? worstLjungBox(s) : null;
  const source = (v: typeof sc) => (v ? `${v.issuedDays} as issued, ${v.days - v.issuedDays} re-forecast` : '—');
  const rows: CompareRow[] = [
    {
      label: `Backtest MAPE, same ${cmp.sameDays.days} days`,
      candidate: pct(cmp.sameDays.candidateMape, digitsToTell(cmp.sameDays.candidateMape, cmp.sameDays.inServiceMape)),
      inService: pct(cmp.sameDays.inServiceMape, digitsToTell(cmp.sameDays.candidateMape, cmp.sameDays.inServiceMape)),
      better: comparable ? lower(cmp.sameDays.candidateMape, cmp.sameDays.inServiceMape) : null,
      baseline: pct(cmp.sameDays.baselineMape),
      note: comparable ? `day-ahead, each day forecast ${cmp.sameDays.issueTime}, own coefficients` : `not ranked: ${cmp.sameDays.notComparable ?? 'not scored alike'}`,
    },
    { label: 'Days scored from forecasts', candidate: source(sc), inService: source(ss), better: null, note: 'as issued: the forecast the version issued then; re-forecast: made now from the hours known then' },
    { label: '80 % band held', candidate: pct(sc?.coverage80), inService: pct(ss?.coverage80), better: null, note: 'share of hours inside the band; about 80 % means the band can be trusted' },
    { label: 'Mean error', candidate: mw(sc?.bias), inService: mw(ss?.bias), better: null, note: 'positive: forecasts too high' },
    { label: 'Backtest MAPE when fitted', candidate: pct(c.backtestMape), inService: pct(s?.backtestMape), better: null, baseline: `${pct(c.baselineMape)} / ${pct(s?.baselineMape)}`, note: 'each on its own days, orders refitted daily: not comparable' },
    { label: 'Orders', candidate: ordersOf(c), inService: s ? ordersOf(s) : '—', better: null },
    { label: 'σ² (MW²)', candidate: fixed(c.sigma2, 2), inService: fixed(s?.sigma2, 2), better: same ? lower(c.sigma2, s?.sigma2) : null },
    { label: 'AICc', candidate: fixed(c.aicc, 1), inService: fixed(s?.aicc, 1), better: same ? lower(c.aicc, s?.aicc) : null, note },
    { label: 'BIC', candidate: fixed(c.bic, 1), inService: fixed(s?.bic, 1), better: same ? lower(c.bic, s?.bic) : null, note },
    {
      label: 'Ljung–Box, lowest p',
      candidate: lbC ? `${fixed(lbC.p, 3)} at ${lbC.lag} h` : '—',
      inService: lbS ? `${fixed(lbS.p, 3)} at ${lbS.lag} h` : '—',
      better: null,
      note: 'below 0.05: some hourly pattern is left, as in nearly every hourly load model; the 80 % band row says whether it matters for the margin',
    },
    { label: 'Training hours (left out)', candidate: `${c.trainingHours} (${c.excludedHours})`, inService: s ? `${s.trainingHours} (${s.excludedHours})` : '—', better: null },
  ];
  return rows;
}

/** The verdict in words, from the day-ahead error on the same days. */
export function compareVerdict(cmp: ModelCompareDto): string {
  const { candidateMape, inServiceMape, baselineMape, days } = cmp.sameDays;
  if (!cmp.inService) return 'No model is in service for this zone: this version would be the first.';
  if (!cmp.sameDays.comparable) return `The two cannot be ranked: ${cmp.sameDays.notComparable ?? 'they were not scored on the same days'}.`;
  if (candidateMape === null || inServiceMape === null) return 'The two could not both be scored on the same days.';
  const base = baselineMape === null ? '' : ` The same hour one week earlier scores ${baselineMape.toFixed(2)} %.`;
  const digits = digitsToTell(candidateMape, inServiceMape);
  const both = `${candidateMape.toFixed(digits)} % against ${inServiceMape.toFixed(digits)} %`;
  if (cmp.candidateBetter) return `Over the same ${days} days this version is better: ${both} for the model in service.${base}`;
  return `Over the same ${days} days this version is not better: ${both} for the model in service.${base}`;
}
