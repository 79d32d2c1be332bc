/**
 * The weather and calendar inputs of `fit` and `backtest` (--temperature, --temperature-forecasts,
 * --calendar, --time-zone), read and placed on the load file's timeline.
 */
import { readFileSync } from 'node:fs';
import { CalendarHours, TemperatureVintage, vintagesFromRows } from '@morrowline/engine';
import { HourlySeries } from './csv-series';
import { parseCalendarCsv, parseTemperatureCsv, parseTemperatureForecastCsv } from './csv-weather';

export const WEATHER_OPTIONS = {
  temperature: { type: 'string' },
  'temperature-forecasts': { type: 'string' },
  calendar: { type: 'string' },
  'time-zone': { type: 'string' },
} as const;

export interface WeatherArgs {
  temperature?: string;
  'temperature-forecasts'?: string;
  calendar?: string;
  'time-zone'?: string;
}

export interface WeatherInputs {
  temperature: Float64Array;
  vintages: TemperatureVintage[];
  calendar: CalendarHours;
  /** local calendar date and hour of each hour of the timeline (and `extra` hours after it) */
  localDays: string[];
}

const HOUR = 3_600_000;

/** Local date and hour of an instant: in `timeZone` (IANA name) when given, else at the fixed offset. */
function localParts(ms: number, offsetMin: number, fmt?: Intl.DateTimeFormat): { day: string; hour: number } {
  if (!fmt) {
    const d = new Date(ms + offsetMin * 60_000).toISOString();
    return { day: d.slice(0, 10), hour: Number(d.slice(11, 13)) };
  }
  const p: Record<string, string> = {};
  for (const x of fmt.formatToParts(new Date(ms))) p[x.type] = x.value;
  return { day: `${p.year}-${p.month}-${p.day}`, hour: Number(p.hour) };
}

export function timeZoneFormat(tz: string): Intl.DateTimeFormat {
  try {
    return new Intl.DateTimeFormat('en-CA', { timeZone: tz, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', hourCycle: 'h23' });
  } catch (e) {
    throw new Error(`--time-zone "${tz}" is not an IANA time zone (e.g. America/Denver)`, { cause: e });
  }
}

/** Operating-day starts (local midnights) of the series in a time zone, replacing the file's offsets' days. */
export function dayStartsIn(series: HourlySeries, tz: string): number[] {
  const fmt = timeZoneFormat(tz);
  const out: number[] = [];
  for (let i = 0; i <= series.values.length; i++) if (localParts(series.startMs + i * HOUR, 0, fmt).hour === 0) out.push(i);
  return out;
}

/** The weather inputs, or undefined when no --temperature is given (--temperature-forecasts and --calendar need it). */
export function readWeatherInputs(a: WeatherArgs, series: HourlySeries, extraHours: number): WeatherInputs | undefined {
  if (!a.temperature) {
    if (a['temperature-forecasts'] || a.calendar) throw new Error('--temperature-forecasts and --calendar need --temperature (the observed temperature the model is fitted on)');
    return undefined;
  }
  const n = series.values.length;
  const read = (file: string, what: string, f: () => void) => {
    try {
      f();
    } catch (e) {
      throw new Error(`${what} ${file}: ${(e as Error).message}`, { cause: e });
    }
  };
  let temperature: Float64Array = new Float64Array(0);
  read(a.temperature, '--temperature', () => (temperature = parseTemperatureCsv(readFileSync(a.temperature!, 'utf8'), series.startMs, n)));
  let vintages: TemperatureVintage[] = [];
  if (a['temperature-forecasts']) read(a['temperature-forecasts'], '--temperature-forecasts', () => (vintages = vintagesFromRows(parseTemperatureForecastCsv(readFileSync(a['temperature-forecasts']!, 'utf8')), series.startMs)));
  let special = new Map<string, string>();
  if (a.calendar) read(a.calendar, '--calendar', () => (special = parseCalendarCsv(readFileSync(a.calendar!, 'utf8'))));
  const fmt = a['time-zone'] ? timeZoneFormat(a['time-zone']) : undefined;
  const total = n + extraHours;
  const hourOfDay = new Uint8Array(total);
  const holiday = new Uint8Array(total);
  const bridge = new Uint8Array(total);
  const weekday = new Uint8Array(total);
  const localDays: string[] = [];
  for (let i = 0; i < total; i++) {
    const p = localParts(series.startMs + i * HOUR, series.offsets[Math.min(i, n - 1)], fmt);
    localDays.push(p.day);
    hourOfDay[i] = p.hour;
    const k = special.get(p.day);
    holiday[i] = k === 'public-holiday' ? 1 : 0;
    bridge[i] = k === 'bridge-day' ? 1 : 0;
    weekday[i] = new Date(`${p.day}T00:00:00Z`).getUTCDay();
  }
  return { temperature, vintages, calendar: { hourOfDay, holiday, bridge, weekday }, localDays };
}
