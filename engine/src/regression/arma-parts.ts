/** The ARMA coefficients of a regression fit in the natural parameters, and their state space. */
import { ArmaSpec } from '../arma/fit';
import { expandAr, expandMa } from '../arma/polynomials';
import { armaStateSpace, ArmaStateSpace } from '../arma/state-space';

/** ARMA coefficients in the natural parameters. */
export interface ArmaParts {
  ar: Float64Array;
  ma: Float64Array;
  sar: Float64Array;
  sma: Float64Array;
}

export function stateSpaceOf(nat: ArmaParts, period: number): ArmaStateSpace {
  return armaStateSpace(expandAr(nat.ar, nat.sar, period || 1), expandMa(nat.ma, nat.sma, period || 1));
}

export function splitArma(v: ArrayLike<number>, o: Required<ArmaSpec>): ArmaParts {
  let k = 0;
  const take = (m: number): Float64Array => {
    const out = new Float64Array(m);
    for (let i = 0; i < m; i++) out[i] = v[k++];
    return out;
  };
  return { ar: take(o.p), ma: take(o.q), sar: take(o.P), sma: take(o.Q) };
}

