/**
 * The regressors a zone's load may answer besides its own past: the temperature and the calendar.
 *
 * Temperature enters through heating and cooling degree terms, HDD_t = max(0, θ_h − T_t) and
 * CDD_t = max(0, T_t − θ_c), the piecewise-linear response of load to temperature that load
 * forecasters use (common practice; the thresholds θ_h ≤ θ_c are chosen per zone, ./term-choice).
 * Each is split by two-hour block of the local hour of day (00–01, 02–03, …, 22–23): hour of day
 * × temperature interactions, as in the benchmark regressions of load forecasting where each hour
 * gets its own temperature polynomial (Hong 2010, "Short term electric load forecasting", PhD
 * thesis, North Carolina State University; the "vanilla" benchmark of Hong, Pinson & Fan 2014,
 * "Global Energy Forecasting Competition 2012", Int. J. Forecasting 30(2), 357–363; both
 * references from memory), because heating and air-conditioning answer the temperature
 * differently when people are at home, at work or asleep, and the answer moves through the day
 * with them. Blocks of two hours rather than single hours: on the simulator's zones (8 weeks of
 * history) they forecast as well as 24 single hours with half the coefficients, and better than
 * the four parts of the day (night 0–5, morning 6–11, afternoon 12–17, evening 18–23) used before
 * (README, "Day-ahead with weather"); a term set without `blockHours`, as stored before, keeps
 * the four parts. The recency effect (Wang, Liu & Hong 2016, "Electric load forecasting with
 * recency effect: a big data approach", Int. J. Forecasting 32(3), 585–597):
 * load answers the temperature of the preceding hours too, here through the degree terms of the
 * 24-hour moving average of the temperature over the hours before t and of the temperature three
 * hours earlier.
 *
 * The calendar enters as dummies: a public holiday (split by the same blocks of the day, since a
 * holiday runs like a Sunday and a Sunday differs from a weekday most in working hours), a bridge day, and
 * the day after a holiday (common practice). Only on working days (Monday to Friday, when the
 * weekday is given): a holiday that falls on a Saturday or Sunday runs like the weekend day it
 * is, and a dummy there would carry a working-day holiday's effect onto it and, through the
 * weekly difference, onto the same day a week later.
 *
 * Every column is a function of the temperature path and the calendar only, so the same code
 * builds the history's regressors (observed temperature) and the forecast's (forecast
 * temperature).
 */

export interface TermSet {
  /** heating and cooling degree terms of the hour's temperature */
  temperature: boolean;
  /** degree terms of the 24-hour moving average and of the 3-hour lag (recency effect) */
  recency: boolean;
  /** holiday, bridge-day and day-after dummies */
  calendar: boolean;
  /** heating threshold θ_h, °C */
  heatBelow: number;
  /** cooling threshold θ_c, °C */
  coolAbove: number;
  /**
   * hours per block of the day of the degree terms and the holiday dummies (2: twelve blocks, what
   * the pipeline chooses now); absent: the four parts of the day of the models fitted before the
   * blocks (stored choices keep their meaning)
   */
  blockHours?: number;
}

/** Per-hour calendar facts, for the history and the forecast hours alike. */
export interface CalendarHours {
  /** local hour of day 0..23 of each hour */
  hourOfDay: ArrayLike<number>;
  /** 1 where the hour's local day is a public holiday, else 0 */
  holiday: ArrayLike<number>;
  /** 1 where the hour's local day is a bridge day, else 0 */
  bridge: ArrayLike<number>;
  /** local day of the week of each hour, 0 = Sunday … 6 = Saturday (optional: without it every special day counts) */
  weekday?: ArrayLike<number>;
}

/** parts of the day (night 0–5, morning, afternoon, evening 18–23) of the models fitted before the two-hour blocks */
export const DAY_PARTS = 4;
const PART_NAMES = ['night', 'morning', 'afternoon', 'evening'];
/** hours of a block of the degree terms and holiday dummies in the term sets the pipeline tries */
export const TEMPERATURE_BLOCK_HOURS = 2;
export const RECENCY_LAG = 3;
export const RECENCY_WINDOW = 24;

/** Part of the day of a local hour: 0 night (0–5), 1 morning, 2 afternoon, 3 evening (18–23). */
export function dayPart(hour: number): number {
  return Math.min(DAY_PARTS - 1, Math.max(0, Math.floor(hour / 6)));
}

/** How a term set splits the day: the count of blocks, the block of a local hour, and each block's name suffix. */
export interface DayBlocks {
  count: number;
  of: (hour: number) => number;
  label: (block: number) => string;
}

/**
 * The blocks of a term set: blocks of `blockHours` hours named by their first local hour ("h00",
 * "h02", … "h22" for two hours), or without `blockHours` the four parts of the day (night,
 * morning, afternoon, evening).
 */
export function dayBlocks(s: Pick<TermSet, 'blockHours'>): DayBlocks {
  const w = s.blockHours;
  if (w === undefined) return { count: DAY_PARTS, of: dayPart, label: (p) => PART_NAMES[p] };
  if (!Number.isInteger(w) || w < 1 || 24 % w !== 0) throw new Error(`blockHours must divide 24 (got ${w})`);
  const count = 24 / w;
  return { count, of: (hour) => Math.min(count - 1, Math.max(0, Math.floor(hour / w))), label: (b) => `h${String(b * w).padStart(2, '0')}` };
}

/** The hour of day when no calendar is given: the series starts at a local midnight. */
export function plainCalendar(n: number, firstHourOfDay = 0): CalendarHours {
  const hourOfDay = new Uint8Array(n);
  for (let i = 0; i < n; i++) hourOfDay[i] = (firstHourOfDay + i) % 24;
  return { hourOfDay, holiday: new Uint8Array(n), bridge: new Uint8Array(n) };
}

/** Names of the columns `termColumns` builds for a term set, in order. */
export function termNames(s: TermSet): string[] {
  const names: string[] = [];
  const blocks = dayBlocks(s);
  if (s.temperature) for (let b = 0; b < blocks.count; b++) names.push(`hdd_${blocks.label(b)}`, `cdd_${blocks.label(b)}`);
  if (s.recency) names.push('hdd_mean24', 'cdd_mean24', 'hdd_lag3', 'cdd_lag3');
  if (s.calendar) {
    for (let b = 0; b < blocks.count; b++) names.push(`holiday_${blocks.label(b)}`);
    names.push('bridge', 'day_after');
  }
  return names;
}

export const heating = (t: number, theta: number): number => (t < theta ? theta - t : 0);
export const cooling = (t: number, theta: number): number => (t > theta ? t - theta : 0);

/**
 * The regressors of hours [from, to) as columns (one Float64Array per name of `termNames`).
 * `temp` is the temperature path indexed like the hours (observed, or observed then forecast);
 * a missing temperature makes that hour's temperature columns NaN (the hour is then left out of
 * the estimation, and a forecast hour falls back as ./forecast-temperature says). The moving
 * average uses the finite values of the 24 hours before t, NaN when fewer than 12 are known; at
 * the very start of the timeline, where fewer than 24 hours exist, those that exist (the hour
 * itself at hour 0), and the 3-hour lag the first hour's: a gap there would make every fit of the
 * error model take the slow path of a series with missing hours (../pipeline).
 */
export function termColumns(s: TermSet, temp: ArrayLike<number>, cal: CalendarHours, from: number, to: number): Float64Array[] {
  const n = Math.max(0, to - from);
  const cols: Float64Array[] = [];
  const blocks = dayBlocks(s);
  const B = blocks.count;
  if (s.temperature) {
    const hdd = Array.from({ length: B }, () => new Float64Array(n));
    const cdd = Array.from({ length: B }, () => new Float64Array(n));
    for (let i = 0; i < n; i++) {
      const t = temp[from + i];
      const block = blocks.of(cal.hourOfDay[from + i]);
      for (let p = 0; p < B; p++) {
        const on = p === block;
        hdd[p][i] = on ? (Number.isFinite(t) ? heating(t, s.heatBelow) : NaN) : 0;
        cdd[p][i] = on ? (Number.isFinite(t) ? cooling(t, s.coolAbove) : NaN) : 0;
      }
    }
    for (let p = 0; p < B; p++) cols.push(hdd[p], cdd[p]);
  }
  if (s.recency) {
    const hm = new Float64Array(n);
    const cm = new Float64Array(n);
    const hl = new Float64Array(n);
    const cl = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const m = movingMean(temp, from + i);
      hm[i] = Number.isFinite(m) ? heating(m, s.heatBelow) : NaN;
      cm[i] = Number.isFinite(m) ? cooling(m, s.coolAbove) : NaN;
      const l = temp[Math.max(0, from + i - RECENCY_LAG)];
      hl[i] = Number.isFinite(l) ? heating(l, s.heatBelow) : NaN;
      cl[i] = Number.isFinite(l) ? cooling(l, s.coolAbove) : NaN;
    }
    cols.push(hm, cm, hl, cl);
  }
  if (s.calendar) {
    const hol = Array.from({ length: B }, () => new Float64Array(n));
    const bridge = new Float64Array(n);
    const after = new Float64Array(n);
    const wd = cal.weekday;
    const working = (t: number) => !wd || (wd[t] >= 1 && wd[t] <= 5);
    for (let i = 0; i < n; i++) {
      const t = from + i;
      const h = cal.holiday[t] && working(t) ? 1 : 0;
      hol[blocks.of(cal.hourOfDay[t])][i] = h;
      bridge[i] = cal.bridge[t] && working(t) ? 1 : 0;
      // the day after a working-day holiday: the same hour 24 hours earlier was one, this one is a working day, no holiday and no bridge day
      after[i] = !cal.holiday[t] && !cal.bridge[t] && working(t) && t >= 24 && cal.holiday[t - 24] && working(t - 24) ? 1 : 0;
    }
    cols.push(...hol, bridge, after);
  }
  return cols;
}

/** Mean of the finite temperatures of the 24 hours before t (fewer at the start); NaN with fewer than half of them known. */
export function movingMean(temp: ArrayLike<number>, t: number): number {
  let s = 0;
  let k = 0;
  if (t === 0) return temp[0];
  for (let j = Math.max(0, t - RECENCY_WINDOW); j < t; j++) {
    const v = temp[j];
    if (Number.isFinite(v)) {
      s += v;
      k++;
    }
  }
  return k >= Math.min(t, RECENCY_WINDOW) / 2 ? s / k : NaN;
}
