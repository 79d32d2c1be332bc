/**
 * What a model version stores of its weather and calendar terms, and the temperature response
 * the desk draws from it. The response is the load's answer to the temperature at a steady
 * temperature: every temperature term (the hour's degree terms by block of the day, and the
 * recency terms of the 24-hour mean and the 3-hour lag) reads the same T, so
 *   g(T) = Σ_blocks (1/B)·(β_hdd,block·HDD(T) + β_cdd,block·CDD(T)) + β_hdd,mean24·HDD(T) + … ,
 * the daily mean over the B blocks of the day (twelve two-hour blocks, or the four parts of the
 * day of the versions fitted before the blocks). HDD(T) = max(0, θ_h − T), CDD(T) = max(0, T − θ_c)
 * (degree terms: common practice). Its uncertainty: ±1.96·√Σ (x_i·se_i)², the coefficients' OLS
 * standard errors taken as independent (the stored fit keeps no covariances; a simplification
 * that ignores the correlation of the parts' coefficients, said so on the desk).
 */
export interface ModelWeatherTermsDto {
  temperature: boolean;
  recency: boolean;
  calendar: boolean;
  /** heating below θ_h °C, cooling above θ_c °C */
  heatBelow: number;
  coolAbove: number;
  /** hours per block of the day of the degree terms and holiday dummies; absent: the four parts of the day (night, morning, afternoon, evening) */
  blockHours?: number;
}

export interface ModelWeatherDto {
  /** true: the version forecasts with these terms; false: the terms were tried and lost to the model without them */
  used: boolean;
  /** e.g. "(1−B^168) ARMA(2,1) + temperature (heating below 14 °C, …), calendar" */
  description: string;
  terms: ModelWeatherTermsDto;
  /** estimated coefficients only: MW per degree (degree terms) or MW per hour (calendar dummies) */
  response: { name: string; value: number; se: number | null }[];
  /** the term sets tried, each with its mean daily MAPE (%) from the day-ahead backtest on forecast weather */
  candidates: { label: string; mape: number | null }[];
  /** weekly seasonal naive on the same days, % */
  baselineMape: number | null;
  selectionDays: number;
  /** issue time of the temperature forecast the version's first forecast used (null: none, persistence) */
  vintageIssuedAt: string | null;
  /**
   * The joint covariance of the response's coefficients (MW², row-major, in the order of `names`)
   * when the fit gave one; absent or null: only the standard errors are known, and the curve's
   * band takes the coefficients as independent.
   */
  responseCovariance?: { names: string[]; values: number[] } | null;
}

/** Whether the response's band can use the coefficients' covariance (a square, finite matrix naming every coefficient), or takes them as independent. */
export function responseBandBasis(w: Pick<ModelWeatherDto, 'response' | 'responseCovariance'>): 'covariance' | 'independent' {
  const c = w.responseCovariance;
  if (!c || c.values.length !== c.names.length * c.names.length || !c.values.every(Number.isFinite)) return 'independent';
  return w.response.every((r) => c.names.includes(r.name)) ? 'covariance' : 'independent';
}

export interface ResponsePoint {
  temperatureC: number;
  mw: number;
  lower95: number;
  upper95: number;
}

const PARTS = ['night', 'morning', 'afternoon', 'evening'];

/** Name suffixes of the blocks of the day of a version's terms, as the engine names them (engine/src/weather/load-terms.ts, dayBlocks). */
export function dayBlockNames(terms: Pick<ModelWeatherTermsDto, 'blockHours'>): string[] {
  const w = terms.blockHours;
  if (w === undefined || !Number.isInteger(w) || w < 1 || 24 % w !== 0) return PARTS;
  return Array.from({ length: 24 / w }, (_, b) => `h${String(b * w).padStart(2, '0')}`);
}

/** The steady-temperature response g(T) with its 95 % band, T from `fromC` to `toC` by `stepC`. */
export function temperatureResponseCurve(w: Pick<ModelWeatherDto, 'terms' | 'response' | 'responseCovariance'>, fromC = -15, toC = 35, stepC = 0.5): ResponsePoint[] {
  const coef = new Map(w.response.map((r) => [r.name, r]));
  // Var(x'β̂) = x'Σx with the coefficients' joint covariance when it is stored (the delta method is
  // exact for a linear combination); otherwise Σ is taken as diagonal from the standard errors
  const cov = responseBandBasis(w) === 'covariance' ? w.responseCovariance! : null;
  const at = cov ? new Map(cov.names.map((n, i) => [n, i])) : null;
  const blocks = dayBlockNames(w.terms);
  const out: ResponsePoint[] = [];
  for (let k = 0; fromC + k * stepC <= toC + 1e-9; k++) {
    const t = fromC + k * stepC;
    const hdd = Math.max(0, w.terms.heatBelow - t);
    const cdd = Math.max(0, t - w.terms.coolAbove);
    const xs: Array<[string, number]> = [];
    for (const p of blocks) xs.push([`hdd_${p}`, hdd / blocks.length], [`cdd_${p}`, cdd / blocks.length]);
    xs.push(['hdd_mean24', hdd], ['cdd_mean24', cdd], ['hdd_lag3', hdd], ['cdd_lag3', cdd]);
    let mw = 0;
    let variance = 0;
    const used = xs.filter(([name, x]) => coef.has(name) && x !== 0);
    for (const [name, x] of used) mw += coef.get(name)!.value * x;
    if (cov && at) {
      const k = cov.names.length;
      for (const [a, xa] of used) for (const [b, xb] of used) variance += xa * xb * cov.values[at.get(a)! * k + at.get(b)!];
    } else {
      for (const [name, x] of used) variance += (x * (coef.get(name)!.se ?? 0)) ** 2;
    }
    variance = Math.max(0, variance);
    const half = 1.96 * Math.sqrt(variance);
    out.push({ temperatureC: t, mw, lower95: mw - half, upper95: mw + half });
  }
  return out;
}

export interface CalendarEffect {
  label: string;
  /** MW added to each hour of such a day (a holiday: mean over its blocks of the day) */
  mw: number;
  /** 95 % half-width, MW */
  halfWidth95: number;
}

/** The calendar dummies in MW: a public holiday (mean of its blocks of the day), a bridge day, the day after a holiday. */
export function calendarEffects(w: Pick<ModelWeatherDto, 'terms' | 'response'>): CalendarEffect[] {
  if (!w.terms.calendar) return [];
  const coef = new Map(w.response.map((r) => [r.name, r]));
  const effects: CalendarEffect[] = [];
  const holidays = dayBlockNames(w.terms).map((p) => coef.get(`holiday_${p}`)).filter((c): c is NonNullable<typeof c> => c !== undefined);
  if (holidays.length) {
    const mw = holidays.reduce((s, c) => s + c.value, 0) / holidays.length;
    const v = holidays.reduce((s, c) => s + (c.se ?? 0) ** 2, 0) / holidays.length ** 2;
    effects.push({ label: 'Public holiday', mw, halfWidth95: 1.96 * Math.sqrt(v) });
  }
  for (const [name, label] of [
    ['bridge', 'Bridge day'],
    ['day_after', 'Day after a holiday'],
  ] as const) {
    const c = coef.get(name);
    if (c) effects.push({ label, mw: c.value, halfWidth95: 1.96 * (c.se ?? 0) });
  }
  return effects;
}

/** The largest temperature shift a weather what-if takes, °C either way (a day-ahead forecast rarely misses by more). */
export const WHAT_IF_MAX_SHIFT_C = 10;

/**
 * GET /api/schedules/:day/:zone/weather-what-if?shift=N | ?vintage=ISO — the load the model that
 * made the day's latest forecast would mean if the temperature forecast were N °C warmer (or
 * colder), or were another vintage; beside the model forecast, never changing it.
 */
/** The temperature forecast vintages known for an operating day, newest first: the what-if's "another vintage" choices. */
export interface WeatherVintagesDto {
  zone: string;
  operatingDay: string;
  /** issue time of the vintage the day's latest forecast was made on (null: no forecast, or none was known then) */
  forecastVintageIssuedAt: string | null;
  vintages: Array<{
    issuedAt: string;
    /** hours of the day this vintage gives a temperature for */
    hours: number;
    usedByForecast: boolean;
  }>;
}

export interface WeatherWhatIfDto {
  zone: string;
  operatingDay: string;
  forecastRunId: number | null;
  modelVersionId: number;
  /** the shift asked for, °C (null when another vintage was asked for) */
  shiftC: number | null;
  /** issue time of the temperature forecast under the model forecast, and of the one the what-if used */
  baseVintageIssuedAt: string | null;
  whatIfVintageIssuedAt: string | null;
  hours: Array<{
    hourStart: string;
    modelMw: number | null;
    temperatureC: number | null;
    whatIfTemperatureC: number | null;
    whatIfMw: number | null;
    /** whatIfMw − modelMw */
    changeMw: number | null;
  }>;
  /** how the what-if is made, for the desk */
  method: string;
}
