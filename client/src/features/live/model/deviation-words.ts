import { formatSignedPercent } from '../../../lib/format';

/** A deviation told in words and signs as well as colour, so colour never carries it alone. */
export interface DeviationWords {
  /** "+12.3 %", "−4.0 %" or "—". */
  figure: string;
  /** "above committed", "below committed", "on committed" or "" when there is no figure. */
  direction: string;
  /** Beyond the zone's alert threshold (either side). */
  beyond: boolean;
  /** A shape that says the same without colour: ▲ above, ▼ below the threshold band. */
  mark: '▲' | '▼' | '';
}

export function deviationWords(pct: number | null, thresholdPct: number | null): DeviationWords {
  if (pct === null || !Number.isFinite(pct)) return { figure: '—', direction: '', beyond: false, mark: '' };
  const figure = formatSignedPercent(pct);
  const rounded = Number(pct.toFixed(1));
  const direction = rounded > 0 ? 'above committed' : rounded < 0 ? 'below committed' : 'on committed';
  const beyond = thresholdPct !== null && Math.abs(pct) > thresholdPct;
  return { figure, direction, beyond, mark: beyond ? (pct > 0 ? '▲' : '▼') : '' };
}
