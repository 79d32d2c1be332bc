import type { ModelCompareDto, ModelVersionDto } from '@morrowline/shared';

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

function pct(value: number | null | undefined): string {
  const text = fixed(value, 2);
  return text === '—' ? text : `${text} %`;
}

/** lower is better */
function lower(a: number | null | undefined, b: number | null | undefined): Better {
  if (a === null || a === undefined || b === null || b === undefined || !Number.isFinite(a) || !Number.isFinite(b) || a === b) return null;
  return a < b ? 'candidate' : 'in-service';
}

export function ordersOf(v: ModelVersionDto): string {
  return `ARMA(${v.p},${v.q}) on ${v.differencingLabel}`;
}

/** The smallest Ljung–Box p-value: the lag where leftover pattern is most likely. */
function worstLjungBox(v: ModelVersionDto): { p: number; lag: number } | null {
  if (v.ljungBox.length === 0) return null;
  const worst = v.ljungBox.reduce((a, b) => (b.pValue < a.pValue ? b : a));
  return { p: worst.pValue, lag: worst.lag };
}

/**
 * The rows of the side-by-side comparison. Backtest error is the judge (both scored on the same
 * days); criteria only compare like with like, so AICc and BIC get a side only when the two
 * versions difference the same way.
 */
export function compareRows(cmp: ModelCompareDto): CompareRow[] {
  const c = cmp.candidate;
  const s = cmp.inService;
  const sameDiff = s !== null && c.differencingLabel === s.differencingLabel;
  const lbC = worstLjungBox(c);
  const lbS = s ? worstLjungBox(s) : null;
  const rows: CompareRow[] = [
    { label: `Backtest MAPE, same ${cmp.sameDays.days} days`, candidate: pct(cmp.sameDays.candidateMape), inService: pct(cmp.sameDays.inServiceMape), better: lower(cmp.sameDays.candidateMape, cmp.sameDays.inServiceMape), baseline: pct(cmp.sameDays.baselineMape) },
    { label: 'Backtest MAPE when fitted', candidate: pct(c.backtestMape), inService: pct(s?.backtestMape), better: null, baseline: `${pct(c.baselineMape)} / ${pct(s?.baselineMape)}`, note: 'each on its own days' },
    { label: 'Orders', candidate: ordersOf(c), inService: s ? ordersOf(s) : '—', better: null },
    { label: 'σ² (MW²)', candidate: fixed(c.sigma2, 2), inService: fixed(s?.sigma2, 2), better: sameDiff ? lower(c.sigma2, s?.sigma2) : null },
    { label: 'AICc', candidate: fixed(c.aicc, 1), inService: fixed(s?.aicc, 1), better: sameDiff ? lower(c.aicc, s?.aicc) : null, note: sameDiff ? undefined : 'not comparable: different differencing' },
    { label: 'BIC', candidate: fixed(c.bic, 1), inService: fixed(s?.bic, 1), better: sameDiff ? lower(c.bic, s?.bic) : null, note: sameDiff ? undefined : 'not comparable: different differencing' },
    {
      label: 'Ljung–Box, lowest p',
      candidate: lbC ? `${fixed(lbC.p, 3)} at ${lbC.lag} h` : '—',
      inService: lbS ? `${fixed(lbS.p, 3)} at ${lbS.lag} h` : '—',
      // higher p: less pattern left in the residuals
      better: lbC && lbS ? lower(-lbC.p, -lbS.p) : null,
      note: 'above 0.05: no pattern left in the residuals',
    },
    { label: 'Training hours (left out)', candidate: `${c.trainingHours} (${c.excludedHours})`, inService: s ? `${s.trainingHours} (${s.excludedHours})` : '—', better: null },
  ];
  return rows;
}

/** The verdict in words, from the backtest on the same days. */
export function compareVerdict(cmp: ModelCompareDto): string {
  const { candidateMape, inServiceMape, baselineMape, days } = cmp.sameDays;
  if (!cmp.inService) return 'No model is in service for this zone: this version would be the first.';
  if (candidateMape === null || inServiceMape === null) return 'The two could not both be scored on the same days.';
  const base = baselineMape === null ? '' : ` The same hour one week earlier scores ${baselineMape.toFixed(2)} %.`;
  if (cmp.candidateBetter) return `Over the same ${days} days this version is better: ${candidateMape.toFixed(2)} % against ${inServiceMape.toFixed(2)} % for the model in service.${base}`;
  return `Over the same ${days} days this version is not better: ${candidateMape.toFixed(2)} % against ${inServiceMape.toFixed(2)} % for the model in service.${base}`;
}
